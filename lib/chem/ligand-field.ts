/**
 * Ligand field: Jørgensen Δo = f·g, spin state with a calibrated pairing rule, LFSE and the
 * Basolo–Pearson crystal-field activation energies (CFAE).
 */
import * as ligandsModule from './ligands';
import * as numberFormat from './number-format';
import type { MetalElement, MetalIon } from './metal-ions';
import type { Geometry, LigandInstance, SpinState } from './types';

// Read once: under tsx each use of an imported name is a getter call (see classify.ts).
const { ligandFieldFactor } = ligandsModule;
const { formatInteger } = numberFormat;

/** 1 cm⁻¹ = 0.01196266 kJ/mol (CODATA conversion, hc·N_A). */
export const KJ_PER_MOL_PER_CM = 0.01196266;

// d-orbital energies in Dq (cfse_cfae.json: octahedron and square pyramid from Day & Selbin,
// Theoretical Inorganic Chemistry 1962, p. 292; pentagonal bipyramid as used by Basolo & Pearson 1967).
const OCTAHEDRON_DQ = [-4, -4, -4, 6, 6] as const;
const SQUARE_PYRAMID_DQ = [-4.57, -4.57, -0.86, 0.86, 9.14] as const;
const PENTAGONAL_BIPYRAMID_DQ = [-5.28, -5.28, 2.82, 2.82, 4.93] as const;

export interface OrbitalOccupancy {
  t2g: number;
  eg: number;
  unpaired: number;
}

/** Octahedral t2g/eg filling for d^n in the given spin state (Hund's rule within each set). */
export function octahedralOccupancy(dElectrons: number, spin: SpinState): OrbitalOccupancy {
  let t2g: number;
  let eg: number;
  if (spin === 'low') {
    t2g = Math.min(dElectrons, 6);
    eg = dElectrons - t2g;
  } else if (dElectrons <= 3) {
    t2g = dElectrons;
    eg = 0;
  } else if (dElectrons <= 5) {
    t2g = 3;
    eg = dElectrons - 3;
  } else if (dElectrons <= 8) {
    t2g = dElectrons - 2;
    eg = 2;
  } else {
    t2g = 6;
    eg = dElectrons - 6;
  }
  const unpaired = (t2g <= 3 ? t2g : 6 - t2g) + (eg <= 2 ? eg : 4 - eg);
  return { t2g, eg, unpaired };
}

/** Octahedral LFSE in Dq (−4 per t2g, +6 per eg electron), pairing energy NOT included (cfse_cfae.json "CFSE_Dq", convention C). */
export function octahedralLfseDq(dElectrons: number, spin: SpinState): number {
  const { t2g, eg } = octahedralOccupancy(dElectrons, spin);
  return -4 * t2g + 6 * eg;
}

/**
 * Tetrahedral LFSE expressed in octahedral Dq with Δt = 4/9 Δo (e at −0.6 Δt, t2 at +0.4 Δt),
 * high spin, pairing energy not included.
 */
export function tetrahedralLfseDq(dElectrons: number): number {
  let e: number;
  let t2: number;
  if (dElectrons <= 2) { e = dElectrons; t2 = 0; }
  else if (dElectrons <= 5) { e = 2; t2 = dElectrons - 2; }
  else if (dElectrons <= 7) { e = dElectrons - 3; t2 = 3; }
  else { e = 4; t2 = dElectrons - 4; }
  return ((-6 * e + 4 * t2) * 4) / 9;
}

/** Lowest one-electron energy with `unpaired` singly occupied orbitals (the rest doubly occupied). */
function lowestEnergyDq(energies: readonly number[], dElectrons: number, unpaired: number): number {
  const sorted = [...energies].sort((a, b) => a - b);
  const pairs = (dElectrons - unpaired) / 2;
  let total = 0;
  for (let index = 0; index < pairs + unpaired && index < 5; index++) {
    total += (index < pairs ? 2 : 1) * (sorted[index] ?? 0);
  }
  return total;
}

export interface ActivationEnergyDq {
  /** Octahedron → square pyramid (dissociative, CN5). */
  dissociative: number;
  /** Octahedron → pentagonal bipyramid (associative, CN7). */
  associative: number;
}

/**
 * Crystal-field activation energy (Basolo & Pearson 1967): CFSE(transition state) − CFSE(octahedron),
 * keeping the number of unpaired electrons; positive = stabilisation lost = slower.
 * Values come straight from the orbital energies, so they carry the ±0.01–0.02 Dq rounding of
 * the printed pentagonal-bipyramid energies (cfse_cfae.json CFAE_method).
 */
function computeActivationEnergyDq(dElectrons: number, spin: SpinState): ActivationEnergyDq {
  const { unpaired } = octahedralOccupancy(dElectrons, spin);
  const ground = lowestEnergyDq(OCTAHEDRON_DQ, dElectrons, unpaired);
  const round = (value: number): number => Math.round(value * 100) / 100;
  return {
    dissociative: round(lowestEnergyDq(SQUARE_PYRAMID_DQ, dElectrons, unpaired) - ground),
    associative: round(lowestEnergyDq(PENTAGONAL_BIPYRAMID_DQ, dElectrons, unpaired) - ground),
  };
}

// Built once: d0–d10 × high/low spin (the values never change).
const ACTIVATION_TABLE: readonly Readonly<Record<SpinState, ActivationEnergyDq>>[] = Array.from({ length: 11 }, (_, d) => ({
  high: Object.freeze(computeActivationEnergyDq(d, 'high')),
  low: Object.freeze(computeActivationEnergyDq(d, 'low')),
}));

export function activationEnergyDq(dElectrons: number, spin: SpinState): ActivationEnergyDq {
  const row = ACTIVATION_TABLE[dElectrons];
  if (!row) throw new RangeError(`d electron count ${dElectrons} is outside 0–10`);
  const values = row[spin];
  return { dissociative: values.dissociative, associative: values.associative };
}

export interface DeltaOEstimate {
  /** Jørgensen estimate f(avg)·g in cm⁻¹ (rounded to 1 cm⁻¹). */
  deltaOcm: number;
  fAverage: number;
  g: number;
  gKind: 'jorgensen' | 'aqua';
  /** true when any ligand used a rough f estimate instead of a published Jørgensen f. */
  fEstimated: boolean;
  /** Δo with π-acceptor ligands weighted up for back-bonding: used for spin and kinetics only. */
  effectiveDeltaOcm: number;
}

/** Back-bonding makes π-acceptors stronger than their f (fitted from Cr/Co(III)) suggests for low-valent/d6 ions: ×1.3, calibrated on [Fe(bpy)3]²⁺ (low spin) vs [Fe(en)3]²⁺ (high spin). */
const PI_ACCEPTOR_WEIGHT = 1.3;
/** Cyanide, carbonyl and nitrosyl: ×1.6, calibrated on the measured Δo of [Fe(CN)6]⁴⁻ (32,800 cm⁻¹) and [Fe(CN)6]³⁻ (35,000 cm⁻¹) against f·g (17,680 and 23,800; jorgensen.json). */
const STRONG_PI_ACCEPTOR_WEIGHT = 1.6;
const STRONG_PI_ACCEPTORS = new Set(['CN', 'CO', 'NO']);

function piWeight(id: string, bondingClass: string): number {
  if (STRONG_PI_ACCEPTORS.has(id)) return STRONG_PI_ACCEPTOR_WEIGHT;
  return bondingClass === 'pi-acceptor' ? PI_ACCEPTOR_WEIGHT : 1;
}

/** The metal factor: published g, or Δo(aqua)/1000 (f(H2O) = 1 by definition) where g is missing or flagged unreliable. */
export function metalFactor(ion: MetalIon | undefined): { g: number; kind: 'jorgensen' | 'aqua' } | null {
  if (!ion) return null;
  if (ion.jorgensenG !== null && ion.jorgensenGReliable !== false) return { g: ion.jorgensenG, kind: 'jorgensen' };
  if (ion.aquaDeltaOcm !== null) return { g: ion.aquaDeltaOcm / 1000, kind: 'aqua' };
  return null;
}

/**
 * Δo = f(avg)·g (Jørgensen), f averaged over donor positions (each ligand weighted by
 * denticity × count). Null when g is unknown or a ligand has no f.
 */
export function estimateDeltaO(ligands: readonly LigandInstance[], ion: MetalIon | undefined): DeltaOEstimate | null {
  const metal = metalFactor(ion);
  if (metal === null) return null;
  const average = averageLigandFactor(ligands);
  if (average === null) return null;
  return {
    deltaOcm: Math.round(average.fAverage * metal.g * 1000),
    fAverage: average.fAverage,
    g: metal.g,
    gKind: metal.kind,
    fEstimated: average.fEstimated,
    effectiveDeltaOcm: average.fEffective * metal.g * 1000,
  };
}

/** Donor-position-weighted mean f, plain and with π-acceptors weighted up; null if a ligand has no f. */
export function averageLigandFactor(
  ligands: readonly LigandInstance[],
): { fAverage: number; fEffective: number; fEstimated: boolean } | null {
  let weighted = 0;
  let weightedEffective = 0;
  let positions = 0;
  let fEstimated = false;
  for (const instance of ligands) {
    const factor = ligandFieldFactor(instance.ligand);
    if (factor === null) return null;
    const sites = instance.ligand.denticity * instance.count;
    weighted += factor.f * sites;
    weightedEffective += factor.f * sites * piWeight(instance.ligand.id, instance.ligand.bondingClass);
    positions += sites;
    if (factor.estimated) fEstimated = true;
  }
  if (positions === 0) return null;
  return { fAverage: weighted / positions, fEffective: weightedEffective / positions, fEstimated };
}

/**
 * Nephelauxetic reduction of the free-ion pairing energy in complexes (~15–30 %, jorgensen.json
 * caution): 20 % is used, calibrated so that [Co(H2O)6]³⁺ is low spin and [CoF6]³⁻ high spin.
 */
export const PAIRING_REDUCTION = 0.8;
/** "Near spin crossover" when the effective Δo is within 12 % of the reduced pairing energy. */
export const CROSSOVER_WINDOW = 0.12;
// Used only when Orgel gives no P for the ion (rough).
const FALLBACK_FREE_ION_PAIRING_CM = 25000;

export interface SpinDecision {
  spinState: SpinState | null;
  nearSpinCrossover: boolean;
  /** Whether the geometry and d count allow two spin states. */
  hasChoice: boolean;
  basis: string;
  pairingEnergyCm: number | null;
}

const STRONG_PI_ACCEPTOR_IDS = new Set(['CN', 'CO', 'NO']);

/** A decision with no spin state to report (a module-level function: tsx names every closure it creates). */
function noSpinChoice(basis: string): SpinDecision {
  return { spinState: null, nearSpinCrossover: false, hasChoice: false, basis, pairingEnergyCm: null };
}

export function decideSpin(params: {
  dElectrons: number;
  electronShell: 'd' | 'f' | 'sp';
  element: MetalElement;
  ion: MetalIon | undefined;
  oxidationState: number;
  geometry: Geometry;
  ligands: readonly LigandInstance[];
  /** The answer's Δo (measured, or the π-weighted estimate); null when none could be estimated. */
  deltaOcm: number | null;
}): SpinDecision {
  const { dElectrons: d, electronShell, element, ion, geometry, ligands, deltaOcm, oxidationState } = params;
  if (electronShell !== 'd' || d === 0 || d === 10) return noSpinChoice('no spin choice (d0, d10 or not a d-block ion)');
  if (geometry === 'tetrahedral') {
    return { spinState: 'high', nearSpinCrossover: false, hasChoice: d >= 3 && d <= 6, basis: 'tetrahedral: Δt ≈ 4/9 Δo is far below any pairing energy, so high spin', pairingEnergyCm: null };
  }
  if (geometry === 'square-planar') {
    if (d === 8) return { spinState: 'low', nearSpinCrossover: false, hasChoice: true, basis: 'square-planar d8: the empty x²−y² orbital lies far above, diamagnetic (low spin)', pairingEnergyCm: null };
    return noSpinChoice('square planar, no spin choice for this d count');
  }
  if (geometry === 'sandwich' || geometry === 'bent-sandwich' || geometry === 'half-sandwich') {
    // The rings split the d set as a1g, e2g and e1g, not as t2g/eg: no octahedral Δo applies. The
    // 18-electron d6 sandwiches (ferrocene, cobaltocenium, bis(benzene)chromium) are diamagnetic
    // (common practice); other counts are left open (manganocene, for one, is high spin).
    return d === 6
      ? { spinState: 'low', nearSpinCrossover: false, hasChoice: false, basis: 'ring complex: the η5/η6 rings split the d orbitals their own way (no octahedral Δo); an 18-electron d6 ring complex is diamagnetic', pairingEnergyCm: null }
      : noSpinChoice('ring complex: the η5/η6 rings split the d orbitals their own way (no octahedral Δo), spin not predicted');
  }
  if (d < 4 || d > 7) return noSpinChoice(`d${d}: only one spin state in an octahedral field`);
  if (element.series === '4d' || element.series === '5d') {
    return { spinState: 'low', nearSpinCrossover: false, hasChoice: true, basis: `${element.series} metal: large Δo and small pairing energy, always low spin`, pairingEnergyCm: null };
  }
  let strongSites = 0;
  let sites = 0;
  for (const instance of ligands) {
    const n = instance.ligand.denticity * instance.count;
    sites += n;
    if (STRONG_PI_ACCEPTOR_IDS.has(instance.ligand.id) || instance.ligand.organometallic === true) strongSites += n;
  }
  const freeIonPairing = ion?.pairingEnergyCm ?? null;
  if (sites > 0 && strongSites / sites >= 0.5) {
    const pairing = freeIonPairing === null ? null : freeIonPairing * PAIRING_REDUCTION;
    const basis =
      deltaOcm !== null && pairing !== null && deltaOcm > pairing
        ? `cyanide, carbonyl or organometallic ligands dominate: Δo ≈ ${formatInteger(deltaOcm)} cm⁻¹ is above the pairing energy in the complex (≈ ${formatInteger(pairing)} cm⁻¹), low spin`
        : 'cyanide, carbonyl or organometallic ligands dominate: their complexes are low spin (common practice)';
    return { spinState: 'low', nearSpinCrossover: false, hasChoice: true, basis, pairingEnergyCm: pairing };
  }
  if (deltaOcm === null) {
    // No Δo: high oxidation states and amine-or-stronger ligand sets go low spin (common practice).
    const low = oxidationState >= 4;
    return { spinState: low ? 'low' : 'high', nearSpinCrossover: false, hasChoice: true, basis: low ? 'Δo only roughly known: a high oxidation state is taken as low spin (common practice)' : 'Δo only roughly known: a 3d ion is taken as high spin (common practice)', pairingEnergyCm: null };
  }
  const reducedPairing = (freeIonPairing ?? FALLBACK_FREE_ION_PAIRING_CM) * PAIRING_REDUCTION;
  const effective = deltaOcm;
  const low = effective > reducedPairing;
  const near = Math.abs(effective - reducedPairing) / reducedPairing < CROSSOVER_WINDOW;
  const pairingText = freeIonPairing === null ? `an assumed pairing energy (about ${formatInteger(reducedPairing)} cm⁻¹, rough)` : `the pairing energy reduced in the complex (0.8 × ${formatInteger(freeIonPairing)} = ${formatInteger(reducedPairing)} cm⁻¹)`;
  return {
    spinState: low ? 'low' : 'high',
    nearSpinCrossover: near,
    hasChoice: true,
    basis: `Δo ≈ ${formatInteger(effective)} cm⁻¹ is ${low ? 'above' : 'below'} ${pairingText}`,
    pairingEnergyCm: reducedPairing,
  };
}

/** Jahn–Teller: strong for an odd number of eg electrons (high-spin d4, low-spin d7, d9), weak for t2g degeneracy (d1, d2, low-spin d4/d5, high-spin d6/d7). */
export function jahnTellerKind(dElectrons: number, spin: SpinState | null, geometry: Geometry): 'strong' | 'weak' | null {
  if (geometry !== 'octahedral') return null;
  const { t2g, eg } = octahedralOccupancy(dElectrons, spin ?? 'high');
  if (eg === 1 || eg === 3) return 'strong';
  if (t2g !== 0 && t2g !== 3 && t2g !== 6) return 'weak';
  return null;
}
