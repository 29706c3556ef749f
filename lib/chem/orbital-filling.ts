/**
 * Fills d electrons into the split d-orbital sets of a geometry, for drawing a splitting diagram.
 * Crystal-field picture only (common practice): octahedral t2g < eg, tetrahedral e < t2,
 * square-planar dxz,dyz < dz2 < dxy < dx²−y², and five degenerate orbitals for anything else.
 */
import type { Geometry, SpinState } from './types';

export type SplittingScheme = 'octahedral' | 'tetrahedral' | 'square-planar' | 'degenerate';

export interface OrbitalLevel {
  /** Stable key, e.g. "t2g", "dx2-y2". */
  id: string;
  /** Label as a chemist writes it, e.g. "t2g", "dx²−y²". */
  label: string;
  /** Electrons in each orbital of the level (0, 1 or 2), lowest-index orbital filled first. */
  occupancy: number[];
  /** Schematic energy relative to the barycentre, in Dq of the drawn field (for placing the level). */
  energyDq: number;
}

export interface OrbitalFilling {
  scheme: SplittingScheme;
  /** Levels from lowest to highest energy. */
  levels: OrbitalLevel[];
  /** Spin state actually used for the filling (null spin defaults per scheme, see fillOrbitals). */
  spinState: SpinState;
  unpairedElectrons: number;
}

interface LevelTemplate {
  id: string;
  label: string;
  orbitals: number;
  energyDq: number;
}

// Energies in Dq, crystal-field model (common practice): octahedral t2g −4, eg +6; tetrahedral
// e −2.67, t2 +1.78 (Δt = 4/9 Δo); square planar −5.14 / −4.28 / +2.28 / +12.28. Barycentre 0.
const TEMPLATES: Record<SplittingScheme, LevelTemplate[]> = {
  octahedral: [
    { id: 't2g', label: 't2g', orbitals: 3, energyDq: -4 },
    { id: 'eg', label: 'eg', orbitals: 2, energyDq: 6 },
  ],
  tetrahedral: [
    { id: 'e', label: 'e', orbitals: 2, energyDq: -2.67 },
    { id: 't2', label: 't2', orbitals: 3, energyDq: 1.78 },
  ],
  'square-planar': [
    { id: 'dxz-dyz', label: 'dxz, dyz', orbitals: 2, energyDq: -5.14 },
    { id: 'dz2', label: 'dz²', orbitals: 1, energyDq: -4.28 },
    { id: 'dxy', label: 'dxy', orbitals: 1, energyDq: 2.28 },
    { id: 'dx2-y2', label: 'dx²−y²', orbitals: 1, energyDq: 12.28 },
  ],
  degenerate: [{ id: 'd', label: 'd', orbitals: 5, energyDq: 0 }],
};

export function splittingSchemeFor(geometry: Geometry): SplittingScheme {
  if (geometry === 'octahedral' || geometry === 'tetrahedral' || geometry === 'square-planar') return geometry;
  return 'degenerate';
}

/**
 * Places dElectrons (0–10) in the orbitals of the geometry.
 * Low spin: aufbau, each level filled completely (Hund's rule inside the level) before the next.
 * High spin: one electron in every orbital, lowest first, before any pairing (Hund across levels).
 * A null spin state means "no choice reported": high spin for octahedral, tetrahedral and the
 * degenerate picture, low spin for square planar (the usual case, common practice).
 */
export function fillOrbitals(dElectrons: number, geometry: Geometry, spinState: SpinState | null): OrbitalFilling {
  if (!Number.isInteger(dElectrons) || dElectrons < 0 || dElectrons > 10) {
    throw new RangeError(`d-electron count must be a whole number from 0 to 10, got ${dElectrons}`);
  }
  const scheme = splittingSchemeFor(geometry);
  const spin: SpinState = spinState ?? (scheme === 'square-planar' ? 'low' : 'high');
  const levels: OrbitalLevel[] = TEMPLATES[scheme].map((template) => ({
    id: template.id,
    label: template.label,
    occupancy: new Array<number>(template.orbitals).fill(0),
    energyDq: template.energyDq,
  }));

  let remaining = dElectrons;
  const place = (level: OrbitalLevel, upTo: number): void => {
    for (let i = 0; i < level.occupancy.length && remaining > 0; i++) {
      const current = level.occupancy[i] ?? 0;
      if (current < upTo) {
        level.occupancy[i] = current + 1;
        remaining -= 1;
      }
    }
  };

  if (spin === 'low') {
    for (const level of levels) {
      place(level, 1);
      place(level, 2);
    }
  } else {
    for (const level of levels) place(level, 1);
    for (const level of levels) place(level, 2);
  }

  const unpairedElectrons = levels.reduce((sum, level) => sum + level.occupancy.filter((n) => n === 1).length, 0);
  return { scheme, levels, spinState: spin, unpairedElectrons };
}

/** Electrons in a level (sum over its orbitals). */
export function levelElectrons(level: OrbitalLevel): number {
  return level.occupancy.reduce((sum, n) => sum + n, 0);
}
