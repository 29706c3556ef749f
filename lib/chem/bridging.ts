/**
 * Bridging ligands for inner-sphere electron transfer.
 *
 * A ligand can bridge two metals only if, once bound to the first, it still has a free lone pair
 * (on the donor atom itself: adjacent attack; or on a far atom joined through a conjugated path:
 * remote attack). Halides, pseudohalides, hydroxide, carboxylates and pyrazine-type ligands can;
 * ammonia, amines and chelating diimines cannot (H. Taube; common practice). Coordinated water keeps
 * one weakly basic lone pair and is a poor bridge; its conjugate base, hydroxide, is the usual
 * bridge wherever aqua ligands are present.
 *
 * The ranking is a heuristic score (0–100), not a rate: polarisability of the bridging atom and the
 * hardness of the metal that attacks the bridge (R. G. Pearson, J. Am. Chem. Soc. 1963, 85, 3533).
 * It reproduces the published orders for [Co(NH3)5X] reductions: with Cr(II), I > Br > Cl > F and
 * OH⁻ ≫ H2O (J. P. Candlin, J. Halpern & D. L. Trimm, J. Am. Chem. Soc. 1964, 86, 1019;
 * J. P. Candlin & J. Halpern, Inorg. Chem. 1965, 4, 766); with the hard reductant Eu(II) the halide
 * order reverses (Candlin, Halpern & Trimm 1964) — and that reversal is still an inner-sphere route.
 */
import { parseFormula } from './formula-parser';
import { ligandWithId } from './ligands';
import { romanNumeral as roman } from './metal-ions';
import type { BridgeAssessment, BridgeAttack, BridgingCandidate, RoutePartner } from './route-types';
import type { LigandDefinition, ParsedFormula } from './types';

/** Pauling electronegativities of likely bridging atoms (standard tables; common practice). */
const PAULING_ELECTRONEGATIVITY: Record<string, number> = {
  F: 3.98,
  O: 3.44,
  Cl: 3.16,
  N: 3.04,
  Br: 2.96,
  I: 2.66,
  S: 2.58,
  C: 2.55,
  Se: 2.55,
  P: 2.19,
};
const ELECTRONEGATIVITY_SPAN = PAULING_ELECTRONEGATIVITY.F! - PAULING_ELECTRONEGATIVITY.S!;

const SOFTNESS_VALUE: Record<LigandDefinition['softness'], number> = { hard: 0, borderline: 0.5, soft: 1 };

/** What the scorer needs to know about a bridge, whether it is on the complex or could be installed. */
export interface BridgeDescriptor {
  id: string;
  name: string;
  bridgingAtom: string;
  attack: BridgeAttack;
  softness: LigandDefinition['softness'];
  charge: number;
  /** Neutral O-donor that carries hydrogen (coordinated water, alcohols): one weakly basic lone pair left. */
  protonatedOxygen: boolean;
  /** Elemental composition, to match an installable bridge with one already present. */
  composition: Record<string, number>;
  /** Donor atom bound to the first metal. */
  boundAtom: string;
  /** How to write it inside a formula (e.g. "Cl", "(N3)"). */
  token: string;
}

/**
 * Bridges worth installing on the inert partner (catalogue ids in data/ligands.json).
 * Halides: Candlin, Halpern & Trimm 1964; N3, NCS/SCN, OH, acetate: Candlin & Halpern 1965;
 * pyrazine-type remote bridges: H. Taube and co-workers (common practice).
 */
export const INSTALLABLE_BRIDGE_IDS: readonly string[] = ['F', 'Cl', 'Br', 'I', 'OH', 'N3', 'SCN', 'NCS', 'OAc', 'pz', "4,4'-bpy"];

let installable: BridgeDescriptor[] | null = null;

/** Descriptors of the installable bridges (ids missing from the catalogue are skipped). */
export function installableBridges(): readonly BridgeDescriptor[] {
  installable ??= INSTALLABLE_BRIDGE_IDS.flatMap((id) => {
    const ligand = ligandWithId(id);
    const descriptor = ligand ? descriptorFromLigand(ligand) : null;
    return descriptor ? [descriptor] : [];
  });
  return installable;
}

function compositionSignature(composition: Record<string, number>): string {
  return Object.keys(composition)
    .filter((key) => (composition[key] ?? 0) !== 0)
    .sort()
    .map((key) => `${key}${composition[key]}`)
    .join('');
}

/** Water or an alcohol: a neutral ligand of C, H and one O, bound through that O. */
function isWaterLike(ligand: LigandDefinition): boolean {
  const elements = Object.keys(ligand.composition).filter((key) => (ligand.composition[key] ?? 0) !== 0);
  return (
    ligand.charge === 0 &&
    ligand.donorAtoms.length === 1 &&
    ligand.donorAtoms[0] === 'O' &&
    ligand.composition.O === 1 &&
    (ligand.composition.H ?? 0) > 0 &&
    elements.every((element) => element === 'C' || element === 'H' || element === 'O')
  );
}

export function isWaterLigand(ligand: LigandDefinition): boolean {
  return compositionSignature(ligand.composition) === 'H2O1' && ligand.charge === 0;
}

/** Token to write a ligand inside a formula: bare for monatomic ligands, in parentheses otherwise. */
export function ligandToken(ligand: LigandDefinition): string {
  return /^[A-Z][a-z]?$/.test(ligand.id) ? ligand.id : `(${ligand.id})`;
}

function whyNoBridge(ligand: LigandDefinition): string {
  const donors = ligand.donorAtoms.join(', ') || 'none listed';
  if (ligand.donorAtoms.every((atom) => atom === 'N')) {
    if (ligand.bondingClass === 'pi-acceptor') {
      return `${ligand.name}: its N lone pairs are all bound to the metal and the ring offers none to a second metal (diimine/aromatic N-donor: outer-sphere only)`;
    }
    return `${ligand.name}: the only lone pair of each N donor is used in the bond to the metal; none is left to bridge`;
  }
  return `${ligand.name} (donor ${donors}): no free lone pair after coordination in the ligand catalogue`;
}

/** Turns a catalogue ligand into a bridge descriptor, or null if it cannot bridge. */
export function descriptorFromLigand(ligand: LigandDefinition): BridgeDescriptor | null {
  const waterLike = isWaterLike(ligand);
  const bridgingAtom = ligand.bridgingAtom ?? (waterLike ? 'O' : null);
  if (bridgingAtom === null) return null;
  return {
    id: ligand.id,
    name: ligand.name,
    bridgingAtom,
    attack: ligand.bridgeMode ?? 'adjacent',
    softness: ligand.softness,
    charge: ligand.charge,
    protonatedOxygen: waterLike,
    composition: ligand.composition,
    boundAtom: ligand.donorAtoms[0] ?? bridgingAtom,
    token: ligandToken(ligand),
  };
}

/** For each ligand of a complex: can it bridge, through which atom, adjacent or remote, and why (not). */
export function bridgeableLigands(parsed: ParsedFormula): BridgeAssessment[] {
  return parsed.ligands.map((instance) => {
    const ligand = instance.ligand;
    const descriptor = descriptorFromLigand(ligand);
    if (descriptor === null) {
      return {
        ligand: ligand.id,
        name: ligand.name,
        count: instance.count,
        canBridge: false,
        strength: 'none',
        bridgingAtom: null,
        attack: null,
        reason: whyNoBridge(ligand),
      };
    }
    if (descriptor.protonatedOxygen) {
      return {
        ligand: ligand.id,
        name: ligand.name,
        count: instance.count,
        canBridge: true,
        strength: 'weak',
        bridgingAtom: descriptor.bridgingAtom,
        attack: descriptor.attack,
        reason:
          `${ligand.name}: coordinated O keeps one weakly basic lone pair, a poor bridge; its conjugate base hydroxide is the usual bridge ` +
          '(e.g. [Co(NH3)5(OH)]2+ reacts with Cr(II) about 10⁶ times faster than [Co(NH3)5(OH2)]3+: Candlin & Halpern 1965; Zwickel & Taube)',
      };
    }
    return {
      ligand: ligand.id,
      name: ligand.name,
      count: instance.count,
      canBridge: true,
      strength: 'good',
      bridgingAtom: descriptor.bridgingAtom,
      attack: descriptor.attack,
      reason:
        descriptor.attack === 'remote'
          ? `${ligand.name}: bound through ${descriptor.boundAtom}, free lone pair on the remote ${descriptor.bridgingAtom} (remote attack)`
          : `${ligand.name}: free lone pair on the bound ${descriptor.bridgingAtom} (adjacent attack)`,
    };
  });
}

const F_BLOCK = new Set(['La', 'Ce', 'Pr', 'Nd', 'Pm', 'Sm', 'Eu', 'Gd', 'Tb', 'Dy', 'Ho', 'Er', 'Tm', 'Yb', 'Lu', 'Ac', 'Th', 'Pa', 'U', 'Np', 'Pu', 'Am']);
const SOFT_METALS = new Set(['Cu', 'Ag', 'Au', 'Hg', 'Pd', 'Pt', 'Tl', 'Cd']);
const FIRST_ROW_D = new Set(['Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn']);

/**
 * Hardness (0 soft … 1 hard) of the metal that attacks the bridge, as it reacts.
 * f-block and s-block ions are hard (Eu(II): reversed halide order, Candlin, Halpern & Trimm 1964);
 * aqueous Fe(II) leans hard (it also shows F > Cl, recalled, as noted in the electron-transfer reference notes);
 * other first-row 2+ ions are borderline, low-valent soft metals soft (Pearson 1963; common practice).
 */
export function attackingMetalHardness(metal: string, oxidationState: number): { hardness: number; label: string } {
  if (F_BLOCK.has(metal) || ['Li', 'Na', 'K', 'Mg', 'Ca', 'Sr', 'Ba', 'Al'].includes(metal)) {
    return { hardness: 1, label: `${metal}(${roman(oxidationState)}) is a hard ion` };
  }
  if (SOFT_METALS.has(metal) && oxidationState <= 2) {
    return { hardness: 0, label: `${metal}(${roman(oxidationState)}) is a soft ion` };
  }
  if (metal === 'Fe' && oxidationState === 2) {
    return { hardness: 0.6, label: 'Fe(II) leans hard (it too favours fluoride bridges)' };
  }
  if (FIRST_ROW_D.has(metal)) {
    return { hardness: oxidationState >= 3 ? 0.7 : 0.2, label: `${metal}(${roman(oxidationState)}) is borderline` };
  }
  return { hardness: 0.3, label: `${metal}(${roman(oxidationState)}) treated as borderline` };
}


/** Context of one bridged encounter: the metal that opens a site and binds the far end of the bridge. */
export interface BridgeScoringContext {
  attackingMetal: string;
  attackingOxidationState: number;
  /** Oxidation state of the attacking metal after the electron has moved. */
  attackingProductOxidationState: number;
}

/** Heuristic bridge score (0–100) for one bridge and one attacking metal, with the reasons. */
export function scoreBridge(bridge: BridgeDescriptor, context: BridgeScoringContext): { score: number; reasons: string[] } {
  const reasons: string[] = [];
  const electronegativity = PAULING_ELECTRONEGATIVITY[bridge.bridgingAtom] ?? 3.0;
  const polarisability = Math.min(1, Math.max(0, (PAULING_ELECTRONEGATIVITY.F! - electronegativity) / ELECTRONEGATIVITY_SPAN));
  const softness = 0.5 * polarisability + 0.5 * SOFTNESS_VALUE[bridge.softness];
  const { hardness, label } = attackingMetalHardness(context.attackingMetal, context.attackingOxidationState);
  const match = (1 - hardness) * softness + hardness * (1 - softness);

  let score = 30 + 35 * match;
  if (hardness >= 0.5) {
    reasons.push(`${label}: harder, less polarisable bridging atoms bind it better (reversed F > Cl > Br > I order, still a bridged route)`);
  } else {
    reasons.push(`${label}: the more polarisable the bridging atom (${bridge.bridgingAtom}), the better it mediates the electron (I > Br > Cl > F order)`);
  }
  if (bridge.charge < 0) {
    score += 15;
    reasons.push('anionic bridge: binds the incoming metal well and eases the approach of cationic partners');
  }
  if (bridge.protonatedOxygen) {
    score -= 25;
    reasons.push('coordinated water: one weakly basic lone pair; deprotonate to hydroxide for a good bridge');
  }
  if (bridge.attack === 'remote') {
    score -= 5;
    reasons.push(`remote attack at ${bridge.bridgingAtom}: needs a conjugated path through the ligand; rates vary widely`);
  } else {
    reasons.push(`adjacent attack at the bound ${bridge.bridgingAtom}`);
  }
  const productIsHard = context.attackingProductOxidationState >= 3 && (FIRST_ROW_D.has(context.attackingMetal) || F_BLOCK.has(context.attackingMetal));
  if (bridge.bridgingAtom === 'S' && productIsHard) {
    score -= 30;
    reasons.push(
      `attack at S would leave the hard ${context.attackingMetal}(${roman(context.attackingProductOxidationState)}) product S-bound, an unstable linkage isomer ` +
        '(Co–NCS reacts with Cr(II) about 10⁴ times slower than Co–SCN: Candlin & Halpern 1965)',
    );
  }
  return { score: Math.round(Math.min(100, Math.max(0, score)) * 10) / 10, reasons };
}

/** A partner given as a formula, a parsed formula, or parsed and classified. */
export type BridgingPartnerInput = string | ParsedFormula | RoutePartner;

/** Oxidation state from the parse: entity charge minus the ligand charges. */
export function oxidationStateOf(parsed: ParsedFormula): number {
  return parsed.complexCharge - parsed.ligands.reduce((sum, instance) => sum + instance.ligand.charge * instance.count, 0);
}

function toParsed(input: BridgingPartnerInput): { parsed: ParsedFormula; metal: string; oxidationState: number } {
  if (typeof input === 'string') {
    const parsed = parseFormula(input);
    return { parsed, metal: parsed.metal, oxidationState: oxidationStateOf(parsed) };
  }
  if ('classification' in input) {
    return { parsed: input.parsed, metal: input.classification.metal, oxidationState: input.classification.oxidationState };
  }
  return { parsed: input, metal: input.metal, oxidationState: oxidationStateOf(input) };
}

export interface RankOptions {
  /** Which partner holds the bridge; default: the oxidant (the classic inert Co(III)/labile reductant case). */
  host?: 'oxidant' | 'reductant';
  /** Include bridges that could be installed (default true). */
  includeInstallable?: boolean;
}

/**
 * Candidate bridging ligands for a pair: the bridgeable ligands already on the host (present: true)
 * first, best first, then bridges that could be installed on it (present: false), best first.
 */
export function rankBridgingCandidates(
  oxidant: BridgingPartnerInput,
  reductant: BridgingPartnerInput,
  options: RankOptions = {},
): BridgingCandidate[] {
  const ox = toParsed(oxidant);
  const red = toParsed(reductant);
  const hostIsOxidant = (options.host ?? 'oxidant') === 'oxidant';
  const host = hostIsOxidant ? ox : red;
  const attacker = hostIsOxidant ? red : ox;
  const context: BridgeScoringContext = {
    attackingMetal: attacker.metal,
    attackingOxidationState: attacker.oxidationState,
    attackingProductOxidationState: attacker.oxidationState + (hostIsOxidant ? 1 : -1),
  };

  const candidates: BridgingCandidate[] = [];
  const presentSignatures = new Set<string>();
  for (const instance of host.parsed.ligands) {
    const descriptor = descriptorFromLigand(instance.ligand);
    if (descriptor === null) continue;
    const signature = `${compositionSignature(descriptor.composition)}|${descriptor.charge}|${descriptor.boundAtom}`;
    if (presentSignatures.has(signature)) continue;
    presentSignatures.add(signature);
    const { score, reasons } = scoreBridge(descriptor, context);
    candidates.push({
      ligand: descriptor.id,
      name: descriptor.name,
      donorAtom: descriptor.bridgingAtom,
      score,
      attack: descriptor.attack,
      present: true,
      reasons: [`already on ${host.parsed.input}`, ...reasons],
    });
  }
  if (options.includeInstallable ?? true) {
    for (const bridge of installableBridges()) {
      const signature = `${compositionSignature(bridge.composition)}|${bridge.charge}|${bridge.boundAtom}`;
      if (presentSignatures.has(signature)) continue;
      const { score, reasons } = scoreBridge(bridge, context);
      candidates.push({
        ligand: bridge.id,
        name: bridge.name,
        donorAtom: bridge.bridgingAtom,
        score,
        attack: bridge.attack,
        present: false,
        reasons: [`not on ${host.parsed.input}: could be installed in place of a non-bridging ligand`, ...reasons],
      });
    }
  }
  // The bridges already on the complex first (the reaction can only use those), each group by score;
  // then by name for a stable order. Installable ones are what a chemist could make instead.
  return candidates.sort((a, b) => Number(b.present) - Number(a.present) || b.score - a.score || (a.ligand < b.ligand ? -1 : a.ligand > b.ligand ? 1 : 0));
}
