import measuredDeltaOData from '@/data/measured-delta-o.json';
import { parseFormula } from './formula-parser';
import type { Checked, LigandInstance } from './types';

/** A measured octahedral Δo for one species (data/measured-delta-o.json). */
export interface MeasuredDeltaO {
  species: string;
  deltaOcm: number;
  source: string;
  checked: Checked;
}

interface MeasuredDeltaORecord extends MeasuredDeltaO {
  note?: string;
}

interface Species {
  metal: string;
  oxidationState: number;
  ligands: readonly LigandInstance[];
}

/** Same metal, oxidation state and ligand set (ids and counts). */
function keyOf(species: Species): string {
  const counts = new Map<string, number>();
  for (const instance of species.ligands) counts.set(instance.ligand.id, (counts.get(instance.ligand.id) ?? 0) + instance.count);
  const set = [...counts].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([id, count]) => `${id}:${count}`);
  return `${species.metal}/${species.oxidationState}/${set.join(',')}`;
}

let index: Map<string, MeasuredDeltaO> | null = null;

/** Built on first use: each record's formula through the same parser, keyed by species. */
function measuredIndex(): Map<string, MeasuredDeltaO> {
  if (index) return index;
  index = new Map();
  for (const record of measuredDeltaOData.values as MeasuredDeltaORecord[]) {
    const { species, deltaOcm, source, checked } = record;
    index.set(keyOf(parseFormula(species)), { species, deltaOcm, source, checked });
  }
  return index;
}

/** The measured Δo of this species, or null when none is tabulated. */
export function measuredDeltaOFor(species: Species): MeasuredDeltaO | null {
  return measuredIndex().get(keyOf(species)) ?? null;
}
