/**
 * Atomic weights and molar masses. Values: IUPAC/CIAAW standard atomic weights
 * (conventional/abridged values; see data/atomic-weights.json for each record's source).
 */
import atomicWeightData from '@/data/atomic-weights.json';

export interface ElementRecord {
  symbol: string;
  atomicNumber: number;
  name: string;
  atomicWeight: number;
  /** false for elements without a standard atomic weight (Tc, Pm, …): a mass number stands in. */
  standard: boolean;
  source: string;
}

const elementRecords: readonly ElementRecord[] = atomicWeightData.elements;
const elementBySymbol: ReadonlyMap<string, ElementRecord> = new Map(
  elementRecords.map((record) => [record.symbol, record]),
);

// Symbols by their character codes (first × 65536 + second, second 0 for a one-letter symbol):
// the parser looks a symbol up where it is written instead of cutting a string out of the input.
const symbolByCharCodes: ReadonlyMap<number, string> = new Map(
  elementRecords.map((record) => [symbolCodeKey(record.symbol.charCodeAt(0), record.symbol.length > 1 ? record.symbol.charCodeAt(1) : 0), record.symbol]),
);

function symbolCodeKey(first: number, second: number): number {
  return first * 65536 + second;
}

/** The element symbol made of these characters (`second` 0 for a one-letter symbol), case-sensitive. */
export function elementSymbolFromCharCodes(first: number, second: number): string | undefined {
  return symbolByCharCodes.get(symbolCodeKey(first, second));
}

export function elementRecord(symbol: string): ElementRecord | undefined {
  return elementBySymbol.get(symbol);
}

/** Case-sensitive: "Co" is cobalt, "CO" is not an element symbol. */
export function isElementSymbol(symbol: string): boolean {
  return elementBySymbol.has(symbol);
}

/** Standard atomic weight in g/mol; throws for an unknown symbol (a programming error, not user input). */
export function atomicWeight(symbol: string): number {
  const record = elementBySymbol.get(symbol);
  if (!record) throw new Error(`No atomic weight for element '${symbol}'`);
  return record.atomicWeight;
}

/** Molar mass (g/mol) of a composition such as {Co:1, N:6, H:18, Cl:3}. */
export function molarMassGPerMol(composition: Readonly<Record<string, number>>): number {
  let total = 0;
  for (const symbol in composition) {
    const count = composition[symbol] ?? 0;
    if (count !== 0) total += atomicWeight(symbol) * count;
  }
  return total;
}

/** Adds `times` × `part` into `target` (mutates target). */
export function addComposition(
  target: Record<string, number>,
  part: Readonly<Record<string, number>>,
  times: number,
): void {
  for (const symbol in part) {
    target[symbol] = (target[symbol] ?? 0) + (part[symbol] ?? 0) * times;
  }
}

/** One element of a composition, with its atomic weight (NaN for a symbol without one). */
export interface CompositionTerm {
  symbol: string;
  count: number;
  atomicWeight: number;
}

// Each catalogue composition ({C:2, H:8, N:2}) as a list of terms, made once per object: iterating
// a short array is much cheaper than for-in over objects of many different shapes, and the weights
// come without a look-up per formula.
const termsByComposition = new WeakMap<Readonly<Record<string, number>>, readonly CompositionTerm[]>();

/** The composition's terms in key order (cached per composition object: do not mutate it afterwards). */
export function compositionTerms(part: Readonly<Record<string, number>>): readonly CompositionTerm[] {
  let terms = termsByComposition.get(part);
  if (terms === undefined) {
    terms = Object.keys(part).map((symbol) => ({
      symbol,
      count: part[symbol] ?? 0,
      atomicWeight: elementBySymbol.get(symbol)?.atomicWeight ?? Number.NaN,
    }));
    termsByComposition.set(part, terms);
  }
  return terms;
}

/** Hill-order formula string (C first, then H, then alphabetical), e.g. "C10H8CoN2". */
export function hillFormula(composition: Readonly<Record<string, number>>): string {
  const symbols = Object.keys(composition).filter((symbol) => (composition[symbol] ?? 0) > 0);
  const hasCarbon = symbols.includes('C');
  symbols.sort((a, b) => {
    if (hasCarbon) {
      const rank = (s: string): number => (s === 'C' ? 0 : s === 'H' ? 1 : 2);
      const diff = rank(a) - rank(b);
      if (diff !== 0) return diff;
    }
    return a < b ? -1 : a > b ? 1 : 0;
  });
  return symbols.map((s) => (composition[s] === 1 ? s : `${s}${composition[s]}`)).join('');
}
