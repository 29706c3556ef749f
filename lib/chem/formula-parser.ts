/**
 * Coordination-formula parser: "[Co(en)2(NO2)Cl]NO3", "K3[Cr(ox)3]·3H2O", "[Cr(H2O)6]³⁺" …
 * Every failure is a FormulaError with a 0-based character position and a message that says
 * what is wrong there. The oxidation state follows from the charge balance
 * (counter-ions + complex charge + ligand charges).
 */
import saltReadingData from '@/data/salt-readings.json';
import trivialNameData from '@/data/trivial-names.json';
import * as elements from './elements';
import * as ligandsModule from './ligands';
import * as metalIons from './metal-ions';
import { FormulaError, type Checked, type FormulaReading, type IonPart, type LigandDefinition, type LigandInstance, type ParsedFormula } from './types';

// Read once: under tsx each use of an imported name is a getter call, which shows in the
// parser's inner loops (see classify.ts).
const { atomicWeight, compositionTerms, elementRecord, elementSymbolFromCharCodes } = elements;
const { findLigand, ligandTable, suggestLigandSpelling } = ligandsModule;
const { electronConfiguration, isMetalSymbol, metalElement } = metalIons;

/** Parsed formula plus what classify() needs beyond the shared ParsedFormula shape. */
export interface ParsedComplex extends ParsedFormula {
  oxidationState: number;
  /** Charge written by the user (null if it came from the counter-ions or defaulted to 0). */
  writtenCharge: number | null;
  readings: FormulaReading[];
  warnings: string[];
  /** µ-bridged dinuclear species: each metal centre with its own oxidation state and ligands (bridges on both). */
  centres?: MetalCentre[];
}

/** One metal centre of a µ-bridged dinuclear species. */
export interface MetalCentre {
  metal: string;
  oxidationState: number;
  /** Terminal ligands of this centre plus every bridge. */
  ligands: LigandInstance[];
  /** The bridging ligands (also in `ligands`). */
  bridges: LigandInstance[];
  /** A mononuclear formula with this centre's ligand set and charge, for classifying the centre. */
  species: string;
}

interface CounterIonDefinition {
  formula: string;
  charge: number;
  composition: Record<string, number>;
}

// Common counter-ions with their charges (common practice). Longest spelling wins when scanning.
const CATIONS: readonly CounterIonDefinition[] = [
  { formula: 'H', charge: 1, composition: { H: 1 } },
  { formula: 'Li', charge: 1, composition: { Li: 1 } },
  { formula: 'Na', charge: 1, composition: { Na: 1 } },
  { formula: 'K', charge: 1, composition: { K: 1 } },
  { formula: 'Rb', charge: 1, composition: { Rb: 1 } },
  { formula: 'Cs', charge: 1, composition: { Cs: 1 } },
  { formula: 'Ag', charge: 1, composition: { Ag: 1 } },
  { formula: 'Tl', charge: 1, composition: { Tl: 1 } },
  { formula: 'NH4', charge: 1, composition: { N: 1, H: 4 } },
  { formula: 'NMe4', charge: 1, composition: { N: 1, C: 4, H: 12 } },
  { formula: 'NEt4', charge: 1, composition: { N: 1, C: 8, H: 20 } },
  { formula: 'NBu4', charge: 1, composition: { N: 1, C: 16, H: 36 } },
  { formula: 'PPh4', charge: 1, composition: { P: 1, C: 24, H: 20 } },
  { formula: 'Mg', charge: 2, composition: { Mg: 1 } },
  { formula: 'Ca', charge: 2, composition: { Ca: 1 } },
  { formula: 'Sr', charge: 2, composition: { Sr: 1 } },
  { formula: 'Ba', charge: 2, composition: { Ba: 1 } },
];

const ANIONS: readonly CounterIonDefinition[] = [
  { formula: 'F', charge: -1, composition: { F: 1 } },
  { formula: 'Cl', charge: -1, composition: { Cl: 1 } },
  { formula: 'Br', charge: -1, composition: { Br: 1 } },
  { formula: 'I', charge: -1, composition: { I: 1 } },
  { formula: 'I3', charge: -1, composition: { I: 3 } },
  { formula: 'OH', charge: -1, composition: { O: 1, H: 1 } },
  { formula: 'CN', charge: -1, composition: { C: 1, N: 1 } },
  { formula: 'SCN', charge: -1, composition: { S: 1, C: 1, N: 1 } },
  { formula: 'N3', charge: -1, composition: { N: 3 } },
  { formula: 'NO3', charge: -1, composition: { N: 1, O: 3 } },
  { formula: 'NO2', charge: -1, composition: { N: 1, O: 2 } },
  { formula: 'ClO4', charge: -1, composition: { Cl: 1, O: 4 } },
  { formula: 'BF4', charge: -1, composition: { B: 1, F: 4 } },
  { formula: 'PF6', charge: -1, composition: { P: 1, F: 6 } },
  { formula: 'SbF6', charge: -1, composition: { Sb: 1, F: 6 } },
  { formula: 'AsF6', charge: -1, composition: { As: 1, F: 6 } },
  { formula: 'OTf', charge: -1, composition: { C: 1, F: 3, S: 1, O: 3 } },
  { formula: 'CF3SO3', charge: -1, composition: { C: 1, F: 3, S: 1, O: 3 } },
  { formula: 'OTs', charge: -1, composition: { C: 7, H: 7, S: 1, O: 3 } },
  { formula: 'BPh4', charge: -1, composition: { B: 1, C: 24, H: 20 } },
  { formula: 'OAc', charge: -1, composition: { C: 2, H: 3, O: 2 } },
  { formula: 'CH3COO', charge: -1, composition: { C: 2, H: 3, O: 2 } },
  { formula: 'HSO4', charge: -1, composition: { H: 1, S: 1, O: 4 } },
  { formula: 'SO4', charge: -2, composition: { S: 1, O: 4 } },
  { formula: 'CO3', charge: -2, composition: { C: 1, O: 3 } },
  { formula: 'C2O4', charge: -2, composition: { C: 2, O: 4 } },
  { formula: 'PO4', charge: -3, composition: { P: 1, O: 4 } },
];

const cationByFormula: ReadonlyMap<string, CounterIonDefinition> = new Map(CATIONS.map((c) => [c.formula, c]));
const anionByFormula: ReadonlyMap<string, CounterIonDefinition> = new Map(ANIONS.map((a) => [a.formula, a]));
function lengthsByFirstChar(tokens: Iterable<string>): ReadonlyMap<string, readonly number[]> {
  const lengths = new Map<string, number[]>();
  for (const token of tokens) {
    const first = token[0] ?? '';
    const list = lengths.get(first) ?? [];
    if (!list.includes(token.length)) list.push(token.length);
    lengths.set(first, list);
  }
  for (const list of lengths.values()) list.sort((a, b) => b - a);
  return lengths;
}

const cationLengths = lengthsByFirstChar(cationByFormula.keys());

/** A catalogue spelling and what it stands for. */
interface CatalogueToken<T> {
  token: string;
  value: T;
}

/**
 * The table's spellings grouped by the code of their first character, longest first: the scanner
 * tries each against the input in place (no substring to cut and hash), and a match hands back the
 * table's own string and a ready-made result.
 */
function tokensByFirstChar<T>(table: ReadonlyMap<string, T>): ReadonlyMap<number, readonly CatalogueToken<T>[]> {
  const byFirst = new Map<number, CatalogueToken<T>[]>();
  for (const [token, value] of table) {
    const list = byFirst.get(token.charCodeAt(0)) ?? [];
    list.push({ token, value });
    byFirst.set(token.charCodeAt(0), list);
  }
  for (const list of byFirst.values()) list.sort((a, b) => b.token.length - a.token.length);
  return byFirst;
}

const cationTokens = tokensByFirstChar(cationByFormula);
const anionTokens = tokensByFirstChar(anionByFormula);
const ligandTokensByFirstChar = tokensByFirstChar(ligandTable);

const MAX_FORMULA_LENGTH = 300;
const WATER_COMPOSITION: Readonly<Record<string, number>> = { H: 2, O: 1 };

// Scratch space for the composition, reused by every parse (parsing is synchronous): symbols in
// order of first appearance, their totals and atomic weights. A formula has only a handful of
// elements, so a linear search beats a Map, and the record is built once at the end.
const scratchSymbols: string[] = [];
const scratchCounts: number[] = [];
const scratchWeights: number[] = [];
let scratchLength = 0;

/** The scratch totals as a composition record (keys in order of first appearance). */
function compositionFromScratch(): Record<string, number> {
  const composition: Record<string, number> = {};
  for (let index = 0; index < scratchLength; index++) composition[scratchSymbols[index] as string] = scratchCounts[index] ?? 0;
  return composition;
}

/** The metal's atomic weight for the scratch (NaN if it has none: molarMassFromScratch then throws). */
function metalAtomicWeight(symbol: string): number {
  return elementRecord(symbol)?.atomicWeight ?? Number.NaN;
}

/** Molar mass (g/mol) of the scratch totals: the same sum, in the same order, as molarMassGPerMol(composition). */
function molarMassFromScratch(): number {
  let total = 0;
  for (let index = 0; index < scratchLength; index++) {
    const count = scratchCounts[index] ?? 0;
    if (count === 0) continue;
    const weight = scratchWeights[index] ?? Number.NaN;
    // NaN: a symbol without an atomic weight; atomicWeight() throws the usual error for it.
    total += (Number.isNaN(weight) ? atomicWeight(scratchSymbols[index] as string) : weight) * count;
  }
  return total;
}

function addToScratch(part: Readonly<Record<string, number>>, times: number): void {
  const terms = compositionTerms(part);
  for (let termIndex = 0; termIndex < terms.length; termIndex++) {
    const term = terms[termIndex] as elements.CompositionTerm;
    let index = 0;
    while (index < scratchLength && scratchSymbols[index] !== term.symbol) index++;
    if (index === scratchLength) {
      scratchSymbols[index] = term.symbol;
      scratchCounts[index] = 0;
      scratchWeights[index] = term.atomicWeight;
      scratchLength++;
    }
    scratchCounts[index] = (scratchCounts[index] ?? 0) + term.count * times;
  }
}
const MAX_COUNT = 99;
const HYDRATE_SEPARATORS = new Set(['·', '.', '*', '•', '⋅', '∙']);
const SUPERSCRIPT_DIGITS: ReadonlyMap<string, number> = new Map(
  [...'⁰¹²³⁴⁵⁶⁷⁸⁹'].map((ch, index) => [ch, index]),
);
const SUBSCRIPT_DIGIT_BASE = 0x2080; // ₀

/**
 * Maps what the app itself prints and what people paste to the characters the scanner reads, one
 * UTF-16 unit for one, so every position still points into the formula as written: subscript digits
 * to ASCII (NH₃ → NH3), superscript digits after η, κ or μ to ASCII (η⁵-C5H5), the micro sign to μ,
 * Unicode hyphens to '-', and primes and curly apostrophes to "'" (2,2′-bpy). Superscript digits
 * elsewhere stay: they are a charge.
 */
export function normalizeFormula(input: string): string {
  // Most formulas are plain ASCII: nothing to map, and no string to build.
  let ascii = true;
  for (let index = 0; index < input.length; index++) {
    if (input.charCodeAt(index) > 127) {
      ascii = false;
      break;
    }
  }
  if (ascii) return input;
  let out = '';
  let changed = false;
  for (let index = 0; index < input.length; index++) {
    const ch = input[index] as string;
    const code = ch.charCodeAt(0);
    let mapped = ch;
    if (code >= SUBSCRIPT_DIGIT_BASE && code <= SUBSCRIPT_DIGIT_BASE + 9) mapped = String.fromCharCode(48 + code - SUBSCRIPT_DIGIT_BASE);
    else if (ch === 'µ') mapped = 'μ';
    else if (ch === '‐' || ch === '‑') mapped = '-';
    else if (ch === '′' || ch === '’' || ch === 'ʼ') mapped = "'";
    else if (SUPERSCRIPT_DIGITS.has(ch) && /[ηκμ]/.test(input[index - 1] ?? '')) mapped = String(SUPERSCRIPT_DIGITS.get(ch));
    if (mapped !== ch) changed = true;
    out += mapped;
  }
  return changed ? out : input;
}

function digitValue(ch: string | undefined): number {
  if (ch === undefined) return -1;
  const code = ch.charCodeAt(0);
  if (code >= 48 && code <= 57) return code - 48;
  if (code >= SUBSCRIPT_DIGIT_BASE && code <= SUBSCRIPT_DIGIT_BASE + 9) return code - SUBSCRIPT_DIGIT_BASE;
  return -1;
}

function isUpper(ch: string | undefined): boolean {
  return ch !== undefined && ch >= 'A' && ch <= 'Z';
}
function isLower(ch: string | undefined): boolean {
  return ch !== undefined && ch >= 'a' && ch <= 'z';
}
function isSpace(ch: string | undefined): boolean {
  return ch === ' ' || ch === '\t' || ch === '\n' || ch === '\r' || ch === '\u00a0';
}
function isPlus(ch: string | undefined): boolean {
  return ch === '+' || ch === '⁺';
}
function isMinus(ch: string | undefined): boolean {
  return ch === '-' || ch === '−' || ch === '⁻' || ch === '–';
}

/** Formats a charge the way chemists write it: "3+", "2−" is avoided in favour of ASCII "2-". */
export function formatCharge(charge: number): string {
  if (charge === 0) return '0';
  const magnitude = Math.abs(charge);
  return `${magnitude === 1 ? '' : magnitude}${charge > 0 ? '+' : '-'}`;
}

class FormulaScanner {
  /** The formula with Unicode subscripts and look-alike characters mapped one to one (see normalizeFormula). */
  readonly input: string;
  /** The formula as written (errors quote it). */
  readonly original: string;
  readonly end: number;
  pos: number;

  constructor(input: string, original: string = input) {
    this.input = input;
    this.original = original;
    let end = input.length;
    while (end > 0 && isSpace(input[end - 1])) end--;
    this.end = end;
    let start = 0;
    while (start < end && isSpace(input[start])) start++;
    this.pos = start;
  }

  fail(message: string, position: number): never {
    throw new FormulaError(message, this.original, Math.max(0, Math.min(position, this.input.length)));
  }

  peek(offset = 0): string | undefined {
    const index = this.pos + offset;
    return index < this.end ? this.input[index] : undefined;
  }

  atEnd(): boolean {
    return this.pos >= this.end;
  }

  skipSpaces(): void {
    while (this.pos < this.end && isSpace(this.input[this.pos])) this.pos++;
  }

  /** Reads an optional count (ASCII or subscript digits); returns 1 when none is written. */
  readCount(what: string): number {
    return this.readCountOf(what, false);
  }

  /** readCount after a catalogue token; the messages quote it ('NH3'), built only when one is needed. */
  readTokenCount(token: string): number {
    return this.readCountOf(token, true);
  }

  private readCountOf(what: string, quoted: boolean): number {
    const start = this.pos;
    let value = 0;
    let digits = 0;
    for (let digit = digitValue(this.peek()); digit >= 0; digit = digitValue(this.peek())) {
      value = value * 10 + digit;
      digits++;
      this.pos++;
      if (digits > 3) this.fail(`Count at character ${start + 1} is too long`, start);
    }
    if (digits === 0) return 1;
    // The quoted subject is built only for an error: most ligands and ions carry a valid count.
    if (value === 0) this.fail(`Count 0 for ${quoted ? `'${what}'` : what} at character ${start + 1} makes no sense`, start);
    if (value > MAX_COUNT) this.fail(`Count ${value} for ${quoted ? `'${what}'` : what} at character ${start + 1} is too large`, start);
    return value;
  }

  /** Longest catalogue token starting at the cursor (before the trailing spaces), without consuming it. */
  matchLongest<T>(tokens: ReadonlyMap<number, readonly CatalogueToken<T>[]>): CatalogueToken<T> | null {
    if (this.pos >= this.end) return null;
    const candidates = tokens.get(this.input.charCodeAt(this.pos));
    if (candidates === undefined) return null;
    const available = this.end - this.pos;
    for (const candidate of candidates) {
      if (candidate.token.length <= available && this.input.startsWith(candidate.token, this.pos)) return candidate;
    }
    return null;
  }

  /**
   * The catalogue token written exactly from `start` to `end` (no spaces around it), or null. A
   * null still leaves the trimmed text to be looked up: catalogue spellings never start or end with a space.
   */
  tokenSpanning<T>(tokens: ReadonlyMap<number, readonly CatalogueToken<T>[]>, start: number, end: number): CatalogueToken<T> | null {
    const candidates = start < end ? tokens.get(this.input.charCodeAt(start)) : undefined;
    if (candidates === undefined) return null;
    const length = end - start;
    for (const candidate of candidates) {
      if (candidate.token.length === length && this.input.startsWith(candidate.token, start)) return candidate;
    }
    return null;
  }

  /** Index of the ')' closing the '(' at `open`, or -1. */
  closingParenthesis(open: number): number {
    let depth = 0;
    for (let index = open; index < this.end; index++) {
      const ch = this.input[index];
      if (ch === '(') depth++;
      else if (ch === ')') {
        depth--;
        if (depth === 0) return index;
      } else if (ch === '[' || ch === ']') return -1;
    }
    return -1;
  }

  /**
   * Reads a written charge at the cursor: "3+", "+3", "^3+", "³⁺", "+", "2-", "−". Returns null
   * (cursor unchanged) when there is none.
   */
  readCharge(): { charge: number; position: number } | null {
    const save = this.pos;
    this.skipSpaces();
    const position = this.pos;
    if (this.peek() === '^') this.pos++;
    // Sign first ("+3") or digits first ("3+"); no closure here: tsx names every closure it creates.
    let sign = signOf(this.peek());
    if (sign !== 0) this.pos++;
    const digitsStart = this.pos;
    let magnitude = this.readChargeDigits(position);
    const digits = this.pos - digitsStart;
    if (sign === 0 && digits > 0) {
      sign = signOf(this.peek());
      if (sign !== 0) this.pos++;
    }
    if (sign === 0) {
      this.pos = save;
      return null;
    }
    if (digits === 0) magnitude = 1;
    if (magnitude === 0) this.fail(`Charge at character ${position + 1}: write a neutral complex without a charge`, position);
    return { charge: sign * magnitude, position };
  }

  /** Reads the digits (ASCII, subscript or superscript) of a charge; each digit is one UTF-16 unit. */
  private readChargeDigits(chargePosition: number): number {
    let magnitude = 0;
    let digits = 0;
    for (;;) {
      const ch = this.peek();
      const ascii = digitValue(ch);
      const superscript = ch === undefined ? undefined : SUPERSCRIPT_DIGITS.get(ch);
      const value = ascii >= 0 ? ascii : superscript ?? -1;
      if (value < 0) return magnitude;
      magnitude = magnitude * 10 + value;
      digits++;
      this.pos++;
      if (digits > 2) this.fail(`Charge at character ${chargePosition + 1} is too large`, chargePosition);
    }
  }
}

/** 1 for a plus sign, −1 for a minus sign, 0 otherwise. */
function signOf(ch: string | undefined): number {
  return isPlus(ch) ? 1 : isMinus(ch) ? -1 : 0;
}

interface InnerSphere {
  metal: string;
  element: metalIons.MetalElement;
  metalPosition: number;
  ligands: LigandInstance[];
}

function readMetal(scanner: FormulaScanner): { metal: string; element: metalIons.MetalElement; position: number } {
  const position = scanner.pos;
  const first = scanner.peek() ?? '';
  if (!isUpper(first)) {
    if (first === '' || first === ']') scanner.fail(`Expected a metal symbol at character ${position + 1}`, position);
    scanner.fail(
      `Expected the metal symbol at character ${position + 1}, found '${first}': write the metal first, e.g. [Co(NH3)6]`,
      position,
    );
  }
  const second = scanner.peek(1);
  const hasSecondLetter = isLower(second);
  // Two letters when the second is lower case and they make a symbol, else the first letter alone.
  const firstCode = scanner.input.charCodeAt(position);
  let symbol = hasSecondLetter ? elementSymbolFromCharCodes(firstCode, scanner.input.charCodeAt(position + 1)) : undefined;
  if (symbol === undefined) symbol = elementSymbolFromCharCodes(firstCode, 0);
  if (symbol === undefined) {
    scanner.fail(`Unknown element '${hasSecondLetter ? `${first}${second}` : first}' at character ${position + 1} (symbols are case-sensitive)`, position);
  }
  const element = metalElement(symbol);
  if (element === undefined) {
    scanner.fail(
      `'${symbol}' at character ${position + 1} is not a metal this tool knows: write the metal first inside [ ], e.g. [Co(NH3)6]3+`,
      position,
    );
  }
  // The table's own string for the symbol: a string cut from the input would be hashed afresh
  // every time it is used as a key (Map look-ups, the composition record) further on.
  symbol = element.symbol;
  scanner.pos += symbol.length;
  const countPosition = scanner.pos;
  if (digitValue(scanner.peek()) >= 0) {
    const count = scanner.readCount('the metal');
    if (count > 1) {
      scanner.fail(
        `Polynuclear species (${count} ${symbol} atoms, character ${countPosition + 1}) are not supported: classify one metal centre at a time`,
        countPosition,
      );
    }
  }
  return { metal: symbol, element, position };
}

function unknownLigandMessage(token: string, position: number): string {
  const suggestion = suggestLigandSpelling(token);
  const hint = suggestion !== undefined && suggestion !== token ? ` (names are case-sensitive: did you mean '${suggestion}'?)` : '';
  return `Unknown ligand '${token}' at character ${position + 1}${hint}`;
}

function addLigand(ligands: LigandInstance[], ligand: LigandDefinition, written: string, count: number, position: number): void {
  for (const existing of ligands) {
    if (existing.ligand === ligand) {
      existing.count += count;
      return;
    }
  }
  ligands.push({ ligand, written, count, position });
}

/** Reads metal and ligands up to `stop` (']' inside brackets; charge/end for a bare entity). */
function readInnerSphere(scanner: FormulaScanner, bracketed: boolean, openPosition: number): InnerSphere {
  scanner.skipSpaces();
  const { metal, element, position: metalPosition } = readMetal(scanner);
  const ligands: LigandInstance[] = [];
  for (;;) {
    scanner.skipSpaces();
    const ch = scanner.peek();
    const position = scanner.pos;
    if (ch === undefined) {
      if (bracketed) scanner.fail(`Unclosed '[' opened at character ${openPosition + 1}`, openPosition);
      break;
    }
    if (bracketed && ch === ']') break;
    if (ch === '[') scanner.fail(`Nested '[' at character ${position + 1} is not supported`, position);
    if (ch === ')') scanner.fail(`Unmatched ')' at character ${position + 1}`, position);
    if (ch === '(') {
      const close = scanner.closingParenthesis(position);
      if (close < 0) scanner.fail(`Unclosed '(' opened at character ${position + 1}`, position);
      const known = scanner.tokenSpanning(ligandTokensByFirstChar, position + 1, close);
      const token = known?.token ?? scanner.input.slice(position + 1, close).trim();
      if (token.length === 0) scanner.fail(`Empty parentheses at character ${position + 1}`, position);
      const ligand = known?.value ?? findLigand(token);
      // Without brackets, a counter-anion that is no ligand ends the entity: "Co(NH3)6(ClO4)3".
      if (!ligand && !bracketed && ligands.length > 0 && anionByFormula.has(token)) break;
      if (!ligand) scanner.fail(unknownLigandMessage(token, position + 1), position + 1);
      scanner.pos = close + 1;
      const count = scanner.readTokenCount(token);
      addLigand(ligands, ligand, token, count, position + 1);
      continue;
    }
    // Letters start ligands: only other characters can be a charge or a hydrate separator.
    const code = ch.charCodeAt(0);
    const letter = (code >= 65 && code <= 90) || (code >= 97 && code <= 122);
    const chargeOrHydrate = !letter && (isPlus(ch) || isMinus(ch) || ch === '^' || HYDRATE_SEPARATORS.has(ch) || SUPERSCRIPT_DIGITS.has(ch));
    if (!bracketed && chargeOrHydrate) break;
    if (chargeOrHydrate) missingBracket(scanner, openPosition, position);
    const match = scanner.matchLongest(ligandTokensByFirstChar);
    if (match === null) {
      let end = position + 1;
      while (end < scanner.end && (isLower(scanner.input[end]) || digitValue(scanner.input[end]) >= 0)) end++;
      const token = scanner.input.slice(position, end);
      if (digitValue(ch) >= 0 && !bracketed) break;
      if (!bracketed && ligands.length > 0 && matchAt(scanner.input, position, anionTokens) !== null) break;
      if (digitValue(ch) >= 0 && (isPlus(scanner.input[end]) || isMinus(scanner.input[end]))) missingBracket(scanner, openPosition, position);
      if (digitValue(ch) >= 0) {
        scanner.fail(`Unexpected number '${token}' at character ${position + 1}: a count must follow a ligand`, position);
      }
      scanner.fail(unknownLigandMessage(token, position), position);
    }
    scanner.pos += match.token.length;
    const count = scanner.readTokenCount(match.token);
    addLigand(ligands, match.value, match.token, count, position);
  }
  if (ligands.length === 0) {
    scanner.fail(
      `No ligands on ${metal} (character ${metalPosition + 1}): free metal ions are not classified; write the aqua ion, e.g. [${metal}(H2O)6]`,
      metalPosition,
    );
  }
  return { metal, element, metalPosition, ligands };
}

/**
 * A charge or hydrate met inside '[…]': the ']' is missing. Digits just before a sign were read as
 * a ligand count, but they may be the charge ("Cl2+"): the ']' is then missing before them.
 */
function missingBracket(scanner: FormulaScanner, openPosition: number, at: number): never {
  const input = scanner.input;
  let start = at;
  if (isPlus(input[at]) || isMinus(input[at])) while (start > 0 && digitValue(input[start - 1]) >= 0) start--;
  let end = at;
  while (end < scanner.end && !isSpace(input[end]) && input[end] !== ']') end++;
  const what = HYDRATE_SEPARATORS.has(input[at] ?? '') ? `the water of crystallisation '${input.slice(at, end)}'` : `the charge '${input.slice(start, end)}'`;
  scanner.fail(`Missing ']' at character ${start + 1}: the '[' opened at character ${openPosition + 1} must be closed before ${what}`, start);
}

/** Reads a run of counter-ions (cations before '[' or anions after ']'). */
function readIons(
  scanner: FormulaScanner,
  table: ReadonlyMap<string, CounterIonDefinition>,
  kind: 'cation' | 'anion',
  stopAt: (ch: string) => boolean,
): IonPart[] {
  const ions: IonPart[] = [];
  for (;;) {
    scanner.skipSpaces();
    const ch = scanner.peek();
    if (ch === undefined || stopAt(ch)) return ions;
    const position = scanner.pos;
    let definition: CounterIonDefinition | undefined;
    let token: string;
    if (ch === '(') {
      const close = scanner.closingParenthesis(position);
      if (close < 0) scanner.fail(`Unclosed '(' opened at character ${position + 1}`, position);
      const known = scanner.tokenSpanning(table === cationByFormula ? cationTokens : anionTokens, position + 1, close);
      token = known?.token ?? scanner.input.slice(position + 1, close).trim();
      definition = known?.value ?? table.get(token);
      if (!definition) scanner.fail(`Unknown ${kind} '${token}' at character ${position + 1 + 1}`, position + 1);
      scanner.pos = close + 1;
    } else {
      const match = scanner.matchLongest(table === cationByFormula ? cationTokens : anionTokens);
      if (match === null) {
        let end = position + 1;
        while (end < scanner.end && (isLower(scanner.input[end]) || digitValue(scanner.input[end]) >= 0)) end++;
        token = scanner.input.slice(position, end);
        if (kind === 'anion' && ch === '[') {
          scanner.fail(
            `A second complex ion at character ${position + 1} is not supported: classify each complex ion on its own`,
            position,
          );
        }
        if (ch === ']') scanner.fail(`Extra ']' at character ${position + 1}: it closes nothing`, position);
        if (ch === ')') scanner.fail(`')' at character ${position + 1} closes nothing`, position);
        scanner.fail(`Unknown ${kind} '${token}' at character ${position + 1}`, position);
      }
      token = match.token;
      definition = match.value;
      scanner.pos += token.length;
    }
    const count = scanner.readTokenCount(token);
    ions.push({ formula: definition.formula, charge: definition.charge, count, composition: definition.composition });
  }
}

/** Cations run up to the complex's '['. */
function isComplexStart(ch: string): boolean {
  return ch === '[';
}

/** Anions run up to a hydrate separator or a written charge. */
function endsAnions(ch: string): boolean {
  return HYDRATE_SEPARATORS.has(ch) || isPlus(ch) || isMinus(ch) || ch === '^' || digitValue(ch) >= 0 || SUPERSCRIPT_DIGITS.has(ch);
}

function readHydrate(scanner: FormulaScanner): number {
  scanner.skipSpaces();
  const separator = scanner.peek();
  if (separator === undefined || !HYDRATE_SEPARATORS.has(separator)) return 0;
  const separatorPosition = scanner.pos;
  scanner.pos++;
  scanner.skipSpaces();
  const countPosition = scanner.pos;
  if (scanner.peek() === 'x' || scanner.peek() === 'n') {
    scanner.fail(`Give the number of waters of crystallisation at character ${countPosition + 1} (e.g. ·6H2O), not '${scanner.peek()}'`, countPosition);
  }
  const count = scanner.readCount('water of crystallisation');
  scanner.skipSpaces();
  const waterPosition = scanner.pos;
  if (scanner.input.startsWith('H2O', waterPosition) || scanner.input.startsWith('OH2', waterPosition)) {
    scanner.pos += 3;
    return count;
  }
  if (scanner.input.startsWith('H₂O', waterPosition)) {
    scanner.pos += 3;
    return count;
  }
  scanner.fail(
    `Only water of crystallisation is understood after '${separator}' (character ${separatorPosition + 1}), e.g. ·6H2O`,
    waterPosition,
  );
}

function sumIonCharge(ions: readonly IonPart[]): number {
  let total = 0;
  for (const ion of ions) total += ion.charge * ion.count;
  return total;
}

/**
 * Parses one coordination formula. Throws FormulaError (never anything else for string input).
 */
const ISOMER_DESCRIPTOR = /^(?:cis|trans|fac|mer|rac|[ΔΛδλ])-\s*/i;
const ISOMER_DESCRIPTOR_FIRST_CODES: ReadonlySet<number> = new Set([...'cCtTfFmMrRΔΛδλ'].map((ch) => ch.charCodeAt(0)));

/**
 * The stereo descriptor a formula is written with (cis, trans, fac, mer, rac, Δ, Λ, δ, λ), or null.
 * The engines skip it (their answer does not depend on it), but two isomers are two compounds.
 * Latin words are lower-cased; the Greek letters keep their case (Δ and δ name different things).
 */
export function isomerDescriptor(formula: string): string | null {
  const match = ISOMER_DESCRIPTOR.exec(normalizeFormula(formula).trimStart());
  if (!match) return null;
  const word = match[0].replace(/-\s*$/, '');
  return /^[a-z]+$/i.test(word) ? word.toLowerCase() : word;
}

/**
 * Salts written without brackets, e.g. KMnO4 or Na2WO4·2H2O: a counter-cation prefix followed by a
 * d- or f-block metal. Returns where the coordination entity starts and ends, or null.
 */
function unbracketedSalt(input: string, from: number): { start: number; end: number } | null {
  let pos = from;
  let sawCation = false;
  for (;;) {
    let matched = '';
    for (const length of cationLengths.get(input[pos] ?? '') ?? []) {
      const token = input.slice(pos, pos + length);
      if (cationByFormula.has(token) && token !== 'H') {
        matched = token;
        break;
      }
    }
    if (!matched) break;
    const afterToken = pos + matched.length;
    let next = afterToken;
    while (digitValue(input[next]) >= 0) next++;
    // Stop when what follows the token is the metal itself (e.g. "Ag" in "Ag2O" is not a prefix).
    const rest = input.slice(next);
    const symbol = /^[A-Z][a-z]?/.exec(rest)?.[0];
    if (!symbol) return null;
    sawCation = true;
    pos = next;
    const element = metalElement(symbol);
    if (element && element.series !== 'main') break;
  }
  if (!sawCation || pos >= input.length) return null;
  const symbol2 = input.slice(pos, pos + 2);
  const symbol1 = input.slice(pos, pos + 1);
  const metal = metalElement(symbol2) ? symbol2 : metalElement(symbol1) ? symbol1 : null;
  if (!metal || metalElement(metal)?.series === 'main') return null;
  let end = input.length;
  for (let index = pos; index < input.length; index++) {
    if (HYDRATE_SEPARATORS.has(input[index] ?? '')) {
      end = index;
      break;
    }
  }
  while (end > pos && isSpace(input[end - 1])) end--;
  return { start: pos, end };
}

/** Parses "KMnO4" as "K[MnO4]", reporting positions in the formula as the user wrote it. */
function parseUnbracketedSalt(input: string, text: string, salt: { start: number; end: number }): ParsedCore {
  const bracketed = `${text.slice(0, salt.start)}[${text.slice(salt.start, salt.end)}]${text.slice(salt.end)}`;
  try {
    return { ...parseCore(bracketed), input };
  } catch (error) {
    if (!(error instanceof FormulaError)) throw error;
    const toWritten = (position: number) =>
      Math.max(0, Math.min(input.length, position - (position > salt.end + 1 ? 2 : position > salt.start ? 1 : 0)));
    // Messages count characters from 1; map them back onto the formula as written.
    const message = error.message.replace(/character (\d+)/g, (_, n: string) => `character ${toWritten(Number(n) - 1) + 1}`);
    throw new FormulaError(message, input, toWritten(error.position));
  }
}

/** A parse without the composition record (its totals are left in the scratch space). */
type ParsedCore = Omit<ParsedComplex, 'composition'>;

/** Parses one coordination formula. Throws FormulaError (never anything else for string input). */
export function parseFormula(input: string): ParsedComplex {
  const core = parseCore(input);
  return {
    input: core.input,
    metal: core.metal,
    ligands: core.ligands,
    complexCharge: core.complexCharge,
    complexCount: core.complexCount,
    counterIons: core.counterIons,
    hydrateWaters: core.hydrateWaters,
    composition: compositionFromScratch(),
    oxidationState: core.oxidationState,
    writtenCharge: core.writtenCharge,
    readings: core.readings,
    warnings: core.warnings,
    ...(core.centres ? { centres: core.centres } : {}),
  };
}

/**
 * parseFormula for the classifier, which needs only the molar mass of the composition: it is
 * summed straight from the parser's totals, without building the record (building records with
 * ever-different element keys is the slowest part of a parse). Same errors as parseFormula.
 */
export function parseFormulaWithMolarMass(input: string): ParsedCore & {
  molarMassGPerMol: number;
  element: metalIons.MetalElement;
  configuration: metalIons.ElectronConfiguration;
} {
  const core = parseCore(input);
  return {
    input: core.input,
    metal: core.metal,
    ligands: core.ligands,
    complexCharge: core.complexCharge,
    complexCount: core.complexCount,
    counterIons: core.counterIons,
    hydrateWaters: core.hydrateWaters,
    oxidationState: core.oxidationState,
    writtenCharge: core.writtenCharge,
    readings: core.readings,
    warnings: core.warnings,
    ...(core.centres ? { centres: core.centres } : {}),
    molarMassGPerMol: molarMassFromScratch(),
    // The charge balance already looked these up: the classifier need not do it again.
    element: lastElement as metalIons.MetalElement,
    configuration: lastConfiguration as metalIons.ElectronConfiguration,
  };
}

// More sites than this on a d-block metal written without brackets means some anions are counter-ions.
const BARE_MAX_SITES = 6;

/**
 * A bare entity as chemists write it without brackets: "Co(NH3)6Cl3" is [Co(NH3)6]Cl3 and
 * "Co(NH3)5Cl2+" is [Co(NH3)5Cl]2+. When the ligands as read would give a d-block metal more than six
 * sites, a count just before a lone sign is read as the charge, or the trailing anions beyond six
 * sites as counter-ions; the warning says what was read. Returns null when nothing was changed.
 */
function settleBareEntity(text: string, inner: InnerSphere, anions: IonPart[], written: { charge: number; position: number } | null): string | null {
  const series = inner.element.series;
  if (series !== '3d' && series !== '4d' && series !== '5d') return null;
  let sites = 0;
  for (const instance of inner.ligands) sites += instance.ligand.denticity * instance.count;
  if (sites <= BARE_MAX_SITES) return null;
  const last = inner.ligands[inner.ligands.length - 1];
  if (last === undefined) return null;
  const entity = () => `[${inner.metal}${inner.ligands.map((instance) => `${/^[A-Z][a-z]?$/.test(instance.written) ? instance.written : `(${instance.written})`}${instance.count > 1 ? instance.count : ''}`).join('')}]`;
  if (written !== null && Math.abs(written.charge) === 1 && anions.length === 0) {
    const digit = digitValue(text[written.position - 1]);
    if (digit > 1 && last.count === digit && digitValue(text[written.position - 2]) < 0 && sites - (digit - 1) * last.ligand.denticity <= BARE_MAX_SITES) {
      last.count = 1;
      written.charge = Math.sign(written.charge) * digit;
      return `Read without brackets as ${entity()}${formatCharge(written.charge)}: the ${digit} before the sign is the charge; write the brackets to choose`;
    }
  }
  const asAnion = anionByFormula.get(last.ligand.id);
  if (asAnion === undefined || written !== null) return null;
  const moved = Math.min(last.count, Math.ceil((sites - BARE_MAX_SITES) / last.ligand.denticity));
  last.count -= moved;
  if (last.count === 0) inner.ligands.pop();
  if (inner.ligands.length === 0) return null;
  anions.unshift({ formula: asAnion.formula, charge: asAnion.charge, count: moved, composition: asAnion.composition });
  const counter = anions.map((ion) => `${ion.formula.length > 2 || anions.length > 1 ? `(${ion.formula})` : ion.formula}${ion.count > 1 ? ion.count : ''}`).join('');
  return `Read without brackets as ${entity()}${counter}: anions beyond six coordination sites are taken as counter-ions; write the brackets to choose`;
}

const NO_READINGS: FormulaReading[] = Object.freeze([]) as unknown as FormulaReading[];
const NO_WARNINGS: string[] = Object.freeze([]) as unknown as string[];

/** A ligand that takes back-bonding (CO, phosphines, alkenes, Cp…): such complexes are often truly zero-valent. */
function hasBackBondingLigand(ligands: readonly LigandInstance[]): boolean {
  for (const instance of ligands) {
    if (instance.ligand.bondingClass === 'pi-acceptor' || instance.ligand.organometallic === true) return true;
  }
  return false;
}

// ---------------------------------------------------------------- trivial names

interface TrivialNameRecord {
  name: string;
  aliases: string[];
  formula: string;
  source: string;
  checked: Checked;
}

/** Lower case, one kind of apostrophe, single spaces: "Zeise’s  Salt" → "zeise's salt". */
function nameKey(text: string): string {
  return text.trim().toLowerCase().replace(/[’‘`´′]/g, "'").replace(/\s+/g, ' ');
}

const trivialNames: readonly TrivialNameRecord[] = trivialNameData.names as unknown as TrivialNameRecord[];
const trivialNameByKey: ReadonlyMap<string, TrivialNameRecord> = (() => {
  const byKey = new Map<string, TrivialNameRecord>();
  for (const record of trivialNames) for (const name of [record.name, ...record.aliases]) byKey.set(nameKey(name), record);
  return byKey;
})();

/** The trivial names the parser knows, with the formula each stands for. */
export function trivialNameTable(): readonly { name: string; aliases: readonly string[]; formula: string; source: string; checked: Checked }[] {
  return trivialNames;
}

// A name starts in lower case, or has a space, an apostrophe or a capitalised word with a hyphen
// ("Gd-DOTA"); a formula starts with a capital and has none of these.
const MAYBE_NAME = /^\s*[a-z]|[\s'’‘`]\S|^\s*[A-Z][a-z]?-/;

function readTrivialName(text: string, input: string): ParsedCore | null {
  const key = nameKey(text);
  if (key.length < 4) return null;
  const record = trivialNameByKey.get(key);
  if (record === undefined) return null;
  const core = parseCore(record.formula);
  const reading: FormulaReading = {
    kind: 'name',
    written: input.trim(),
    species: record.formula,
    text: `Read '${input.trim()}' as ${record.formula}`,
    source: record.source,
    checked: record.checked,
  };
  return { ...core, input, readings: [reading, ...core.readings] };
}

// ---------------------------------------------------------------- plain salts, hydrates, alums

interface AquaIonRecord {
  metal: string;
  oxidationState: number;
  waters: number;
  source: string;
  checked: Checked;
}

interface SaltSolidRecord {
  formula: string;
  metal: string;
  oxidationState: number;
  anions: Record<string, number>;
  waters: number;
  reading: 'solid' | 'dissolved' | 'mixture';
  species: string | null;
  text: string;
  source: string;
  checked: Checked;
}

const aquaIons: readonly AquaIonRecord[] = saltReadingData.aquaIons as unknown as AquaIonRecord[];
const saltSolids: readonly SaltSolidRecord[] = saltReadingData.solids as unknown as SaltSolidRecord[];

function aquaIonOf(metal: string, oxidationState: number): AquaIonRecord | undefined {
  for (const record of aquaIons) if (record.metal === metal && record.oxidationState === oxidationState) return record;
  return undefined;
}

/** The aqua ions the salt reader knows (metal, oxidation state, waters). */
export function aquaIonTable(): readonly AquaIonRecord[] {
  return aquaIons;
}

// Anions that stay outside the first sphere of an aqua ion in dilute solution (common practice);
// cyanide, thiocyanate, nitrite, hydroxide, oxalate, carbonate… bind, and those salts are read as written.
const AQUA_SALT_ANIONS: ReadonlySet<string> = new Set(['F', 'Cl', 'Br', 'I', 'NO3', 'ClO4', 'SO4', 'HSO4', 'BF4', 'PF6', 'OTf', 'CF3SO3', 'OTs', 'OAc', 'CH3COO']);
const HALIDES: ReadonlySet<string> = new Set(['F', 'Cl', 'Br', 'I']);

interface SaltUnit {
  kind: 'cation' | 'metal';
  symbol: string;
  charge: number;
  count: number;
  composition: Record<string, number>;
}

/** Metal symbol at `pos` (two letters first), or null. */
function metalSymbolAt(text: string, pos: number): string | null {
  const two = text.slice(pos, pos + 2);
  if (two.length === 2 && isLower(two[1]) && isMetalSymbol(two)) return two;
  const one = text.slice(pos, pos + 1);
  return isUpper(one) && isMetalSymbol(one) ? one : null;
}

/** Count digits at `pos`: [value, next position]; 1 when none. */
function countAt(text: string, pos: number): [number, number] {
  let value = 0;
  let next = pos;
  while (digitValue(text[next]) >= 0 && next - pos < 3) value = value * 10 + digitValue(text[next++]);
  return next === pos ? [1, pos] : [value, next];
}

/**
 * Plain salts, hydrates, alums and double salts written without brackets — CoCl2·6H2O,
 * KCr(SO4)2·12H2O, (NH4)2Fe(SO4)2·6H2O — read as the species they give in water (the aqua ion),
 * or as the complex their solid holds when that is what a fresh solution contains (CrCl3·6H2O).
 * Returns null when the formula is not such a salt (KMnO4, K2[PtCl4] written as K2PtCl4, TiCl4…):
 * the other readers take it. The molar mass stays that of the salt as written.
 */
function readPlainSalt(scanner: FormulaScanner): ParsedCore | null {
  const text = scanner.input;
  const start = scanner.pos;
  let pos = start;
  const units: SaltUnit[] = [];
  for (;;) {
    if (text[pos] === '(') {
      const close = text.indexOf(')', pos);
      const cation = close > pos ? cationByFormula.get(text.slice(pos + 1, close)) : undefined;
      if (cation === undefined) break;
      const [count, next] = countAt(text, close + 1);
      units.push({ kind: 'cation', symbol: cation.formula, charge: cation.charge, count, composition: cation.composition });
      pos = next;
      continue;
    }
    const cationMatch = scanner.input[pos] === 'H' ? null : matchAt(text, pos, cationTokens);
    const metal = metalSymbolAt(text, pos);
    if (cationMatch === null && metal === null) break;
    const token = cationMatch !== null && (metal === null || cationMatch.token.length >= metal.length) ? cationMatch.token : (metal as string);
    const [count, next] = countAt(text, pos + token.length);
    const definition = cationByFormula.get(token);
    units.push(
      definition !== undefined
        ? { kind: 'cation', symbol: token, charge: definition.charge, count, composition: definition.composition }
        : { kind: 'metal', symbol: token, charge: 0, count, composition: { [token]: 1 } },
    );
    pos = next;
  }
  const centre = units[units.length - 1];
  if (centre === undefined) return null;
  const element = metalElement(centre.symbol);
  if (element === undefined) return null;
  const cations = units.slice(0, -1);
  for (const unit of cations) if (unit.kind !== 'cation') return null;

  const anions: IonPart[] = [];
  while (pos < scanner.end && !HYDRATE_SEPARATORS.has(text[pos] ?? '') && !isSpace(text[pos])) {
    let definition: CounterIonDefinition | undefined;
    let after: number;
    if (text[pos] === '(') {
      const close = text.indexOf(')', pos);
      definition = close > pos ? anionByFormula.get(text.slice(pos + 1, close)) : undefined;
      after = close + 1;
    } else {
      const match = matchAt(text, pos, anionTokens);
      definition = match?.value;
      after = pos + (match?.token.length ?? 0);
    }
    if (definition === undefined || !AQUA_SALT_ANIONS.has(definition.formula)) return null;
    const [count, next] = countAt(text, after);
    anions.push({ formula: definition.formula, charge: definition.charge, count, composition: definition.composition });
    pos = next;
  }
  if (anions.length === 0) return null;
  // With counter-cations, halides make a halometallate (K2PtCl4 is K2[PtCl4]): not a double salt.
  if (cations.length > 0 && anions.every((anion) => HALIDES.has(anion.formula))) return null;
  const rest = new FormulaScanner(text, scanner.original);
  rest.pos = pos;
  const waters = readHydrate(rest);
  rest.skipSpaces();
  if (!rest.atEnd()) return null;

  let positive = 0;
  for (const unit of cations) positive += unit.charge * unit.count;
  let negative = 0;
  for (const anion of anions) negative += -anion.charge * anion.count;
  const metalCharge = negative - positive;
  if (metalCharge <= 0 || metalCharge % centre.count !== 0) return null;
  const oxidationState = metalCharge / centre.count;

  const anionCounts: Record<string, number> = {};
  for (const anion of anions) anionCounts[anion.formula] = (anionCounts[anion.formula] ?? 0) + anion.count;
  const solid = cations.length === 0 ? findSaltSolid(element.symbol, oxidationState, anionCounts, waters) : undefined;
  const written = scanner.original.trim();
  let species: string;
  let reading: FormulaReading;
  if (solid !== undefined) {
    if (solid.reading === 'mixture' || solid.species === null) scanner.fail(solid.text, start);
    species = solid.species;
    reading = { kind: solid.reading, written, species, text: solid.text, source: solid.source, checked: solid.checked };
  } else {
    const aqua = aquaIonOf(element.symbol, oxidationState);
    if (aqua === undefined) return null;
    species = `[${element.symbol}(H2O)${aqua.waters}]${formatCharge(oxidationState)}`;
    reading = {
      kind: 'dissolved',
      written,
      species,
      text: `Read as the species in water: ${written} dissolves to ${species}`,
      source: aqua.source,
      checked: aqua.checked,
    };
  }
  const core = parseCore(species);
  if (reading.kind === 'solid') return { ...core, input: scanner.original, readings: [reading] };

  // The classified species is the aqua ion; the counter-ions, waters and molar mass stay the salt's.
  const counterIons: IonPart[] = [];
  for (const unit of cations) counterIons.push({ formula: unit.symbol, charge: unit.charge, count: unit.count, composition: unit.composition });
  for (const anion of anions) counterIons.push(anion);
  scratchSymbols[0] = element.symbol;
  scratchCounts[0] = centre.count;
  scratchWeights[0] = metalAtomicWeight(element.symbol);
  scratchLength = 1;
  for (const ion of counterIons) addToScratch(ion.composition, ion.count);
  if (waters > 0) addToScratch(WATER_COMPOSITION, waters);
  return {
    ...core,
    input: scanner.original,
    complexCount: centre.count,
    counterIons,
    hydrateWaters: waters,
    readings: [reading],
  };
}

function findSaltSolid(metal: string, oxidationState: number, anions: Record<string, number>, waters: number): SaltSolidRecord | undefined {
  for (const record of saltSolids) {
    if (record.metal !== metal || record.oxidationState !== oxidationState || record.waters !== waters) continue;
    const keys = Object.keys(record.anions);
    if (keys.length === Object.keys(anions).length && keys.every((key) => anions[key] === record.anions[key])) return record;
  }
  return undefined;
}

/** Longest catalogue token at `pos` in `text`, or null. */
function matchAt<T>(text: string, pos: number, tokens: ReadonlyMap<number, readonly CatalogueToken<T>[]>): CatalogueToken<T> | null {
  const candidates = tokens.get(text.charCodeAt(pos));
  if (candidates === undefined) return null;
  for (const candidate of candidates) if (text.startsWith(candidate.token, pos)) return candidate;
  return null;
}

// The metal and its electron configuration from the last successful parseCore (like the scratch
// totals: parsing is synchronous, and a nested parse of an unbracketed salt sets the same values).
let lastElement: metalIons.MetalElement | null = null;
let lastConfiguration: metalIons.ElectronConfiguration | null = null;

function parseCore(input: string): ParsedCore {
  if (typeof input !== 'string') throw new FormulaError('The formula must be text', String(input), 0);
  if (input.length > MAX_FORMULA_LENGTH) {
    throw new FormulaError(`Formula is too long (more than ${MAX_FORMULA_LENGTH} characters)`, input, MAX_FORMULA_LENGTH);
  }
  const text = normalizeFormula(input);
  const scanner: FormulaScanner = new FormulaScanner(text, input);
  if (scanner.atEnd()) scanner.fail('The formula is empty', 0);
  if (text.indexOf('[') < 0 && (MAYBE_NAME.test(text) || trivialNameByKey.has(text.trim().toLowerCase()))) {
    const named = readTrivialName(text, input);
    if (named !== null) return named;
  }
  // Isomer descriptors (cis-, trans-, fac-, mer-, Δ-, Λ-) name a stereoisomer; the engine's answer
  // does not depend on them, so they are read and skipped.
  // Only a formula starting with a descriptor's first letter is worth the regular expression.
  const descriptor = ISOMER_DESCRIPTOR_FIRST_CODES.has(text.charCodeAt(scanner.pos)) ? ISOMER_DESCRIPTOR.exec(text.slice(scanner.pos)) : null;
  if (descriptor) scanner.pos += descriptor[0].length;
  if (text.indexOf('[') < 0) {
    const plain = readPlainSalt(scanner);
    if (plain !== null) return plain;
    const salt = unbracketedSalt(text, scanner.pos);
    if (salt) return parseUnbracketedSalt(input, text, salt);
  }

  const bracketIndex = text.indexOf('[');
  let cations: IonPart[] = [];
  let inner: InnerSphere;
  let complexCount = 1;
  let anions: IonPart[] = [];
  let written: { charge: number; position: number } | null = null;
  let anionPosition = -1;
  let dinuclear: DinuclearSphere | null = null;
  let bareWarning: string | null = null;

  if (bracketIndex < 0) {
    // No brackets: accept a bare entity such as "Cr(H2O)6 3+"; reject a bare ion such as "Fe3+".
    const start = scanner.pos;
    if (text.indexOf(']') >= 0) {
      scanner.fail(
        `Missing '[' at character ${start + 1}: the ']' at character ${text.indexOf(']') + 1} closes nothing (e.g. [Co(NH3)6]Cl3)`,
        start,
      );
    }
    const first = scanner.peek();
    const two = isLower(scanner.peek(1)) ? `${first}${scanner.peek(1)}` : '';
    const symbol = two !== '' && isMetalSymbol(two) ? two : first !== undefined && isMetalSymbol(first) ? first : null;
    if (symbol === null) {
      scanner.fail(
        "No coordination entity found: put the metal and its ligands in square brackets, e.g. [Co(NH3)6]Cl3",
        start,
      );
    }
    const after = start + symbol.length;
    const next = text[after];
    const bareIon = next === undefined || isSpace(next) || isPlus(next) || isMinus(next) || digitValue(next) >= 0 || next === '^' || SUPERSCRIPT_DIGITS.has(next);
    if (bareIon && next !== undefined && digitValue(next) >= 0) {
      // "Fe3+" (charge) versus "Fe2Cl6"-type; both are outside what we classify.
      scanner.fail(
        `A bare metal ion '${text.slice(start).trim()}' has no ligands: write the complex in brackets, e.g. [${symbol}(H2O)6]${text.slice(after).trim()}`,
        start,
      );
    }
    if (bareIon) {
      scanner.fail(
        `A bare metal '${symbol}' has no ligands: write the complex in brackets, e.g. [${symbol}(H2O)6]`,
        start,
      );
    }
    inner = readInnerSphere(scanner, false, start);
    written = scanner.readCharge();
    if (written === null) {
      // Counter-ions written after a bare entity: "Co(NH3)6(ClO4)3".
      scanner.skipSpaces();
      anionPosition = scanner.pos;
      anions = readIons(scanner, anionByFormula, 'anion', endsAnions);
      if (anions.length === 0) anionPosition = -1;
      written = scanner.readCharge();
    }
    bareWarning = settleBareEntity(text, inner, anions, written);
  } else {
    cations = readIons(scanner, cationByFormula, 'cation', isComplexStart);
    const openPosition = scanner.pos;
    scanner.pos++; // '['
    const close = text.indexOf(']', openPosition);
    const bridge = text.indexOf('μ', openPosition);
    const bridged = bridge >= 0 && bridge < close;
    if (bridged) {
      dinuclear = readDinuclear(scanner, openPosition, close);
      inner = dinuclear.inner;
    } else {
      inner = readInnerSphere(scanner, true, openPosition);
    }
    scanner.pos++; // ']'
    // A count straight after ']' is a number of complex ions unless a sign follows (then a charge).
    const afterBracket = scanner.pos;
    written = scanner.readCharge();
    if (written === null && digitValue(scanner.peek()) >= 0) {
      complexCount = scanner.readCount('the complex ion');
    }
    if (written === null) {
      scanner.skipSpaces();
      anionPosition = scanner.pos;
      anions = readIons(
        scanner,
        anionByFormula,
        'anion',
        endsAnions,
      );
      if (anions.length === 0) anionPosition = -1;
      // A charge written after the counter-ions is checked against them below.
      written = scanner.readCharge();
    }
    if (complexCount > 1 && anions.length === 0 && cations.length === 0) {
      const digits = text.slice(afterBracket, scanner.pos).trim();
      scanner.fail(
        `'${digits}' after ']' (character ${afterBracket + 1}) needs a sign to be a charge (${digits}+ or ${digits}-), or counter-ions to be a count`,
        afterBracket,
      );
    }
  }

  const hydrateWaters = readHydrate(scanner);
  scanner.skipSpaces();
  if (!scanner.atEnd()) {
    const position = scanner.pos;
    const ch = scanner.peek();
    if (ch === '[') {
      scanner.fail(`A second complex ion at character ${position + 1} is not supported: classify each complex ion on its own`, position);
    }
    if (written !== null && anions.length === 0 && matchAt(text, position, anionTokens) !== null) {
      scanner.fail(
        `Counter-ions at character ${position + 1} after the charge: write either the charge or the counter-ions, e.g. [Co(NH3)6]3+ or [Co(NH3)6]Cl3`,
        position,
      );
    }
    scanner.fail(`Unexpected '${ch}' at character ${position + 1}`, position);
  }

  const counterIons = anions.length === 0 ? cations : cations.length === 0 ? anions : cations.concat(anions);
  const counterCharge = sumIonCharge(counterIons);
  let complexCharge: number;
  if (counterIons.length > 0) {
    if (counterCharge % complexCount !== 0 || (counterCharge === 0 && cations.length > 0 && anions.length > 0)) {
      const position = anionPosition >= 0 ? anionPosition : 0;
      scanner.fail(`Counter-ions (total charge ${formatCharge(counterCharge)}) cannot balance ${complexCount} complex ions`, position);
    }
    complexCharge = -counterCharge / complexCount;
    if (written !== null && written.charge !== complexCharge) {
      scanner.fail(
        `Charge ${formatCharge(written.charge)} does not balance the counter-ions: they need the complex to be ${formatCharge(complexCharge)}`,
        written.position,
      );
    }
    if (cations.length > 0 && anions.length === 0 && complexCharge >= 0) {
      scanner.fail(`The cations before '[' need an anionic complex, but the charges give ${formatCharge(complexCharge)}`, 0);
    }
  } else {
    complexCharge = written?.charge ?? 0;
  }

  let ligandCharge = 0;
  for (const instance of inner.ligands) ligandCharge += instance.ligand.charge * instance.count;
  const warnings: string[] = [];
  if (bareWarning !== null) warnings.push(bareWarning);
  let centres: MetalCentre[] | undefined;
  let oxidationState = complexCharge - ligandCharge;
  if (dinuclear !== null) {
    centres = assignCentres(scanner, dinuclear, complexCharge, warnings);
    oxidationState = (centres[0] as MetalCentre).oxidationState;
  }
  const element = inner.element;
  const configuration = electronConfiguration(element, oxidationState);
  if (!configuration) {
    const position = written?.position ?? inner.metalPosition;
    scanner.fail(
      `Oxidation state ${oxidationState > 0 ? '+' : ''}${oxidationState} for ${inner.metal} is impossible (complex charge ${formatCharge(complexCharge)}, ligand charges ${ligandCharge}): check the charge and the ligands`,
      position,
    );
  }

  lastElement = element;
  lastConfiguration = configuration;

  if (dinuclear === null && written === null && counterIons.length === 0 && complexCharge === 0 && oxidationState === 0 && !hasBackBondingLigand(inner.ligands)) {
    // [Fe(H2O)6] with no charge: a zero-valent metal with only σ/π-donor ligands is almost always a typing slip.
    const entity = bracketIndex < 0 ? text.slice(inner.metalPosition, scanner.end).trim() : text.slice(bracketIndex, text.indexOf(']', bracketIndex) + 1);
    warnings.push(
      `No charge or counter-ions written: ${entity} was taken as neutral, which makes ${inner.metal}(0); if you meant an ion, add its charge, e.g. ${entity}2+ or ${entity}3+`,
    );
  }

  // Complex ion(s) first (metal, then ligands), then counter-ions, then water: the key order of the record.
  scratchSymbols[0] = inner.metal;
  scratchCounts[0] = complexCount;
  scratchWeights[0] = metalAtomicWeight(inner.metal);
  scratchLength = 1;
  if (dinuclear === null) {
    for (const instance of inner.ligands) addToScratch(instance.ligand.composition, instance.count * complexCount);
  } else {
    // Both metals, every terminal ligand and each bridge once.
    for (const centre of dinuclear.centres) {
      addToScratch({ [centre.metal]: 1 }, complexCount);
      for (const instance of centre.terminal) addToScratch(instance.ligand.composition, instance.count * complexCount);
    }
    scratchCounts[0] = (scratchCounts[0] ?? 0) - complexCount;
    for (const instance of dinuclear.bridges) addToScratch(instance.ligand.composition, instance.count * complexCount);
  }
  for (const ion of counterIons) addToScratch(ion.composition, ion.count);
  if (hydrateWaters > 0) addToScratch(WATER_COMPOSITION, hydrateWaters);

  return {
    input,
    metal: inner.metal,
    ligands: inner.ligands,
    complexCharge,
    complexCount,
    counterIons,
    hydrateWaters,
    oxidationState,
    writtenCharge: written?.charge ?? null,
    readings: NO_READINGS,
    warnings: warnings.length === 0 ? NO_WARNINGS : warnings,
    ...(centres ? { centres } : {}),
  };
}

// ---------------------------------------------------------------- µ-bridged dinuclear species

interface DinuclearCentre {
  metal: string;
  element: metalIons.MetalElement;
  position: number;
  terminal: LigandInstance[];
  explicitOxidationState: number | null;
}

interface DinuclearSphere {
  centres: DinuclearCentre[];
  bridges: LigandInstance[];
  /** Written as M2 (both centres alike, bridges symmetric). */
  symmetric: boolean;
  /** The first centre seen as a mononuclear inner sphere (its terminal ligands and the bridges). */
  inner: InnerSphere;
}

const LINKAGE_PARTNER: ReadonlyMap<string, string> = new Map([['NC', 'CN'], ['CN', 'NC'], ['NCS', 'SCN'], ['SCN', 'NCS']]);
const ROMAN: ReadonlyMap<string, number> = new Map([['0', 0], ['I', 1], ['II', 2], ['III', 3], ['IV', 4], ['V', 5], ['VI', 6], ['VII', 7], ['VIII', 8]]);
const BRIDGE_PREFIX = /^μ\d?-/;

/**
 * Reads "[(NH3)5Co(μ-OH)Co(NH3)5]", "[Co(NH3)5(μ-pz)Ru(NH3)5]", "[Cr2(μ-OH)2(H2O)8]" or
 * "[Co(III)(NH3)5(μ-NC)Fe(II)(CN)5]" between '[' and its ']': two metal centres, their terminal
 * ligands and the µ-bridges they share. Ligands written before a metal belong to it; ligands after a
 * metal belong to it until a bridge; a metal written with count 2 shares the terminal ligands evenly.
 */
function readDinuclear(scanner: FormulaScanner, openPosition: number, close: number): DinuclearSphere {
  const text = scanner.input;
  const centres: DinuclearCentre[] = [];
  const bridges: LigandInstance[] = [];
  let pending: LigandInstance[] = [];
  let target: LigandInstance[] | null = null;
  let doubled = false;
  let doubledPosition = -1;
  scanner.pos = openPosition + 1;
  for (;;) {
    scanner.skipSpaces();
    const position = scanner.pos;
    if (position >= close) break;
    const ch = text[position] as string;
    if (ch === ')') scanner.fail(`Unmatched ')' at character ${position + 1}`, position);
    let bridgeToken: string | null = null;
    let ligand: LigandDefinition | undefined;
    let token = '';
    let tokenPosition = position;
    if (ch === '(') {
      const end = scanner.closingParenthesis(position);
      if (end < 0 || end > close) scanner.fail(`Unclosed '(' opened at character ${position + 1}`, position);
      const content = text.slice(position + 1, end).trim();
      if (content.length === 0) scanner.fail(`Empty parentheses at character ${position + 1}`, position);
      const roman = ROMAN.get(content);
      if (roman !== undefined) {
        const centre = centres[centres.length - 1];
        if (centre === undefined || target !== centre.terminal || centre.terminal.length > 0 || centre.explicitOxidationState !== null) {
          scanner.fail(`An oxidation state '(${content})' at character ${position + 1} must follow its metal, e.g. Co(III)`, position);
        }
        centre.explicitOxidationState = roman;
        scanner.pos = end + 1;
        continue;
      }
      const prefix = BRIDGE_PREFIX.exec(content);
      token = prefix ? content.slice(prefix[0].length) : content;
      if (prefix) bridgeToken = token;
      tokenPosition = position + 1 + (prefix ? prefix[0].length : 0);
      ligand = findLigand(token);
      if (!ligand) scanner.fail(unknownLigandMessage(token, tokenPosition), tokenPosition);
      scanner.pos = end + 1;
    } else if (ch === 'μ') {
      const prefix = BRIDGE_PREFIX.exec(text.slice(position, close));
      if (!prefix) scanner.fail(`Write a bridge as μ-ligand at character ${position + 1}, e.g. (μ-OH)`, position);
      scanner.pos = position + prefix[0].length;
      tokenPosition = scanner.pos;
      const match = scanner.matchLongest(ligandTokensByFirstChar);
      if (match === null) scanner.fail(`Expected a bridging ligand after 'μ-' at character ${tokenPosition + 1}`, tokenPosition);
      token = match.token;
      bridgeToken = token;
      ligand = match.value;
      scanner.pos += token.length;
    } else {
      const match = scanner.matchLongest(ligandTokensByFirstChar);
      const metal = metalSymbolAt(text, position);
      if (metal !== null && (match === null || match.token.length <= metal.length)) {
        const element = metalElement(metal) as metalIons.MetalElement;
        scanner.pos = position + metal.length;
        const countPosition = scanner.pos;
        const count = digitValue(text[countPosition]) >= 0 ? scanner.readCount('the metal') : 1;
        if (count > 2 || (count === 2 && centres.length > 0)) {
          scanner.fail(`Only mononuclear and dinuclear species are read (character ${countPosition + 1}): classify one metal centre at a time`, countPosition);
        }
        if (centres.length === 2) scanner.fail(`A third metal at character ${position + 1}: only dinuclear species are read`, position);
        const centre: DinuclearCentre = { metal: element.symbol, element, position, terminal: pending, explicitOxidationState: null };
        centres.push(centre);
        if (count === 2) {
          doubled = true;
          doubledPosition = countPosition;
        }
        pending = [];
        target = centre.terminal;
        continue;
      }
      if (match === null) {
        let end = position + 1;
        while (end < close && (isLower(text[end]) || digitValue(text[end]) >= 0)) end++;
        if (isPlus(ch) || isMinus(ch) || SUPERSCRIPT_DIGITS.has(ch)) missingBracket(scanner, openPosition, position);
        scanner.fail(unknownLigandMessage(text.slice(position, end), position), position);
      }
      token = match.token;
      ligand = match.value;
      scanner.pos += token.length;
    }
    const count = scanner.readTokenCount(token);
    if (bridgeToken !== null) {
      addLigand(bridges, ligand as LigandDefinition, bridgeToken, count, tokenPosition);
      target = null;
    } else {
      addLigand(target ?? pending, ligand as LigandDefinition, token, count, tokenPosition);
    }
  }
  scanner.pos = close;
  const first = centres[0];
  if (first === undefined) scanner.fail(`Expected a metal symbol inside the brackets at character ${openPosition + 2}`, openPosition + 1);
  if (bridges.length === 0) scanner.fail(`A dinuclear species needs its bridge written as (μ-ligand) (character ${first.position + 1})`, first.position);
  if (pending.length > 0) {
    const last = centres[centres.length - 1] as DinuclearCentre;
    for (const instance of pending) addLigand(last.terminal, instance.ligand, instance.written, instance.count, instance.position);
  }
  if (doubled) {
    // M2 with shared bridges: each centre takes half of every terminal ligand.
    const half: LigandInstance[] = [];
    for (const instance of first.terminal) {
      if (instance.count % 2 !== 0) {
        scanner.fail(`${instance.count} × ${instance.written} at character ${instance.position + 1} cannot be shared evenly between the two ${first.metal} centres`, instance.position);
      }
      half.push({ ...instance, count: instance.count / 2 });
    }
    first.terminal = half;
    centres.push({ ...first, terminal: half.map((instance) => ({ ...instance })) });
  }
  if (centres.length !== 2) {
    scanner.fail(`A μ-bridge needs two metal centres (character ${doubledPosition >= 0 ? doubledPosition + 1 : first.position + 1})`, first.position);
  }
  const ligands: LigandInstance[] = first.terminal.map((instance) => ({ ...instance }));
  for (const bridge of bridges) addLigand(ligands, bridge.ligand, bridge.written, bridge.count, bridge.position);
  return { centres, bridges, symmetric: doubled, inner: { metal: first.metal, element: first.element, metalPosition: first.position, ligands } };
}

function ligandChargeOf(instances: readonly LigandInstance[]): number {
  let total = 0;
  for (const instance of instances) total += instance.ligand.charge * instance.count;
  return total;
}

/** The mononuclear formula for one centre: its ligands in brackets and the charge that balances them. */
function centreSpecies(metal: string, oxidationState: number, ligands: readonly LigandInstance[]): string {
  let body = '';
  for (const instance of ligands) body += `(${instance.ligand.id})${instance.count > 1 ? instance.count : ''}`;
  const charge = oxidationState + ligandChargeOf(ligands);
  return `[${metal}${body}]${charge === 0 ? '' : formatCharge(charge)}`;
}

/**
 * Splits the metals' total oxidation state between the two centres: the written states where given;
 * otherwise an even split, or for a mixed-valence or heteronuclear pair the split closest to even
 * (the first-written centre higher) with a warning that says what was assumed.
 */
function assignCentres(scanner: FormulaScanner, sphere: DinuclearSphere, complexCharge: number, warnings: string[]): MetalCentre[] {
  const [a, b] = sphere.centres as [DinuclearCentre, DinuclearCentre];
  const total = complexCharge - ligandChargeOf(a.terminal) - ligandChargeOf(b.terminal) - ligandChargeOf(sphere.bridges);
  let first: number;
  if (a.explicitOxidationState !== null || b.explicitOxidationState !== null) {
    first = a.explicitOxidationState ?? total - (b.explicitOxidationState as number);
    const second = b.explicitOxidationState ?? total - first;
    if (first + second !== total) {
      scanner.fail(`The written oxidation states ${a.metal}(${first}) and ${b.metal}(${second}) do not balance the charge: together they must make ${total}`, a.position);
    }
  } else {
    const plausible = (metal: metalIons.MetalElement, state: number): boolean => electronConfiguration(metal, state) !== null;
    const high = Math.ceil(total / 2);
    const candidates = [high, total - high].filter((state, index, list) => list.indexOf(state) === index);
    const found = candidates.find((state) => plausible(a.element, state) && plausible(b.element, total - state));
    if (found === undefined) {
      scanner.fail(`No oxidation states for ${a.metal} and ${b.metal} add up to ${total}: check the charge and the ligands`, a.position);
    }
    first = found;
    const second = total - first;
    if (a.metal !== b.metal || first !== second) {
      warnings.push(
        `Oxidation states assumed ${a.metal}(${roman(first)}) and ${b.metal}(${roman(second)})${first !== second && a.metal === b.metal ? ' (mixed valence; the real ion may be delocalised)' : ''}: write them to choose, e.g. [${a.metal}(${roman(second)})…${b.metal}(${roman(first)})…]`,
      );
    }
  }
  const second = total - first;
  const result: MetalCentre[] = [];
  for (const [centre, state] of [[a, first], [b, second]] as const) {
    if (electronConfiguration(centre.element, state) === null) {
      scanner.fail(`Oxidation state ${state} for ${centre.metal} is impossible: check the charge and the ligands`, centre.position);
    }
    const ligands = centre.terminal.map((instance) => ({ ...instance }));
    // A bridge written between the metals binds the first by its first atom and the second by its
    // far end: Co–N≡C–Fe is NC on cobalt and CN on iron.
    const farEnd = centre === b && !sphere.symmetric;
    for (const bridge of sphere.bridges) {
      const flipped = farEnd ? LINKAGE_PARTNER.get(bridge.ligand.id) : undefined;
      const ligand = flipped === undefined ? bridge.ligand : findLigand(flipped) ?? bridge.ligand;
      addLigand(ligands, ligand, bridge.written, bridge.count, bridge.position);
    }
    result.push({ metal: centre.metal, oxidationState: state, ligands, bridges: sphere.bridges.map((instance) => ({ ...instance })), species: centreSpecies(centre.metal, state, ligands) });
  }
  return result;
}

function roman(state: number): string {
  for (const [numeral, value] of ROMAN) if (value === state) return numeral;
  return String(state);
}
