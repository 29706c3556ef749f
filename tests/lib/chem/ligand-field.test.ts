import { classifyFormula } from '@/lib/chem/classify';
import { parseFormula } from '@/lib/chem/formula-parser';
import { activationEnergyDq, estimateDeltaO, octahedralLfseDq } from '@/lib/chem/ligand-field';
import { metalIon } from '@/lib/chem/metal-ions';

/** The plain f·g estimate for a formula (before π weighting or a measured value replaces it in an answer). */
function fgEstimate(formula: string): number | undefined {
  const parsed = parseFormula(formula);
  return estimateDeltaO(parsed.ligands, metalIon(parsed.metal, parsed.oxidationState))?.deltaOcm;
}

const CFSE = 'cfse_cfae.json octahedral_CFSE (Dq, pairing energy not included)';
describe('octahedral LFSE, exact', () => {
  // [d, high-spin Dq, low-spin Dq] — source: CFSE
  const table: [number, number, number][] = [
    [0, 0, 0], [1, -4, -4], [2, -8, -8], [3, -12, -12], [4, -6, -16], [5, 0, -20],
    [6, -4, -24], [7, -8, -18], [8, -12, -12], [9, -6, -6], [10, 0, 0],
  ];
  it.each(table)(`d%i: high spin %f Dq, low spin %f Dq (${CFSE})`, (d, high, low) => {
    expect(octahedralLfseDq(d, 'high')).toBe(high);
    expect(octahedralLfseDq(d, 'low')).toBe(low);
  });
});

const BP = 'F. Basolo & R. G. Pearson, Mechanisms of Inorganic Reactions, 2nd ed., 1967 (as in cfse_cfae.json, recalled)';
describe('crystal-field activation energies within ±0.02 Dq', () => {
  // [d, spin, square pyramid, pentagonal bipyramid] — source: BP
  const table: [number, 'high' | 'low', number, number][] = [
    [0, 'low', 0, 0], [1, 'low', -0.57, -1.28], [2, 'low', -1.14, -2.56], [3, 'low', 2.0, 4.26],
    [4, 'low', 1.43, 2.98], [5, 'low', 0.86, 1.7], [6, 'low', 4.0, 8.52], [7, 'low', -1.14, 5.34],
    [8, 'low', 2.0, 4.26], [9, 'low', -3.14, 1.07], [10, 'low', 0, 0],
    [4, 'high', -3.14, 1.07], [5, 'high', 0, 0], [6, 'high', -0.57, -1.28], [7, 'high', -1.14, -2.56],
  ];
  it.each(table)(`d%i %s spin: %f / %f Dq (${BP})`, (d, spin, dissociative, associative) => {
    const cfae = activationEnergyDq(d, spin);
    expect(Math.abs(cfae.dissociative - dissociative)).toBeLessThanOrEqual(0.02 + 1e-9);
    expect(Math.abs(cfae.associative - associative)).toBeLessThanOrEqual(0.02 + 1e-9);
  });
});

const JG = 'jorgensen.json jorgensen_check_values (f·g arithmetic, Jørgensen 1971 table)';
describe('Jørgensen Δo = f·g', () => {
  it.each([
    ['[Cr(H2O)6]3+', 17400], ['[Cr(NH3)6]3+', 21750], ['[Co(NH3)6]3+', 22750], ['[Co(H2O)6]3+', 18200],
    ['[Fe(H2O)6]3+', 14000], ['[Rh(H2O)6]3+', 27000], ['[Rh(NH3)6]3+', 33750], ['[Ni(H2O)6]2+', 8700],
    ['[V(H2O)6]2+', 12000], ['[Mn(H2O)6]2+', 8000], ['[Ir(NH3)6]3+', 40000], ['[Co(CN)6]3-', 30940],
    ['[Cr(en)3]3+', 22272],
  ])(`%s: f·g = %i cm⁻¹ exactly (${JG})`, (formula, estimate) => {
    expect(fgEstimate(formula)).toBe(estimate);
  });

  const LT = 'jorgensen.json measured_Delta_o_cm-1 (LibreTexts Table 1.1 / Lever 1984)';
  it.each([
    ['[Cr(H2O)6]3+', 17400], ['[Cr(NH3)6]3+', 21500], ['[Co(NH3)6]3+', 22900], ['[Fe(H2O)6]3+', 14300],
    ['[Rh(NH3)6]3+', 34000], ['[Ni(H2O)6]2+', 8500], ['[V(H2O)6]2+', 12600], ['[Mn(H2O)6]2+', 8500],
    ['[Ir(NH3)6]3+', 41000], ['[Co(CN)6]3-', 33500], ['[Ni(NH3)6]2+', 10800],
  ])(`%s: estimate within ±10 %% of the measured %i cm⁻¹ (${LT})`, (formula, measured) => {
    const estimate = fgEstimate(formula) ?? Number.NaN;
    expect(Math.abs(estimate - measured) / measured).toBeLessThanOrEqual(0.1);
  });
});

describe('spin states', () => {
  const HKK = 'jorgensen.json pairing_energies with_Delta_o_and_observed_spin (Huheey, Keiter & Keiter 1993)';
  const TRAP = 'SCIENCE.md trap 2';
  it.each([
    ['[Co(H2O)6]3+', 'low', TRAP],
    ['[Co(NH3)6]3+', 'low', HKK],
    ['[CoF6]3-', 'high', HKK],
    ['[Fe(H2O)6]2+', 'high', HKK],
    ['[Fe(CN)6]4-', 'low', HKK],
    ['[Fe(phen)3]2+', 'low', TRAP],
    ['[Fe(bpy)3]2+', 'low', TRAP],
    ['[Fe(H2O)6]3+', 'high', HKK],
    ['[Fe(CN)6]3-', 'low', 'textbook, recalled'],
    ['[Mn(H2O)6]2+', 'high', HKK],
    ['[Mn(H2O)6]3+', 'high', HKK],
    ['[Cr(H2O)6]2+', 'high', HKK],
    ['[Co(H2O)6]2+', 'high', HKK],
    ['[Co(NH3)6]2+', 'high', 'textbook, recalled'],
    ['[Rh(H2O)6]3+', 'low', 'water_exchange.json (4d6 low spin)'],
    ['[Ru(H2O)6]3+', 'low', 'water_exchange.json (4d5 low spin)'],
    ['[Fe(Cp)2]', 'low', 'common practice (diamagnetic ferrocene)'],
    ['[CoCl4]2-', 'high', 'common practice: tetrahedral complexes are high spin'],
    ['[PtCl4]2-', 'low', 'common practice: square-planar d8 is diamagnetic'],
    ['[Ni(CN)4]2-', 'low', 'common practice: square-planar d8 is diamagnetic'],
  ])('%s is %s spin (%s)', (formula, spin) => {
    expect(classifyFormula(formula).spinState).toBe(spin);
  });

  it.each([['[Ni(H2O)6]2+'], ['[Cr(H2O)6]3+'], ['[V(H2O)6]2+'], ['[Cu(H2O)6]2+'], ['[Zn(H2O)6]2+']])(
    '%s has no spin choice (octahedral d8/d3/d9/d10; common practice)',
    (formula) => {
      expect(classifyFormula(formula).spinState).toBeNull();
    },
  );

  it('flags the classic spin-crossover type [Fe(bpy)2(NCS)2] as near crossover (common practice) but not [Fe(CN)6]4- or [Fe(H2O)6]3+', () => {
    expect(classifyFormula('[Fe(bpy)2(NCS)2]').nearSpinCrossover).toBe(true);
    expect(classifyFormula('[Fe(CN)6]4-').nearSpinCrossover).toBe(false);
    expect(classifyFormula('[Fe(H2O)6]3+').nearSpinCrossover).toBe(false);
  });

  it('Jahn–Teller: strong for Cu(II) and high-spin Cr(II), none for Cr(III) (common practice)', () => {
    expect(classifyFormula('[Cu(H2O)6]2+').jahnTeller).toBe('strong');
    expect(classifyFormula('[Cr(H2O)6]2+').jahnTeller).toBe('strong');
    expect(classifyFormula('[Cr(H2O)6]3+').jahnTeller).toBeNull();
    expect(classifyFormula('[Ti(H2O)6]3+').jahnTeller).toBe('weak');
  });

  it('LFSE in kJ/mol uses Dq = Δo/10 and 1 cm⁻¹ = 0.01196266 kJ/mol (CODATA)', () => {
    // [Cr(H2O)6]3+: −12 Dq × 1740 cm⁻¹ × 0.01196266 = −249.8 kJ/mol (hand calculation).
    expect(classifyFormula('[Cr(H2O)6]3+').lfseKJPerMol).toBeCloseTo(-249.8, 1);
  });
});
