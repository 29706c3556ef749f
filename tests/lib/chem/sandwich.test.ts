import { classifyFormula } from '@/lib/chem/classify';

/**
 * Ring complexes are not octahedra: the geometry is read from the ligands' hapticity.
 * Check values (structures as published; references recalled, not re-read):
 *   ferrocene, a sandwich of two parallel Cp rings, diamagnetic — G. Wilkinson, M. Rosenblum,
 *     M. C. Whiting, R. B. Woodward, J. Am. Chem. Soc. 1952, 74, 2125;
 *   bis(benzene)chromium, a sandwich of two benzene rings — E. O. Fischer, W. Hafner,
 *     Z. Naturforsch. B 1955, 10, 665;
 *   (η6-benzene)tricarbonylchromium, a half-sandwich (piano stool) — E. O. Fischer, K. Öfele,
 *     Chem. Ber. 1957, 90, 2532;
 *   titanocene dichloride, a bent metallocene — common practice.
 */
describe('sandwich, bent-sandwich and half-sandwich complexes', () => {
  it.each([
    ['ferrocene', 'sandwich'],
    ['[Fe(Cp)2]', 'sandwich'],
    ['[Fe(η5-C5H5)2]', 'sandwich'],
    ['bis(benzene)chromium', 'sandwich'],
    ['[Co(Cp)2]+', 'sandwich'],
    ['[Cr(C6H6)(CO)3]', 'half-sandwich'],
    ['[Mn(Cp)(CO)3]', 'half-sandwich'],
    ['[Ti(Cp)2Cl2]', 'bent-sandwich'],
  ])('%s is %s, never octahedral', (formula, geometry) => {
    const result = classifyFormula(formula);
    expect(result.geometry).toBe(geometry);
    expect(result.reasons.join(' ')).not.toMatch(/octahedral(?! Δo)/);
  });

  it('gives a ring complex no octahedral Δo, LFSE or t2g/eg occupancy', () => {
    const ferrocene = classifyFormula('ferrocene');
    expect(ferrocene.deltaOcm).toBeNull();
    expect(ferrocene.lfseDq).toBeNull();
    expect(ferrocene.lfseLossToTransitionStateDq).toBeNull();
    expect(ferrocene.reasons.join(' ')).not.toMatch(/t2g|\beg\b/);
  });

  it('ferrocene is low spin (diamagnetic, Wilkinson et al. 1952)', () => {
    expect(classifyFormula('ferrocene').spinState).toBe('low');
  });

  it('names each ring by its own hapticity (benzene is η6, not η5-cyclopentadienyl)', () => {
    const reasons = classifyFormula('bis(benzene)chromium').reasons.join(' ');
    expect(reasons).toMatch(/η6-benzene as 3 coordination sites/);
    expect(reasons).not.toMatch(/cyclopentadienyl/);
  });

  it('a classical octahedral complex is still octahedral ([Co(NH3)6]3+, common practice)', () => {
    expect(classifyFormula('[Co(NH3)6]3+').geometry).toBe('octahedral');
  });
});

describe('the ligand-field share of the barrier is named for what it is', () => {
  it('is the LFSE lost on the way to the transition state, and negative where the transition state gains LFSE', () => {
    // Basolo & Pearson, Mechanisms of Inorganic Reactions, 2nd ed., Wiley 1967 (cfse_cfae.json):
    // d3 loses 2.00 Dq to a square pyramid (barrier raised); high-spin d4 loses −3.14 Dq, i.e. gains LFSE.
    const chromium3 = classifyFormula('[Cr(H2O)6]3+');
    expect(chromium3.lfseLossToTransitionStateDq?.dissociative).toBeCloseTo(2.0, 2);
    const chromium2 = classifyFormula('[Cr(H2O)6]2+');
    expect(chromium2.lfseLossToTransitionStateDq?.dissociative).toBeCloseTo(-3.14, 2);
    expect(Object.keys(chromium3)).not.toContain('activationEnergyDq');
    expect(Object.keys(chromium3)).not.toContain('activationEnergyKJPerMol');
  });
});
