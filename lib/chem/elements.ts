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

// Each catalogue composition ({C:2, H:8, N:2}) as a list of [symbol, count], made once per object:
// iterating a short array is much cheaper than for-in over objects of many different shapes.
const entriesByComposition = new WeakMap<Readonly<Record<string, number>>, readonly (readonly [string, number])[]>();

/** The composition's [symbol, count] pairs in key order (cached per composition object: do not mutate it afterwards). */
export function compositionEntries(part: Readonly<Record<string, number>>): readonly (readonly [string, number])[] {
  let entries = entriesByComposition.get(part);
  if (entries === undefined) {
    entries = Object.keys(part).map((symbol) => [symbol, part[symbol] ?? 0] as const);
    entriesByComposition.set(part, entries);
  }
  return entries;
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
