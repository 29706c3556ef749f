/**
 * The ligand catalogue (data/ligands.json), indexed once at module load by id and by every alias.
 */
import ligandData from '@/data/ligands.json';
import type { LigandDefinition } from './types';

// JSON module types are structural unions; the shape is checked by tests/lib/chem/catalogue.test.ts.
export const ligandCatalogue: readonly LigandDefinition[] = ligandData.ligands as unknown as LigandDefinition[];

const ligandByToken: Map<string, LigandDefinition> = new Map();
for (const ligand of ligandCatalogue) {
  ligandByToken.set(ligand.id, ligand);
  for (const alias of ligand.aliases) ligandByToken.set(alias, ligand);
}

/** Every accepted spelling (ids and aliases), for the parser's look-ahead tables. */
export function ligandTokens(): string[] {
  return [...ligandByToken.keys()];
}

/** Read-only view of spelling → ligand. */
export const ligandTable: ReadonlyMap<string, LigandDefinition> = ligandByToken;

/** Case-sensitive lookup by id or alias ("OH2" → aqua, "Cl" → chlorido). */
export function findLigand(token: string): LigandDefinition | undefined {
  return ligandByToken.get(token);
}

const ligandById: ReadonlyMap<string, LigandDefinition> = new Map(
  ligandCatalogue.map((ligand) => [ligand.id, ligand]),
);

export function ligandWithId(id: string): LigandDefinition | undefined {
  return ligandById.get(id);
}

/** Spellings that differ only in letter case, for "did you mean" hints. */
const tokenByLowerCase: Map<string, string> = new Map();
for (const token of ligandByToken.keys()) {
  const lower = token.toLowerCase();
  if (!tokenByLowerCase.has(lower)) tokenByLowerCase.set(lower, token);
}

export function suggestLigandSpelling(token: string): string | undefined {
  return tokenByLowerCase.get(token.toLowerCase());
}

/**
 * Ligand-field strength used for Δo: the published Jørgensen f where there is one, else the
 * catalogue's rough estimate, else null. `estimated` says which.
 */
export function ligandFieldFactor(
  ligand: LigandDefinition,
): { f: number; estimated: boolean } | null {
  if (ligand.jorgensenF !== null) return { f: ligand.jorgensenF, estimated: false };
  if (ligand.fEstimate !== undefined && ligand.fEstimate !== null) {
    return { f: ligand.fEstimate, estimated: true };
  }
  return null;
}
