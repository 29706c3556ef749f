/**
 * Inner- or outer-sphere? The route engine for an oxidant/reductant pair.
 *
 * The rules (H. Taube's criteria, as restated in standard texts; common practice):
 * - A bridged (inner-sphere) route needs a ligand with a free lone pair on one partner (the more
 *   inert one, which keeps it in place) and a partner that can open a coordination site fast
 *   enough to bind the far end of the bridge.
 * - No bridgeable ligand on the inert partner ([Co(NH3)6]3+, [Co(en)3]3+, [Ru(NH3)6]3+,
 *   [Fe(phen)3]3+): outer-sphere.
 * - Both partners substitution-inert: outer-sphere (the electron moves faster than any ligand).
 * - Borderline (both labile; a reductant that substitutes only moderately fast such as V(II), whose
 *   reductions are often substitution-controlled; only coordinated water as a bridge): 'either'.
 * A reversed halide order (F > Cl > Br > I, hard reductants such as Eu(II)) is NOT an outer-sphere
 * signature (Candlin, Halpern & Trimm, J. Am. Chem. Soc. 1964, 86, 1019).
 */
import {
  attackingMetalHardness,
  bridgeableLigands,
  descriptorFromLigand,
  isWaterLigand,
  ligandToken,
  rankBridgingCandidates,
  scoreBridge,
} from './bridging';
import { classifyFormula } from './classify';
import { parseFormula } from './formula-parser';
import { marcusCrossRate, MarcusInputError, type MarcusResult } from './marcus';
import { romanNumeral as roman } from './metal-ions';
import { capitaliseSentence, formatDuration, formatPowerOfTen } from './number-format';
import { findCouple, speciesKey } from './redox-couples';
import type {
  BridgeAssessment,
  CoupleMatch,
  RouteError,
  RouteKind,
  RouteOptions,
  RoutePartner,
  RouteResult,
  RouteRoles,
  TransferredLigand,
} from './route-types';
import { CHECKED_MARKER, FormulaError, type Classification, type LigandInstance, type ParsedFormula } from './types';

/**
 * log10 of the first-order exchange rate (s⁻¹) above which a partner opens a site faster than the
 * bridged step can use it. Chosen here (common practice): Cr(II), Fe(II), Eu(II) aqua ions are far
 * above it; V(II) (k_ex ≈ 10² s⁻¹, Helm & Merbach, Chem. Rev. 2005, 105, 1923) is below and its
 * reductions are often substitution-controlled or outer-sphere.
 */
export const FAST_SUBSTITUTION_LOG_K = 3;

/** Bad input to the route engine: which formula, what is wrong, where. */
export class RouteInputError extends Error {
  readonly field: 'oxidant' | 'reductant';
  readonly formula: string;
  readonly position: number | null;
  constructor(field: 'oxidant' | 'reductant', formula: string, message: string, position: number | null) {
    super(`${field} "${formula}": ${message}${position === null ? '' : ` (at character ${position + 1})`}`);
    this.name = 'RouteInputError';
    this.field = field;
    this.formula = formula;
    this.position = position;
  }
}

function loadPartner(field: 'oxidant' | 'reductant', formula: string, temperatureC: number): RoutePartner {
  if (typeof formula !== 'string' || formula.trim() === '') {
    throw new RouteInputError(field, String(formula), 'give a formula', 0);
  }
  try {
    const parsed = parseFormula(formula);
    const classification = classifyFormula(formula, { temperatureC });
    return { parsed, classification };
  } catch (error) {
    if (error instanceof FormulaError) throw new RouteInputError(field, formula, error.message, error.position);
    throw new RouteInputError(field, formula, error instanceof Error ? error.message : String(error), null);
  }
}

function label(partner: RoutePartner): string {
  const c = partner.classification;
  return `${partner.parsed.input} (${c.metal}(${roman(c.oxidationState)}))`;
}

function formatHalfLife(seconds: number): string {
  return Number.isFinite(seconds) ? formatDuration(seconds) : 'indefinitely long';
}

function labilityWords(role: string, partner: RoutePartner): string {
  const c = partner.classification;
  const basis = c.decidedBy === 'model' ? 'predicted' : 'measured';
  return `${role} ${label(partner)} is ${c.verdict} (exchange half-life ≈ ${formatHalfLife(c.halfLifeSeconds)}, ${basis})`;
}

/** Can the partner open a coordination site? It needs a monodentate ligand to lose (or be a bare aqua ion). */
function hasMonodentateToLose(parsed: ParsedFormula): boolean {
  return parsed.ligands.length === 0 || parsed.ligands.some((instance) => instance.ligand.denticity === 1);
}

type SubstitutionSpeed = 'fast' | 'moderate' | 'slow';

function substitutionSpeed(c: Classification): SubstitutionSpeed {
  if (c.verdict === 'inert') return 'slow';
  if (c.verdict === 'labile' && c.logKPerSecond >= FAST_SUBSTITUTION_LOG_K) return 'fast';
  return 'moderate';
}

// ---------------------------------------------------------------- roles

interface Roles {
  oxidant: RoutePartner;
  reductant: RoutePartner;
  oxidantCouple: CoupleMatch | null;
  reductantCouple: CoupleMatch | null;
  roles: RouteRoles;
  redoxPair: boolean;
  redoxNote: string | null;
}

function assignRoles(first: RoutePartner, second: RoutePartner, options: RouteOptions): Roles {
  const coupleFirst = findCouple(first.parsed);
  const coupleSecond = findCouple(second.parsed);
  const make = (swapped: boolean, source: RouteRoles['oxidant'], note: string, redoxPair = true, redoxNote: string | null = null): Roles => ({
    oxidant: swapped ? second : first,
    reductant: swapped ? first : second,
    oxidantCouple: swapped ? coupleSecond : coupleFirst,
    reductantCouple: swapped ? coupleFirst : coupleSecond,
    roles: { oxidant: source, swapped, note },
    redoxPair,
    redoxNote,
  });

  if (speciesKey(first.parsed) === speciesKey(second.parsed)) {
    return make(false, 'given', 'Same species given twice: roles as given.', false,
      'The same species was given twice: no net reaction, and no self-exchange either (that needs the two oxidation states of the couple).');
  }

  const a = first.classification;
  const b = second.classification;
  const sameSide = coupleFirst === null || coupleSecond === null || coupleFirst.side === coupleSecond.side;
  if (a.metal === b.metal && a.oxidationState === b.oxidationState && sameSide) {
    return make(false, 'given', 'Both partners are in the same oxidation state: roles as given.', false,
      `Both partners are ${a.metal}(${roman(a.oxidationState)}): no electron to exchange between the same oxidation states.`);
  }

  if (coupleFirst && coupleSecond && coupleFirst.couple.e0 && coupleSecond.couple.e0) {
    const e1 = coupleFirst.couple.e0.volts;
    const e2 = coupleSecond.couple.e0.volts;
    if (coupleFirst.side === coupleSecond.side) {
      const which = coupleFirst.side === 'oxidised' ? 'oxidised' : 'reduced';
      return make(false, 'given', `Both are the ${which} forms of their couples: roles as given.`, false,
        `Both are the ${which} forms of their couples (${coupleFirst.couple.label}, ${coupleSecond.couple.label}): neither can ${which === 'oxidised' ? 'reduce' : 'oxidise'} the other.`);
    }
    const swapped = coupleFirst.side === 'reduced';
    if (swapped && options.keepGivenRoles) {
      return make(false, 'given', 'Roles kept as given on request, although the first formula is the reduced form of its couple.');
    }
    const eOx = swapped ? e2 : e1;
    const eRed = swapped ? e1 : e2;
    const oxLabel = swapped ? coupleSecond.couple.label : coupleFirst.couple.label;
    const redLabel = swapped ? coupleFirst.couple.label : coupleSecond.couple.label;
    const selfExchange = coupleFirst.couple.label === coupleSecond.couple.label;
    const direction = selfExchange
      ? `Self-exchange of the ${oxLabel} couple: the same couple on both sides, so ΔE° = 0 and K12 = 1 — no driving force; the electron swaps between the two oxidation states (measurable by isotope labelling or NMR line broadening).`
      : eOx >= eRed
        ? `E°(${oxLabel}) = ${eOx} V > E°(${redLabel}) = ${eRed} V: downhill (ΔE° = ${(eOx - eRed).toFixed(3)} V).`
        : `E°(${oxLabel}) = ${eOx} V < E°(${redLabel}) = ${eRed} V: this direction is uphill (K12 < 1); the reverse reaction is favoured.`;
    const lead = selfExchange ? 'oxidant is the oxidised form of the couple.' : 'oxidant is the oxidised form of the higher-potential couple as given.';
    return make(swapped, 'from-potentials', `${swapped ? 'Order reversed: ' : ''}${lead} ${direction}`);
  }

  // Only one (or no) couple known: a known reduced form given as the oxidant, or two oxidation
  // states of the same metal, still tell which way round the pair goes.
  if (!options.keepGivenRoles) {
    if (coupleFirst?.side === 'reduced' && coupleSecond?.side !== 'reduced') {
      return make(true, 'from-oxidation-states',
        `Order reversed: ${first.parsed.input} is the reduced form of ${coupleFirst.couple.label}, so it is taken as the reductant.`);
    }
    if (a.metal === b.metal && a.oxidationState < b.oxidationState) {
      return make(true, 'from-oxidation-states', `Order reversed: ${a.metal}(${roman(b.oxidationState)}) is the oxidant of the two.`);
    }
  }
  if (coupleSecond?.side === 'oxidised' && coupleFirst === null) {
    return make(false, 'given',
      `Roles as given, but ${second.parsed.input} is the oxidised form of ${coupleSecond.couple.label}: check that ${first.parsed.input} can reduce it.`);
  }
  const unknown = [coupleFirst ? null : first.parsed.input, coupleSecond ? null : second.parsed.input].filter((x): x is string => x !== null);
  return make(false, 'given', `Roles as given: no standard potential for ${unknown.join(' and ')} in the couples table.`);
}

// ---------------------------------------------------------------- product formulas

interface LigandSlot {
  token: string;
  count: number;
  instance: LigandInstance | null;
}

function chargeText(charge: number): string {
  if (charge === 0) return '';
  const sign = charge > 0 ? '+' : '-';
  return Math.abs(charge) === 1 ? sign : `${Math.abs(charge)}${sign}`;
}

function slotText(slots: LigandSlot[]): string {
  return slots
    .filter((slot) => slot.count > 0)
    .map((slot) => `${slot.token}${slot.count > 1 ? slot.count : ''}`)
    .join('');
}

function writeFormula(metal: string, slots: LigandSlot[], charge: number): string {
  return `[${metal}${slotText(slots)}]${chargeText(charge)}`;
}

function slotsOf(parsed: ParsedFormula): LigandSlot[] {
  return parsed.ligands.map((instance) => ({ token: ligandToken(instance.ligand), count: instance.count, instance }));
}

/** Product classifications are used internally only (never returned), so they can be memoised. */
const productClassCache = new Map<string, Classification | null>();
const PRODUCT_CACHE_LIMIT = 500;

function tryClassify(formula: string, temperatureC: number): Classification | null {
  const key = `${formula}|${temperatureC}`;
  const cached = productClassCache.get(key);
  if (cached !== undefined) return cached;
  let result: Classification | null;
  try {
    result = classifyFormula(formula, { temperatureC });
  } catch {
    result = null;
  }
  if (productClassCache.size >= PRODUCT_CACHE_LIMIT) productClassCache.clear();
  productClassCache.set(key, result);
  return result;
}

/** Linkage isomer the bridge gives on the far metal after remote attack (bound through the bridging atom). */
const REMOTE_PRODUCT_TOKEN: Record<string, string> = { SCN: '(NCS)', NCS: '(SCN)', CN: '(NC)', NC: '(CN)', NO2: '(ONO)' };

function aquationWords(product: string, productClass: Classification | null, slots: LigandSlot[], medium: 'acid' | 'neutral'): string {
  if (productClass === null) return `${product} (lability of this product not assessed)`;
  if (productClass.verdict !== 'labile') return `${product} (${productClass.metal}(${roman(productClass.oxidationState)}), ${productClass.verdict}: keeps its ligands for a while)`;
  const released = slots.filter((slot) => slot.instance !== null && !isWaterLigand(slot.instance.ligand) && slot.count > 0);
  if (released.length === 0) return `${product} (${productClass.metal}(${roman(productClass.oxidationState)}), labile)`;
  const charge = productClass.oxidationState;
  const aqua = ['Sc', 'Ti', 'V', 'Cr', 'Mn', 'Fe', 'Co', 'Ni', 'Cu', 'Zn'].includes(productClass.metal)
    ? `[${productClass.metal}(H2O)6]${chargeText(charge)}`
    : `${productClass.metal}${chargeText(charge)}(aq)`;
  const ligandWords = released.map((slot) => {
    const id = slot.instance?.ligand.id ?? slot.token;
    if (medium === 'acid' && id === 'NH3') return `${slot.count} NH4+`;
    if (medium === 'acid' && slot.instance?.ligand.bondingClass === 'sigma' && slot.instance.ligand.donorAtoms.every((atom) => atom === 'N')) {
      return `${slot.count} ${id} (protonated)`;
    }
    return `${slot.count} ${id}${chargeText(slot.instance?.ligand.charge ?? 0)}`;
  });
  return `${product} is ${productClass.metal}(${roman(productClass.oxidationState)}), labile: it falls apart${medium === 'acid' ? ' in acid' : ''} → ${aqua} + ${ligandWords.join(' + ')}`;
}

interface BridgedProducts {
  products: string[];
  transferred: TransferredLigand;
}

type ProductOptions = Required<Pick<RouteOptions, 'medium' | 'temperatureC'>>;

function bridgedProducts(
  host: RoutePartner,
  opener: RoutePartner,
  hostIsOxidant: boolean,
  bridge: LigandInstance,
  options: ProductOptions,
): BridgedProducts {
  const descriptor = descriptorFromLigand(bridge.ligand);
  const bridgingAtom = descriptor?.bridgingAtom ?? bridge.ligand.donorAtoms[0] ?? '?';
  const attack = descriptor?.attack ?? 'adjacent';
  const electronShift = hostIsOxidant ? -1 : 1;
  const q = bridge.ligand.charge;

  // Host loses the bridge and takes (or gives) the electron; water fills the vacated site.
  const hostSlots = slotsOf(host.parsed).map((slot) => (slot.instance === bridge ? { ...slot, count: slot.count - 1 } : slot));
  const waterSlot = hostSlots.find((slot) => slot.instance !== null && isWaterLigand(slot.instance.ligand));
  if (waterSlot) waterSlot.count += 1;
  else hostSlots.push({ token: '(H2O)', count: 1, instance: null });
  const hostCharge = host.parsed.complexCharge - q + electronShift;
  const hostProduct = writeFormula(host.parsed.metal, hostSlots, hostCharge);
  const hostProductClass = tryClassify(hostProduct, options.temperatureC);

  // The site-opening partner loses one water (or its first monodentate ligand) and gains the bridge.
  const openerSlots = slotsOf(opener.parsed);
  const leaving =
    openerSlots.find((slot) => slot.instance !== null && isWaterLigand(slot.instance.ligand)) ??
    openerSlots.find((slot) => slot.instance !== null && slot.instance.ligand.denticity === 1 && slot.instance.ligand.charge === 0);
  const oxidationWord = `${opener.classification.metal}(${roman(opener.classification.oxidationState - electronShift)})`;
  const bridgeToken = attack === 'remote' ? (REMOTE_PRODUCT_TOKEN[bridge.ligand.id] ?? ligandToken(bridge.ligand)) : ligandToken(bridge.ligand);
  let openerClass: Classification | null = null;
  // The opener's ligands besides the bridge in its product, and the charge of the ligand it lost.
  let openerTerminal: LigandSlot[] = [];
  let leavingChargeLost = 0;
  let openerProduct: string | null = null;
  let openerWords: string;
  const openerCn = opener.classification.coordinationNumber;
  if (opener.parsed.ligands.length > 0 && openerCn <= 5 && opener.classification.geometry !== 'square-planar' && !opener.classification.centres) {
    // Already five-coordinate (e.g. [Co(CN)5]3-): the site is open, the bridge simply adds.
    openerTerminal = openerSlots;
    const slots = [...openerSlots, { token: bridgeToken, count: 1, instance: null }];
    openerProduct = writeFormula(opener.parsed.metal, slots, opener.parsed.complexCharge + q - electronShift);
    const cls = tryClassify(openerProduct, options.temperatureC);
    const boundVia = attack === 'remote' ? `, now bound through ${bridgingAtom}` : '';
    openerWords = `${openerProduct} (${bridge.ligand.name} added to the open sixth site of five-coordinate ${opener.parsed.input}${boundVia}, now ${cls?.verdict === 'inert' ? 'inert ' : ''}${oxidationWord}; no ligand has to leave)`;
    openerClass = cls;
  } else if (leaving || opener.parsed.ligands.length === 0) {
    const slots = leaving ? openerSlots.map((slot) => (slot === leaving ? { ...slot, count: slot.count - 1 } : slot)) : [];
    const leavingCharge = leaving?.instance?.ligand.charge ?? 0;
    openerTerminal = slots.slice();
    leavingChargeLost = leavingCharge;
    slots.push({ token: bridgeToken, count: 1, instance: null });
    const openerCharge = opener.parsed.complexCharge - leavingCharge + q - electronShift;
    openerProduct =
      opener.parsed.ligands.length === 0
        ? `${oxidationWord}–${bridge.ligand.id} (aqua ion with ${bridge.ligand.id} bound)`
        : writeFormula(opener.parsed.metal, slots, openerCharge);
    const cls = opener.parsed.ligands.length === 0 ? null : tryClassify(openerProduct, options.temperatureC);
    openerClass = cls;
    const boundVia = attack === 'remote' ? `, now bound through ${bridgingAtom}` : '';
    if (cls === null) {
      openerWords = `${openerProduct} (${bridge.ligand.name} transferred to ${opener.classification.metal}${boundVia}, now ${oxidationWord})`;
    } else if (cls.verdict === 'inert') {
      openerWords = `${openerProduct} (${bridge.ligand.name} transferred to ${opener.classification.metal}${boundVia}, now inert ${oxidationWord}: the transferred ligand stays put — Taube's test for a bridged route)`;
    } else {
      openerWords = `${openerProduct} (${bridge.ligand.name} transferred to ${opener.classification.metal}${boundVia}, but ${oxidationWord} is ${cls.verdict}: it may lose the ligand before it is seen, so transfer cannot be proved this way)`;
    }
    if (bridge.ligand.id === 'OH' && options.medium === 'acid') {
      openerWords += `; in acid the hydroxo product is protonated to the aqua ion`;
    }
  } else {
    openerWords = `${oxidationWord} product carrying ${bridge.ligand.name} (the ligand it loses to make room could not be predicted)`;
  }
  if (opener.classification.electronShell === 'sp') {
    openerWords += `; a main-group ${oxidationWord} intermediate usually goes on to a two-electron product`;
  }

  let products = hostIsOxidant
    ? [openerWords, aquationWords(hostProduct, hostProductClass, hostSlots, options.medium)]
    : [aquationWords(hostProduct, hostProductClass, hostSlots, options.medium), openerWords];
  // Both metals inert after the transfer: the bridged binuclear complex is what is seen, not two
  // separate ions (e.g. [(NC)5Fe(µ-CN)Co(CN)5]6− from [Fe(CN)6]3− and [Co(CN)5]3−: Haim & Wilmarth 1961).
  if (hostProductClass?.verdict === 'inert' && openerClass?.verdict === 'inert' && openerProduct !== null) {
    const hostTerminal = slotsOf(host.parsed).map((slot) => (slot.instance === bridge ? { ...slot, count: slot.count - 1 } : slot));
    const charge = host.parsed.complexCharge + opener.parsed.complexCharge - leavingChargeLost;
    // Oxidation states written after each metal, so the formula parses back to the same two centres.
    const openerOxidationState = opener.classification.oxidationState - electronShift;
    const binuclear = `[${host.parsed.metal}(${roman(hostProductClass.oxidationState)})${slotText(hostTerminal)}(μ-${ligandToken(bridge.ligand).replace(/^\(|\)$/g, '')})${opener.parsed.metal}(${roman(openerOxidationState)})${slotText(openerTerminal)}]${chargeText(charge)}`;
    products = [
      `${binuclear}: the bridged binuclear complex is kept — both ${host.parsed.metal}(${roman(hostProductClass.oxidationState)}) and ${oxidationWord} are inert after the transfer, so the bridge does not break on the time scale of the reaction`,
      ...products.map((p) => `only on slow cleavage: ${p}`),
    ];
  }
  return {
    products,
    transferred: {
      ligand: bridge.ligand.id,
      name: bridge.ligand.name,
      bridgingAtom,
      attack,
      from: host.parsed.input,
      to: openerProduct,
    },
  };
}

function outerSphereProducts(oxidant: RoutePartner, reductant: RoutePartner, options: ProductOptions): string[] {
  const oxSlots = slotsOf(oxidant.parsed);
  const redSlots = slotsOf(reductant.parsed);
  const oxProduct = writeFormula(oxidant.parsed.metal, oxSlots, oxidant.parsed.complexCharge - 1);
  const redProduct = writeFormula(reductant.parsed.metal, redSlots, reductant.parsed.complexCharge + 1);
  return [
    aquationWords(oxProduct, tryClassify(oxProduct, options.temperatureC), oxSlots, options.medium),
    `${redProduct} (same ligands, no ligand transfer)`,
  ];
}

// ---------------------------------------------------------------- Marcus

function marcusFor(roles: Roles, temperatureC: number): { marcus: MarcusResult | null; notes: string[] } {
  const notes: string[] = [];
  const ox = roles.oxidantCouple;
  const red = roles.reductantCouple;
  if (!roles.redoxPair) return { marcus: null, notes: ['No Marcus estimate: the partners cannot exchange an electron as given.'] };
  if (!ox || !red) {
    const missing = [ox ? null : roles.oxidant.parsed.input, red ? null : roles.reductant.parsed.input].filter((x): x is string => x !== null);
    return { marcus: null, notes: [`No Marcus estimate: no self-exchange constant and potential for ${missing.join(' and ')} in the couples table.`] };
  }
  if (!ox.couple.k11 || !red.couple.k11 || !ox.couple.e0 || !red.couple.e0) {
    return { marcus: null, notes: ['No Marcus estimate: the couples table lacks k11 or E° for one of the couples.'] };
  }
  try {
    const marcus = marcusCrossRate({
      k11: ox.couple.k11.valuePerMolarSecond,
      k22: red.couple.k11.valuePerMolarSecond,
      deltaEV: ox.couple.e0.volts - red.couple.e0.volts,
      temperatureC,
    });
    for (const couple of ox.couple === red.couple ? [ox.couple] : [ox.couple, red.couple]) {
      const k11 = couple.k11;
      if (!k11) continue;
      notes.push(`k11(${couple.label}) = ${k11.asReported} M⁻¹ s⁻¹ at ${k11.temperatureC} °C, ${k11.medium} — ${k11.source} [${CHECKED_MARKER[k11.checked]}].`);
      if (k11.qualifier !== 'measured') notes.push(`k11(${couple.label}) is ${k11.qualifier.replace('-', ' ')}: the prediction inherits that.`);
      notes.push(...couple.mediumCaveats.map((caveat) => `${couple.label}: ${caveat}`));
    }
    notes.push('The cross relation describes the outer-sphere path; a bridged route, if open, is usually faster.');
    return { marcus, notes };
  } catch (error) {
    if (error instanceof MarcusInputError) return { marcus: null, notes: [`No Marcus estimate: ${error.message}`] };
    throw error;
  }
}

// ---------------------------------------------------------------- the route

function goodBridges(assessments: BridgeAssessment[]): BridgeAssessment[] {
  return assessments.filter((assessment) => assessment.strength === 'good');
}

function uniqueStrings(values: string[]): string[] {
  return [...new Set(values)];
}

/**
 * Predicts the electron-transfer route for an oxidant/reductant pair. Throws RouteInputError when a
 * formula cannot be read (with the field and the character position).
 */
export function predictRoute(oxidantFormula: string, reductantFormula: string, options: RouteOptions = {}): RouteResult {
  const temperatureC = options.temperatureC ?? 25;
  const medium = options.medium ?? 'acid';
  const first = loadPartner('oxidant', oxidantFormula, temperatureC);
  const second = loadPartner('reductant', reductantFormula, temperatureC);
  const assigned = assignRoles(first, second, options);
  const { oxidant, reductant } = assigned;
  const ox = oxidant.classification;
  const red = reductant.classification;
  const reasons: string[] = [];
  if (assigned.roles.swapped) reasons.push(assigned.roles.note);
  if (!assigned.redoxPair && assigned.redoxNote) reasons.push(`Not a redox pair: ${assigned.redoxNote} The route below is what would apply if they were.`);

  reasons.push(labilityWords('Oxidant', oxidant), labilityWords('Reductant', reductant));

  const oxSpeed = substitutionSpeed(ox);
  const redSpeed = substitutionSpeed(red);
  let route: RouteKind;
  let bridgeHost: 'oxidant' | 'reductant' | null = null;
  let bridgeInstance: LigandInstance | null = null;
  let aquaBridgeOnly = false;
  const productOptions = { medium, temperatureC };

  if (oxSpeed === 'slow' && redSpeed === 'slow') {
    route = 'outer-sphere';
    reasons.push('Both partners are substitution-inert: neither can open a site for a bridge in time, so the electron moves across the intact coordination spheres (outer-sphere).');
  } else {
    // The more inert partner holds the bridge; the other must open a site to bind its far end.
    const hostIsOxidant = oxSpeed === 'slow' ? true : redSpeed === 'slow' ? false : ox.logKPerSecond <= red.logKPerSecond;
    bridgeHost = hostIsOxidant ? 'oxidant' : 'reductant';
    const host = hostIsOxidant ? oxidant : reductant;
    const opener = hostIsOxidant ? reductant : oxidant;
    const openerSpeed = hostIsOxidant ? redSpeed : oxSpeed;
    const assessments = bridgeableLigands(host.parsed);
    const good = goodBridges(assessments);
    const weak = assessments.filter((assessment) => assessment.strength === 'weak');
    const blocked = assessments.filter((assessment) => !assessment.canBridge);
    if (blocked.length > 0) reasons.push(...blocked.map((assessment) => `No bridge: ${assessment.reason}.`));
    reasons.push(...good.map((assessment) => `Bridge available on ${host.parsed.input}: ${assessment.reason}.`));
    reasons.push(...weak.map((assessment) => `Weak bridge on ${host.parsed.input}: ${assessment.reason}.`));

    const canOpenSite = hasMonodentateToLose(opener.parsed);
    const bothLabile = oxSpeed !== 'slow' && redSpeed !== 'slow';

    if (good.length === 0 && weak.length === 0) {
      route = 'outer-sphere';
      reasons.push(`${host.parsed.input} has no ligand with a free lone pair: no bridge can form, so the route is outer-sphere.`);
    } else if (!canOpenSite) {
      route = 'outer-sphere';
      reasons.push(`${opener.parsed.input} holds only chelating ligands: it cannot readily open a site for the bridge (tris-chelate reductants such as [Cr(bpy)3]2+ react outer-sphere, common practice).`);
    } else if (bothLabile) {
      route = 'either';
      reasons.push('Both partners substitute quickly: a bridged route is possible but products re-equilibrate, so ligand transfer is hard to prove; the outer-sphere path competes.');
    } else if (good.length > 0 && openerSpeed === 'fast') {
      route = 'inner-sphere';
      reasons.push(`${opener.parsed.input} is labile and can open a site quickly while ${host.parsed.input} keeps its bridging ligand in place: a bridged (inner-sphere) route is expected.`);
    } else if (good.length > 0) {
      route = 'either';
      reasons.push(
        `${opener.parsed.input} substitutes only moderately fast (k ≈ ${formatPowerOfTen((hostIsOxidant ? red : ox).logKPerSecond)} s⁻¹): a bridged path would be limited by its substitution rate, and the outer-sphere path may win (e.g. V(II) reductions are often substitution-controlled or outer-sphere, common practice).`,
      );
    } else if (openerSpeed === 'fast' && hostIsOxidant) {
      // Murmann, Taube & Posey, J. Am. Chem. Soc. 1957, 79, 262: with Cr(II), the 18O of
      // [Co(NH3)5(OH2)]3+ ends up on Cr(III); the rate has a term in 1/[H+] (the hydroxo form).
      route = 'inner-sphere';
      aquaBridgeOnly = true;
      reasons.push(
        `Only coordinated water could bridge on ${host.parsed.input}, and water itself is a poor bridge; its conjugate base, the hydroxo form, bridges well. Acid dependence: the hydroxo form is a small fraction set by the acid dissociation constant Ka of the aqua ligand, so the bridged rate grows as 1/[H+] — inner-sphere through hydroxide at low acid; in strong acid this path slows and the outer-sphere path competes. The oxygen moves from ${host.classification.metal} to ${opener.classification.metal} (an 18O label shows it: Murmann, Taube & Posey 1957).`,
      );
    } else {
      route = 'either';
      aquaBridgeOnly = true;
      reasons.push(
        `Only coordinated water could bridge on ${host.parsed.input}: the aqua form reacts slowly through its conjugate base (hydroxo-bridged path, rate ∝ 1/[H+], faster at low acid) and the outer-sphere path competes.`,
      );
    }

    if (good.length > 0 && route !== 'outer-sphere') {
      const context = {
        attackingMetal: opener.classification.metal,
        attackingOxidationState: opener.classification.oxidationState,
        attackingProductOxidationState: opener.classification.oxidationState + (hostIsOxidant ? 1 : -1),
      };
      let best: { instance: LigandInstance; score: number } | null = null;
      for (const instance of host.parsed.ligands) {
        const descriptor = descriptorFromLigand(instance.ligand);
        if (descriptor === null || descriptor.protonatedOxygen) continue;
        const { score } = scoreBridge(descriptor, context);
        if (best === null || score > best.score) best = { instance, score };
      }
      bridgeInstance = best?.instance ?? null;
      const hardness = attackingMetalHardness(context.attackingMetal, context.attackingOxidationState);
      if (hardness.hardness >= 0.5 && host.parsed.ligands.some((instance) => ['F', 'Cl', 'Br', 'I'].includes(instance.ligand.id))) {
        reasons.push(
          `${hardness.label}: expect the reversed halide order (F > Cl > Br > I) for it — still a bridged route; a reversed order is not an outer-sphere signature (Candlin, Halpern & Trimm 1964).`,
        );
      }
    }
  }

  for (const partner of [oxidant, reductant]) {
    const c = partner.classification;
    if (c.electronShell === 'sp') {
      reasons.push(`${partner.parsed.input} is a main-group ion: such partners often react by two-electron or atom-transfer steps; the one-electron route model is a guide only.`);
    } else if (c.electronShell === 'f') {
      reasons.push(`${partner.parsed.input} is an f-block ion: labile and hard, it binds hard bridges (F⁻, OH⁻) best.`);
    }
  }

  const roundedHost = bridgeHost ?? 'oxidant';
  const bridgingCandidates = rankBridgingCandidates(oxidant, reductant, { host: roundedHost });

  let expectedProducts: string[];
  let transferredLigand: TransferredLigand | null = null;
  if (!assigned.redoxPair) {
    expectedProducts = ['No electron transfer expected between these two species.'];
  } else if (route !== 'outer-sphere' && bridgeInstance !== null && bridgeHost !== null) {
    const hostIsOxidant = bridgeHost === 'oxidant';
    const host = hostIsOxidant ? oxidant : reductant;
    const opener = hostIsOxidant ? reductant : oxidant;
    const bridged = bridgedProducts(host, opener, hostIsOxidant, bridgeInstance, productOptions);
    transferredLigand = bridged.transferred;
    expectedProducts = route === 'inner-sphere'
      ? bridged.products
      : [...bridged.products.map((p) => `if bridged: ${p}`), ...outerSphereProducts(oxidant, reductant, productOptions).map((p) => `if outer-sphere: ${p}`)];
  } else {
    expectedProducts = outerSphereProducts(oxidant, reductant, productOptions);
    if (aquaBridgeOnly && bridgeHost !== null) {
      const opener = bridgeHost === 'oxidant' ? reductant : oxidant;
      if (route === 'inner-sphere') {
        expectedProducts = expectedProducts.map((p) => p.replace(' (same ligands, no ligand transfer)', ` (one of its waters is the oxygen that was on ${(bridgeHost === 'oxidant' ? oxidant : reductant).classification.metal})`));
      }
      expectedProducts.push(
        route === 'inner-sphere'
          ? `through the hydroxo bridge: the O of the aqua ligand goes to ${opener.classification.metal} as hydroxide and is protonated in acid — the same products as without a bridge, told apart only by isotope (18O) labelling`
          : `if bridged through the hydroxo form: O transferred to ${opener.classification.metal} as hydroxide, protonated in acid — same products, provable only by isotope (18O) labelling`,
      );
    }
  }

  const { marcus, notes: marcusNotes } = marcusFor(assigned, temperatureC);
  reasons.push('Rules of thumb, not measurements: confirm the route by product analysis (ligand transfer) or by rate comparisons.');

  return {
    input: { first: oxidantFormula, second: reductantFormula },
    route,
    redoxPair: assigned.redoxPair,
    reasons: reasons.map(capitaliseSentence),
    bridgingCandidates,
    bridgeHost,
    oxidant: ox,
    reductant: red,
    roles: assigned.roles,
    transferredLigand,
    expectedProducts: expectedProducts.map(capitaliseSentence),
    cautions: uniqueStrings([...ox.cautions, ...red.cautions]),
    marcus,
    marcusNotes,
  };
}

/** Batch form for the CLI and API: one result or one error per pair, in order. */
export function predictRoutes(pairs: readonly (readonly [string, string])[], options: RouteOptions = {}): (RouteResult | RouteError)[] {
  return pairs.map(([oxidant, reductant]) => {
    try {
      return predictRoute(oxidant, reductant, options);
    } catch (error) {
      if (error instanceof RouteInputError) {
        return { oxidant, reductant, field: error.field, error: error.message, position: error.position };
      }
      return { oxidant, reductant, field: null, error: error instanceof Error ? error.message : String(error), position: null };
    }
  });
}

export function isRouteError(value: RouteResult | RouteError): value is RouteError {
  return 'error' in value;
}
