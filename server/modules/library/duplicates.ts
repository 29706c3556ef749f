import type { EntityManager } from '@mikro-orm/postgresql';
import { roleAtLeast } from '@/lib/schemas/groups';
import type { ComplexStatus, DuplicateEntry } from '@/lib/schemas/library';
import { isomerDescriptor } from '@/lib/chem/formula-parser';
import type { Reader } from './library-access';

/**
 * The same species twice in a group: same metal centre, oxidation state and ligand set (which
 * fixes the charge), however the formula is written, and not two different isomers: formulas
 * written with different stereo descriptors (cis- and trans-[PtCl2(NH3)2]) are two compounds. A
 * formula without a descriptor may be either isomer, so it is reported against both. Retired and
 * declined entries do not count. A person is told only of entries they may see (accepted ones,
 * their own, or all for curators).
 */
export interface SpeciesKey {
  metal: string;
  oxidationState: number;
  ligandSetKey: string;
  /** The stereo descriptor the formula is written with (isomerDescriptor), null or absent when none. */
  isomer?: string | null;
}

export const speciesKeyOf = (s: SpeciesKey) => `${s.metal}|${s.oxidationState}|${s.ligandSetKey}|${s.isomer ?? ''}`;

/** The species a formula names, with its stereo descriptor, from its derived columns. */
export const speciesOf = (formula: string, derived: Omit<SpeciesKey, 'isomer'>): SpeciesKey => ({
  metal: derived.metal,
  oxidationState: derived.oxidationState,
  ligandSetKey: derived.ligandSetKey,
  isomer: isomerDescriptor(formula),
});

/** Two descriptors name possibly the same isomer unless both are given and differ. */
const sameIsomerPossible = (a: string | null | undefined, b: string | null | undefined) => a == null || b == null || a === b;

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
  for (const asked of unique) {
    // Rows come oldest first: the first one of the same species (and a possible isomer) is the answer.
    const row = rows.find(
      (r) =>
        r.metal === asked.metal &&
        r.oxidation_state === asked.oxidationState &&
        r.ligand_set_key === asked.ligandSetKey &&
        sameIsomerPossible(isomerDescriptor(r.formula), asked.isomer),
    );
    if (row) found.set(speciesKeyOf(asked), { id: row.id, name: row.name, formula: row.formula, status: row.status });
  }
  return found;
}
