import type { Geometry } from './types';

/** The polyhedra a coordination number can take (common practice; the geometries the engine knows). */
const GEOMETRIES_BY_COORDINATION_NUMBER: Record<number, readonly Geometry[]> = {
  2: ['linear'],
  3: ['trigonal-planar'],
  4: ['tetrahedral', 'square-planar'],
  5: ['trigonal-bipyramidal', 'square-pyramidal'],
  6: ['octahedral'],
  7: ['pentagonal-bipyramidal'],
  8: ['square-antiprismatic'],
  9: ['tricapped-trigonal-prismatic'],
};

/** The coordination number a geometry has room for. */
const COORDINATION_NUMBER_OF: Partial<Record<Geometry, number>> = Object.fromEntries(
  Object.entries(GEOMETRIES_BY_COORDINATION_NUMBER).flatMap(([cn, geometries]) => geometries.map((geometry) => [geometry, Number(cn)])),
);

export function geometriesFor(coordinationNumber: number): readonly Geometry[] {
  return GEOMETRIES_BY_COORDINATION_NUMBER[coordinationNumber] ?? [];
}

/** Null when the geometry fits the coordination number, else why not (product copy). */
export function geometryMismatch(geometry: Geometry, coordinationNumber: number): string | null {
  if (geometry === 'other') return null;
  const needs = COORDINATION_NUMBER_OF[geometry];
  if (needs === undefined || needs === coordinationNumber) return null;
  const fits = geometriesFor(coordinationNumber);
  return `${geometry} needs coordination number ${needs}, but this complex has ${coordinationNumber}${fits.length > 0 ? ` (it can be ${fits.join(' or ')})` : ''}.`;
}
