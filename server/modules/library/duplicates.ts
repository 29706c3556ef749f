import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { ComplexStatus, DuplicateEntry } from '@/lib/schemas/library';
import type { Reader } from './library-access';

/**
 * The same species twice in a group: same metal centre, oxidation state and ligand set (which
 * fixes the charge), however the formula is written. Retired and declined entries do not count.
 * A person is told only of entries they may see (accepted ones, their own, or all for curators).
 */
export interface SpeciesKey {
  metal: string;
  oxidationState: number;
  ligandSetKey: string;
}

export const speciesKeyOf = (s: SpeciesKey) => `${s.metal}|${s.oxidationState}|${s.ligandSetKey}`;

interface Row {
  id: string;
  name: string;
  formula: string;
  status: ComplexStatus;
  metal: string;
  oxidation_state: number;
  ligand_set_key: string;
}

/** The oldest visible entry of each species asked about, by species key. */
export async function existingSpecies(
  em: EntityManager,
  groupId: string,
  reader: Reader,
  species: readonly SpeciesKey[],
  exceptId?: string,
): Promise<Map<string, DuplicateEntry>> {
  const found = new Map<string, DuplicateEntry>();
  if (species.length === 0) return found;
  const unique = [...new Map(species.map((s) => [speciesKeyOf(s), s])).values()];
  const seesAll = roleAtLeast(reader.role, 'curator');
  const rows = (await em.getConnection().execute(
    `select c.id, c.name, c.formula, c.status, c.metal, c.oxidation_state, c.ligand_set_key
       from complex c
       join jsonb_to_recordset(?::jsonb) as k(metal text, oxidation_state int, ligand_set_key text)
         on c.metal = k.metal and c.oxidation_state = k.oxidation_state and c.ligand_set_key = k.ligand_set_key
      where c.group_id = ? and c.status not in ('retired', 'declined') and c.id <> coalesce(?::uuid, '00000000-0000-0000-0000-000000000000'::uuid)
        and (? or c.accepted_snapshot is not null or c.created_by_id = ?)
      order by c.created_at, c.id`,
    [
      JSON.stringify(unique.map((s) => ({ metal: s.metal, oxidation_state: s.oxidationState, ligand_set_key: s.ligandSetKey }))),
      groupId,
      exceptId ?? null,
      seesAll,
      reader.userId,
    ],
  )) as Row[];
  for (const row of rows) {
    const key = speciesKeyOf({ metal: row.metal, oxidationState: row.oxidation_state, ligandSetKey: row.ligand_set_key });
    if (!found.has(key)) found.set(key, { id: row.id, name: row.name, formula: row.formula, status: row.status });
  }
  return found;
}
