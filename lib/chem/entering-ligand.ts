/**
 * Reads an entering ligand as people type it: the table's id or alias ("NH3", "Cl", "bpy"), the
 * free ion with its charge ("Cl-", "NO2⁻", "SCN^-"), the ligand's name in the table ("chlorido",
 * "pyridine") or the everyday name of the free species ("ammonia", "chloride", "water").
 */
import { findLigand, ligandCatalogue, suggestLigandSpelling } from './ligands';
import type { LigandDefinition } from './types';

/** Everyday names of free entering species → the table's id (common practice). */
const EVERYDAY_NAMES: Record<string, string> = {
  ammonia: 'NH3',
  water: 'H2O',
  chloride: 'Cl',
  bromide: 'Br',
  iodide: 'I',
  fluoride: 'F',
  cyanide: 'CN',
  hydroxide: 'OH',
  azide: 'N3',
  nitrite: 'NO2',
  nitrate: 'NO3',
  thiocyanate: 'NCS',
  thiourea: 'tu',
  ethylene: 'C2H4',
  ethene: 'C2H4',
  acetate: 'OAc',
  glycinate: 'gly',
  oxalate: 'ox',
  bipyridine: 'bpy',
  phenanthroline: 'phen',
};

const byName = new Map<string, LigandDefinition>();
for (const ligand of ligandCatalogue) byName.set(ligand.name.toLowerCase(), ligand);

export type EnteringLigandReading = { ligand: LigandDefinition } | { problem: string };

export function readEnteringLigand(text: string): EnteringLigandReading {
  const token = text.trim();
  if (token === '') return { problem: 'is empty: give a ligand such as NH3, Cl or bpy' };
  const direct = findLigand(token);
  if (direct) return { ligand: direct };
  // A free ion written with its charge: "Cl-", "NO2⁻", "SCN^-", "CO3 2-", "CO32-". The sign alone is
  // tried first, so the 2 of "NO2-" stays part of the formula.
  const withoutSign = token.replace(/\s*\^?[-−⁻+⁺]$/u, '');
  const withoutCharge = withoutSign === token ? token : withoutSign.replace(/\s*[\d²³]$/u, '');
  for (const candidate of [withoutSign, withoutCharge]) {
    if (candidate === token) continue;
    const bare = findLigand(candidate);
    if (bare) return { ligand: bare };
  }
  const lower = token.toLowerCase();
  const everyday = EVERYDAY_NAMES[lower];
  if (everyday) {
    const ligand = findLigand(everyday);
    if (ligand) return { ligand };
  }
  const named = byName.get(lower);
  if (named) return { ligand: named };
  const suggestion = suggestLigandSpelling(withoutCharge);
  return { problem: `"${token}" is not in the ligand table${suggestion ? ` (did you mean ${suggestion}?)` : ''}: give one such as NH3, Cl, py or bpy` };
}
