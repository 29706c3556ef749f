import { classifyFormula } from '@/lib/chem/classify';
import { elementRecord } from '@/lib/chem/elements';
import { FormulaError, type Classification } from '@/lib/chem/types';
import type { DerivedFields } from '@/lib/schemas/library';
import { AppError } from '@/server/http/errors';

/** What the library stores beside a formula: the engine's answer, and the text search runs over. */
export interface DerivedColumns extends DerivedFields {
  /** "id:count" pairs sorted by id, e.g. "Cl:1,NH3:5": the ligand set, counts included. */
  ligandSetKey: string;
  searchText: string;
}

const ROMAN = ['0', 'i', 'ii', 'iii', 'iv', 'v', 'vi', 'vii', 'viii', 'ix'];

/** Lower case, every run of characters other than letters, digits and + - becomes one space. */
export function normaliseSearchText(text: string): string {
  return text
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, ' ')
    .trim();
}

/**
 * Query tokens: "Co amm" → ["co", "amm"]; "[Co(NH3)6]3+" → ["co", "nh3", "6", "3"]. Each token is
 * matched against the words of search_text by trigram word similarity (pg_trgm `<%`).
 */
export function searchTokens(query: string): string[] {
  const tokens = normaliseSearchText(query).split(' ').filter((token) => token.length > 0);
  return [...new Set(tokens)].slice(0, 8);
}

export function ligandSetKeyOf(ligands: readonly { id: string; count: number }[]): string {
  const counts = new Map<string, number>();
  for (const ligand of ligands) counts.set(ligand.id, (counts.get(ligand.id) ?? 0) + ligand.count);
  return [...counts.entries()]
    .sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0))
    .map(([id, count]) => `${id}:${count}`)
    .join(',');
}

/** The engine's classification, or a 400 that says what is wrong and at which character. */
export function classifyOrExplain(formula: string, field = 'formula'): Classification {
  try {
    return classifyFormula(formula);
  } catch (error) {
    if (error instanceof FormulaError) {
      throw new AppError(
        'VALIDATION_FAILED',
        `The formula cannot be read: ${error.message}`,
        { [field]: `${error.message} (character ${error.position + 1})` },
        { position: error.position },
      );
    }
    throw error;
  }
}

/**
 * search_text holds the formula's tokens, the entry's name, the metal symbol and element name, the
 * oxidation state as "co iii", and every ligand's id and name — so "Co amm", "cobalt ammine",
 * "hexaammine" and "Co NH3" all find [Co(NH3)6]3+.
 */
export function buildSearchText(formula: string, name: string, classification: Classification): string {
  const element = elementRecord(classification.metal);
  const parts = [
    formula,
    name,
    classification.metal,
    element?.name ?? '',
    ROMAN[classification.oxidationState] ?? String(classification.oxidationState),
    ...classification.ligands.flatMap((ligand) => [ligand.id, ligand.name]),
  ];
  return normaliseSearchText(parts.join(' '));
}

export function deriveColumns(formula: string, name: string, field = 'formula'): DerivedColumns {
  const classification = classifyOrExplain(formula, field);
  return derivedFromClassification(classification, formula, name);
}

export function derivedFromClassification(classification: Classification, formula: string, name: string): DerivedColumns {
  return {
    metal: classification.metal,
    oxidationState: classification.oxidationState,
    dElectrons: classification.dElectrons,
    spinState: classification.spinState,
    verdict: classification.verdict,
    ligandIds: [...new Set(classification.ligands.map((ligand) => ligand.id))].sort(),
    ligandSetKey: ligandSetKeyOf(classification.ligands),
    searchText: buildSearchText(formula, name, classification),
  };
}
