import { classifyFormula } from '@/lib/chem/classify';

/**
 * Water exchange, 298 K: the water-exchange reference notes (L. Helm & A. E. Merbach,
 * Chem. Rev. 2005, 105, 1923, and the primary papers cited per ion there).
 * Model tolerance, stated honestly: the model's own log k (predictedLogKPerSecond) lies within
 * ±1.1 log units of every numeric value below (a least-squares calibration on these ions; most are
 * within ±0.7). Measured values decide the verdict.
 */
const aquaIons: [string, number, string][] = [
  ['[Ti(H2O)6]3+', 1.8e5, 'Hugi, Helm & Merbach, Inorg. Chem. 1987'],
  ['[V(H2O)6]2+', 87, 'Ducommun, Newman & Merbach 1980'],
  ['[V(H2O)6]3+', 500, 'Hugi, Helm & Merbach 1985'],
  ['[Cr(H2O)6]3+', 2.4e-6, 'Xu, Krouse & Swaddle, Inorg. Chem. 1985'],
  ['[Mn(H2O)6]2+', 2.1e7, 'Ducommun, Newman & Merbach 1980'],
  ['[Fe(H2O)6]2+', 4.4e6, 'Ducommun, Newman & Merbach 1980'],
  ['[Fe(H2O)6]3+', 160, 'Swaddle & Merbach, Inorg. Chem. 1981'],
  ['[Co(H2O)6]2+', 3.2e6, 'Ducommun, Newman & Merbach 1980'],
  ['[Ni(H2O)6]2+', 3.2e4, 'Ducommun, Newman & Merbach 1980'],
  ['[Cu(H2O)6]2+', 4.4e9, 'Powell, Helm & Merbach, J. Chem. Phys. 1991'],
  ['[Ru(H2O)6]2+', 0.018, 'Rapaport, Helm, Merbach, Bernhard & Ludi, Inorg. Chem. 1988'],
  ['[Ru(H2O)6]3+', 3.5e-6, 'Rapaport et al., Inorg. Chem. 1988'],
  ['[Rh(H2O)6]3+', 2.2e-9, 'Laurenczy, Rapaport, Zbinden & Merbach 1991'],
  ['[Ir(H2O)6]3+', 1.1e-10, 'Cusanelli, Frey, Richens & Merbach, JACS 1996'],
  ['[Pt(H2O)4]2+', 3.9e-4, 'Helm, Elding & Merbach, Inorg. Chem. 1985'],
  ['[Pd(H2O)4]2+', 560, 'Helm, Elding & Merbach, Helv. Chim. Acta 1984'],
  ['[Ga(H2O)6]3+', 400, 'Hugi-Cleary, Helm & Merbach 1985'],
  ['[Al(H2O)6]3+', 1.29, 'Hugi-Cleary, Helm & Merbach 1985'],
  ['[Mg(H2O)6]2+', 6.7e5, 'Bleuzen, Pittet, Helm & Merbach 1997'],
];

const oneMinuteK = Math.LN2 / 60; // Taube 1952, as restated in water_exchange.json

describe('water exchange on aqua ions', () => {
  it.each(aquaIons)('%s: k_ex = %f s⁻¹ (%s)', (formula, kMeasured) => {
    const result = classifyFormula(formula);
    // The verdict follows from the published k: t½ = ln 2 / k under 60 s is labile (Taube 1952), 60–300 s
    // intermediate, 300 s or more inert (the bands as stated in the product). [Ru(H2O)6]2+: t½ ≈ 39 s, labile.
    const halfLife = Math.LN2 / kMeasured;
    const expectedVerdict = halfLife < 60 ? 'labile' : halfLife < 300 ? 'intermediate' : 'inert';
    expect(result.verdict).toBe(expectedVerdict);
    expect(result.decidedBy).toBe('reference');
    expect(result.logKPerSecond).toBeCloseTo(Math.log10(kMeasured), 1);
    expect(Math.abs((result.predictedLogKPerSecond ?? Number.NaN) - Math.log10(kMeasured))).toBeLessThanOrEqual(1.1);
  });

  it.each([
    ['[Cr(H2O)6]2+', 'labile', 'water_exchange.json: >1e8 s⁻¹, order of magnitude only'],
    ['[Zn(H2O)6]2+', 'labile', 'water_exchange.json: 1e7–1e8 s⁻¹, order of magnitude only'],
  ])('%s is %s by prediction alone (%s)', (formula, verdict) => {
    const result = classifyFormula(formula);
    expect(result.decidedBy).toBe('model');
    expect(result.verdict).toBe(verdict);
  });

  it('the model alone (no measured value) still calls every ion on the right side of the line, except borderline Ru(II)', () => {
    for (const [formula, kMeasured] of aquaIons) {
      if (formula === '[Ru(H2O)6]2+') continue;
      const predicted = classifyFormula(formula).predictedLogKPerSecond ?? Number.NaN;
      expect(predicted > Math.log10(oneMinuteK)).toBe(kMeasured > oneMinuteK);
    }
  });
});

describe('trap 1: the d-count rule is not enough (SCIENCE.md)', () => {
  it('[V(H2O)6]2+ is d3 yet labile (only 2+); [Cr(H2O)6]3+ is d3 and inert', () => {
    expect(classifyFormula('[V(H2O)6]2+').predictedLogKPerSecond).toBeGreaterThan(0);
    expect(classifyFormula('[Cr(H2O)6]3+').predictedLogKPerSecond).toBeLessThan(-3);
    expect(classifyFormula('[V(H2O)6]2+').reasons.join(' ')).toMatch(/only 2\+/i);
  });
  it('[Ni(H2O)6]2+ shares the d3 CFAE in Dq yet is labile', () => {
    // Basolo & Pearson 1967 (cfse_cfae.json): d3 and d8 both 2.00 / 4.26 Dq, ±0.02.
    const nickel = classifyFormula('[Ni(H2O)6]2+').lfseLossToTransitionStateDq;
    expect(nickel?.dissociative).toBeCloseTo(2.0, 1);
    expect(Math.abs((nickel?.associative ?? 0) - 4.26)).toBeLessThanOrEqual(0.02);
    expect(classifyFormula('[Ni(H2O)6]2+').verdict).toBe('labile');
  });
  it('4d/5d ions are far slower than 3d: Rh(III) < Co(III)-type, Pt(II) ≪ Pd(II) (Helm & Merbach 2005)', () => {
    expect(classifyFormula('[Pt(H2O)4]2+').predictedLogKPerSecond).toBeLessThan((classifyFormula('[Pd(H2O)4]2+').predictedLogKPerSecond ?? 0) - 5);
  });
});

describe('verdicts beyond the aqua ions (textbook, recalled / common practice)', () => {
  it.each([
    ['[Co(NH3)6]3+', 'inert'], ['[Co(NH3)5Cl]Cl2', 'inert'], ['[Co(en)3]3+', 'inert'], ['[Co(NH3)6]2+', 'labile'],
    ['[Cr(NH3)6]3+', 'inert'], ['K3[Cr(ox)3]·3H2O', 'inert'], ['[Cr(CN)6]3-', 'inert'], ['[Fe(CN)6]4-', 'inert'],
    ['[Fe(CN)6]3-', 'inert'], ['[Fe(phen)3]2+', 'inert'], ['[Ni(CN)4]2-', 'labile'], ['[Ni(en)3]2+', 'labile'],
    ['[Cu(en)2]2+', 'labile'], ['[Zn(NH3)4]2+', 'labile'], ['[Pt(NH3)2Cl2]', 'inert'], ['[PtCl4]2-', 'inert'],
    ['[PdCl4]2-', 'labile'], ['[Rh(bpy)2Cl2]PF6', 'inert'], ['[Ru(bpy)3]Cl2·6H2O', 'inert'], ['[Ir(NH3)6]3+', 'inert'],
    ['[Cr(CO)6]', 'inert'], ['[Mn(CO)5Br]', 'inert'], ['[Fe(Cp)2]', 'inert'], ['[Gd(H2O)8]3+', 'labile'],
    ['[Be(H2O)4]2+', 'labile'], ['[Na(H2O)6]+', 'labile'], ['[ReO4]-', 'labile'], ['[PtCl6]2-', 'inert'],
    ['[Co(edta)]-', 'inert'], ['[CoCl4]2-', 'labile'],
  ])('%s is %s', (formula, verdict) => {
    expect(classifyFormula(formula).verdict).toBe(verdict);
  });

  it('trap 3: [Ni(CN)4]2- gets the "stability is not inertness" hint', () => {
    expect(classifyFormula('[Ni(CN)4]2-').hints.join(' ')).toMatch(/stability is not kinetic inertness/);
  });

  it('inert Co(III) gets substitute-then-oxidise and redox-catalysis hints (Basolo & Pearson 1967, common practice)', () => {
    const hints = classifyFormula('[Co(NH3)5Cl]Cl2').hints.join(' ');
    expect(hints).toMatch(/Co\(II\)/);
    expect(hints).toMatch(/redox catalysis/);
  });
});

describe('temperature', () => {
  it('uses the measured Eyring ΔH‡ for [Ni(H2O)6]2+ (56.9 kJ/mol, water_exchange.json): faster at 50 °C', () => {
    const at25 = classifyFormula('[Ni(H2O)6]2+');
    const at50 = classifyFormula('[Ni(H2O)6]2+', { temperatureC: 50 });
    // Hand calculation: ln(k50/k25) = ΔH‡/R (1/298.15 − 1/323.15) + ln(323.15/298.15) = 1.846 → Δlog k = 0.80.
    expect(at50.logKPerSecond - at25.logKPerSecond).toBeCloseTo(0.8, 1);
  });
});

describe('every answer says what it rests on', () => {
  it('a prediction ends with the rule-of-thumb disclaimer; a measured verdict names its source', () => {
    const predicted = classifyFormula('[Co(NH3)6]3+');
    expect(predicted.reasons[predicted.reasons.length - 1]).toMatch(/rule-of-thumb prediction, not a measurement/);
    const measured = classifyFormula('[Rh(H2O)6]3+');
    expect(measured.reasons.join(' ')).toMatch(/Laurenczy/);
  });
});
