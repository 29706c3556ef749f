import fc from 'fast-check';

import { fillOrbitals, levelElectrons, splittingSchemeFor, type OrbitalFilling } from '@/lib/chem/orbital-filling';
import type { Geometry, SpinState } from '@/lib/chem/types';

/** { levelId: electrons } written out by hand below. */
function byLevel(filling: OrbitalFilling): Record<string, number> {
  return Object.fromEntries(filling.levels.map((level) => [level.id, levelElectrons(level)]));
}

describe('fillOrbitals: octahedral t2g / eg (common practice, crystal-field aufbau and Hund)', () => {
  // [d, spin, t2g, eg, unpaired] — textbook octahedral configurations (common practice).
  const cases: [number, SpinState, number, number, number][] = [
    [1, 'high', 1, 0, 1],
    [3, 'high', 3, 0, 3], // Cr3+
    [4, 'high', 3, 1, 4], // Cr2+ aqua
    [4, 'low', 4, 0, 2],
    [5, 'high', 3, 2, 5], // Mn2+, Fe3+ aqua
    [5, 'low', 5, 0, 1], // [Fe(CN)6]3-
    [6, 'high', 4, 2, 4], // [Fe(H2O)6]2+
    [6, 'low', 6, 0, 0], // [Co(NH3)6]3+
    [7, 'high', 5, 2, 3], // [Co(H2O)6]2+
    [7, 'low', 6, 1, 1],
    [8, 'high', 6, 2, 2], // Ni2+
    [8, 'low', 6, 2, 2], // no spin choice for d8 octahedral
    [9, 'high', 6, 3, 1], // Cu2+
    [10, 'high', 6, 4, 0],
  ];
  it.each(cases)('d%i %s spin: t2g %i, eg %i, %i unpaired', (d, spin, t2g, eg, unpaired) => {
    const filling = fillOrbitals(d, 'octahedral', spin);
    expect(filling.scheme).toBe('octahedral');
    expect(byLevel(filling)).toEqual({ t2g, eg });
    expect(filling.unpairedElectrons).toBe(unpaired);
  });

  it('pairs within t2g from the first orbital for d6 low spin and leaves one pair for d6 high spin', () => {
    expect(fillOrbitals(6, 'octahedral', 'low').levels.map((l) => l.occupancy)).toEqual([[2, 2, 2], [0, 0]]);
    expect(fillOrbitals(6, 'octahedral', 'high').levels.map((l) => l.occupancy)).toEqual([[2, 1, 1], [1, 1]]);
  });

  it('puts the lower set first (t2g below eg)', () => {
    const [lower, upper] = fillOrbitals(2, 'octahedral', 'high').levels;
    expect(lower?.id).toBe('t2g');
    expect(upper?.id).toBe('eg');
    expect((lower?.energyDq ?? 0) < (upper?.energyDq ?? 0)).toBe(true);
  });
});

describe('fillOrbitals: tetrahedral e / t2 (common practice, high spin)', () => {
  it.each([
    [2, 2, 0, 2],
    [5, 2, 3, 5],
    [7, 4, 3, 3], // [CoCl4]2-
    [8, 4, 4, 2], // [NiCl4]2-
    [9, 4, 5, 1],
  ])('d%i: e %i, t2 %i, %i unpaired', (d, e, t2, unpaired) => {
    const filling = fillOrbitals(d, 'tetrahedral', null);
    expect(filling.spinState).toBe('high');
    expect(byLevel(filling)).toEqual({ e, t2 });
    expect(filling.unpairedElectrons).toBe(unpaired);
  });
});

describe('fillOrbitals: square planar dxz,dyz < dz2 < dxy < dx2−y2 (common practice ordering)', () => {
  it('d8 low spin leaves dx2−y2 empty and is diamagnetic ([PtCl4]2-, [Ni(CN)4]2-)', () => {
    const filling = fillOrbitals(8, 'square-planar', 'low');
    expect(filling.levels.map((l) => l.id)).toEqual(['dxz-dyz', 'dz2', 'dxy', 'dx2-y2']);
    expect(byLevel(filling)).toEqual({ 'dxz-dyz': 4, dz2: 2, dxy: 2, 'dx2-y2': 0 });
    expect(filling.unpairedElectrons).toBe(0);
  });

  it('null spin defaults to low spin; d9 puts the single electron in dx2−y2 ([CuCl4]2- planar)', () => {
    const filling = fillOrbitals(9, 'square-planar', null);
    expect(filling.spinState).toBe('low');
    expect(byLevel(filling)).toEqual({ 'dxz-dyz': 4, dz2: 2, dxy: 2, 'dx2-y2': 1 });
    expect(filling.unpairedElectrons).toBe(1);
  });

  it('d8 high spin spreads over all five orbitals: two unpaired', () => {
    const filling = fillOrbitals(8, 'square-planar', 'high');
    expect(byLevel(filling)).toEqual({ 'dxz-dyz': 4, dz2: 2, dxy: 1, 'dx2-y2': 1 });
    expect(filling.unpairedElectrons).toBe(2);
  });
});

describe('fillOrbitals: other geometries and limits', () => {
  it('draws five degenerate orbitals for geometries without a drawn splitting', () => {
    for (const geometry of ['trigonal-bipyramidal', 'linear', 'other'] as Geometry[]) {
      expect(splittingSchemeFor(geometry)).toBe('degenerate');
    }
    const filling = fillOrbitals(7, 'trigonal-bipyramidal', null);
    expect(filling.levels).toHaveLength(1);
    expect(filling.levels[0]?.occupancy).toEqual([2, 2, 1, 1, 1]);
  });

  it('rejects counts outside 0–10 with a clear message', () => {
    expect(() => fillOrbitals(11, 'octahedral', 'high')).toThrow(/0 to 10, got 11/);
    expect(() => fillOrbitals(2.5, 'octahedral', 'high')).toThrow(/whole number/);
  });

  it('conserves electrons, never overfills an orbital, and low spin never has more unpaired than high spin', () => {
    const geometries: Geometry[] = ['octahedral', 'tetrahedral', 'square-planar', 'other'];
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10 }), fc.constantFrom(...geometries), (d, geometry) => {
        const low = fillOrbitals(d, geometry, 'low');
        const high = fillOrbitals(d, geometry, 'high');
        for (const filling of [low, high]) {
          const orbitals = filling.levels.flatMap((l) => l.occupancy);
          expect(orbitals).toHaveLength(5);
          expect(orbitals.every((n) => n >= 0 && n <= 2)).toBe(true);
          expect(orbitals.reduce((a, b) => a + b, 0)).toBe(d);
        }
        expect(low.unpairedElectrons).toBeLessThanOrEqual(high.unpairedElectrons);
        // Hund (common practice): high spin has min(d, 10 − d) unpaired electrons.
        expect(high.unpairedElectrons).toBe(Math.min(d, 10 - d));
      }),
    );
  });
});
