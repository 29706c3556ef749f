import { classifyFormula } from '@/lib/chem/classify';
import { classFromActivationVolume } from '@/lib/chem/mechanism';

/**
 * Mechanism classes from measured activation volumes of solvent exchange (298 K). Each row holds
 * the published ΔV‡ (cm³ mol⁻¹) and the class its authors or the review assign, with the source:
 *   HM2005 = L. Helm & A. E. Merbach, Chem. Rev. 2005, 105, 1923 (review table of solvent exchange);
 *   LM1995 = S. F. Lincoln & A. E. Merbach, Adv. Inorg. Chem. 1995, 42, 1;
 *   the ammine rows from the primary papers named. All values from memory (recalled), as in the
 *   data file, where `checked` says so. Where the literature leaves two classes open, both are listed.
 */
const measured: [string, number, string[], string][] = [
  ['[Ti(H2O)6]3+', -12.1, ['Ia'], 'Hugi, Helm & Merbach, Inorg. Chem. 1987; HM2005'],
  ['[V(H2O)6]2+', -4.1, ['Ia'], 'Ducommun, Newman & Merbach, Inorg. Chem. 1980; HM2005'],
  ['[V(H2O)6]3+', -8.9, ['Ia'], 'Hugi, Helm & Merbach, Helv. Chim. Acta 1985; HM2005'],
  ['[Cr(H2O)6]3+', -9.6, ['Ia'], 'Xu, Krouse & Swaddle, Inorg. Chem. 1985; HM2005'],
  ['[Mn(H2O)6]2+', -5.4, ['Ia'], 'Ducommun, Newman & Merbach 1980; HM2005'],
  ['[Fe(H2O)6]2+', 3.8, ['Id'], 'Ducommun, Newman & Merbach 1980; HM2005'],
  ['[Fe(H2O)6]3+', -5.4, ['Ia'], 'Swaddle & Merbach, Inorg. Chem. 1981; HM2005'],
  ['[Co(H2O)6]2+', 6.1, ['Id'], 'Ducommun, Newman & Merbach 1980; HM2005'],
  ['[Ni(H2O)6]2+', 7.1, ['Id'], 'Ducommun, Earl & Merbach, Inorg. Chem. 1979; HM2005 (+7.2 there)'],
  ['[Cu(H2O)6]2+', 2.0, ['Id', 'D'], 'Powell, Furrer, Pittet & Merbach, J. Phys. Chem. 1995 (dissociatively activated)'],
  ['[Ru(H2O)6]2+', -0.4, ['I', 'Id'], 'Rapaport, Helm, Merbach, Bernhard & Ludi, Inorg. Chem. 1988'],
  ['[Ru(H2O)6]3+', -8.3, ['Ia'], 'Rapaport et al., Inorg. Chem. 1988; HM2005'],
  ['[Rh(H2O)6]3+', -4.2, ['Ia'], 'Laurenczy, Rapaport, Zbinden & Merbach, Magn. Reson. Chem. 1991; HM2005'],
  ['[Ir(H2O)6]3+', -5.7, ['Ia'], 'Cusanelli, Frey, Richens & Merbach, J. Am. Chem. Soc. 1996; HM2005'],
  ['[Pd(H2O)4]2+', -2.2, ['A'], 'Helm, Elding & Merbach, Helv. Chim. Acta 1984; HM2005 (square-planar, associative)'],
  ['[Pt(H2O)4]2+', -4.6, ['A'], 'Helm, Elding & Merbach, Inorg. Chem. 1985; HM2005 (square-planar, associative)'],
  ['[Ga(H2O)6]3+', 5.0, ['Id'], 'Hugi-Cleary, Helm & Merbach, Helv. Chim. Acta 1985; HM2005'],
  ['[Al(H2O)6]3+', 5.7, ['Id'], 'Hugi-Cleary, Helm & Merbach, Helv. Chim. Acta 1985; HM2005'],
  ['[Mg(H2O)6]2+', 6.7, ['Id', 'D'], 'Bleuzen, Pittet, Helm & Merbach, Magn. Reson. Chem. 1997; HM2005'],
  ['[Be(H2O)4]2+', -13.6, ['A'], 'Pisaniello, Helm, Meier & Merbach, J. Am. Chem. Soc. 1983; HM2005'],
  ['[Gd(H2O)8]3+', -3.3, ['Ia', 'A'], 'Micskei, Powell, Helm, Brücher & Merbach, Magn. Reson. Chem. 1993; HM2005'],
  ['[Fe(H2O)5(OH)]2+', 7.0, ['Id'], 'Swaddle & Merbach, Inorg. Chem. 1981; LM1995'],
  ['[Ga(H2O)5(OH)]2+', 6.2, ['Id'], 'Hugi-Cleary, Helm & Merbach 1985; LM1995'],
  ['[Cr(H2O)5(OH)]2+', 2.7, ['Id'], 'Xu, Krouse & Swaddle, Inorg. Chem. 1985; LM1995'],
  // An 18-electron organometallic aqua ion whose measured volume overrules the 18-electron trend (D):
  ['[Mn(CO)3(H2O)3]+', -4.5, ['Ia'], 'Prinz, Koelle, Ulrich, Merbach, Maas & Hegetschweiler, Inorg. Chem. 2004, 43, 2387 (abstract: Ia)'],
  ['[Co(NH3)5(H2O)]3+', 1.2, ['Id'], 'Tong, Krouse & Swaddle, Inorg. Chem. 1976'],
  ['[Cr(NH3)5(H2O)]3+', -5.8, ['Ia'], 'Guastalla & Swaddle, Can. J. Chem. 1973'],
  ['[Rh(NH3)5(H2O)]3+', -4.1, ['Ia'], 'Swaddle & Stranks, J. Am. Chem. Soc. 1972'],
  ['[Ir(NH3)5(H2O)]3+', -3.2, ['Ia'], 'Tong & Swaddle, Inorg. Chem. 1974'],
];

describe('mechanism class from measured activation volumes (at least 15 aqua and ammine ions)', () => {
  it('covers at least 15 ions', () => {
    expect(measured.length).toBeGreaterThanOrEqual(15);
  });

  it.each(measured)('%s: ΔV‡ = %f cm³ mol⁻¹, class %j (%s)', (formula, dV, classes) => {
    const { mechanism } = classifyFormula(formula);
    expect(mechanism.evidence).toBe('measured');
    expect(mechanism.activationVolume).toBeCloseTo(dV, 1);
    expect(classes).toContain(mechanism.class);
    expect(mechanism.source).toEqual(expect.any(String));
    expect(mechanism.reasons.join(' ')).toMatch(/ΔV‡ = [−+]\d/);
  });

  it('the sign of ΔV‡ decides the side (common practice: negative associative, positive dissociative)', () => {
    expect(classFromActivationVolume(-14)).toBe('A');
    expect(classFromActivationVolume(-5)).toBe('Ia');
    expect(classFromActivationVolume(0.3)).toBe('I');
    expect(classFromActivationVolume(5)).toBe('Id');
    expect(classFromActivationVolume(14)).toBe('D');
  });
});

describe('mechanism class from the trend that applies (no measurement on the species)', () => {
  it.each([
    // Late 3d M2+ aqua ions are Id (HM2005: changeover from Ia at V2+/Mn2+ to Id from Fe2+ on).
    ['[Zn(H2O)6]2+', 'Id'],
    // Co(III) ammines Id; Cr(III) and Rh(III) ammines lean Ia (Lincoln & Merbach 1995; Swaddle's ΔV‡ for the aqua-pentaammines above).
    ['[Co(NH3)5Cl]2+', 'Id'],
    ['[Co(en)2Cl2]+', 'Id'],
    ['[Cr(NH3)5Cl]2+', 'Ia'],
    ['[Rh(NH3)5Cl]2+', 'Ia'],
    // Square-planar d8: associative with the two-term rate law (Basolo & Pearson, Mechanisms of Inorganic Reactions, 2nd edn, 1967).
    ['[PtCl4]2-', 'A'],
    ['[Pt(NH3)4]2+', 'A'],
    ['[PdCl4]2-', 'A'],
    // 18-electron carbonyls lose CO first; 17-electron V(CO)6 substitutes associatively
    // (Shi, Richmond, Trogler & Basolo, J. Am. Chem. Soc. 1984, 106, 7423, recalled).
    ['[Cr(CO)6]', 'D'],
    ['[Ni(CO)4]', 'D'],
    ['[V(CO)6]', 'A'],
  ])('%s → %s', (formula, expected) => {
    const { mechanism } = classifyFormula(formula);
    expect(mechanism.evidence).toBe('trend');
    expect(mechanism.class).toBe(expected);
    expect(mechanism.activationVolume).toBeUndefined();
    expect(mechanism.reasons.at(-1)).toMatch(/trend/);
  });

  it('square-planar d8 carries the two-term rate law and a five-coordinate intermediate', () => {
    const { mechanism } = classifyFormula('[PtCl4]2-');
    expect(mechanism.rateLaw).toMatch(/\(k1 \+ k2\[Y\]\)/);
    expect(mechanism.intermediateCoordination).toBe(5);
  });

  it('an 18-electron carbonyl loses a ligand first: a five-coordinate intermediate', () => {
    expect(classifyFormula('[Cr(CO)6]').mechanism.intermediateCoordination).toBe(5);
  });

  it('the aqua-ion trend carried over to another ligand set is said so and held with low confidence', () => {
    const { mechanism } = classifyFormula('[Fe(CN)6]4-');
    expect(mechanism.confidence).toBe('low');
    expect(mechanism.reasons[0]).toMatch(/taken over from the aqua ions/);
  });

  it('Co(III) trend is held with more confidence than an octahedral ion with no close trend', () => {
    expect(classifyFormula('[Co(NH3)5Cl]2+').mechanism.confidence).toBe('high');
    expect(classifyFormula('[Zn(H2O)6]2+').mechanism.confidence).not.toBe('high');
  });
});

describe('conjugate-base and acid paths (Co(III) amines with an N–H and a leaving group)', () => {
  it('[Co(NH3)5Cl]2+: base hydrolysis with rate = k_OH[complex][OH⁻], orders of magnitude over aquation', () => {
    const paths = classifyFormula('[Co(NH3)5Cl]2+').mechanism.assistedPaths ?? [];
    const base = paths.find((path) => path.kind === 'base-hydrolysis');
    expect(base?.rateLaw).toBe('rate = k_OH[complex][OH⁻]');
    // Tobe & Burgess, Inorganic Reaction Mechanisms, 1999 (recalled): k_OH ≈ 0.85 M⁻¹ s⁻¹, k_aq ≈ 1.7e-6 s⁻¹ at 25 °C.
    expect(base?.measured?.kOHPerMolarSecond).toBeCloseTo(0.85, 2);
    expect(base?.measured?.kAquationPerSecond).toBeCloseTo(1.7e-6, 7);
    expect(paths.some((path) => path.kind === 'acid-catalysed-aquation')).toBe(false);
  });

  it('[Co(NH3)5F]2+: both paths; acid-catalysed aquation with rate = (k_aq + k_H[H⁺])[complex] (fluoride is basic)', () => {
    const kinds = (classifyFormula('[Co(NH3)5F]2+').mechanism.assistedPaths ?? []).map((path) => path.kind);
    expect(kinds).toEqual(['base-hydrolysis', 'acid-catalysed-aquation']);
    const acid = classifyFormula('[Co(NH3)5F]2+').mechanism.assistedPaths?.[1];
    expect(acid?.rateLaw).toBe('rate = (k_aq + k_H[H⁺])[complex]');
  });

  it.each([
    ['[Co(NH3)6]3+', 'no leaving group'],
    ['[Co(CN)5Cl]3-', 'no N–H'],
    ['[Cr(NH3)5Cl]2+', 'not cobalt(III)'],
  ])('%s: no assisted path (%s)', (formula) => {
    expect(classifyFormula(formula).mechanism.assistedPaths).toBeUndefined();
  });
});
