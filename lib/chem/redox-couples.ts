/**
 * Redox couples with self-exchange constants and standard potentials (data/redox-couples.json),
 * looked up by formula in either oxidation state.
 *
 * Formulas are compared by what the parser makes of them (metal, coordination-entity composition
 * and charge), so "[Fe(OH2)6]3+", "[Fe(H2O)6]3+" and "[Fe(H2O)6](ClO4)3" all find the same couple.
 * Aqua ions match on metal and charge alone: the number of waters varies with the author
 * (Eu(III) aqua is 8- or 9-coordinate).
 */
import redoxCouplesData from '@/data/redox-couples.json';

import { parseFormula } from './formula-parser';
import type { CoupleMatch, RedoxCouple } from './route-types';
import type { ParsedFormula } from './types';

const couples: readonly RedoxCouple[] = (redoxCouplesData as unknown as { couples: RedoxCouple[] }).couples;

/** Every couple in the table. */
export function listCouples(): readonly RedoxCouple[] {
  return couples;
}

export function coupleById(id: string): RedoxCouple | null {
  return couples.find((couple) => couple.id === id) ?? null;
}

function isWater(composition: Record<string, number>, charge: number): boolean {
  const keys = Object.keys(composition).filter((key) => (composition[key] ?? 0) !== 0);
  return charge === 0 && keys.length === 2 && composition.H === 2 && composition.O === 1;
}

/** Composition of the coordination entity alone (metal + ligands; counter-ions and hydrate waters left out). */
export function entityComposition(parsed: ParsedFormula): Record<string, number> {
  const composition: Record<string, number> = { [parsed.metal]: 1 };
  for (const instance of parsed.ligands) {
    for (const [element, count] of Object.entries(instance.ligand.composition)) {
      composition[element] = (composition[element] ?? 0) + count * instance.count;
    }
  }
  return composition;
}

/** Key that two formulas of the same species share. */
export function speciesKey(parsed: ParsedFormula): string {
  const allWater = parsed.ligands.every((instance) => isWater(instance.ligand.composition, instance.ligand.charge));
  if (allWater) return `aqua|${parsed.metal}|${parsed.complexCharge}`;
  const composition = entityComposition(parsed);
  const formula = Object.keys(composition)
    .sort()
    .map((element) => `${element}${composition[element]}`)
    .join('');
  return `${parsed.metal}|${formula}|${parsed.complexCharge}`;
}

interface CoupleIndex {
  byKey: Map<string, CoupleMatch>;
  /** Couple formulas the parser did not accept (a data or catalogue gap; reported, not thrown). */
  notIndexed: { coupleId: string; formula: string; error: string }[];
}

let index: CoupleIndex | null = null;

function buildIndex(): CoupleIndex {
  const byKey = new Map<string, CoupleMatch>();
  const notIndexed: CoupleIndex['notIndexed'] = [];
  for (const couple of couples) {
    for (const side of ['oxidised', 'reduced'] as const) {
      const formula = couple[side];
      try {
        const key = speciesKey(parseFormula(formula));
        if (!byKey.has(key)) byKey.set(key, { couple, side });
      } catch (error) {
        notIndexed.push({ coupleId: couple.id, formula, error: error instanceof Error ? error.message : String(error) });
      }
    }
  }
  return { byKey, notIndexed };
}

function getIndex(): CoupleIndex {
  index ??= buildIndex();
  return index;
}

/** Couple formulas in the data file that the parser could not read (should be empty). */
export function couplesNotIndexed(): CoupleIndex['notIndexed'] {
  return getIndex().notIndexed;
}

/**
 * The couple a complex belongs to and which side it is on, or null if the table has none.
 * Accepts a formula string (throws the parser's FormulaError if it cannot be read) or a parsed formula.
 */
export function findCouple(formula: string | ParsedFormula): CoupleMatch | null {
  const parsed = typeof formula === 'string' ? parseFormula(formula) : formula;
  return getIndex().byKey.get(speciesKey(parsed)) ?? null;
}
