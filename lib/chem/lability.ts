/**
 * Lability model: an estimated log10 k (s⁻¹, first-order ligand/water exchange, 298 K) built from
 * charge density, the crystal-field activation energy in kJ/mol, e_g occupancy, vacant t2g
 * orbitals, Jahn–Teller distortion and the row of the metal — not the d-count rule alone.
 *
 * Calibration: least-squares fit to the 19 aqua ions with numeric k_ex in
 * the water-exchange reference notes (Helm & Merbach 2005 and the primary papers cited
 * there); residuals within ±1.1 log units (see tests/lib/chem/lability.test.ts). Square-planar d8,
 * 18-electron organometallics and f-block ions use the separate, rougher rules below.
 */
import * as numberFormat from './number-format';
import type { Confidence, Geometry, LigandInstance, MeasuredRate, SpinState } from './types';

import { ONE_MINUTE_LOG_K, verdictFromLogK } from './verdict-bands';

// Read once: under tsx each use of an imported name is a getter call (see classify.ts).
const { formatFixed, formatInteger } = numberFormat;

// The verdict bands live in verdict-bands.ts (one definition for the whole product).
export { ONE_MINUTE_LOG_K, verdictFromLogK };

const BOLTZMANN = 1.380649e-23; // J/K
const PLANCK = 6.62607015e-34; // J s
const GAS_CONSTANT = 8.314462618; // J/(mol K)
const T_REFERENCE_K = 298.15;

// Fitted coefficients (log10 units).
const INTERCEPT = 8.6;
const CHARGE_DENSITY_SLOPE = 60; // per (z²/r, pm⁻¹)
const NOBLE_GAS_CORE = 1.0; // Mg²⁺, Al³⁺: no d shell
const PER_VACANT_T2G = 2.4; // associative path through an empty t2g orbital (Taube 1952)
const PER_EG_ELECTRON = 0.6; // σ-antibonding e_g electrons weaken M–L bonds
const CFAE_FRACTION = 0.22; // fraction of the CFAE (kJ/mol) that appears in the barrier
const TAUBE_INERT_CLASS = -3.2; // d3 and low-spin d4–d6: no vacant t2g and an empty e_g set
const JAHN_TELLER_STRONG = 2.5; // Cu²⁺, Cr²⁺: the long axis exchanges very fast
const HEAVY_ROW = -1.1; // 4d/5d: stronger, more covalent bonds beyond the larger Δo
const F_BLOCK = 6.0; // high CN, non-directional 4f/5f bonding; Ln³⁺ ~1e8–1e9 s⁻¹ (Helm & Merbach 2005, recalled)
const PER_CHELATE_TOOTH = -0.3; // chelates dissociate more slowly (common practice, rough)
const CHELATE_CAP = -1.5;
const HYDROXO_CONJUGATE_BASE = 3.0; // [M(H2O)5OH]: 10^1.9–10^4.4 faster (water_exchange.json other_species)
const LOG_K_MAX = 10; // near diffusion/encounter limits
const LOG_K_MIN = -12;

/** Square-planar d8 (associative): log k by row, anchored on [Pt(H2O)4]²⁺ and [Pd(H2O)4]²⁺ (Helm, Elding & Merbach 1984/1985) and Ni ≫ Pd (common practice). */
const SQUARE_PLANAR_LOG_K: Record<string, number> = { '3d': 5.0, '4d': 2.7, '5d': -3.4 };
const SQUARE_PLANAR_PER_CHARGE_STEP = 2.0; // Au(III), Rh(I), Ir(I) vs Pt(II): rough, recalled

/** 18-electron organometallics substitute dissociatively and slowly at 25 °C (common practice). */
const EIGHTEEN_ELECTRON_LOG_K: Record<string, number> = { '3d': -6, '4d': -5, '5d': -7 };
const EIGHTEEN_ELECTRON_D10 = -2; // Ni(CO)4-type: CO loss k ~1e-2 s⁻¹ at 25 °C (recalled)

export interface LabilityInput {
  metal: string;
  oxidationState: number;
  series: string;
  electronShell: 'd' | 'f' | 'sp';
  dElectrons: number;
  spinState: SpinState | null;
  geometry: Geometry;
  coordinationNumber: number;
  ligands: readonly LigandInstance[];
  radiusPm: number;
  radiusEstimated: boolean;
  /** Effective Δo (cm⁻¹) for the barrier, or null. */
  deltaOcm: number | null;
  deltaORough: boolean;
  activationEnergyDq: { dissociative: number; associative: number } | null;
  egElectrons: number;
  vacantT2g: number;
  jahnTeller: 'strong' | 'weak' | null;
  valenceElectronCount: number | null;
  organometallic: boolean;
}

/** Classes where the model is weak; each comes with a reason saying why. */
export type WeakClass = 'organometallic' | 'low-valent-square-planar' | 'oxoanion' | 'macrocycle' | 'cyanide';

/** Half-width (log10 units) of the range printed for a weak class: three orders of magnitude either way. */
export const WEAK_CLASS_HALF_WIDTH = 3;

export interface LabilityPrediction {
  logKPerSecond: number;
  reasons: string[];
  /** Rules that made the estimate rougher (lower the confidence). */
  roughness: number;
  model: 'aqua-type' | 'square-planar' | 'organometallic' | 'f-block';
  /**
   * A class the aqua-ion fit does not describe (README, "Rates outside the calibration set"): the
   * answer then gives an order-of-magnitude range, never a precise half-life, with low confidence.
   */
  weakClass?: WeakClass;
}

const KJ_PER_MOL_PER_CM = 0.01196266;
const RT_LN10_KJ = (GAS_CONSTANT * T_REFERENCE_K * Math.LN10) / 1000; // 5.708 kJ/mol per log unit

function chargeDensityTerm(oxidationState: number, radiusPm: number): number {
  // Formal charges above 3 are not ionic: covalency caps the effective charge (rough).
  const z = Math.max(1, Math.min(oxidationState, 3));
  return INTERCEPT - (CHARGE_DENSITY_SLOPE * z * z) / radiusPm;
}

function chelateTerm(ligands: readonly LigandInstance[]): number {
  let extraTeeth = 0;
  for (const instance of ligands) {
    if (instance.ligand.hapticity === undefined && instance.ligand.denticity > 1) {
      extraTeeth += (instance.ligand.denticity - 1) * instance.count;
    }
  }
  return Math.max(CHELATE_CAP, PER_CHELATE_TOOTH * extraTeeth);
}

function hasLigand(ligands: readonly LigandInstance[], id: string): boolean {
  for (const instance of ligands) if (instance.ligand.id === id) return true;
  return false;
}

function signed(value: number): string {
  return `${value >= 0 ? '+' : '−'}${formatFixed(Math.abs(value), 1)}`;
}

// The charge-density reason depends on the ion alone (charge and radius), which distinct formulas
// share: a bounded memo (oxidation state → radius → text) saves building it per formula.
const CHARGE_DENSITY_MEMO_LIMIT = 1024;
const chargeDensityReasons = new Map<number, Map<number, string>>();
let chargeDensityReasonCount = 0;

function chargeDensityReason(oxidationState: number, radiusPm: number, zText: string): string {
  let byRadius = chargeDensityReasons.get(oxidationState);
  if (byRadius === undefined) {
    byRadius = new Map();
    chargeDensityReasons.set(oxidationState, byRadius);
  }
  let text = byRadius.get(radiusPm);
  if (text === undefined) {
    const zEffective = Math.max(1, Math.min(oxidationState, 3));
    const density = (zEffective * zEffective) / radiusPm;
    if (oxidationState <= 2) text = `only ${zText}: low charge density (z²/r = ${formatFixed(density * 100, 1)} per 100 pm)`;
    else if (density > 0.12) text = `${zText} on a small ion: high charge density holds the ligands (z²/r = ${formatFixed(density * 100, 1)} per 100 pm)`;
    else text = `${zText}, radius ${radiusPm} pm: moderate charge density`;
    if (chargeDensityReasonCount >= CHARGE_DENSITY_MEMO_LIMIT) {
      chargeDensityReasons.clear();
      chargeDensityReasonCount = 0;
      byRadius = new Map();
      chargeDensityReasons.set(oxidationState, byRadius);
    }
    byRadius.set(radiusPm, text);
    chargeDensityReasonCount++;
  }
  return text;
}

export function predictLogK(input: LabilityInput): LabilityPrediction {
  const reasons: string[] = [];
  let roughness = input.radiusEstimated ? 1 : 0;
  const zText = `${input.oxidationState}+`;

  // 1. Organometallic 18-electron rule.
  if (input.organometallic && input.electronShell === 'd' && input.valenceElectronCount !== null) {
    const count = input.valenceElectronCount;
    // The electron count says which path (dissociative at 18, associative below) but not how fast:
    // CO loss from 18-electron carbonyls spans many orders of magnitude (validation error ~4 log units).
    roughness += 2;
    const weak = 'the electron count gives the kind of path, not its rate (CO or ligand loss from 18-electron complexes at 25 °C ranges over many orders of magnitude and is often far slower): only an order of magnitude is given';
    if (count === 18) {
      const logK = input.dElectrons === 10 ? EIGHTEEN_ELECTRON_D10 : EIGHTEEN_ELECTRON_LOG_K[input.series] ?? -6;
      reasons.push(`18-electron organometallic (d${input.dElectrons} + ${input.coordinationNumber} × 2 e): substitution needs a ligand to leave first, slow at 25 °C; ${weak}`);
      return { logKPerSecond: logK, reasons, roughness, model: 'organometallic', weakClass: 'organometallic' };
    }
    if (count < 18) {
      reasons.push(`${count}-electron organometallic: an open site allows fast associative substitution; ${weak}`);
      return { logKPerSecond: 4, reasons, roughness, model: 'organometallic', weakClass: 'organometallic' };
    }
    reasons.push(`${count}-electron count above 18: a ligand is easily lost; ${weak}`);
    return { logKPerSecond: 6, reasons, roughness, model: 'organometallic', weakClass: 'organometallic' };
  }

  // 2. Square-planar d8: associative path, set by the row.
  if (input.geometry === 'square-planar' && input.dElectrons === 8 && input.electronShell === 'd') {
    const base = SQUARE_PLANAR_LOG_K[input.series] ?? 2.7;
    const chargeStep = Math.abs(input.oxidationState - 2);
    const logK = base + SQUARE_PLANAR_PER_CHARGE_STEP * chargeStep;
    reasons.push('square-planar d8: associative path through the open axial site');
    if (input.series === '5d') reasons.push('5d metal: larger Δo and stronger bonds make the associative path slow (Pt(II)-type)');
    else if (input.series === '4d') reasons.push('4d metal: ~10⁵–10⁶ times faster than its 5d congener (Pd(II) vs Pt(II))');
    else reasons.push('3d metal: square-planar Ni(II)-type complexes substitute fast');
    let weakClass: WeakClass | undefined;
    if (chargeStep > 0) {
      // Rh(I), Ir(I), Au(III): set from Pt(II)/Pd(II) by a rough step per charge; phosphine loss from
      // Rh(I) is off by about five log units in validation.
      roughness += 2;
      weakClass = 'low-valent-square-planar';
      reasons.push(`oxidation state ${input.oxidationState} rather than 2: the rate is carried over from Pt(II)/Pd(II) by a rough step (phosphine and other ligand loss from Rh(I) and Ir(I) is not modelled): only an order of magnitude is given`);
    }
    if (hasMacrocycle(input.ligands)) {
      roughness += 2;
      weakClass = 'macrocycle';
      reasons.push(MACROCYCLE_REASON);
    }
    return { logKPerSecond: clamp(logK + chelateTerm(input.ligands)), reasons, roughness, model: 'square-planar', ...(weakClass ? { weakClass } : {}) };
  }

  // 3. Charge density (all other ions).
  let logK = chargeDensityTerm(input.oxidationState, input.radiusPm);
  reasons.push(chargeDensityReason(input.oxidationState, input.radiusPm, zText));
  if (input.oxidationState > 3) reasons.push(`formal oxidation state ${input.oxidationState}: bonds are largely covalent, charge term capped at 3+`);

  if (input.electronShell === 'f') {
    logK += F_BLOCK;
    reasons.push('f-block ion: high coordination numbers and non-directional f bonding give very fast exchange');
    return { logKPerSecond: clamp(logK + chelateTerm(input.ligands)), reasons, roughness, model: 'f-block' };
  }

  if (input.electronShell === 'sp') {
    if (input.dElectrons === 0) {
      logK += NOBLE_GAS_CORE;
      reasons.push('main-group ion with a noble-gas core: no ligand-field stabilisation to lose');
    } else {
      reasons.push('main-group d10 ion: no ligand-field stabilisation to lose');
      if (input.geometry === 'octahedral') {
        // The filled d10 shell holds 4 σ-antibonding e_g electrons, as for Zn²⁺ (same fitted term).
        logK += PER_EG_ELECTRON * 4;
      }
    }
  } else {
    const d = input.dElectrons;
    if (d === 0) reasons.push('d0: empty d shell, no ligand-field barrier');
    if (d === 10) reasons.push('d10: filled d shell, no ligand-field stabilisation to lose');
    if (input.vacantT2g > 0 && input.geometry === 'octahedral') {
      logK += PER_VACANT_T2G * input.vacantT2g;
      reasons.push(`${input.vacantT2g} vacant t2g orbital${input.vacantT2g > 1 ? 's' : ''}: an entering ligand can attack (associative path)`);
    } else if (d === 0) {
      logK += PER_VACANT_T2G * 3;
    }
    if (input.egElectrons > 0 && input.geometry === 'octahedral') {
      logK += PER_EG_ELECTRON * input.egElectrons;
      reasons.push(`${input.egElectrons} σ-antibonding eg electron${input.egElectrons > 1 ? 's' : ''}: weaker metal–ligand bonds`);
    }
    const octahedralLike = input.geometry === 'octahedral';
    const taubeInert = octahedralLike && input.egElectrons === 0 && input.vacantT2g === 0 && d >= 3 && d <= 6;
    if (taubeInert) {
      logK += TAUBE_INERT_CLASS;
      reasons.push(taubeInertReason(d, zText));
    }
    if (octahedralLike && input.activationEnergyDq !== null) {
      const cfaeDq = Math.min(input.activationEnergyDq.dissociative, input.activationEnergyDq.associative);
      if (cfaeDq > 0) {
        if (input.deltaOcm !== null) {
          const cfaeKJ = cfaeDq * (input.deltaOcm / 10) * KJ_PER_MOL_PER_CM;
          const change = -(CFAE_FRACTION * cfaeKJ) / RT_LN10_KJ;
          logK += change;
          reasons.push(`crystal-field activation energy ${formatFixed(cfaeDq, 2)} Dq ≈ ${Math.round(cfaeKJ)} kJ mol⁻¹ with Δo ≈ ${formatInteger(input.deltaOcm)} cm⁻¹ (${signed(change)} log units)`);
          if (input.deltaORough) roughness += 1;
        } else {
          roughness += 1;
          reasons.push(`crystal-field activation energy ${formatFixed(cfaeDq, 2)} Dq, but no Δo estimate to put it in kJ mol⁻¹`);
        }
      }
    }
    if (input.jahnTeller === 'strong') {
      logK += JAHN_TELLER_STRONG;
      reasons.push('strong Jahn–Teller distortion: the long, weak axial bonds exchange very fast');
    }
    // The heavier rows' stronger, more covalent bonds slow exchange only where a ligand field is lost
    // on the way to the transition state: not for d0 or d10 (Ag⁺, Cd²⁺, Hg²⁺ exchange fast).
    if ((input.series === '4d' || input.series === '5d') && d > 0 && d < 10) {
      logK += HEAVY_ROW;
      reasons.push(`${input.series} metal: larger Δo and stronger bonds than its 3d congener`);
    }
  }

  if (input.oxidationState >= 3 && hasLigand(input.ligands, 'OH')) {
    logK += HYDROXO_CONJUGATE_BASE;
    reasons.push('hydroxo ligand: π-donation labilises the other ligands (conjugate-base effect)');
  }
  const chelate = chelateTerm(input.ligands);
  if (chelate < 0) {
    logK += chelate;
    reasons.push('chelating ligands: all teeth must let go, slower dissociation');
  }
  // Classes the aqua-ion fit does not describe (out-of-sample errors of 7–12 log units, README):
  // say so and lower the confidence rather than print a half-life the model cannot back.
  let weakClass: WeakClass | undefined;
  if (hasLigand(input.ligands, 'O') && input.dElectrons === 0 && input.oxidationState >= 5) {
    roughness += 2;
    weakClass = 'oxoanion';
    reasons.push('d0 oxoanion: oxygen exchange with water is not described by this model (neutral MnO4⁻ and CrO4²⁻ exchange over hours to days); the rate is only a guess');
  }
  if (hasMacrocycle(input.ligands)) {
    roughness += 2;
    weakClass = 'macrocycle';
    reasons.push(MACROCYCLE_REASON);
  }
  if (weakClass === undefined && input.coordinationNumber > 6 && cyanideShare(input.ligands) >= 0.5) {
    // [Mo(CN)8]4− is inert where the aqua-ion terms call it labile (validation error ~7 log units);
    // the hexacyano complexes of the 3d metals come out inert, as published, and keep their half-life.
    roughness += 2;
    weakClass = 'cyanide';
    reasons.push('high-coordinate cyanide complex: cyanide exchange of the octacyano complexes is not described by this model (π back-bonding and coordination numbers above six lie outside the aqua-ion fit): only an order of magnitude is given');
  }
  return { logKPerSecond: clamp(logK), reasons, roughness, model: 'aqua-type', ...(weakClass ? { weakClass } : {}) };
}

/** Why an octahedral d3 or low-spin d4–d6 ion is slow, in words true for each count. */
function taubeInertReason(d: number, zText: string): string {
  if (d === 3) return `d3 with ${zText} charge: each t2g orbital singly occupied (t2g³), eg empty: no empty orbital to accept an entering ligand and no eg electron to weaken the bonds`;
  if (d === 6) return 'low-spin d6: t2g set filled (t2g⁶), eg empty: no empty orbital to accept an entering ligand and no eg electron to weaken the bonds';
  return `low-spin d${d}: t2g${d === 4 ? '⁴' : '⁵'} leaves no t2g orbital empty (the vacancy is a half-filled orbital, not an empty one) and eg is empty: no easy associative path and no eg electron to weaken the bonds`;
}

const MACROCYCLE_REASON = 'macrocyclic or cryptand ligand: the macrocyclic kinetic effect (dissociation far slower than for open-chain ligands) is not in this model; the rate is only a guess';

/** Share of the coordination sites held by cyanide. */
function cyanideShare(ligands: readonly LigandInstance[]): number {
  let cyanide = 0;
  let total = 0;
  for (const instance of ligands) {
    const sites = instance.ligand.denticity * instance.count;
    total += sites;
    if (instance.ligand.id === 'CN') cyanide += sites;
  }
  return total === 0 ? 0 : cyanide / total;
}

function hasMacrocycle(ligands: readonly LigandInstance[]): boolean {
  for (const instance of ligands) if (instance.ligand.macrocycle !== undefined) return true;
  return false;
}

function clamp(logK: number): number {
  return Math.min(LOG_K_MAX, Math.max(LOG_K_MIN, logK));
}

/** Eyring: k = (kB T / h) exp(ΔS‡/R) exp(−ΔH‡/RT). */
export function eyringRatePerSecond(deltaHKJPerMol: number, deltaSJPerMolK: number, temperatureK: number): number {
  return ((BOLTZMANN * temperatureK) / PLANCK) * Math.exp(deltaSJPerMolK / GAS_CONSTANT) * Math.exp((-deltaHKJPerMol * 1000) / (GAS_CONSTANT * temperatureK));
}

/**
 * Moves log10 k from 298.15 K to another temperature when only k is known: ΔG‡(298) from
 * Eyring, assumed all enthalpic (ΔS‡ = 0). Returns log10 k at temperatureK.
 */
export function scaleLogKWithoutEyring(logK298: number, temperatureK: number): number {
  if (Math.abs(temperatureK - T_REFERENCE_K) < 1e-9) return logK298;
  const prefactor298 = (BOLTZMANN * T_REFERENCE_K) / PLANCK;
  const deltaG = -GAS_CONSTANT * T_REFERENCE_K * Math.log(10 ** logK298 / prefactor298);
  return Math.log10(eyringRatePerSecond(deltaG / 1000, 0, temperatureK));
}

export function measuredLogKAt(measured: MeasuredRate, temperatureK: number): { logK: number; usedEyring: boolean } {
  if (measured.deltaHActivationKJPerMol !== null && measured.deltaSActivationJPerMolK !== null) {
    if (Math.abs(temperatureK - measured.temperatureK) < 1e-9) return { logK: Math.log10(measured.kPerSecond), usedEyring: true };
    // Anchor on the measured k and move it with ΔH‡ (ΔS‡ enters only through the measured k).
    const ratio =
      eyringRatePerSecond(measured.deltaHActivationKJPerMol, measured.deltaSActivationJPerMolK, temperatureK) /
      eyringRatePerSecond(measured.deltaHActivationKJPerMol, measured.deltaSActivationJPerMolK, measured.temperatureK);
    return { logK: Math.log10(measured.kPerSecond * ratio), usedEyring: true };
  }
  return { logK: scaleLogKWithoutEyring(Math.log10(measured.kPerSecond), temperatureK), usedEyring: false };
}

export function confidenceFrom(logK: number, roughness: number, measured: boolean): Confidence {
  if (measured) return 'high';
  const distance = Math.abs(logK - ONE_MINUTE_LOG_K);
  if (roughness >= 2 || distance < 1.5) return 'low';
  if (roughness === 1 || distance < 3) return 'medium';
  return 'high';
}
