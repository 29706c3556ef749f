/**
 * The lability engine's entry point: formula in, Classification out.
 */
import measuredRateData from '@/data/measured-rates.json';
import * as cautionsModule from './cautions';
import * as electronCounting from './electron-count';
import * as formulaParser from './formula-parser';
import * as ligandField from './ligand-field';
import * as lability from './lability';
import * as metalIons from './metal-ions';
import * as numberFormat from './number-format';
import type { ElectronConfiguration, MetalElement } from './metal-ions';
import * as measuredDeltaOModule from './measured-delta-o';
import * as orbitalFilling from './orbital-filling';
import * as geometryFit from './geometry-fit';
import { mechanismFor } from './mechanism';
import { FormulaError, GeometryMismatchError, type Classification, type ClassifyOptions, type EngineDecidedBy, type LigandInstance, type MeasuredRate } from './types';

// Under tsx (the server, the bench, scripts) every module is compiled to CommonJS and each use of
// an imported name becomes a call through a shared getter, a measurable cost in a function that
// makes ~25 such calls per formula. The names are read once, here. (No import cycles reach classify.)
const { cautionsFor } = cautionsModule;
const { measuredDeltaOFor } = measuredDeltaOModule;
const { fillOrbitals, splittingSchemeFor } = orbitalFilling;
const { geometryMismatch } = geometryFit;
const { coordinationNumber, predictGeometry, valenceElectronCount, settleFlexibleDenticity } = electronCounting;
const { parseFormulaWithMolarMass } = formulaParser;
const {
  KJ_PER_MOL_PER_CM,
  activationEnergyDq,
  averageLigandFactor,
  decideSpin,
  estimateDeltaO,
  jahnTellerKind,
  octahedralLfseDq,
  octahedralOccupancy,
  tetrahedralLfseDq,
} = ligandField;
const { confidenceFrom, measuredLogKAt, predictLogK, scaleLogKWithoutEyring, verdictFromLogK, WEAK_CLASS_HALF_WIDTH } = lability;
const { ionLabel, ionicRadiusPm, metalIon } = metalIons;
const { capitaliseSentence, formatCelsius, formatDuration, formatFixed, formatInteger, formatPowerOfTen, formatRecorded } = numberFormat;

interface MeasuredRecord {
  species: string;
  metal: string;
  oxidationState: number;
  ligands: Record<string, number>;
  kind: string;
  kPerSecond: number;
  temperatureK: number;
  deltaHActivationKJPerMol: number | null;
  deltaSActivationJPerMolK: number | null;
  source: string;
  checked: MeasuredRate['checked'];
}

function ligandSetKey(entries: [string, number][]): string {
  return entries
    .sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0))
    .map(([id, count]) => `${id}:${count}`)
    .join(',');
}

interface MeasuredEntry {
  metal: string;
  oxidationState: number;
  /** Ligand id → count, as in the record. */
  ligandCounts: ReadonlyMap<string, number>;
  rate: MeasuredRate;
  species: string;
}

// One entry per distinct metal/oxidation state/ligand set (a later record with the same set wins).
const measuredByKey: ReadonlyMap<string, MeasuredEntry> = new Map(
  (measuredRateData.rates as unknown as MeasuredRecord[]).map((record) => [
    `${record.metal}/${record.oxidationState}/${ligandSetKey(Object.entries(record.ligands))}`,
    {
      metal: record.metal,
      oxidationState: record.oxidationState,
      ligandCounts: new Map(Object.entries(record.ligands)),
      species: record.species,
      rate: {
        kind: 'water-exchange',
        kPerSecond: record.kPerSecond,
        temperatureK: record.temperatureK,
        deltaHActivationKJPerMol: record.deltaHActivationKJPerMol,
        deltaSActivationJPerMolK: record.deltaSActivationJPerMolK,
        source: record.source,
        checked: record.checked,
      },
    },
  ]),
);

// metal → oxidation state → measured entries: a formula is compared with the one or two entries
// of its ion directly, without building a key string.
const measuredByIon: ReadonlyMap<string, ReadonlyMap<number, readonly MeasuredEntry[]>> = (() => {
  const byMetal = new Map<string, Map<number, MeasuredEntry[]>>();
  for (const entry of measuredByKey.values()) {
    const byState = byMetal.get(entry.metal) ?? new Map<number, MeasuredEntry[]>();
    byState.set(entry.oxidationState, [...(byState.get(entry.oxidationState) ?? []), entry]);
    byMetal.set(entry.metal, byState);
  }
  return byMetal;
})();

/** Same ligand set: every instance has the record's count for its id, and every record id is present. */
function sameLigandSet(ligands: readonly LigandInstance[], ligandCounts: ReadonlyMap<string, number>): boolean {
  if (ligands.length !== ligandCounts.size) return false;
  for (const instance of ligands) {
    if (ligandCounts.get(instance.ligand.id) !== instance.count) return false;
  }
  for (const id of ligandCounts.keys()) {
    if (!hasLigandWhere(ligands, id, id, 0)) return false;
  }
  return true;
}

/**
 * Whether a ligand has id `first` or `second`, or at least `minimumDenticity` teeth (0: ignored).
 * A loop rather than some(arrow): an arrow in a per-formula function is a new closure every call.
 */
function hasLigandWhere(ligands: readonly LigandInstance[], first: string, second: string, minimumDenticity: number): boolean {
  for (const instance of ligands) {
    const ligand = instance.ligand;
    if (ligand.id === first || ligand.id === second || (minimumDenticity > 0 && ligand.denticity >= minimumDenticity)) return true;
  }
  return false;
}

function findMeasured(metal: string, oxidationState: number, ligands: readonly LigandInstance[]): MeasuredEntry | undefined {
  const entries = measuredByIon.get(metal)?.get(oxidationState);
  if (entries === undefined) return undefined;
  for (const entry of entries) {
    if (sameLigandSet(ligands, entry.ligandCounts)) return entry;
  }
  return undefined;
}

// Rough metal factor (10³ cm⁻¹) for ions without a published g: Δo rises ~50 % from 3d to 4d and
// ~25 % more to 5d (common practice); 3d values typical of M²⁺/M³⁺ aqua ions (jorgensen.json).
const ROUGH_G_3D: Record<number, number> = { 0: 8, 1: 8, 2: 9.5, 3: 17, 4: 22, 5: 24, 6: 26, 7: 26, 8: 26 };
const ROW_FACTOR: Record<string, number> = { '3d': 1, '4d': 1.45, '5d': 1.8 };

const DISCLAIMER = 'The verdict is a rule-of-thumb prediction, not a measurement: check it experimentally where it matters.';
const KINETIC_SCALE_NOTE = 'Rates are first-order exchange constants per bound ligand (s⁻¹); labile means t½ under about a minute at 25 °C (Taube 1952).';

// Classification is a pure function of (formula, temperature, geometry): repeated formulas (a
// library page, a CSV import, the benchmark mix) are served from a bounded memo. Callers always get
// a fresh copy, so mutating a result cannot corrupt the memo.
const MEMO_LIMIT = 2048;
/** Default options (25 °C, predicted geometry): keyed by the formula itself, no key string to build. */
const memoByFormula = new Map<string, Classification>();
/** Other options: keyed by formula, temperature and geometry. */
const memoWithOptions = new Map<string, Classification>();

// Admission: a formula enters the memo on its second request only, so one-off formulas (unique
// keys) do not fill it with objects that survive into the old generation and slow the collector.
// "Seen once" is a bit set over a hash of the key rather than a set of strings: it keeps no string
// alive. A hash collision only admits a formula one request early, which changes no result.
// 2²⁰ bits (128 KB): with up to SEEN_LIMIT keys marked, under 1 % of one-off formulas are admitted
// by a collision (6 % with 2¹⁶ bits, each a deep copy that lives on in the memo).
const SEEN_BITS = 1 << 20;
const SEEN_LIMIT = 8192;
const seenOnceBits = new Uint32Array(SEEN_BITS / 32);
let seenOnceCount = 0;

/** FNV-1a over the UTF-16 code units, folded to SEEN_BITS. */
function seenSlot(key: string): number {
  let hash = 0x811c9dc5;
  for (let index = 0; index < key.length; index++) {
    hash ^= key.charCodeAt(index);
    hash = Math.imul(hash, 0x01000193);
  }
  return (hash >>> 0) & (SEEN_BITS - 1);
}

/** True when the key was marked before; marks it otherwise. */
function markSeen(key: string): boolean {
  const slot = seenSlot(key);
  const word = slot >>> 5;
  const bit = 1 << (slot & 31);
  const current = seenOnceBits[word] ?? 0;
  if ((current & bit) !== 0) return true;
  if (seenOnceCount >= SEEN_LIMIT) {
    seenOnceBits.fill(0);
    seenOnceCount = 0;
  }
  seenOnceBits[word] = (seenOnceBits[word] ?? 0) | bit;
  seenOnceCount++;
  return false;
}

function copyClassification(source: Classification): Classification {
  return {
    ...source,
    reasons: source.reasons.slice(),
    cautions: source.cautions.slice(),
    hints: source.hints.slice(),
    ligands: source.ligands.map((ligand) => ({ ...ligand, donorAtoms: ligand.donorAtoms.slice() })),
    lfseLossToTransitionStateDq: source.lfseLossToTransitionStateDq && { ...source.lfseLossToTransitionStateDq },
    lfseLossToTransitionStateKJPerMol: source.lfseLossToTransitionStateKJPerMol && { ...source.lfseLossToTransitionStateKJPerMol },
    measured: source.measured && { ...source.measured },
    mechanism: { ...source.mechanism, reasons: source.mechanism.reasons.slice(), ...(source.mechanism.assistedPaths ? { assistedPaths: source.mechanism.assistedPaths.map((path) => ({ ...path })) } : {}) },
    ...(source.halfLifeRangeSeconds ? { halfLifeRangeSeconds: { ...source.halfLifeRangeSeconds } } : {}),
    ...(source.readings ? { readings: source.readings.map((reading) => ({ ...reading })) } : {}),
    ...(source.warnings ? { warnings: source.warnings.slice() } : {}),
    ...(source.centres ? { centres: source.centres.map((centre) => ({ ...centre })) } : {}),
  };
}

export function classifyFormula(formula: string, options: ClassifyOptions = {}): Classification {
  const defaultOptions = (options.temperatureC === undefined || options.temperatureC === 25) && !options.geometry;
  const memo = defaultOptions ? memoByFormula : memoWithOptions;
  const key = defaultOptions ? formula : `${formula}\u0000${options.temperatureC ?? 25}\u0000${options.geometry ?? ''}`;
  const known = memo.get(key);
  if (known !== undefined) return copyClassification(known);
  const result = computeClassification(formula, options);
  if (markSeen(key)) {
    if (memo.size >= MEMO_LIMIT) memo.clear();
    memo.set(key, copyClassification(result));
  }
  return result;
}

function computeClassification(formula: string, options: ClassifyOptions): Classification {
  const parsed = parseFormulaWithMolarMass(formula);
  if (parsed.centres !== undefined && parsed.centres.length === 2) return classifyDinuclear(formula, parsed, parsed.centres, options);
  const temperatureC = options.temperatureC ?? 25;
  if (!Number.isFinite(temperatureC) || temperatureC < -100 || temperatureC > 400) {
    throw new FormulaError(`Temperature ${temperatureC} °C is outside the range this tool handles (−100 to 400 °C)`, formula, 0);
  }
  const temperatureK = temperatureC + 273.15;
  const { metal, oxidationState } = parsed;
  const { element, configuration } = parsed;
  const ligands = settleFlexibleDenticity(parsed.ligands, element?.series === '4f' || element?.series === '5f');
  if (!element || !configuration) {
    throw new FormulaError(`Cannot count electrons for ${metal} in oxidation state ${oxidationState}`, formula, 0);
  }
  const { dElectrons, fElectrons, electronShell } = configuration;
  const reasons: string[] = [];

  const cn = coordinationNumber(ligands);
  const predictedGeometry = predictGeometry({ coordinationNumber: cn, dElectrons, electronShell, series: element.series, metal, oxidationState, ligands });
  if (options.geometry) {
    const mismatch = geometryMismatch(options.geometry, cn);
    if (mismatch) throw new GeometryMismatchError(`Geometry ${mismatch}`, formula);
  }
  const geometry = options.geometry ?? predictedGeometry;
  const geometrySource = options.geometry ? 'given' : 'predicted';

  const ion = metalIon(metal, oxidationState);
  const isDBlock = electronShell === 'd';
  // η5/η6 rings split the d set their own way: no octahedral Δo, LFSE or orbital picture applies to them.
  const ringComplex = geometry === 'sandwich' || geometry === 'bent-sandwich' || geometry === 'half-sandwich';
  const hasLigandField = isDBlock && dElectrons > 0 && dElectrons < 10 && !ringComplex;
  const deltaO = hasLigandField ? estimateDeltaO(ligands, ion) : null;

  // One Δo for the whole answer: a published measurement of this species, else the f·g estimate
  // with π-acceptors weighted up for back-bonding, else a rough value (labelled so). Every reason,
  // card, the spin decision and the rate use it.
  const measuredDeltaO = hasLigandField && geometry === 'octahedral' ? measuredDeltaOFor({ metal, oxidationState, ligands }) : null;
  let answerDeltaOcm: number | null = null;
  let deltaOBasis: Classification['deltaOBasis'];
  let deltaORough = false;
  if (measuredDeltaO) {
    answerDeltaOcm = measuredDeltaO.deltaOcm;
    deltaOBasis = 'measured';
  } else if (deltaO) {
    answerDeltaOcm = Math.round(deltaO.effectiveDeltaOcm);
    deltaOBasis = 'estimated';
    deltaORough = deltaO.fEstimated || deltaO.gKind === 'aqua';
  } else if (hasLigandField) {
    const average = averageLigandFactor(ligands);
    const roughG = (ROUGH_G_3D[Math.max(0, Math.min(oxidationState, 8))] ?? 17) * (ROW_FACTOR[element.series] ?? 1);
    answerDeltaOcm = Math.round(((average?.fEffective ?? 1) * roughG * 1000) / 100) * 100;
    deltaOBasis = 'rough';
    deltaORough = true;
  }

  // A rough Δo is not trusted to decide the spin: the usual rules of thumb do.
  const spin = decideSpin({ dElectrons, electronShell, element, ion, oxidationState, geometry, ligands, deltaOcm: deltaOBasis === 'rough' ? null : answerDeltaOcm });
  const spinForCounting = spin.spinState ?? 'high';
  const occupancy = isDBlock ? octahedralOccupancy(dElectrons, spinForCounting) : null;
  const kineticDeltaOcm = answerDeltaOcm;

  let lfseDq: number | null = null;
  if (isDBlock && geometry === 'octahedral') lfseDq = octahedralLfseDq(dElectrons, spinForCounting);
  else if (isDBlock && geometry === 'tetrahedral') lfseDq = Math.round(tetrahedralLfseDq(dElectrons) * 100) / 100;
  const deltaOcm = answerDeltaOcm;
  const dqKJ = deltaOcm === null ? null : (deltaOcm / 10) * KJ_PER_MOL_PER_CM;
  const lfseKJPerMol = lfseDq !== null && dqKJ !== null ? lfseDq * dqKJ : null;
  const cfae = isDBlock && geometry === 'octahedral' ? activationEnergyDq(dElectrons, spinForCounting) : null;
  const cfaeKJ = cfae !== null && dqKJ !== null ? { dissociative: cfae.dissociative * dqKJ, associative: cfae.associative * dqKJ } : null;
  const jahnTeller = isDBlock ? jahnTellerKind(dElectrons, spin.spinState, geometry) : null;
  const electronCount = isDBlock ? valenceElectronCount(dElectrons, cn) : null;
  // One pass over the ligands for the flags the reasons and the model need.
  let organometallic = false;
  let hasNitrosyl = false;
  let hapticReason: string | null = null;
  let ligandWithoutF = false;
  for (const instance of ligands) {
    const ligand = instance.ligand;
    if (ligand.organometallic === true) organometallic = true;
    if (ligand.id === 'NO') hasNitrosyl = true;
    if (ligand.hapticity !== undefined && hapticReason === null) hapticReason = hapticityReason(ligands);
    if (ligand.jorgensenF === null && (ligand.fEstimate ?? null) === null) ligandWithoutF = true;
  }
  const { radiusPm, estimated: radiusEstimated } = ionicRadiusPm(element, oxidationState, spin.spinState, ion);

  // --- how the formula was read (trivial name, salt or hydrate), and what had to be assumed
  for (const reading of parsed.readings) reasons.push(reading.text);
  for (const warning of parsed.warnings) reasons.push(warning);
  // --- electron counting reasons
  reasons.push(summaryReason(element, oxidationState, configuration, parsed.complexCharge, parsed.counterIons.length > 0, cn, geometry, geometrySource === 'given'));
  if (hasNitrosyl) reasons.push('nitrosyl counted as NO⁺ (linear, 2-electron donor) by convention');
  if (hapticReason !== null) reasons.push(hapticReason);
  if (ringComplex) reasons.push(RING_GEOMETRY_REASONS[geometry] ?? '');
  if (measuredDeltaO) {
    reasons.push(`Δo = ${formatInteger(measuredDeltaO.deltaOcm)} cm⁻¹, measured for ${measuredDeltaO.species} (${measuredDeltaO.source})`);
  } else if (deltaO !== null) {
    const fgText = deltaOReason(deltaO.fAverage, deltaO.g, deltaO.gKind === 'aqua', deltaO.fEstimated, deltaO.deltaOcm);
    const piFactor = deltaO.effectiveDeltaOcm / deltaO.deltaOcm;
    reasons.push(
      piFactor > 1.001
        ? `Δo ≈ ${formatInteger(answerDeltaOcm ?? 0)} cm⁻¹: π-acceptor ligands raised ×${formatFixed(piFactor, 2)} for back-bonding over ${fgText.replace(/^Δo ≈ /, '')} (weights calibrated on the measured Δo of the hexacyanoferrates and of the tris(diimine)iron(II) spin states)`
        : fgText,
    );
  } else if (hasLigandField) {
    reasons.push(`Δo ≈ ${formatInteger(answerDeltaOcm ?? 0)} cm⁻¹, a rough value: no published g for ${ionLabel(metal, oxidationState)}${ligandWithoutF ? ' or no f for a ligand' : ''}`);
  }
  if (answerDeltaOcm !== null && geometry === 'tetrahedral') reasons.push(`Tetrahedral: Δt ≈ ${formatInteger((answerDeltaOcm * 4) / 9)} cm⁻¹ (4/9 of the octahedral Δo)`);
  if (spin.spinState !== null) {
    reasons.push(`${spin.spinState} spin: ${spin.basis}`);
    if (spin.nearSpinCrossover) reasons.push('near spin crossover: Δo and the pairing energy are close — check the spin state experimentally');
  }

  // --- rate
  const prediction = predictLogK({
    metal,
    oxidationState,
    series: element.series,
    electronShell,
    dElectrons,
    spinState: spin.spinState,
    geometry,
    coordinationNumber: cn,
    ligands,
    radiusPm,
    radiusEstimated,
    deltaOcm: kineticDeltaOcm,
    deltaORough,
    activationEnergyDq: cfae,
    egElectrons: occupancy?.eg ?? 0,
    vacantT2g: occupancy && occupancy.t2g < 3 ? 3 - occupancy.t2g : 0,
    jahnTeller,
    valenceElectronCount: electronCount,
    organometallic,
  });
  for (const reason of prediction.reasons) reasons.push(reason);
  const predictedLogK = scaleLogKWithoutEyring(prediction.logKPerSecond, temperatureK);

  const measuredMatch = findMeasured(metal, oxidationState, ligands);
  let logK = predictedLogK;
  let decidedBy: EngineDecidedBy = 'model';
  if (measuredMatch) {
    const { logK: measuredLogK, usedEyring } = measuredLogKAt(measuredMatch.rate, temperatureK);
    logK = measuredLogK;
    decidedBy = 'reference';
    reasons.push(`Measured water-exchange kₑₓ = ${formatRecorded(measuredMatch.rate.kPerSecond)} s⁻¹ at ${formatCelsius(measuredMatch.rate.temperatureK - 273.15)} for ${measuredMatch.species} (${measuredMatch.rate.source}) decides; the model alone gives k ≈ ${formatPowerOfTen(predictedLogK)} s⁻¹`);
    if (Math.abs(temperatureK - 298.15) > 1e-9) {
      reasons.push(usedEyring ? `Moved to ${formatCelsius(temperatureC)} with the measured Eyring ΔH‡ = ${measuredMatch.rate.deltaHActivationKJPerMol} kJ mol⁻¹` : `Moved to ${formatCelsius(temperatureC)} assuming ΔS‡ = 0 (no activation parameters published here)`);
    }
  } else if (Math.abs(temperatureK - 298.15) > 1e-9) {
    reasons.push(`Moved to ${formatCelsius(temperatureC)} assuming the whole barrier is enthalpic (ΔS‡ = 0): a rough correction`);
  }
  const { verdict, halfLifeSeconds, reason: rateReason } = rateAt(logK);
  const confidence = confidenceFrom(logK, prediction.roughness, decidedBy === 'reference');
  // A weak class with nothing measured: an order-of-magnitude range, never a precise half-life.
  const weakClass = decidedBy === 'model' ? prediction.weakClass : undefined;
  const halfLifeRangeSeconds = weakClass === undefined ? undefined : halfLifeRange(logK);
  reasons.push(halfLifeRangeSeconds === undefined ? rateReason : rangeReason(verdict, logK));
  reasons.push(KINETIC_SCALE_NOTE);

  const hints = hintsFor(metal, oxidationState, verdict, ligands, dElectrons, geometry);
  reasons.push(decidedBy === 'reference' ? 'The verdict rests on the published measurement above; the model estimate is shown for comparison.' : DISCLAIMER);
  // Every reason is a sentence: capitalised here, once, whichever module wrote it (symbols such as "d6" keep their case).
  for (let index = 0; index < reasons.length; index++) reasons[index] = capitaliseSentence(reasons[index] as string);

  return {
    formula,
    metal,
    oxidationState,
    // PRODUCT.md: "d (or f) electron count" — the count of the open valence shell; electronShell says which.
    dElectrons: electronShell === 'f' ? fElectrons : dElectrons,
    electronShell,
    spinState: spin.spinState,
    geometry,
    geometrySource,
    verdict,
    reasons,
    cautions: cautionsFor(parsed, oxidationState),
    coordinationNumber: cn,
    complexCharge: parsed.complexCharge,
    molarMassGPerMol: Math.round(parsed.molarMassGPerMol * 1000) / 1000,
    ligands: ligandSummaries(ligands),
    nearSpinCrossover: spin.nearSpinCrossover,
    deltaOcm,
    ...(deltaOBasis ? { deltaOBasis } : {}),
    ...(measuredDeltaO ? { deltaOSource: { source: measuredDeltaO.source, checked: measuredDeltaO.checked } } : {}),
    lfseDq,
    lfseKJPerMol: lfseKJPerMol === null ? null : Math.round(lfseKJPerMol * 10) / 10,
    lfseLossToTransitionStateDq: cfae,
    lfseLossToTransitionStateKJPerMol: cfaeKJ === null ? null : { dissociative: Math.round(cfaeKJ.dissociative * 10) / 10, associative: Math.round(cfaeKJ.associative * 10) / 10 },
    jahnTeller,
    logKPerSecond: Math.round(logK * 100) / 100,
    halfLifeSeconds,
    ...(halfLifeRangeSeconds ? { halfLifeRangeSeconds, weakClass } : {}),
    temperatureC,
    confidence,
    decidedBy,
    measured: measuredMatch?.rate ?? null,
    hints,
    fElectrons,
    predictedLogKPerSecond: Math.round(predictedLogK * 100) / 100,
    // Read off the same filling the orbital diagram draws, for every geometry with a splitting picture.
    unpairedElectrons: isDBlock && splittingSchemeFor(geometry) !== 'degenerate' ? fillOrbitals(dElectrons, geometry, spin.spinState).unpairedElectrons : null,
    valenceElectronCount: electronCount ?? undefined,
    ...(parsed.readings.length > 0 ? { readings: parsed.readings.map(readingSummary) } : {}),
    ...(parsed.warnings.length > 0 ? { warnings: parsed.warnings.slice() } : {}),
    mechanism: mechanismFor({ metal, oxidationState, series: element.series, electronShell, dElectrons, spinState: spin.spinState, geometry, coordinationNumber: cn, ligands, organometallic, valenceElectronCount: electronCount }),
  };
}

function readingSummary(reading: { kind: 'name' | 'dissolved' | 'solid'; species: string; text: string }): NonNullable<Classification['readings']>[number] {
  return { kind: reading.kind, species: reading.species, text: reading.text };
}

/**
 * A µ-bridged dinuclear species, classified per metal centre: each centre as the mononuclear species
 * with its own terminal ligands and the bridges. Substitution starts at the faster centre, so that
 * centre gives the headline; both are listed, and the molar mass, charge and cautions are the whole ion's.
 */
function classifyDinuclear(
  formula: string,
  parsed: ReturnType<typeof parseFormulaWithMolarMass>,
  centres: readonly formulaParser.MetalCentre[],
  options: ClassifyOptions,
): Classification {
  const results = centres.map((centre) => classifyFormula(centre.species, options));
  let main = 0;
  for (let index = 1; index < results.length; index++) if ((results[index] as Classification).logKPerSecond > (results[main] as Classification).logKPerSecond) main = index;
  const headline = results[main] as Classification;
  const centreLines = results.map(
    (result, index) =>
      `Centre ${index + 1}: ${ionLabel(result.metal, result.oxidationState)} as ${(centres[index] as formulaParser.MetalCentre).species} — ${result.verdict}, k ≈ ${formatPowerOfTen(result.logKPerSecond)} s⁻¹`,
  );
  const bridges = (centres[0] as formulaParser.MetalCentre).bridges.map((bridge) => bridge.ligand.name).join(', ');
  const reasons = [
    ...parsed.readings.map((reading) => reading.text),
    ...parsed.warnings,
    `A µ-bridged dinuclear species (bridge: ${bridges}): each metal centre is classified on its own; the faster centre (${main + 1}) sets the verdict`,
    ...centreLines,
    ...headline.reasons.filter((reason) => !headline.readings?.some((reading) => reading.text === reason)),
  ];
  const cautions = cautionsFor(parsed, parsed.oxidationState);
  for (const result of results) for (const caution of result.cautions) if (!cautions.includes(caution)) cautions.push(caution);
  return {
    ...headline,
    formula,
    reasons,
    cautions,
    complexCharge: parsed.complexCharge,
    molarMassGPerMol: Math.round(parsed.molarMassGPerMol * 1000) / 1000,
    ...(parsed.readings.length > 0 ? { readings: parsed.readings.map(readingSummary) } : {}),
    ...(parsed.warnings.length > 0 ? { warnings: parsed.warnings.slice() } : {}),
    centres: results.map((result, index) => ({
      metal: result.metal,
      oxidationState: result.oxidationState,
      species: (centres[index] as formulaParser.MetalCentre).species,
      dElectrons: result.dElectrons,
      electronShell: result.electronShell,
      spinState: result.spinState,
      coordinationNumber: result.coordinationNumber,
      geometry: result.geometry,
      verdict: result.verdict,
      logKPerSecond: result.logKPerSecond,
      halfLifeSeconds: result.halfLifeSeconds,
      confidence: result.confidence,
    })),
  };
}

/** The result's ligand list (a loop: no closure per formula). */
function ligandSummaries(ligands: readonly LigandInstance[]): Classification['ligands'] {
  const summaries: Classification['ligands'] = [];
  for (const instance of ligands) {
    summaries.push({ id: instance.ligand.id, name: instance.ligand.name, count: instance.count, donorAtoms: instance.ligand.donorAtoms, charge: instance.ligand.charge });
  }
  return summaries;
}

export type ClassifyManyResult = Classification | { formula: string; error: string; position: number | null };

export function classifyMany(formulas: readonly string[], options?: ClassifyOptions): ClassifyManyResult[] {
  const results: ClassifyManyResult[] = new Array(formulas.length);
  for (let index = 0; index < formulas.length; index++) {
    const formula = formulas[index] ?? '';
    try {
      results[index] = classifyFormula(formula, options);
    } catch (error) {
      if (error instanceof GeometryMismatchError) results[index] = { formula, error: error.message, position: null };
      else if (error instanceof FormulaError) results[index] = { formula, error: error.message, position: error.position };
      else throw error;
    }
  }
  return results;
}

function buildSummaryReason(element: MetalElement, oxidationState: number, configuration: ElectronConfiguration, complexCharge: number, fromCounterIons: boolean, cn: number, geometry: string, given: boolean): string {
  const { dElectrons, fElectrons, electronShell } = configuration;
  const shellText = electronShell === 'f' ? `f${fElectrons}` : electronShell === 'sp' ? (dElectrons === 10 ? 'd10 (main group)' : 'noble-gas core (main group)') : `d${dElectrons}`;
  return `${ionLabel(element.symbol, oxidationState)}, ${shellText}; charge ${chargeInWords(complexCharge)}${fromCounterIons ? ' (from the counter-ions)' : ''}; coordination number ${cn}, ${geometry}${given ? ' (given)' : ''}`;
}

// The first reason depends on the ion (its configuration follows from element and oxidation
// state), the charge, its source, the coordination number and the geometry, which distinct formulas
// share: a bounded memo keyed by those small integers packed into one saves building a ten-part
// string per formula. Values outside the packed ranges are built every time.
const SUMMARY_MEMO_LIMIT = 4096;
const summaryReasons = new Map<number, string>();
// Geometry → index for the key (a scan: identical strings compare by pointer, cheaper than a hash).
const GEOMETRY_KEYS: readonly string[] = ['octahedral', 'tetrahedral', 'square-planar', 'linear', 'trigonal-planar', 'trigonal-bipyramidal', 'square-pyramidal', 'pentagonal-bipyramidal', 'square-antiprismatic', 'tricapped-trigonal-prismatic', 'sandwich', 'bent-sandwich', 'half-sandwich', 'other'];

/** A charge in running text: 0, +3, −1 (a lone "-" for 1− reads as a glitch in prose). */
function chargeInWords(charge: number): string {
  if (charge === 0) return '0';
  return `${charge > 0 ? '+' : '−'}${Math.abs(charge)}`;
}

function summaryReason(element: MetalElement, oxidationState: number, configuration: ElectronConfiguration, complexCharge: number, fromCounterIons: boolean, cn: number, geometry: string, given: boolean): string {
  const geometryIndex = GEOMETRY_KEYS.indexOf(geometry);
  const inRange = geometryIndex >= 0 && element.atomicNumber < 128 && oxidationState >= -8 && oxidationState < 24 && Number.isInteger(complexCharge) && complexCharge >= -32 && complexCharge < 32 && cn >= 0 && cn < 32;
  if (!inRange) return buildSummaryReason(element, oxidationState, configuration, complexCharge, fromCounterIons, cn, geometry, given);
  // Z (7 bits) · oxidation state + 8 (5) · charge + 32 (6) · counter-ions (1) · CN (5) · given (1) · geometry (4): 29 bits, a small integer.
  const key = (((((element.atomicNumber * 32 + oxidationState + 8) * 64 + complexCharge + 32) * 2 + (fromCounterIons ? 1 : 0)) * 32 + cn) * 2 + (given ? 1 : 0)) * 16 + geometryIndex;
  let text = summaryReasons.get(key);
  if (text === undefined) {
    text = buildSummaryReason(element, oxidationState, configuration, complexCharge, fromCounterIons, cn, geometry, given);
    if (summaryReasons.size >= SUMMARY_MEMO_LIMIT) summaryReasons.clear();
    summaryReasons.set(key, text);
  }
  return text;
}

// The Δo reason is a pure function of f(avg), g, the kind of g and whether f is estimated (Δo is
// round(f·g·1000)); distinct formulas share far fewer of these than they are many: a bounded memo
// (f → g → [jørgensen, jørgensen + estimated f, aqua, aqua + estimated f]) saves building the text.
const DELTA_O_MEMO_LIMIT = 4096;
const deltaOReasons = new Map<number, Map<number, (string | undefined)[]>>();
let deltaOReasonCount = 0;

function deltaOReason(fAverage: number, g: number, aquaG: boolean, fEstimated: boolean, deltaOcm: number): string {
  let byG = deltaOReasons.get(fAverage);
  if (byG === undefined) {
    if (deltaOReasonCount >= DELTA_O_MEMO_LIMIT) {
      deltaOReasons.clear();
      deltaOReasonCount = 0;
    }
    byG = new Map();
    deltaOReasons.set(fAverage, byG);
  }
  let texts = byG.get(g);
  if (texts === undefined) {
    texts = [undefined, undefined, undefined, undefined];
    byG.set(g, texts);
  }
  const slot = (aquaG ? 2 : 0) + (fEstimated ? 1 : 0);
  let text = texts[slot];
  if (text === undefined) {
    const source = aquaG ? 'g taken as the aqua ion’s Δo' : 'Jørgensen g';
    text = `Δo ≈ f·g = ${formatFixed(fAverage, 2)} × ${g} × 10³ = ${formatInteger(deltaOcm)} cm⁻¹ (${source}${fEstimated ? '; some f values are rough estimates' : ''})`;
    texts[slot] = text;
    deltaOReasonCount++;
  }
  return text;
}

interface RateText {
  verdict: Classification['verdict'];
  halfLifeSeconds: number;
  reason: string;
}

// The verdict, half-life and rate reason are a pure function of log k, and the model gives only
// a few thousand distinct values (20 000 distinct bench formulas: ~2 000): a bounded memo saves the
// power, the formatting and the string per formula. (A Map treats −0 and 0 as one key; both give
// the same verdict, half-life and text.)
const RATE_MEMO_LIMIT = 4096;
const rateByLogK = new Map<number, RateText>();

function rateAt(logK: number): RateText {
  let rate = rateByLogK.get(logK);
  if (rate === undefined) {
    const verdict = verdictFromLogK(logK);
    const halfLifeSeconds = Math.LN2 / 10 ** logK;
    const band = verdict === 'labile' ? 'under a minute' : verdict === 'intermediate' ? 'one to five minutes' : 'five minutes or more';
    // k from log k to two decimals, as the answer's logKPerSecond (the card and the reason show the same k).
    const reason = `${VERDICT_WORDS[verdict]}: k ≈ ${formatPowerOfTen(Math.round(logK * 100) / 100)} s⁻¹, t½ ≈ ${formatDuration(halfLifeSeconds)} (${band}; labile under 1 min, inert from 5 min)`;
    rate = { verdict, halfLifeSeconds, reason };
    if (rateByLogK.size >= RATE_MEMO_LIMIT) rateByLogK.clear();
    rateByLogK.set(logK, rate);
  }
  return rate;
}

/** How the ring ligands were counted, naming each (η5-Cp, η6-benzene, η2-ethylene …). */
function hapticityReason(ligands: readonly LigandInstance[]): string {
  const parts: string[] = [];
  for (const instance of ligands) {
    const ligand = instance.ligand;
    if (ligand.hapticity === undefined) continue;
    parts.push(`${ligand.name} as ${ligand.denticity} coordination site${ligand.denticity > 1 ? 's' : ''} (${2 * ligand.denticity}-electron donor)`);
  }
  return `Ring and π ligands counted by convention (ionic count): ${parts.join('; ')}`;
}

const RING_GEOMETRY_REASONS: Partial<Record<string, string>> = {
  sandwich: 'Sandwich: the metal lies between two parallel rings, not at the centre of an octahedron; "coordination number" counts the sites the rings fill by convention',
  'bent-sandwich': 'Bent sandwich: two tilted rings with the other ligands in the wedge between them, not an octahedron',
  'half-sandwich': 'Half-sandwich (piano stool): one ring and the other ligands as the legs, not an octahedron',
};

/** t½ for log k ± WEAK_CLASS_HALF_WIDTH: the fastest rate gives the shortest half-life. */
function halfLifeRange(logK: number): { shortest: number; longest: number } {
  return { shortest: Math.LN2 / 10 ** (logK + WEAK_CLASS_HALF_WIDTH), longest: Math.LN2 / 10 ** (logK - WEAK_CLASS_HALF_WIDTH) };
}

/** The rate line for a weak class: a range of k and t½, and whether the range crosses a band edge. */
function rangeReason(verdict: Classification['verdict'], logK: number): string {
  const { shortest, longest } = halfLifeRange(logK);
  const spansBands = verdictFromLogK(logK + WEAK_CLASS_HALF_WIDTH) !== verdictFromLogK(logK - WEAK_CLASS_HALF_WIDTH);
  return (
    `${VERDICT_WORDS[verdict]} by the model's central estimate, but only the order of magnitude is known: k between ` +
    `${formatPowerOfTen(logK - WEAK_CLASS_HALF_WIDTH, 1)} and ${formatPowerOfTen(logK + WEAK_CLASS_HALF_WIDTH, 1)} s⁻¹, ` +
    `t½ between ${formatDuration(shortest)} and ${formatDuration(longest)}` +
    (spansBands ? '; the range crosses the band edges, so the verdict itself is uncertain' : '') +
    ' (labile under 1 min, inert from 5 min)'
  );
}

const VERDICT_WORDS: Record<Classification['verdict'], string> = { labile: 'Labile', intermediate: 'Intermediate', inert: 'Inert' };

const HINT_HEAT = 'Inert at room temperature: plan on heat, a long reflux or a catalyst rather than waiting.';
const HINT_INTERMEDIATE = 'Substitution takes minutes: allow time or warm gently.';
const HINT_STABLE_NOT_INERT = 'Thermodynamic stability is not kinetic inertness: a large formation constant does not stop fast ligand exchange ([Ni(CN)4]²⁻ is very stable yet swaps cyanide quickly).';
const HINT_INERT_NOT_STABLE = 'Kinetic inertness is not thermodynamic stability: an inert complex may survive conditions that would decompose it at equilibrium ([Co(NH3)6]³⁺ lasts for days in acid).';
// metal → oxidation state → hints (nested maps: no "Co/3" key string per formula).
const REDOX_HINTS: ReadonlyMap<string, ReadonlyMap<number, readonly string[]>> = byMetalAndState({
  'Co/3': [
    'Substitute on labile Co(II) first, then oxidise to Co(III) (air or H2O2, often with charcoal).',
    'Traces of Co(II) catalyse substitution on Co(III) through electron exchange (redox catalysis).',
  ],
  'Cr/3': [
    'Substitute on labile Cr(II) under an inert atmosphere, then oxidise to Cr(III).',
    'Traces of Cr(II) catalyse substitution on Cr(III) through electron exchange (redox catalysis).',
  ],
  'Ru/3': ['Ru(II) exchanges water ~10⁴ times faster than Ru(III) (Rapaport et al. 1988): substitute on Ru(II), then oxidise if Ru(III) is wanted.'],
  'Ru/2': ['Reflux for hours; photolysis can labilise Ru(II) polypyridyls.'],
  'Pt/4': ['Traces of Pt(II) catalyse substitution on Pt(IV) (halide-bridged redox); alternatively substitute on Pt(II) and oxidise.'],
  'Pt/2': ['Use the trans effect to choose which ligand leaves, and allow hours at 40–80 °C.'],
  'Rh/3': ['Reducing agents (e.g. ethanol, traces of Rh(I)) catalyse substitution on Rh(III).'],
  'Fe/3': ['If Fe(III) is inert here, substitute on Fe(II) and oxidise.'],
});

/** {"Co/3": value} → Co → 3 → value. */
function byMetalAndState<T>(table: Record<string, T>): ReadonlyMap<string, ReadonlyMap<number, T>> {
  const byMetal = new Map<string, Map<number, T>>();
  for (const [key, value] of Object.entries(table)) {
    const [metal = '', state = ''] = key.split('/');
    const byState = byMetal.get(metal) ?? new Map<number, T>();
    byState.set(Number(state), value);
    byMetal.set(metal, byState);
  }
  return byMetal;
}

function hintsFor(metal: string, oxidationState: number, verdict: string, ligands: readonly LigandInstance[], dElectrons: number, geometry: string): string[] {
  const hints: string[] = [];
  if (verdict === 'inert') {
    const redox = REDOX_HINTS.get(metal)?.get(oxidationState);
    if (redox) for (const hint of redox) hints.push(hint);
    hints.push(HINT_HEAT);
    if (metal === 'Co' && oxidationState === 3 && hasLigandWhere(ligands, 'NH3', 'en', 0)) hints.push(HINT_INERT_NOT_STABLE);
  } else if (verdict === 'intermediate') {
    hints.push(HINT_INTERMEDIATE);
  } else if (hasLigandWhere(ligands, 'CN', 'CN', 4) || (geometry === 'square-planar' && dElectrons === 8)) {
    hints.push(HINT_STABLE_NOT_INERT);
  }
  return hints;
}
