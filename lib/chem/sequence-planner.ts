/**
 * Stepwise substitution on a square-planar d8 complex: which ligand leaves at each step and which
 * isomer forms. Two published orders decide, both in data/trans-effect.json: the trans-effect
 * series (F. Basolo & R. G. Pearson, Prog. Inorg. Chem. 1962, 4, 381) — a ligand trans to a strong
 * trans director is labilised — and the leaving-group order (a ligand bound weakly to the metal
 * goes more readily). Each site scores its trans director's rank plus its own leaving rank and the
 * highest leaves: a heuristic that reproduces the classic isomer syntheses; it is not a rate model.
 * Sites are numbered round the square: 0 is trans to 2, 1 to 3.
 */
import transEffectData from '@/data/trans-effect.json';
import { classifyFormula } from './classify';
import { formatCharge } from './formula-parser';
import { readEnteringLigand } from './entering-ligand';
import { ligandWithId } from './ligands';
import { FormulaError, formulaProblemText, type LigandDefinition } from './types';

export type Isomer = 'cis' | 'trans' | null;

/** A request the planner cannot answer, with the field at fault (start, or ligands[index]). */
export class SequenceInputError extends Error {
  readonly field: string;
  readonly position: number | null;
  constructor(field: string, message: string, position: number | null = null) {
    super(message);
    this.name = 'SequenceInputError';
    this.field = field;
    this.position = position;
  }
}

export interface SequenceStep {
  entering: string;
  leaving: string;
  product: string;
  isomer: Isomer;
  /** The product with its isomer label, e.g. "cis-[PtCl2(NH3)2]". */
  productLabel: string;
  reasons: string[];
  /** Ligand ids round the square after the step (0 trans to 2, 1 trans to 3). */
  sites: string[];
  /** The site the entering ligand took. */
  site: number;
  /** The site trans to it, whose ligand directed the substitution. */
  transDirectorSite: number;
  transDirector: string;
}

export interface SequenceResult {
  start: { formula: string; sites: string[]; isomer: Isomer; productLabel: string };
  steps: SequenceStep[];
  product: string;
  isomer: Isomer;
  productLabel: string;
  /** Notes on the whole sequence (metal, series used, limits). */
  notes: string[];
}

interface RankGroup {
  rank: number;
  ligands: string[];
}

const transEffectRank = new Map<string, number>();
for (const group of transEffectData.transEffect.ranks as RankGroup[]) for (const id of group.ligands) transEffectRank.set(id, group.rank);
const leavingRank = new Map<string, number>();
for (const group of transEffectData.leavingGroup.ranks as RankGroup[]) for (const id of group.ligands) leavingRank.set(id, group.rank);

/** The published series in words, weakest last (for the reasons). */
export const TRANS_EFFECT_SERIES = 'CN⁻ ≈ CO ≈ C2H4 > PR3 ≈ H⁻ > CH3⁻ ≈ thiourea > C6H5⁻ > NO2⁻ ≈ I⁻ ≈ SCN⁻ > Br⁻ > Cl⁻ > py ≈ NH3 ≈ OH⁻ > H2O';
export const TRANS_EFFECT_SOURCE = transEffectData.transEffect.source;

const BULKY = new Set(['PPh3', 'PCy3', 'PBu3', 'PMePh2', 'P(OPh)3', 'CNtBu', 'IPr', 'IMes']);

function transOf(site: number): number {
  return (site + 2) % 4;
}

function cisOf(site: number): [number, number] {
  return [(site + 1) % 4, (site + 3) % 4];
}

/** A ligand's trans-effect rank; one missing from the series is placed by its bonding class (rough). */
function transRank(ligand: LigandDefinition): { rank: number; listed: boolean } {
  const listed = transEffectRank.get(ligand.id);
  if (listed !== undefined) return { rank: listed, listed: true };
  return { rank: ligand.bondingClass === 'pi-acceptor' ? 8 : ligand.bondingClass === 'pi-donor' ? 3 : 2, listed: false };
}

function leavingTendency(id: string): number {
  return leavingRank.get(id) ?? 1;
}

function ionText(ligand: LigandDefinition): string {
  const charge = ligand.charge;
  return `${ligand.id}${charge === -1 ? '⁻' : charge === -2 ? '²⁻' : charge === 1 ? '⁺' : ''}`;
}

function ligandOf(id: string): LigandDefinition {
  const ligand = ligandWithId(id);
  if (!ligand) throw new Error(`ligand ${id} missing from the table`);
  return ligand;
}

/** Writes the complex as a formula the parser reads back: ligands in alphabetical order of their ids, the charge after. */
function formulaOf(metal: string, oxidationState: number, sites: readonly string[], chelateOf: readonly number[]): string {
  const counts = new Map<string, number>();
  const seenChelates = new Set<number>();
  sites.forEach((id, index) => {
    const chelate = chelateOf[index] ?? -1;
    if (chelate >= 0) {
      if (seenChelates.has(chelate)) return;
      seenChelates.add(chelate);
    }
    counts.set(id, (counts.get(id) ?? 0) + 1);
  });
  let charge = oxidationState;
  const parts = [...counts.entries()]
    .sort(([a], [b]) => a.toLowerCase().localeCompare(b.toLowerCase()))
    .map(([id, count]) => {
      charge += ligandOf(id).charge * count;
      const bare = /^[A-Z][a-z]?$/.test(id);
      return `${bare ? id : `(${id})`}${count > 1 ? count : ''}`;
    });
  return `[${metal}${parts.join('')}]${charge === 0 ? '' : formatCharge(charge)}`;
}

/** cis/trans for MA2B2 and MA2BC (the relation of the two identical monodentate ligands); null otherwise. */
function isomerOf(sites: readonly string[], chelateOf: readonly number[]): Isomer {
  const monodentate = new Map<string, number[]>();
  sites.forEach((id, index) => {
    if ((chelateOf[index] ?? -1) >= 0) return;
    monodentate.set(id, [...(monodentate.get(id) ?? []), index]);
  });
  if (sites.some((_, index) => (chelateOf[index] ?? -1) >= 0)) return null;
  const pairs = [...monodentate.values()].filter((indices) => indices.length === 2);
  if (pairs.length === 0 || [...monodentate.values()].some((indices) => indices.length > 2)) return null;
  const [first, second] = pairs[0] as number[];
  return transOf(first as number) === second ? 'trans' : 'cis';
}

function labelled(formula: string, isomer: Isomer): string {
  return isomer ? `${isomer}-${formula}` : formula;
}

function readEntering(text: string, index: number): LigandDefinition {
  const reading = readEnteringLigand(text);
  const field = `ligands[${index}]`;
  if ('problem' in reading) throw new SequenceInputError(field, `Entering ligand ${index + 1} ${reading.problem}`);
  const ligand = reading.ligand;
  if (ligand.denticity !== 1) throw new SequenceInputError(field, `Entering ligand ${index + 1} (${ligand.id}) binds through ${ligand.denticity} donor atoms: the planner adds one monodentate ligand per step`);
  return ligand;
}

interface Arrangement {
  sites: string[];
  chelateOf: number[];
  notes: string[];
}

/** Places the start complex's ligands round the square: chelates on cis pairs, then the rest as the isomer prefix says. */
function arrange(ligands: readonly { id: string; count: number }[], wanted: Isomer, start: string): Arrangement {
  const sites: (string | null)[] = [null, null, null, null];
  const chelateOf = [-1, -1, -1, -1];
  const notes: string[] = [];
  let chelateIndex = 0;
  const monodentate: string[] = [];
  for (const entry of ligands) {
    const ligand = ligandOf(entry.id);
    if (ligand.denticity === 2) {
      for (let copy = 0; copy < entry.count; copy++) {
        const free = [0, 2].find((site) => sites[site] === null && sites[site + 1] === null);
        if (free === undefined) throw new SequenceInputError('start', `${start}: too many chelating ligands for four sites`);
        sites[free] = entry.id;
        sites[free + 1] = entry.id;
        chelateOf[free] = chelateIndex;
        chelateOf[free + 1] = chelateIndex;
        chelateIndex++;
      }
    } else if (ligand.denticity === 1) {
      for (let copy = 0; copy < entry.count; copy++) monodentate.push(entry.id);
    } else {
      throw new SequenceInputError('start', `${start}: ${entry.id} binds through ${ligand.denticity} donor atoms; the planner handles monodentate and bidentate ligands`);
    }
  }
  const freeSites = [0, 1, 2, 3].filter((site) => sites[site] === null);
  const counts = new Map<string, number>();
  for (const id of monodentate) counts.set(id, (counts.get(id) ?? 0) + 1);
  const pair = [...counts.entries()].find(([, count]) => count === 2)?.[0];
  const needsIsomer = freeSites.length === 4 && pair !== undefined;
  if (needsIsomer && wanted === null) {
    throw new SequenceInputError('start', `${start} has a cis and a trans isomer: write cis-${start} or trans-${start}`);
  }
  if (!needsIsomer && wanted !== null) notes.push(`${start} has no ${wanted} isomer to choose: the prefix was ignored`);
  let order = monodentate;
  if (needsIsomer && pair !== undefined) {
    const others = monodentate.filter((id) => id !== pair);
    // Sites 0 and 2 are trans, 0 and 1 cis.
    order = wanted === 'trans' ? [pair, others[0] as string, pair, others[1] as string] : [pair, pair, others[0] as string, others[1] as string];
  } else if (freeSites.length === 4 && counts.size === 4) {
    notes.push(`four different ligands: they were placed round the square in the order written (${monodentate[0]} trans to ${monodentate[2]}, ${monodentate[1]} trans to ${monodentate[3]})`);
  }
  freeSites.forEach((site, index) => {
    sites[site] = order[index] ?? null;
  });
  return { sites: sites as string[], chelateOf, notes };
}

/** Plans the stepwise substitution of a square-planar d8 complex by the given entering ligands. */
export function planSequence(startText: string, enteringTexts: readonly string[]): SequenceResult {
  const trimmed = startText.trim();
  const prefix = /^(cis|trans)-/i.exec(trimmed);
  const wanted: Isomer = prefix ? (prefix[1]?.toLowerCase() as 'cis' | 'trans') : null;
  const formula = prefix ? trimmed.slice(prefix[0].length) : trimmed;
  if (enteringTexts.length === 0) throw new SequenceInputError('ligands', 'Give at least one entering ligand');
  const entering = enteringTexts.map((text, index) => readEntering(text, index));
  let classification;
  try {
    classification = classifyFormula(formula);
  } catch (error) {
    if (error instanceof FormulaError) {
      const position = error.position >= 0 ? error.position + (prefix ? prefix[0].length : 0) : null;
      throw new SequenceInputError('start', formulaProblemText(error.message, error.position), position);
    }
    throw error;
  }
  if (classification.geometry !== 'square-planar' || classification.dElectrons !== 8 || classification.electronShell !== 'd') {
    throw new SequenceInputError(
      'start',
      `${formula} is ${classification.geometry} ${classification.electronShell === 'd' ? `d${classification.dElectrons}` : ''}: the planner follows square-planar d8 complexes (Pt(II), Pd(II), Au(III), Rh(I), Ir(I))`.replace(/ {2}/, ' '),
    );
  }
  const { metal, oxidationState } = classification;
  const arrangement = arrange(classification.ligands, wanted, formula);
  const sites = arrangement.sites.slice();
  const chelateOf = arrangement.chelateOf.slice();
  const startFormula = formulaOf(metal, oxidationState, sites, chelateOf);
  const startIsomer = isomerOf(sites, chelateOf);
  const notes = [...arrangement.notes, `trans-effect series (${TRANS_EFFECT_SOURCE}): ${TRANS_EFFECT_SERIES}`];
  if (metal === 'Pd') notes.push('Pd(II) substitutes about 10⁵ times faster than Pt(II) and its isomers equilibrate more easily: the kinetic product the trans effect predicts may isomerise');
  if (metal === 'Pt') notes.push('Pt(II) substitution is slow (minutes to hours at room temperature), so the kinetic isomer the trans effect gives is the one isolated');
  if (arrangement.chelateOf.some((value) => value >= 0)) notes.push('chelating ligands are kept in place: ring opening is not followed');

  const steps: SequenceStep[] = [];
  entering.forEach((ligand, stepIndex) => {
    // Each site that can change: its trans director's rank plus its own leaving-group rank; the
    // highest leaves. Equal scores: the ligand holding more such sites goes (statistics), then the
    // first site round the square.
    const candidates: { site: number; score: number; director: number; leaving: number }[] = [];
    for (let site = 0; site < 4; site++) {
      if ((chelateOf[site] ?? -1) >= 0) continue;
      if (sites[site] === ligand.id) continue; // like for like changes nothing
      const director = transRank(ligandOf(sites[transOf(site)] as string)).rank;
      const leaving = leavingTendency(sites[site] as string);
      candidates.push({ site, score: director + leaving, director, leaving });
    }
    if (candidates.length === 0) {
      throw new SequenceInputError(`ligands[${stepIndex}]`, `Step ${stepIndex + 1}: ${ligand.id} has nothing to replace in ${formulaOf(metal, oxidationState, sites, chelateOf)} (only ${ligand.id} or chelate sites are left)`);
    }
    const topScore = Math.max(...candidates.map((candidate) => candidate.score));
    const top = candidates.filter((candidate) => candidate.score === topScore);
    const groups = new Map<string, number[]>();
    for (const candidate of top) {
      const key = `${sites[candidate.site]}|${sites[transOf(candidate.site)]}`;
      groups.set(key, [...(groups.get(key) ?? []), candidate.site]);
    }
    const chosenGroup = [...groups.values()].sort((a, b) => b.length - a.length || (a[0] as number) - (b[0] as number))[0] as number[];
    const best = chosenGroup[0] as number;
    const chosen = candidates.find((candidate) => candidate.site === best) as (typeof candidates)[number];
    const leavingLigand = ligandOf(sites[best] as string);
    const directorSite = transOf(best);
    const director = ligandOf(sites[directorSite] as string);
    const reasons: string[] = [];
    const directorRank = transRank(director);
    reasons.push(
      `${ionText(ligand)} replaces the ${ionText(leavingLigand)} trans to ${ionText(director)}: its trans director and its hold on ${metal} together make it the most labile site` +
        (directorRank.listed ? '' : ` (${director.id} is not in the published series; placed by its bonding class, rough)`),
    );
    const others = candidates.filter((candidate) => sites[candidate.site] !== sites[best] || sites[transOf(candidate.site)] !== sites[directorSite]);
    const strongerDirector = others.filter((candidate) => candidate.director > chosen.director).sort((a, b) => b.director - a.director)[0];
    if (strongerDirector) {
      reasons.push(
        `the ${ionText(ligandOf(sites[strongerDirector.site] as string))} trans to the stronger director ${ionText(ligandOf(sites[transOf(strongerDirector.site)] as string))} stays: it is bound far more firmly to ${metal} than ${ionText(leavingLigand)} (leaving-group order)`,
      );
    }
    const betterLeaving = others.filter((candidate) => candidate.leaving > chosen.leaving && candidate.score < topScore).sort((a, b) => b.leaving - a.leaving)[0];
    if (betterLeaving) {
      reasons.push(`the ${ionText(ligandOf(sites[betterLeaving.site] as string))} trans to ${ionText(ligandOf(sites[transOf(betterLeaving.site)] as string))} leaves more easily, but its trans director is weaker`);
    }
    const tied = others.filter((candidate) => candidate.score === topScore);
    if (tied.length > 0) {
      reasons.push(
        `${ionText(ligandOf(sites[(tied[0] as (typeof tied)[number]).site] as string))} trans to ${ionText(ligandOf(sites[transOf((tied[0] as (typeof tied)[number]).site)] as string))} is an equal choice; ${ionText(leavingLigand)} trans to ${ionText(director)} holds ${chosenGroup.length > 1 ? 'more such sites' : 'the first site'}, so it is taken as the likelier (a close call)`,
      );
    }
    const cisStrong = cisOf(best)
      .map((site) => ligandOf(sites[site] as string))
      .filter((cisLigand) => transRank(cisLigand).rank >= 8);
    if (cisStrong.length > 0) reasons.push(`cis effect: ${cisStrong.map(ionText).join(', ')} cis to the leaving site speeds the step a little (under ten-fold on Pt(II)) but does not change which ligand leaves`);
    if (BULKY.has(ligand.id) && cisOf(best).some((site) => BULKY.has(sites[site] as string))) {
      reasons.push(`steric exception: ${ligand.id} lands cis to another bulky ligand; the crowded cis product may rearrange to trans where the complex can isomerise`);
    }
    sites[best] = ligand.id;
    const product = formulaOf(metal, oxidationState, sites, chelateOf);
    const isomer = isomerOf(sites, chelateOf);
    reasons.push(`product: ${labelled(product, isomer)}`);
    const phosphines = sites.filter((id) => transEffectRank.get(id) === 9 && id !== 'H').length;
    if (isomer === 'trans' && phosphines === 2 && sites.some((id, site) => transEffectRank.get(id) === 9 && transEffectRank.get(sites[transOf(site)] as string) === 9)) {
      reasons.push('exception: free phosphine catalyses trans → cis isomerisation of bis(phosphine) complexes, and the cis isomer is often the one isolated');
    }
    steps.push({
      entering: ligand.id,
      leaving: leavingLigand.id,
      product,
      isomer,
      productLabel: labelled(product, isomer),
      reasons,
      sites: sites.slice(),
      site: best,
      transDirectorSite: directorSite,
      transDirector: director.id,
    });
  });
  const last = steps[steps.length - 1] as SequenceStep;
  return {
    start: { formula: startFormula, sites: arrangement.sites.slice(), isomer: startIsomer, productLabel: labelled(startFormula, startIsomer) },
    steps,
    product: last.product,
    isomer: last.isomer,
    productLabel: last.productLabel,
    notes,
  };
}
