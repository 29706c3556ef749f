/**
 * Shared types of the chemistry engines (lability, route, Marcus).
 * Pure data shapes: no I/O, no React, no server code may be imported here.
 */
import type { Mechanism } from './mechanism';

/**
 * Where a parse failed: a message a chemist can act on (characters counted from 1, as people count)
 * and the 0-based character index in `position` (for highlighting).
 */
export class FormulaError extends Error {
  readonly position: number;
  readonly formula: string;
  constructor(message: string, formula: string, position: number) {
    super(message);
    this.name = 'FormulaError';
    this.formula = formula;
    this.position = position;
  }
}

/**
 * A geometry override that cannot hold the complex's ligands (square-planar for six donor atoms).
 * A FormulaError so batch callers report it per formula; `field` says which input is wrong.
 */
export class GeometryMismatchError extends FormulaError {
  readonly field = 'geometry';
  constructor(message: string, formula: string) {
    super(message, formula, -1);
    this.name = 'GeometryMismatchError';
  }
}

export type Geometry =
  | 'linear'
  | 'trigonal-planar'
  | 'tetrahedral'
  | 'square-planar'
  | 'trigonal-bipyramidal'
  | 'square-pyramidal'
  | 'octahedral'
  | 'pentagonal-bipyramidal'
  | 'square-antiprismatic'
  | 'tricapped-trigonal-prismatic'
  /** Two parallel η5/η6 rings and nothing else (ferrocene, bis(benzene)chromium). */
  | 'sandwich'
  /** Two tilted rings with other ligands between them (Cp2TiCl2). */
  | 'bent-sandwich'
  /** One η5/η6 ring and other ligands: a piano stool (CpMn(CO)3, (C6H6)Cr(CO)3). */
  | 'half-sandwich'
  | 'other';

export type Verdict = 'labile' | 'intermediate' | 'inert';
export type SpinState = 'high' | 'low';
export type Confidence = 'high' | 'medium' | 'low';

/** One entry of the ligand catalogue in data/ligands.json. */
export interface LigandDefinition {
  /** Catalogue key, e.g. "NH3", "Cl", "en", "NCS" (N-bound), "SCN" (S-bound). */
  id: string;
  name: string;
  /** Other spellings accepted by the parser, e.g. ["OH2"] for H2O. */
  aliases: string[];
  /** Elemental composition of the free ligand as coordinated (e.g. {C:2,H:8,N:2} for en). */
  composition: Record<string, number>;
  charge: number;
  denticity: number;
  /** Atoms bound to the metal, one per tooth (e.g. ["N","N"] for en). */
  donorAtoms: string[];
  /** σ-donor / π-donor / π-acceptor class (common practice). */
  bondingClass: 'sigma' | 'pi-donor' | 'pi-acceptor';
  /** Jørgensen f factor where published, else null. */
  jorgensenF: number | null;
  /** Atom that keeps a free lone pair after coordination and can bridge to a second metal, or null. */
  bridgingAtom: string | null;
  /** 'adjacent' (bridge through the donor atom) or 'remote' (through a far atom, e.g. pyrazine N4). */
  bridgeMode: 'adjacent' | 'remote' | null;
  softness: 'hard' | 'borderline' | 'soft';
  /** For ambidentate O-donor anions (carbonate, nitrate, acetate, sulfate): denticity when chelating. */
  chelatingDenticity?: number;
  hazards: string[];
  source: string;
  /** Position in the spectrochemical series (Shriver & Atkins; 0 = I⁻, weakest), null if not listed. */
  spectrochemicalRank?: number | null;
  /** Rough f where Jørgensen published none (interpolated from the series; flagged in reasons), else null. */
  fEstimate?: number | null;
  fEstimateSource?: string | null;
  /** η number for π-bound ligands (5 for Cp); denticity then counts coordination sites. */
  hapticity?: number;
  /** Metal–carbon bonded ligand (CO, Cp, Me): the 18-electron rule applies. */
  organometallic?: boolean;
  /** Ring ligand: 'macrocycle' (cyclam, porphyrins, crown ethers) or 'cryptand' (kinetic effects). */
  macrocycle?: 'macrocycle' | 'cryptand';
  /** How well the published numbers were checked (see data/ligands.json). */
  checked?: Checked;
  /** Curators' note: never shown to users or exported. */
  note?: string;
}

/** How well a published value was checked: the paper, a review table, a secondary source, or recalled and not yet checked. */
export type Checked = 'primary' | 'review' | 'secondary' | 'recalled';

/** The small marker shown beside a value for how well it was checked. */
export const CHECKED_MARKER: Readonly<Record<Checked, string>> = {
  primary: 'checked against the paper',
  review: 'from a review table',
  secondary: 'from a secondary source',
  recalled: 'recalled, not yet checked against the paper',
};

/**
 * How a formula was read when it was not a bracketed complex as written: a trivial name, a plain
 * salt or hydrate read as the species it gives in water ('dissolved') or as the complex its solid
 * holds ('solid'). `species` is the formula that was classified (it parses back to the same species).
 */
export interface FormulaReading {
  kind: 'name' | 'dissolved' | 'solid';
  written: string;
  species: string;
  /** One line for the reasons, naming what was read. */
  text: string;
  source: string | null;
  checked: Checked | null;
}

/** A ligand as it occurs in a parsed complex. */
export interface LigandInstance {
  ligand: LigandDefinition;
  /** How the user wrote it, e.g. "OH2". */
  written: string;
  count: number;
  /** 0-based character index of the ligand in the input. */
  position: number;
}

export interface IonPart {
  /** Formula of the ion as written, e.g. "NO3", "K". */
  formula: string;
  charge: number;
  count: number;
  composition: Record<string, number>;
}

export interface ParsedFormula {
  input: string;
  /** Element symbol of the (single) metal centre. */
  metal: string;
  ligands: LigandInstance[];
  /** Net charge of the coordination entity (the bracketed part). */
  complexCharge: number;
  /** Number of coordination entities in the formula unit (e.g. 2 in [Co(NH3)6]2(SO4)3). */
  complexCount: number;
  counterIons: IonPart[];
  /** Waters (or other solvents) of crystallisation per formula unit. */
  hydrateWaters: number;
  /** Composition of the whole formula unit, counter-ions and hydrate included. */
  composition: Record<string, number>;
  /** How the formula was read when not as written (trivial name, salt or hydrate); empty otherwise. */
  readings?: FormulaReading[];
  /** Assumptions the parser had to make (e.g. a missing charge), worded for users. */
  warnings?: string[];
}

export interface ClassifyOptions {
  /** Temperature for the rate estimate (°C, default 25). */
  temperatureC?: number;
  /** Overrides the predicted geometry. */
  geometry?: Geometry;
}

/** What decides a verdict; the engine itself answers 'reference' or 'model'. */
export type DecidedBy = 'library' | 'reference' | 'model';
export type EngineDecidedBy = Exclude<DecidedBy, 'library'>;

/** A clean reference for a library measurement (what users see; no notes). */
export interface CitationRef {
  authors: string;
  title: string | null;
  journal: string;
  year: number | null;
  volume: string | null;
  pages: string | null;
  doi: string | null;
  /** article (default), book, chapter or web-page; books name their publisher. */
  kind?: 'article' | 'book' | 'chapter' | 'web-page';
  publisher?: string | null;
}

/** The group-library measurement that decides a verdict (POST /api/classify with groupId). */
export interface LibraryMeasurementRef {
  entryId: string;
  /** The entry's name and formula, for the headline. */
  entryName: string;
  entryFormula: string;
  kind: 'water-exchange' | 'ligand-exchange' | 'substitution' | 'half-life';
  /** First-order rate constant at temperatureK (a half-life is given as ln 2 / t½). */
  kPerSecond: number;
  temperatureK: number;
  citation: CitationRef | null;
}

/** A measured value that decides or sits beside a prediction. */
export interface MeasuredRate {
  kind: 'water-exchange' | 'ligand-exchange' | 'substitution';
  kPerSecond: number;
  temperatureK: number;
  deltaHActivationKJPerMol: number | null;
  deltaSActivationJPerMolK: number | null;
  source: string;
  /** How well the value was checked against its source. */
  checked?: Checked;
}

/** The lability engine's answer for one formula (stable fields first: see PRODUCT.md). */
export interface Classification {
  formula: string;
  metal: string;
  oxidationState: number;
  /** d-electron count of the ion; for lanthanides/actinides the f count (electronShell 'f', also in fElectrons); 10 for d10 main-group ions such as Ga³⁺. */
  dElectrons: number;
  electronShell: 'd' | 'f' | 'sp';
  spinState: SpinState | null;
  geometry: Geometry;
  geometrySource: 'predicted' | 'given';
  verdict: Verdict;
  reasons: string[];
  cautions: string[];
  coordinationNumber: number;
  complexCharge: number;
  molarMassGPerMol: number;
  ligands: { id: string; name: string; count: number; donorAtoms: string[]; charge: number }[];
  nearSpinCrossover: boolean;
  /** The one Δo of this answer (cm⁻¹), used in every reason, card, the spin decision and the rate. */
  deltaOcm: number | null;
  /** Where deltaOcm comes from: a published measurement, the f·g estimate (π-acceptors weighted), or a rough guess. */
  deltaOBasis?: 'measured' | 'estimated' | 'rough';
  /** The publication of a measured Δo. */
  deltaOSource?: { source: string; checked: Checked };
  lfseDq: number | null;
  lfseKJPerMol: number | null;
  /**
   * Ligand-field stabilisation lost on the way to the transition state (the crystal-field activation
   * energy of Basolo & Pearson), in Dq, for a square-pyramidal (dissociative) and a
   * pentagonal-bipyramidal (associative) transition state. It is one term of the barrier, not the
   * activation energy: positive raises the barrier (d3, low-spin d6), negative means the transition
   * state holds more ligand-field stabilisation and lowers it (d1, high-spin d4). Measured
   * activation parameters are library measurements (ΔH‡, kind "activation-enthalpy").
   */
  lfseLossToTransitionStateDq: { dissociative: number; associative: number } | null;
  /** The same in kJ mol⁻¹ with the answer's Δo (Dq = Δo/10). */
  lfseLossToTransitionStateKJPerMol: { dissociative: number; associative: number } | null;
  jahnTeller: 'strong' | 'weak' | null;
  /** Estimated log10 of the first-order exchange rate constant at temperatureC (s⁻¹). */
  logKPerSecond: number;
  halfLifeSeconds: number;
  /**
   * Where the model is weak (18-electron organometallics and CO loss, Rh(I)/Ir(I) square-planar,
   * d0 oxoanions, macrocycles and cryptands, cyanide exchange) and nothing measured decides: the
   * order-of-magnitude range the answer gives instead of a half-life (log k ± 3). Absent otherwise.
   */
  halfLifeRangeSeconds?: { shortest: number; longest: number };
  /** The class that made the model weak here (see halfLifeRangeSeconds). */
  weakClass?: 'organometallic' | 'low-valent-square-planar' | 'oxoanion' | 'macrocycle' | 'cyanide';
  temperatureC: number;
  confidence: Confidence;
  /**
   * What decides the verdict: a measurement in the group's library (set by the server or the app,
   * never by the engine), a published reference rate in data/, or the model.
   */
  decidedBy: DecidedBy;
  /** The group's measurement that decided (only with decidedBy 'library'). */
  libraryMeasurement?: LibraryMeasurementRef;
  /** When the library decided: the model's verdict and reasons, shown as the footnote. */
  modelVerdict?: Verdict;
  modelReasons?: string[];
  measured: MeasuredRate | null;
  hints: string[];
  /** f-electron count for lanthanides/actinides (0 otherwise). */
  fElectrons?: number;
  /** The model's own log10 k (s⁻¹) at temperatureC, kept even when a measured value decides. */
  predictedLogKPerSecond?: number;
  unpairedElectrons?: number | null;
  /** Metal d electrons + 2 per coordination site (ionic counting), for the 18-electron rule. */
  valenceElectronCount?: number;
  /** How the formula was read (trivial name, salt or hydrate as dissolved or solid species); absent when read as written. */
  readings?: { kind: FormulaReading['kind']; species: string; text: string }[];
  /** Assumptions made while reading the formula (e.g. a missing charge taken as neutral). */
  warnings?: string[];
  /** How a ligand comes on or off: the Langford–Gray class with its evidence (lib/chem/mechanism.ts). */
  mechanism: Mechanism;
  /**
   * µ-bridged dinuclear species: each metal centre classified on its own (as the mononuclear species
   * with its terminal ligands and the bridges). The top-level fields are those of the faster centre.
   */
  centres?: CentreClassification[];
}

/** One metal centre of a dinuclear species, classified on its own. */
export interface CentreClassification {
  metal: string;
  oxidationState: number;
  species: string;
  dElectrons: number;
  electronShell: 'd' | 'f' | 'sp';
  spinState: SpinState | null;
  coordinationNumber: number;
  geometry: Geometry;
  verdict: Verdict;
  logKPerSecond: number;
  halfLifeSeconds: number;
  confidence: Confidence;
}

/** A formula problem for people: the message, with the character (from 1) unless it already names it. */
export function formulaProblemText(message: string, position: number | null): string {
  if (position === null || position < 0) return message;
  return /character \d+/.test(message) ? message : `${message} (character ${position + 1})`;
}
