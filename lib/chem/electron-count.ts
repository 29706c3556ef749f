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

/**
 * Carbonate, nitrate, acetate and sulfate bind through one O or chelate through two. Written in a
 * formula they look the same, so one of them is counted as chelating when that completes an
 * otherwise 5- or 3-coordinate sphere to 6 or 4 (common practice: [Co(NH3)4(CO3)]⁺ is six-coordinate).
 */
export function settleFlexibleDenticity(ligands: readonly LigandInstance[], largeIon = false): readonly LigandInstance[] {
  // Large f-block ions take O,O′-chelating nitrate, carbonate and acetate ([Ce(NO3)6]2− and
  // [Th(NO3)6]2− are 12-coordinate: common practice, Greenwood & Earnshaw 1997).
  if (largeIon) return chelateAllFlexible(ligands);
  const sites = coordinationNumber(ligands);
  if (sites !== 5 && sites !== 3) return ligands;
  const index = ligands.findIndex((instance) => (instance.ligand.chelatingDenticity ?? 0) > instance.ligand.denticity);
  const flexible = ligands[index];
  if (!flexible) return ligands;
  const chelating: LigandInstance = {
    ...flexible,
    count: 1,
    ligand: {
      ...flexible.ligand,
      denticity: flexible.ligand.chelatingDenticity ?? 2,
      donorAtoms: [flexible.ligand.donorAtoms[0] ?? 'O', flexible.ligand.donorAtoms[0] ?? 'O'],
      name: flexible.ligand.name.replace(/\s*\(κO, monodentate\)|\s*\(monodentate\)/, '') + ' (κ²O,O′, chelating)',
    },
  };
  const rest = flexible.count > 1 ? [{ ...flexible, count: flexible.count - 1 }] : [];
  return [...ligands.slice(0, index), chelating, ...rest, ...ligands.slice(index + 1)];
}

function chelateAllFlexible(ligands: readonly LigandInstance[]): readonly LigandInstance[] {
  let changed = false;
  const settled = ligands.map((instance) => {
    const chelating = instance.ligand.chelatingDenticity ?? 0;
    if (chelating <= instance.ligand.denticity) return instance;
    changed = true;
    const donor = instance.ligand.donorAtoms[0] ?? 'O';
    return {
      ...instance,
      ligand: {
        ...instance.ligand,
        denticity: chelating,
        donorAtoms: Array.from({ length: chelating }, () => donor),
        name: instance.ligand.name.replace(/\s*\(κO, monodentate\)|\s*\(monodentate\)/, '') + ' (κ²O,O′, chelating)',
      },
    };
  });
  return changed ? settled : ligands;
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
  const sandwich = sandwichGeometry(ligands);
  if (sandwich !== null) return sandwich;
  switch (cn) {
    case 2:
      return 'linear';
    case 3:
      return 'trigonal-planar';
    case 4: {
      // One tetradentate ligand (salen, cyclam, porphyrin-type) holds the metal in its plane.
      if (ligands.length === 1 && ligands[0]?.ligand.denticity === 4 && ligands[0].count === 1) return 'square-planar';
      if (electronShell === 'd' && dElectrons === 8) {
        if (series === '4d' || series === '5d') return 'square-planar';
        if (siteFraction(ligands, (i) => STRONG_FIELD_IDS.has(i.ligand.id)) >= 0.5) return 'square-planar';
        // 3d d8 (Ni(II)): weak-field halide, O-donor and bulky phosphine sets go tetrahedral
        // ([NiCl4]2−, [NiCl2(PPh3)2]); N-donor sets go square planar ([Ni(en)2]2+, [Ni(Hdmg)2]) (common practice).
        const weakOrBulky = siteFraction(
          ligands,
          (i) => HALIDE_IDS.has(i.ligand.id) || i.ligand.id === 'PPh3' || i.ligand.donorAtoms.every((atom) => atom === 'O'),
        );
        return weakOrBulky >= 0.5 ? 'tetrahedral' : 'square-planar';
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

/**
 * Rings bound through five or six carbons (η5-Cp, η6-arene) are not a set of point donors: two of
 * them alone make a sandwich, two with other ligands a bent sandwich, one a half-sandwich (piano
 * stool). Read from the ligands' hapticity (common practice).
 */
export function sandwichGeometry(ligands: readonly LigandInstance[]): Geometry | null {
  let rings = 0;
  let others = 0;
  for (const instance of ligands) {
    if ((instance.ligand.hapticity ?? 0) >= 5) rings += instance.count;
    else others += instance.count;
  }
  if (rings === 0) return null;
  if (rings === 1) return 'half-sandwich';
  if (rings === 2) return others === 0 ? 'sandwich' : 'bent-sandwich';
  return null;
}

/** Ionic-model valence electron count: d electrons + 2 per coordination site. */
export function valenceElectronCount(dElectrons: number, coordinationNumberValue: number): number {
  return dElectrons + 2 * coordinationNumberValue;
}
