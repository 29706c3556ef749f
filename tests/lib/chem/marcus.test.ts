import fc from 'fast-check';

import {
  coulombWorkKJPerMol,
  debyeKappaPerAngstrom,
  equilibriumConstantFromPotential,
  marcusCrossRate,
  MarcusInputError,
} from '@/lib/chem/marcus';

// Independent check arithmetic, written out here from the published equation (not the code under test):
// k12 = (k11 k22 K12 f12)^½, log f12 = (log K12)² / 4 log(k11 k22 / Z²), Z = 1e11,
// K12 = exp(FΔE/RT) — R. A. Marcus, J. Phys. Chem. 1963, 67, 853; N. Sutin, Prog. Inorg. Chem. 1983, 30, 441
// (as restated in the electron-transfer reference notes section b). CODATA 2018 constants.
const F = 96485.33212;
const R = 8.314462618;
const Z = 1e11;
function handCrossRelation(k11: number, k22: number, deltaEV: number, temperatureK = 298.15) {
  const log10K = deltaEV / ((Math.LN10 * R * temperatureK) / F);
  const log10f = log10K ** 2 / (4 * Math.log10((k11 * k22) / Z ** 2));
  const K = 10 ** log10K;
  const f = 10 ** log10f;
  return { K, f, log10K, log10f, k12: Math.sqrt(k11 * k22 * K * f), k12NoF: Math.sqrt(k11 * k22 * K) };
}
const relClose = (actual: number, expected: number, rel: number) =>
  expect(Math.abs(actual - expected) / Math.abs(expected)).toBeLessThanOrEqual(rel);

describe('marcusCrossRate: arithmetic of electron_transfer.json section b', () => {
  // [Ru(NH3)6]3+ + [V(H2O)6]2+: k11 4.3e3 (Brown & Sutin 1979, via RSC Adv. 2023 compilation),
  // k22 1e-2 (Krishnamurty & Wahl 1958, recalled), E° 0.07 and −0.255 V (recalled);
  // computed block of electron_transfer.json: K12 3.116e5, f12 0.4261, k12 2390, k12(f=1) 3661.
  const ruV = { k11: 4300, k22: 0.01, deltaEV: 0.07 - -0.255 };

  it('matches the hand calculation to 1e-6 relative', () => {
    const result = marcusCrossRate(ruV);
    const hand = handCrossRelation(ruV.k11, ruV.k22, ruV.deltaEV);
    relClose(result.K12, hand.K, 1e-6);
    relClose(result.f12, hand.f, 1e-6);
    relClose(result.k12, hand.k12, 1e-6);
    relClose(result.k12WithoutF, hand.k12NoF, 1e-6);
    relClose(result.logK12, hand.log10K, 1e-6);
    relClose(result.lnf12, hand.log10f * Math.LN10, 1e-6);
    expect(result.Z).toBe(1e11);
    expect(result.temperatureC).toBe(25);
  });

  it('reproduces the rounded values printed in the json (4 significant figures)', () => {
    const result = marcusCrossRate(ruV);
    relClose(result.K12, 311600, 5e-4);
    relClose(result.f12, 0.4261, 5e-4);
    relClose(result.k12, 2390, 5e-4);
    relClose(result.k12WithoutF, 3661, 5e-4);
    expect(result.logK12).toBeCloseTo(5.494, 3);
  });

  // [Ru(bpy)3]3+ + [Fe(H2O)6]2+: k11 4.2e8 (Sutin compilations, recalled), k22 4.0 (Silverman & Dodson 1952),
  // E° 1.26 (recalled) and 0.771 V (Harris / Bard et al. 1985); json computed: K12 1.844e8, f12 0.04602,
  // k12 1.194e8, k12(f=1) 5.566e8.
  it('large driving force: f12 well below 1, values as in the json', () => {
    const input = { k11: 4.2e8, k22: 4.0, deltaEV: 1.26 - 0.771 };
    const result = marcusCrossRate(input);
    const hand = handCrossRelation(input.k11, input.k22, input.deltaEV);
    relClose(result.k12, hand.k12, 1e-6);
    relClose(result.f12, hand.f, 1e-6);
    relClose(result.K12, 1.844e8, 5e-4);
    relClose(result.f12, 0.04602, 5e-4);
    relClose(result.k12, 1.194e8, 5e-4);
    relClose(result.k12WithoutF, 5.566e8, 5e-4);
    expect(result.f12).toBeLessThan(0.1);
    expect(result.notes.join(' ')).toMatch(/f12/);
  });

  it('identity: k11 = k22 and K12 = 1 give k12 = k11 exactly (json identity check)', () => {
    const viaK = marcusCrossRate({ k11: 1000, k22: 1000, K12: 1 });
    expect(viaK.k12).toBe(1000);
    expect(viaK.f12).toBe(1);
    const viaE = marcusCrossRate({ k11: 1000, k22: 1000, deltaEV: 0 });
    expect(viaE.k12).toBe(1000);
    expect(viaE.K12).toBe(1);
  });

  it('symmetry check: k11 1e2, k22 1e4, ΔE 0 ⇒ geometric mean 1e3 (json)', () => {
    relClose(marcusCrossRate({ k11: 100, k22: 1e4, deltaEV: 0 }).k12, 1000, 1e-12);
  });

  it('property: with K12 = 1 the result is the geometric mean of k11 and k22', () => {
    fc.assert(
      fc.property(fc.double({ min: -8, max: 10, noNaN: true }), fc.double({ min: -8, max: 10, noNaN: true }), (a, b) => {
        const k11 = 10 ** a;
        const k22 = 10 ** b;
        relClose(marcusCrossRate({ k11, k22, K12: 1 }).k12, Math.sqrt(k11 * k22), 1e-9);
      }),
      { numRuns: 200 },
    );
  });

  it('property: f12 ≤ 1 always, and k12 rises with the driving force', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -6, max: 9, noNaN: true }),
        fc.double({ min: -6, max: 9, noNaN: true }),
        fc.double({ min: -0.6, max: 0.6, noNaN: true }),
        (a, b, dE) => {
          const low = marcusCrossRate({ k11: 10 ** a, k22: 10 ** b, deltaEV: dE });
          const high = marcusCrossRate({ k11: 10 ** a, k22: 10 ** b, deltaEV: dE + 0.05 });
          expect(low.f12).toBeLessThanOrEqual(1);
          expect(high.k12).toBeGreaterThan(low.k12);
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('K12 from ΔE°', () => {
  it('59.16 mV per decade at 25 °C (common practice: 2.303RT/F = 0.05916 V)', () => {
    expect(Math.log10(equilibriumConstantFromPotential(0.05916))).toBeCloseTo(1, 4);
    // ΔE = 0.059 V ⇒ K ≈ 10 (hand check, common practice).
    expect(equilibriumConstantFromPotential(0.059)).toBeGreaterThan(9.8);
    expect(equilibriumConstantFromPotential(0.059)).toBeLessThan(10);
  });

  it('uses the given temperature: 2.303RT/F = 0.06154 V at 37 °C (hand-computed from CODATA F, R)', () => {
    const result = marcusCrossRate({ k11: 1, k22: 1, deltaEV: 0.06154, temperatureC: 37 });
    expect(result.logK12).toBeCloseTo(1, 3);
  });

  it('K12 given instead of ΔE: implied ΔE° is reported', () => {
    const result = marcusCrossRate({ k11: 1, k22: 1, K12: 10 });
    expect(result.deltaEV).toBeCloseTo(0.05916, 5);
  });
});

describe('comparison with an observed k12', () => {
  const base = { k11: 4300, k22: 0.01, deltaEV: 0.325 };
  const predicted = handCrossRelation(4300, 0.01, 0.325).k12;

  it('within one log unit ⇒ consistent (common practice threshold)', () => {
    const result = marcusCrossRate({ ...base, observedK12: predicted * 5 });
    expect(result.comparison?.verdict).toBe('consistent-with-outer-sphere');
    expect(result.comparison?.logRatio).toBeCloseTo(Math.log10(5), 9);
  });

  it('far faster ⇒ hint of a bridged route', () => {
    const result = marcusCrossRate({ ...base, observedK12: predicted * 1e4 });
    expect(result.comparison?.verdict).toBe('faster-than-outer-sphere');
    expect(result.comparison?.explanation).toMatch(/inner-sphere|bridged/);
  });

  it('far slower ⇒ slower-than-predicted', () => {
    const result = marcusCrossRate({ ...base, observedK12: predicted / 300 });
    expect(result.comparison?.verdict).toBe('slower-than-predicted');
  });

  it('no observation ⇒ comparison null', () => {
    expect(marcusCrossRate(base).comparison).toBeNull();
  });
});

describe('work terms', () => {
  it('Coulomb work for z1z2 = 1 at 1 Å, I = 0, 25 °C is 4.23 kcal/mol = 17.7 kJ/mol (Sutin 1983 constant, recalled)', () => {
    expect(coulombWorkKJPerMol(1, 1, 1, 0, 25)).toBeCloseTo(4.23 * 4.184, 1);
  });

  it('Debye κ = 0.329 √I Å⁻¹ in water at 25 °C (common practice)', () => {
    expect(debyeKappaPerAngstrom(0.1, 25)).toBeCloseTo(0.329 * Math.sqrt(0.1), 3);
  });

  it('like charges: work terms lower k12; higher ionic strength screens them', () => {
    const charges = { oxidant: 3, reductant: 2, oxidantReduced: 2, reductantOxidised: 3 };
    const plain = marcusCrossRate({ k11: 4300, k22: 0.01, deltaEV: 0.325 });
    const lowI = marcusCrossRate({ k11: 4300, k22: 0.01, deltaEV: 0.325, workTerms: { ionicStrengthM: 0.01, charges } });
    const highI = marcusCrossRate({ k11: 4300, k22: 0.01, deltaEV: 0.325, workTerms: { ionicStrengthM: 1, charges } });
    expect(lowI.workTerms?.w12KJPerMol).toBeGreaterThan(highI.workTerms?.w12KJPerMol ?? Infinity);
    expect(lowI.workTerms?.w12KJPerMol).toBeGreaterThan(0);
    // Symmetric charges (3+/2+ on both sides): w12 = w21 and w11 = w22 when radii are equal, so W12 = 1 and only f12 changes.
    expect(lowI.workTerms?.W12).toBeCloseTo(1, 12);
    expect(Number.isFinite(lowI.k12)).toBe(true);
    expect(plain.workTerms).toBeNull();
  });

  it('oppositely charged partners: W12 > 1', () => {
    const charges = { oxidant: 3, reductant: -4, oxidantReduced: 2, reductantOxidised: -3 };
    const result = marcusCrossRate({ k11: 40, k22: 740, deltaEV: 0.014, workTerms: { ionicStrengthM: 0.1, charges } });
    expect(result.workTerms?.W12).toBeGreaterThan(1);
  });
});

describe('bad input', () => {
  const expectField = (fn: () => unknown, field: string) => {
    try {
      fn();
    } catch (error) {
      expect(error).toBeInstanceOf(MarcusInputError);
      expect((error as MarcusInputError).field).toBe(field);
      expect((error as MarcusInputError).message.length).toBeGreaterThan(10);
      return;
    }
    throw new Error('expected a MarcusInputError');
  };

  it.each([
    [{ k11: -1, k22: 1, deltaEV: 0 }, 'k11'],
    [{ k11: 0, k22: 1, deltaEV: 0 }, 'k11'],
    [{ k11: Number.NaN, k22: 1, deltaEV: 0 }, 'k11'],
    [{ k11: 1, k22: Infinity, deltaEV: 0 }, 'k22'],
    [{ k11: 1, k22: 2e11, deltaEV: 0 }, 'k22'],
    [{ k11: 1, k22: 1 }, 'deltaEV'],
    [{ k11: 1, k22: 1, deltaEV: 0.1, K12: 3 }, 'K12'],
    [{ k11: 1, k22: 1, K12: -3 }, 'K12'],
    [{ k11: 1, k22: 1, deltaEV: 250 }, 'deltaEV'],
    [{ k11: 1, k22: 1, deltaEV: 0, temperatureC: 298.15 }, 'temperatureC'],
    [{ k11: 1, k22: 1, deltaEV: 0, temperatureC: -300 }, 'temperatureC'],
    [{ k11: 1, k22: 1, deltaEV: 0, observedK12: 0 }, 'observedK12'],
  ])('%j ⇒ error on %s', (input, field) => {
    expectField(() => marcusCrossRate(input as Parameters<typeof marcusCrossRate>[0]), field);
  });

  it('work-term inputs are checked', () => {
    const charges = { oxidant: 3, reductant: 2, oxidantReduced: 2, reductantOxidised: 3 };
    expectField(() => marcusCrossRate({ k11: 1, k22: 1, deltaEV: 0, workTerms: { ionicStrengthM: -1, charges } }), 'workTerms.ionicStrengthM');
    expectField(
      () => marcusCrossRate({ k11: 1, k22: 1, deltaEV: 0, workTerms: { ionicStrengthM: 0.1, charges: { ...charges, oxidantReduced: 3 } } }),
      'workTerms.charges',
    );
    expectField(
      () =>
        marcusCrossRate({
          k11: 1,
          k22: 1,
          deltaEV: 0,
          workTerms: { ionicStrengthM: 0.1, charges, radiiAngstrom: { oxidant: 0, reductant: 3 } },
        }),
      'workTerms.radiiAngstrom',
    );
  });
});
