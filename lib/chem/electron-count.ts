/**
 * Electron counting and geometry: coordination number, likely geometry, 18-electron count.
 * Conventions (common practice): coordination number = sum of denticities, η5-Cp counting as
 * three sites; the valence-electron count uses the ionic model (metal d electrons + 2 per site).
 */
import type { Geometry, LigandInstance } from './types';

export function coordinationNumber(ligands: readonly LigandInstance[]): number {
  let total = 0;
  for (const instance of ligands) total += instance.ligand.denticity * instance.count;
  return total;
}

/** Fraction of coordination sites held by ligands satisfying `test`. */
export function siteFraction(
  ligands: readonly LigandInstance[],
  test: (instance: LigandInstance) => boolean,
): number {
  let matching = 0;
  let total = 0;
  for (const instance of ligands) {
    const sites = instance.ligand.denticity * instance.count;
    total += sites;
    if (test(instance)) matching += sites;
  }
  return total === 0 ? 0 : matching / total;
}

// Cyanide and carbonyl head the spectrochemical series (Shriver & Atkins; jorgensen.json).
const STRONG_FIELD_IDS = new Set(['CN', 'CO', 'NO']);
const HALIDE_IDS = new Set(['F', 'Cl', 'Br', 'I']);

export interface GeometryContext {
  coordinationNumber: number;
  dElectrons: number;
  electronShell: 'd' | 'f' | 'sp';
  series: string;
  metal: string;
  oxidationState: number;
  ligands: readonly LigandInstance[];
}

/**
 * Likely geometry by common practice:
 * CN 4: square planar for d8 with a 4d/5d metal (Pt(II), Pd(II), Au(III), Rh(I), Ir(I)) or with
 * strong-field ligands (Ni(CN)4²⁻), and for Cu(II) without halides; otherwise tetrahedral.
 * CN 5: trigonal bipyramidal for d8 (Fe(CO)5), square pyramidal otherwise. CN 6 octahedral, etc.
 */
export function predictGeometry(context: GeometryContext): Geometry {
  const { coordinationNumber: cn, dElectrons, electronShell, series, ligands } = context;
  switch (cn) {
    case 2:
      return 'linear';
    case 3:
      return 'trigonal-planar';
    case 4: {
      if (electronShell === 'd' && dElectrons === 8) {
        if (series === '4d' || series === '5d') return 'square-planar';
        if (siteFraction(ligands, (i) => STRONG_FIELD_IDS.has(i.ligand.id)) >= 0.5) return 'square-planar';
        return 'tetrahedral';
      }
      if (electronShell === 'd' && dElectrons === 9) {
        return siteFraction(ligands, (i) => HALIDE_IDS.has(i.ligand.id)) >= 0.5 ? 'tetrahedral' : 'square-planar';
      }
      return 'tetrahedral';
    }
    case 5:
      return electronShell === 'd' && dElectrons === 8 ? 'trigonal-bipyramidal' : 'square-pyramidal';
    case 6:
      return 'octahedral';
    case 7:
      return 'pentagonal-bipyramidal';
    case 8:
      return 'square-antiprismatic';
    case 9:
      return 'tricapped-trigonal-prismatic';
    default:
      return 'other';
  }
}

/** Ionic-model valence electron count: d electrons + 2 per coordination site. */
export function valenceElectronCount(dElectrons: number, coordinationNumberValue: number): number {
  return dElectrons + 2 * coordinationNumberValue;
}
