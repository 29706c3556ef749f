/**
 * Types of the electron-transfer route engine (route.ts, bridging.ts, redox-couples.ts).
 * Pure data shapes. The lability engine's shared types stay in types.ts.
 */
import type { Checked, Classification, ParsedFormula } from './types';
import type { MarcusResult } from './marcus';

export type RouteKind = 'inner-sphere' | 'outer-sphere' | 'either';
export type BridgeAttack = 'adjacent' | 'remote';

/** A partner of the pair, parsed and classified. */
export interface RoutePartner {
  parsed: ParsedFormula;
  classification: Classification;
}

/** Can one ligand on a complex bridge to a second metal? */
export interface BridgeAssessment {
  /** Catalogue id, e.g. "Cl", "NH3", "SCN". */
  ligand: string;
  name: string;
  count: number;
  canBridge: boolean;
  /** 'good' (free lone pair on a bridging atom), 'weak' (coordinated water and the like), 'none'. */
  strength: 'good' | 'weak' | 'none';
  bridgingAtom: string | null;
  attack: BridgeAttack | null;
  /** Why it can bridge, or why not (plain words). */
  reason: string;
}

/** One candidate bridging ligand for a given oxidant/reductant pair. */
export interface BridgingCandidate {
  ligand: string;
  name: string;
  /** Atom through which the second metal binds (the bridging atom). */
  donorAtom: string;
  /** 0–100; higher = better bridge for this pair (a ranking, not a rate). */
  score: number;
  attack: BridgeAttack;
  /** true if the ligand is already on the partner that holds the bridge; false = could be installed. */
  present: boolean;
  reasons: string[];
}

/** 'from-oxidation-states': swapped because one partner is a known reduced (or oxidised) form, or by the oxidation states of the same metal. */
export type RoleSource = 'given' | 'from-potentials' | 'from-oxidation-states';

export interface RouteRoles {
  oxidant: RoleSource;
  /** true if the order given was reversed to put the oxidant first. */
  swapped: boolean;
  note: string;
}

export interface TransferredLigand {
  ligand: string;
  name: string;
  bridgingAtom: string;
  attack: BridgeAttack;
  /** Formula of the partner that held the bridge. */
  from: string;
  /** Formula of the product that keeps it (if it could be written). */
  to: string | null;
}

export interface RouteOptions {
  /** Reaction medium for the product words (default 'acid': the classic perchloric-acid conditions). */
  medium?: 'acid' | 'neutral';
  /** Temperature (°C) passed to the lability engine and the Marcus estimate; default 25. */
  temperatureC?: number;
  /** Keep the roles as given even when the potentials say otherwise. */
  keepGivenRoles?: boolean;
}

export interface RouteResult {
  /** The formulas as given, in the order given. */
  input: { first: string; second: string };
  route: RouteKind;
  /** True when the two partners cannot exchange an electron (same oxidation states, both oxidised forms, …). */
  redoxPair: boolean;
  reasons: string[];
  bridgingCandidates: BridgingCandidate[];
  /** Which partner would hold the bridge (the more inert one), or null when no bridge is relevant. */
  bridgeHost: 'oxidant' | 'reductant' | null;
  oxidant: Classification;
  reductant: Classification;
  roles: RouteRoles;
  transferredLigand: TransferredLigand | null;
  expectedProducts: string[];
  cautions: string[];
  marcus: MarcusResult | null;
  /** Why marcus is null, or caveats on the self-exchange data used. */
  marcusNotes: string[];
}

export interface RouteError {
  oxidant: string;
  reductant: string;
  /** Which of the two formulas is bad (null if the failure is not tied to one). */
  field: 'oxidant' | 'reductant' | null;
  error: string;
  /** 0-based character position in that formula, or null. */
  position: number | null;
}

/** Shapes of data/redox-couples.json. */
export type K11Qualifier = 'measured' | 'approximate' | 'upper-bound' | 'lower-bound' | 'representative';

export interface SelfExchangeValue {
  valuePerMolarSecond: number;
  qualifier: K11Qualifier;
  asReported: string;
  temperatureC: number;
  medium: string;
  ionicStrengthM: number | null;
  /** Clean published reference. */
  source: string;
  /** How well the value was checked (shown as a small marker, never as prose). */
  checked: Checked;
  /** Curators' note: never shown or exported. */
  note?: string;
}

export interface StandardPotential {
  volts: number;
  reference: 'NHE';
  rangeV: number[] | null;
  formal: { medium: string; volts: number }[];
  source: string;
  checked: Checked;
  note?: string;
}

export interface RedoxCouple {
  id: string;
  label: string;
  /** Oxidised form as the formula parser accepts it. */
  oxidised: string;
  reduced: string;
  electrons: number;
  k11: SelfExchangeValue | null;
  otherK11: SelfExchangeValue[];
  e0: StandardPotential | null;
  mediumCaveats: string[];
  source: string;
  checked: Checked;
  note?: string;
}

export interface CoupleMatch {
  couple: RedoxCouple;
  side: 'oxidised' | 'reduced';
}
