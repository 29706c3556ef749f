/**
 * Base- and acid-assisted paths for cobalt(III) amine complexes.
 *
 * Base hydrolysis: a Co(III) complex with an N–H on an amine and a leaving group X reacts with OH⁻
 * through the amido conjugate base (the Dcb, or SN1CB, path: fast pre-equilibrium deprotonation,
 * then loss of X⁻ from the five-coordinate amido species), with the rate law
 * −d[complex]/dt = k_OH[complex][OH⁻] (F. Basolo & R. G. Pearson, Mechanisms of Inorganic
 * Reactions, 2nd edn, Wiley, 1967; M. L. Tobe & J. Burgess, Inorganic Reaction Mechanisms,
 * Longman, 1999). Acid-catalysed aquation: a basic leaving group (fluoride, carboxylates,
 * carbonate, nitrite, azide) is protonated first and leaves as the neutral acid, with
 * −d[complex]/dt = (k_aq + k_H[H⁺])[complex] (same sources).
 */
import baseHydrolysisData from '@/data/base-hydrolysis.json';
import { scientificText } from './scientific-text';
import type { Checked, LigandInstance } from './types';

export interface AssistedPath {
  kind: 'base-hydrolysis' | 'acid-catalysed-aquation';
  /** The published rate law, in the product's notation. */
  rateLaw: string;
  /** What the path means for this complex. */
  text: string;
  /** A published pair of rate constants for this species, where there is one. */
  measured?: { kOHPerMolarSecond?: number; kAquationPerSecond: number; kHPerMolarSecond?: number; temperatureC: number; source: string; checked: Checked };
}

interface BaseHydrolysisRecord {
  species: string;
  metal: string;
  oxidationState: number;
  ligands: Record<string, number>;
  kOH?: number;
  kH?: number;
  kAquation: number;
  temperatureC: number;
  source: string;
  checked: Checked;
}

const records = baseHydrolysisData.records as unknown as BaseHydrolysisRecord[];

/** Amines with an N–H that the base can remove (ammine, primary and secondary amines). */
const AMINES_WITH_NH = new Set(['NH3', 'en', 'tn', 'pn', 'dien', 'trien', 'tren', 'MeNH2', 'cyclam', 'cyclen', 'tacn', 'dach', 'gly']);
/** Anionic or neutral leaving groups that base hydrolysis displaces (common practice). */
const LEAVING_GROUPS = new Set(['Cl', 'Br', 'I', 'F', 'NO3', 'SO4', 'ONO', 'OAc', 'HCO2', 'CO3', 'N3', 'NCS', 'dmso', 'dmf', 'OCMe2', 'O2CPh']);
/** Leaving groups basic enough to take a proton before they leave (common practice). */
const BASIC_LEAVING_GROUPS = new Set(['F', 'OAc', 'HCO2', 'CO3', 'ONO', 'N3', 'O2CPh']);

function sameLigands(ligands: readonly LigandInstance[], counts: Record<string, number>): boolean {
  if (ligands.length !== Object.keys(counts).length) return false;
  return ligands.every((instance) => counts[instance.ligand.id] === instance.count);
}

/** The assisted paths that apply to a complex: none unless it is a Co(III) amine with a leaving group. */
export function assistedPaths(metal: string, oxidationState: number, ligands: readonly LigandInstance[]): AssistedPath[] {
  if (metal !== 'Co' || oxidationState !== 3) return [];
  const amine = ligands.find((instance) => AMINES_WITH_NH.has(instance.ligand.id));
  const leaving = ligands.filter((instance) => LEAVING_GROUPS.has(instance.ligand.id) && instance.ligand.denticity === 1);
  if (!amine || leaving.length === 0) return [];
  const record = records.find((entry) => entry.metal === metal && entry.oxidationState === oxidationState && sameLigands(ligands, entry.ligands));
  const leavingNames = leaving.map((instance) => instance.ligand.name).join(', ');
  const paths: AssistedPath[] = [];
  const baseText =
    `base hydrolysis: OH⁻ removes an N–H proton from ${amine.ligand.name}, and the amido conjugate base loses ${leavingNames} far faster than the parent complex (Dcb path); ` +
    'above about pH 8 this path outruns plain aquation by orders of magnitude, so work in neutral or acidic solution to keep the leaving group on';
  const baseMeasured = record?.kOH !== undefined ? { kOHPerMolarSecond: record.kOH, kAquationPerSecond: record.kAquation, temperatureC: record.temperatureC, source: record.source, checked: record.checked } : undefined;
  paths.push({
    kind: 'base-hydrolysis',
    rateLaw: 'rate = k_OH[complex][OH⁻]',
    text: baseMeasured
      ? `${baseText}; for ${record?.species} k_OH = ${baseMeasured.kOHPerMolarSecond} M⁻¹ s⁻¹ against k_aq = ${scientificText(baseMeasured.kAquationPerSecond)} s⁻¹ at ${baseMeasured.temperatureC} °C (${baseMeasured.source}), about ${scientificText(baseMeasured.kOHPerMolarSecond / baseMeasured.kAquationPerSecond, 1)} times faster at 1 M OH⁻ and still about ${scientificText((baseMeasured.kOHPerMolarSecond * 1e-4) / baseMeasured.kAquationPerSecond, 1)} times at pH 10`
      : baseText,
    ...(baseMeasured ? { measured: baseMeasured } : {}),
  });
  const basic = leaving.filter((instance) => BASIC_LEAVING_GROUPS.has(instance.ligand.id));
  if (basic.length > 0) {
    const acidRecord = record?.kH !== undefined ? record : undefined;
    const acidText = `acid-catalysed aquation: ${basic.map((instance) => instance.ligand.name).join(', ')} takes a proton and leaves as the neutral acid, so aquation speeds up in acid`;
    paths.push({
      kind: 'acid-catalysed-aquation',
      rateLaw: 'rate = (k_aq + k_H[H⁺])[complex]',
      text: acidRecord ? `${acidText}; for ${acidRecord.species} k_H = ${acidRecord.kH} M⁻¹ s⁻¹ against k_aq = ${scientificText(acidRecord.kAquation)} s⁻¹ (${acidRecord.source})` : acidText,
      ...(acidRecord ? { measured: { kHPerMolarSecond: acidRecord.kH, kAquationPerSecond: acidRecord.kAquation, temperatureC: acidRecord.temperatureC, source: acidRecord.source, checked: acidRecord.checked } } : {}),
    });
  }
  return paths;
}
