/**
 * Marcus cross relation for outer-sphere electron transfer.
 *
 *   k12 = (k11 · k22 · K12 · f12)^½ · W12
 *   ln f12 = [ln K12 + (w12 − w21)/RT]² / 4 [ln(k11·k22/Z²) + (w11 + w22)/RT]
 *   W12 = exp[−(w12 + w21 − w11 − w22) / 2RT]
 *
 * Without work terms (w = 0, W12 = 1) this is the textbook form
 * log f12 = (log K12)² / 4 log(k11·k22/Z²), Z = 10¹¹ M⁻¹ s⁻¹.
 * Sources: R. A. Marcus, J. Chem. Phys. 1956, 24, 966; J. Phys. Chem. 1963, 67, 853;
 * J. Chem. Phys. 1965, 43, 679; N. Sutin, Prog. Inorg. Chem. 1983, 30, 441 (extended form
 * with work terms); R. A. Marcus & N. Sutin, Biochim. Biophys. Acta 1985, 811, 265.
 *
 * Pure arithmetic: no I/O. Self-exchange constants are good to about ±0.5 log units at best and
 * several depend on the medium (cation catalysis), so the result is an order-of-magnitude guide.
 */
import { formatDecimal, formatScientific } from './number-format';

/** Collision frequency of two neutral molecules in solution (M⁻¹ s⁻¹), the usual choice (Marcus; Sutin 1983). */
export const COLLISION_FREQUENCY_Z = 1e11;

/** CODATA 2018 exact SI constants. */
export const FARADAY_C_PER_MOL = 96485.33212;
export const GAS_CONSTANT_J_PER_MOL_K = 8.314462618;
export const ELEMENTARY_CHARGE_C = 1.602176634e-19;
export const AVOGADRO_PER_MOL = 6.02214076e23;
export const BOLTZMANN_J_PER_K = 1.380649e-23;
/** CODATA 2018 recommended value (no longer exact since the 2019 SI). */
export const VACUUM_PERMITTIVITY_F_PER_M = 8.8541878128e-12;

const ZERO_CELSIUS_K = 273.15;

/**
 * |log10(observed/predicted)| at or below this counts as agreement. Common practice: the cross
 * relation is expected to hold "to an order of magnitude or so" (Taube's comment on Sutin's tests),
 * and k11 values are themselves good to ±0.5 log at best.
 */
export const CONSISTENCY_LOG_WINDOW = 1;

/** Temperatures accepted (°C): covers cold kinetics and heated aqueous work; outside, the inputs are suspect. */
export const MIN_TEMPERATURE_C = -50;
export const MAX_TEMPERATURE_C = 150;
/** Range of the water-permittivity fit used for work terms (Malmberg & Maryott 1956: 0–100 °C). */
const WORK_TERM_MIN_TEMPERATURE_C = 0;
const WORK_TERM_MAX_TEMPERATURE_C = 100;

/** Relative permittivity of water at 25 °C used for the work terms (common practice). */
export const WATER_RELATIVE_PERMITTIVITY_25C = 78.4;

/**
 * Default radius of each reactant (Å) when none is given: the size of a hexaammine or hexaaqua
 * ion (common practice in Sutin's compilations, ~3.3–3.5 Å; recalled). Tris(bipyridine)
 * complexes are nearer 6.8 Å: pass radii for them.
 */
export const DEFAULT_RADIUS_ANGSTROM = 3.5;

export type MarcusField =
  | 'k11'
  | 'k22'
  | 'deltaEV'
  | 'K12'
  | 'temperatureC'
  | 'observedK12'
  | 'workTerms'
  | 'workTerms.ionicStrengthM'
  | 'workTerms.charges'
  | 'workTerms.radiiAngstrom';

/** Bad input to the cross relation: names the field and says what is wrong with it. */
export class MarcusInputError extends Error {
  readonly field: MarcusField;
  constructor(field: MarcusField, message: string) {
    super(`${field}: ${message}`);
    this.name = 'MarcusInputError';
    this.field = field;
  }
}

export interface MarcusCharges {
  /** Charge of the oxidant as it reacts (oxidised form of couple 1). */
  oxidant: number;
  /** Charge of the reductant as it reacts (reduced form of couple 2). */
  reductant: number;
  /** Charge of the oxidant after it has gained the electron. */
  oxidantReduced: number;
  /** Charge of the reductant after it has lost the electron. */
  reductantOxidised: number;
}

export interface MarcusRadii {
  /** Radius of the oxidant couple's species (both oxidation states), Å. */
  oxidant: number;
  /** Radius of the reductant couple's species (both oxidation states), Å. */
  reductant: number;
}

export interface MarcusWorkTermsInput {
  ionicStrengthM: number;
  charges: MarcusCharges;
  radiiAngstrom?: MarcusRadii;
}

export interface MarcusInput {
  /** Self-exchange rate constant of the oxidant's couple (M⁻¹ s⁻¹). */
  k11: number;
  /** Self-exchange rate constant of the reductant's couple (M⁻¹ s⁻¹). */
  k22: number;
  /** E°(oxidant couple) − E°(reductant couple), volts; give this or K12. */
  deltaEV?: number;
  /** Equilibrium constant of the cross reaction; give this or deltaEV. */
  K12?: number;
  temperatureC?: number;
  /** Measured cross-reaction rate constant (M⁻¹ s⁻¹) to compare with the prediction. */
  observedK12?: number;
  workTerms?: MarcusWorkTermsInput;
}

export type MarcusVerdict = 'consistent-with-outer-sphere' | 'faster-than-outer-sphere' | 'slower-than-predicted';

export interface MarcusComparison {
  observedK12: number;
  /** observed / predicted. */
  ratio: number;
  logRatio: number;
  verdict: MarcusVerdict;
  explanation: string;
}

export interface MarcusWorkTermsResult {
  model: string;
  ionicStrengthM: number;
  relativePermittivity: number;
  /** Debye screening parameter κ (Å⁻¹). */
  debyeKappaPerAngstrom: number;
  radiiAngstrom: MarcusRadii;
  /** Work to bring the partners of each encounter together (kJ/mol). */
  w11KJPerMol: number;
  w22KJPerMol: number;
  w12KJPerMol: number;
  w21KJPerMol: number;
  /** Work-term factor of the extended cross relation (dimensionless). */
  W12: number;
}

export interface MarcusResult {
  /** Predicted cross-reaction rate constant (M⁻¹ s⁻¹). */
  k12: number;
  f12: number;
  K12: number;
  logK12: number;
  lnf12: number;
  /** k12 with f12 = 1 and no work terms, for comparison. */
  k12WithoutF: number;
  /** ΔE° used or implied by K12 (V). */
  deltaEV: number;
  temperatureC: number;
  Z: number;
  workTerms: MarcusWorkTermsResult | null;
  comparison: MarcusComparison | null;
  notes: string[];
}

function requirePositiveFinite(field: MarcusField, value: unknown, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new MarcusInputError(field, `${what} must be a finite number (got ${String(value)})`);
  }
  if (value <= 0) {
    throw new MarcusInputError(field, `${what} must be positive (got ${value})`);
  }
  return value;
}

function requireRateConstant(field: 'k11' | 'k22', value: unknown): number {
  const k = requirePositiveFinite(field, value, 'the self-exchange rate constant (M⁻¹ s⁻¹)');
  if (k >= COLLISION_FREQUENCY_Z) {
    throw new MarcusInputError(
      field,
      `the self-exchange rate constant ${k} M⁻¹ s⁻¹ is not below the collision frequency Z = 1e11 M⁻¹ s⁻¹; no bimolecular rate constant can reach it`,
    );
  }
  return k;
}

/** F/RT in V⁻¹ at a temperature in °C. */
export function faradayOverRT(temperatureC: number): number {
  return FARADAY_C_PER_MOL / (GAS_CONSTANT_J_PER_MOL_K * (temperatureC + ZERO_CELSIUS_K));
}

/** K = exp(nFΔE°/RT) for a one-electron (n = 1) reaction. */
export function equilibriumConstantFromPotential(deltaEV: number, temperatureC = 25): number {
  return Math.exp(faradayOverRT(temperatureC) * deltaEV);
}

/**
 * Relative permittivity of water: 78.4 at 25 °C (common practice), scaled to other temperatures
 * with the Malmberg–Maryott fit ε(t) = 87.740 − 0.40008 t + 9.398e-4 t² − 1.410e-6 t³
 * (C. G. Malmberg & A. A. Maryott, J. Res. Natl. Bur. Stand. 1956, 56, 1; recalled).
 */
export function waterRelativePermittivity(temperatureC: number): number {
  const fit = (t: number): number => 87.74 - 0.40008 * t + 9.398e-4 * t * t - 1.41e-6 * t * t * t;
  return (WATER_RELATIVE_PERMITTIVITY_25C * fit(temperatureC)) / fit(25);
}

/** Debye screening parameter κ (Å⁻¹) for a 1:1-type ionic strength I (mol/L) in water. */
export function debyeKappaPerAngstrom(ionicStrengthM: number, temperatureC: number): number {
  const relativePermittivity = waterRelativePermittivity(temperatureC);
  const temperatureK = temperatureC + ZERO_CELSIUS_K;
  // κ² = 2 N_A e² I / (ε0 εr kB T), with I in mol/m³ (×1000 from mol/L).
  const kappaSquaredPerM2 =
    (2 * AVOGADRO_PER_MOL * ELEMENTARY_CHARGE_C ** 2 * ionicStrengthM * 1000) /
    (VACUUM_PERMITTIVITY_F_PER_M * relativePermittivity * BOLTZMANN_J_PER_K * temperatureK);
  return Math.sqrt(kappaSquaredPerM2) * 1e-10;
}

/**
 * Debye–Hückel-screened Coulomb work to bring two ions to contact (kJ/mol):
 * w = z1 z2 e² N_A / [4π ε0 εr r (1 + κ r)], r = r1 + r2 (common practice; Sutin 1983 uses
 * this form, often quoted as 4.23 z1 z2 / [r(1 + 0.329 r √I)] kcal/mol with r in Å at 25 °C).
 */
export function coulombWorkKJPerMol(
  chargeA: number,
  chargeB: number,
  distanceAngstrom: number,
  ionicStrengthM: number,
  temperatureC: number,
): number {
  const relativePermittivity = waterRelativePermittivity(temperatureC);
  const kappa = debyeKappaPerAngstrom(ionicStrengthM, temperatureC);
  const distanceM = distanceAngstrom * 1e-10;
  const joulesPerMol =
    (chargeA * chargeB * ELEMENTARY_CHARGE_C ** 2 * AVOGADRO_PER_MOL) /
    (4 * Math.PI * VACUUM_PERMITTIVITY_F_PER_M * relativePermittivity * distanceM * (1 + kappa * distanceAngstrom));
  return joulesPerMol / 1000;
}

function validateCharges(charges: unknown): MarcusCharges {
  if (typeof charges !== 'object' || charges === null) {
    throw new MarcusInputError('workTerms.charges', 'give the charges {oxidant, reductant, oxidantReduced, reductantOxidised}');
  }
  const record = charges as Record<string, unknown>;
  const keys = ['oxidant', 'reductant', 'oxidantReduced', 'reductantOxidised'] as const;
  const out: Record<(typeof keys)[number], number> = { oxidant: 0, reductant: 0, oxidantReduced: 0, reductantOxidised: 0 };
  for (const key of keys) {
    const value = record[key];
    if (typeof value !== 'number' || !Number.isInteger(value) || Math.abs(value) > 10) {
      throw new MarcusInputError('workTerms.charges', `charges.${key} must be an integer between −10 and 10 (got ${String(value)})`);
    }
    out[key] = value;
  }
  if (out.oxidantReduced !== out.oxidant - 1) {
    throw new MarcusInputError(
      'workTerms.charges',
      `charges.oxidantReduced (${out.oxidantReduced}) must be one less than charges.oxidant (${out.oxidant}) for a one-electron step`,
    );
  }
  if (out.reductantOxidised !== out.reductant + 1) {
    throw new MarcusInputError(
      'workTerms.charges',
      `charges.reductantOxidised (${out.reductantOxidised}) must be one more than charges.reductant (${out.reductant}) for a one-electron step`,
    );
  }
  return out;
}

function validateRadii(radii: unknown): MarcusRadii {
  if (radii === undefined) return { oxidant: DEFAULT_RADIUS_ANGSTROM, reductant: DEFAULT_RADIUS_ANGSTROM };
  if (typeof radii !== 'object' || radii === null) {
    throw new MarcusInputError('workTerms.radiiAngstrom', 'give radii as {oxidant, reductant} in Å');
  }
  const record = radii as Record<string, unknown>;
  const out: MarcusRadii = { oxidant: 0, reductant: 0 };
  for (const key of ['oxidant', 'reductant'] as const) {
    const value = record[key];
    if (typeof value !== 'number' || !Number.isFinite(value) || value < 1 || value > 20) {
      throw new MarcusInputError('workTerms.radiiAngstrom', `radiiAngstrom.${key} must be between 1 and 20 Å (got ${String(value)})`);
    }
    out[key] = value;
  }
  return out;
}

function compare(observedK12: number, predictedK12: number): MarcusComparison {
  const ratio = observedK12 / predictedK12;
  const logRatio = Math.log10(ratio);
  const window = CONSISTENCY_LOG_WINDOW;
  if (Math.abs(logRatio) <= window) {
    return {
      observedK12,
      ratio,
      logRatio,
      verdict: 'consistent-with-outer-sphere',
      explanation:
        `Observed k12 is within a factor of ${10 ** window} of the outer-sphere prediction ` +
        `(|log(obs/pred)| = ${formatDecimal(Math.abs(logRatio), 2)} ≤ ${window}); agreement is what an outer-sphere route ` +
        'leads one to expect, though on its own it does not exclude a bridged route.',
    };
  }
  if (logRatio > window) {
    return {
      observedK12,
      ratio,
      logRatio,
      verdict: 'faster-than-outer-sphere',
      explanation:
        `Observed k12 is ${formatScientific(ratio, 2)} times the outer-sphere prediction (log ratio ${formatDecimal(logRatio, 2)} > ${window}): ` +
        'a path the cross relation does not describe is likely, most often a bridged (inner-sphere) route; ' +
        'also check for catalysis by the medium (e.g. cation catalysis of anion couples) and the k11 values used.',
    };
  }
  return {
    observedK12,
    ratio,
    logRatio,
    verdict: 'slower-than-predicted',
    explanation:
      `Observed k12 is ${formatScientific(1 / ratio, 2)} times slower than the prediction (log ratio ${formatDecimal(logRatio, 2)} < −${window}): ` +
      'work terms, non-adiabatic transfer, a spin change, or an unsuitable k11 (e.g. the anomalously slow cross reactions ' +
      'of aqueous Fe(III)/Fe(II)) are the usual suspects; a bridged route cannot make a reaction slower than the outer-sphere path.',
  };
}

/**
 * Predicts the cross-reaction rate constant k12 from the self-exchange constants and the driving
 * force. Throws MarcusInputError on bad input.
 */
export function marcusCrossRate(input: MarcusInput): MarcusResult {
  if (typeof input !== 'object' || input === null) {
    throw new MarcusInputError('k11', 'give an object with k11, k22 and deltaEV or K12');
  }
  const k11 = requireRateConstant('k11', input.k11);
  const k22 = requireRateConstant('k22', input.k22);

  const temperatureC = input.temperatureC ?? 25;
  if (typeof temperatureC !== 'number' || !Number.isFinite(temperatureC)) {
    throw new MarcusInputError('temperatureC', `temperature must be a finite number in °C (got ${String(temperatureC)})`);
  }
  if (temperatureC < MIN_TEMPERATURE_C || temperatureC > MAX_TEMPERATURE_C) {
    throw new MarcusInputError(
      'temperatureC',
      `temperature ${temperatureC} °C is outside ${MIN_TEMPERATURE_C}…${MAX_TEMPERATURE_C} °C (is it in kelvin? the field is °C)`,
    );
  }

  const hasDelta = input.deltaEV !== undefined;
  const hasK = input.K12 !== undefined;
  if (hasDelta === hasK) {
    throw new MarcusInputError(
      hasDelta ? 'K12' : 'deltaEV',
      hasDelta ? 'give either deltaEV or K12, not both' : 'give the driving force as deltaEV (V) or K12',
    );
  }

  const fOverRT = faradayOverRT(temperatureC);
  let K12: number;
  let deltaEV: number;
  if (hasDelta) {
    const value = input.deltaEV;
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new MarcusInputError('deltaEV', `ΔE° must be a finite number of volts (got ${String(value)})`);
    }
    if (Math.abs(value) > 5) {
      throw new MarcusInputError('deltaEV', `ΔE° = ${value} V is beyond ±5 V; is it in mV? the field is volts`);
    }
    deltaEV = value;
    K12 = Math.exp(fOverRT * deltaEV);
  } else {
    K12 = requirePositiveFinite('K12', input.K12, 'the equilibrium constant K12');
    deltaEV = Math.log(K12) / fOverRT;
  }

  let observedK12: number | null = null;
  if (input.observedK12 !== undefined) {
    observedK12 = requirePositiveFinite('observedK12', input.observedK12, 'the observed rate constant (M⁻¹ s⁻¹)');
  }

  const notes: string[] = [];
  const RT = (GAS_CONSTANT_J_PER_MOL_K * (temperatureC + ZERO_CELSIUS_K)) / 1000; // kJ/mol
  const lnK12 = Math.log(K12);
  const lnRateProduct = Math.log((k11 * k22) / COLLISION_FREQUENCY_Z ** 2);

  let workTerms: MarcusWorkTermsResult | null = null;
  let lnf12: number;
  let lnW12 = 0;
  if (input.workTerms !== undefined) {
    const wt = input.workTerms;
    if (typeof wt !== 'object' || wt === null) {
      throw new MarcusInputError('workTerms', 'give {ionicStrengthM, charges, radiiAngstrom?}');
    }
    const I = wt.ionicStrengthM;
    if (typeof I !== 'number' || !Number.isFinite(I) || I < 0 || I > 5) {
      throw new MarcusInputError('workTerms.ionicStrengthM', `ionic strength must be between 0 and 5 M (got ${String(I)})`);
    }
    if (temperatureC < WORK_TERM_MIN_TEMPERATURE_C || temperatureC > WORK_TERM_MAX_TEMPERATURE_C) {
      throw new MarcusInputError(
        'temperatureC',
        `work terms use the permittivity of liquid water, fitted for 0…100 °C only (got ${temperatureC} °C)`,
      );
    }
    const charges = validateCharges(wt.charges);
    const radii = validateRadii(wt.radiiAngstrom);
    const r11 = 2 * radii.oxidant;
    const r22 = 2 * radii.reductant;
    const r12 = radii.oxidant + radii.reductant;
    const w11 = coulombWorkKJPerMol(charges.oxidant, charges.oxidantReduced, r11, I, temperatureC);
    const w22 = coulombWorkKJPerMol(charges.reductant, charges.reductantOxidised, r22, I, temperatureC);
    const w12 = coulombWorkKJPerMol(charges.oxidant, charges.reductant, r12, I, temperatureC);
    const w21 = coulombWorkKJPerMol(charges.oxidantReduced, charges.reductantOxidised, r12, I, temperatureC);
    const denominator = 4 * (lnRateProduct + (w11 + w22) / RT);
    if (denominator >= 0) {
      throw new MarcusInputError(
        'workTerms',
        'the work terms exceed the intrinsic barrier term ln(k11·k22/Z²); the extended relation is not defined for these inputs',
      );
    }
    lnf12 = (lnK12 + (w12 - w21) / RT) ** 2 / denominator;
    lnW12 = -(w12 + w21 - w11 - w22) / (2 * RT);
    workTerms = {
      model:
        'Debye–Hückel-screened Coulomb work w = z1·z2·e²·N_A / [4π·ε0·εr·r·(1 + κr)] at contact (r = r1 + r2) in water; ' +
        'extended cross relation with W12 (N. Sutin, Prog. Inorg. Chem. 1983, 30, 441); εr 78.4 at 25 °C',
      ionicStrengthM: I,
      relativePermittivity: waterRelativePermittivity(temperatureC),
      debyeKappaPerAngstrom: debyeKappaPerAngstrom(I, temperatureC),
      radiiAngstrom: radii,
      w11KJPerMol: w11,
      w22KJPerMol: w22,
      w12KJPerMol: w12,
      w21KJPerMol: w21,
      W12: Math.exp(lnW12),
    };
    if (wt.radiiAngstrom === undefined) {
      notes.push(`Radii not given: ${DEFAULT_RADIUS_ANGSTROM} Å assumed for every species (hexaammine/hexaaqua size).`);
    }
    notes.push('Work terms assume the self-exchange constants were measured at the same ionic strength.');
  } else {
    // Textbook form; lnRateProduct < 0 because k11, k22 < Z.
    lnf12 = lnK12 ** 2 / (4 * lnRateProduct);
  }

  const f12 = Math.exp(lnf12);
  const k12 = Math.sqrt(k11 * k22 * K12 * f12) * Math.exp(lnW12);
  const k12WithoutF = Math.sqrt(k11 * k22 * K12);

  if (workTerms === null) notes.push('Work terms neglected (or taken to cancel), as in the textbook form.');
  if (f12 < 0.1) {
    notes.push(`Large driving force: f12 = ${formatScientific(f12, 3)} lowers k12 ${formatScientific(1 / Math.sqrt(f12), 2)}-fold; do not drop it.`);
  }
  if (k12 > 1e10) {
    notes.push('Predicted k12 exceeds the diffusion limit (about 10⁹–10¹⁰ M⁻¹ s⁻¹): the observed rate will be diffusion-controlled.');
  }
  if (K12 > 1e20 || K12 < 1e-20) {
    notes.push('|log K12| > 20: far outside the range where the cross relation has been tested (inverted region not modelled).');
  }
  notes.push(
    `Self-exchange constants are good to about ±0.5 log units at best; agreement is judged within ±${CONSISTENCY_LOG_WINDOW} log unit.`,
  );

  return {
    k12,
    f12,
    K12,
    logK12: Math.log10(K12),
    lnf12,
    k12WithoutF,
    deltaEV,
    temperatureC,
    Z: COLLISION_FREQUENCY_Z,
    workTerms,
    comparison: observedK12 === null ? null : compare(observedK12, k12),
    notes,
  };
}
