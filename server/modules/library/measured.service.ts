import type { EntityManager } from '@mikro-orm/postgresql';
import type { Classification } from '@/lib/chem/types';
import { candidatesFromRows, type LibraryCandidate } from '@/lib/chem/library-decision';
import type { ComplexSnapshot, LibraryMeasurement } from '@/lib/schemas/library';
import { RETIRED_STATUS } from '@/lib/schemas/library-status';
import { classifyOrExplain, ligandSetKeyOf } from './derive';

/**
 * Measured meets predicted: the accepted measurements a group holds for the same complex as a
 * classification — same metal, oxidation state and ligand set (ligand ids with their counts, so
 * "[Co(NH3)5(OH2)]3+" and "[Co(H2O)(NH3)5]3+" match, and counter-ions or hydrate water do not
 * matter). Only accepted snapshots count (what viewers see), never drafts or retired entries.
 */
export async function findLibraryMeasurements(
  em: EntityManager,
  classification: Pick<Classification, 'metal' | 'oxidationState' | 'ligands'>,
  groupId: string,
): Promise<LibraryMeasurement[]> {
  const key = ligandSetKeyOf(classification.ligands);
  // The stored columns narrow by index; the accepted snapshot decides (a pending edit may differ).
  const rows = await em.execute<{ id: string; accepted_snapshot: ComplexSnapshot }[]>(
    `select c.id, c.accepted_snapshot from complex c
      where c.group_id = ? and c.metal = ? and c.accepted_snapshot is not null and c.status <> ?
      order by c.id`,
    [groupId, classification.metal, RETIRED_STATUS],
  );
  const found: LibraryMeasurement[] = [];
  for (const row of rows) {
    const snapshot = row.accepted_snapshot;
    if (snapshot.oxidationState !== classification.oxidationState) continue;
    let snapshotKey: string;
    try {
      snapshotKey = ligandSetKeyOf(classifyOrExplain(snapshot.formula).ligands);
    } catch {
      continue;
    }
    if (snapshotKey !== key) continue;
    for (const m of snapshot.measurements) {
      found.push({ ...m, complexId: row.id, complexFormula: snapshot.formula, complexName: snapshot.name });
    }
  }
  return found;
}

/** The same entries as candidates for the measured-decides rule (lib/chem/library-decision.ts), ordered by entry id. */
export async function findLibraryCandidates(
  em: EntityManager,
  classification: Pick<Classification, 'metal' | 'oxidationState' | 'ligands'>,
  groupId: string,
): Promise<LibraryCandidate[]> {
  return candidatesFromRows(await findLibraryMeasurements(em, classification, groupId));
}
