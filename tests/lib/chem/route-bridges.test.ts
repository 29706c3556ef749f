import { classifyFormula } from '@/lib/chem/classify';
import { predictRoute } from '@/lib/chem/route';

/**
 * Bridges as they are on the complex: aqua and hydroxo with the acid dependence, remote attack
 * through conjugated ligands, the bridge on the complex ranked first, five-coordinate reductants,
 * binuclear products kept, and self-exchange said as such. Sources beside each case.
 */

const CR2 = '[Cr(H2O)6]2+';

describe('aqua and hydroxo bridges', () => {
  // R. K. Murmann, H. Taube & F. A. Posey, J. Am. Chem. Soc. 1957, 79, 262 (recalled): the 18O of
  // [Co(NH3)5(OH2)]3+ is found on Cr(III) after reduction by Cr(II); the rate has a 1/[H+] term
  // (the hydroxo form bridges).
  it('[Co(NH3)5(OH2)]3+ + Cr(II) is inner-sphere through the hydroxo form, with the acid dependence stated', () => {
    const result = predictRoute('[Co(NH3)5(OH2)]3+', CR2);
    expect(result.route).toBe('inner-sphere');
    const text = result.reasons.join(' ');
    expect(text).toMatch(/1\/\[H\+\]/);
    expect(text).toMatch(/hydroxo/);
    expect(text).toMatch(/strong acid/);
    expect(result.expectedProducts.join(' ')).toMatch(/18O/);
    expect(result.expectedProducts.join(' ')).not.toMatch(/no ligand transfer/);
  });

  // Candlin & Halpern, Inorg. Chem. 1965, 4, 766: [Co(NH3)5(OH)]2+ + Cr(II) bridged through OH.
  it('[Co(NH3)5(OH)]2+ + Cr(II) is inner-sphere with hydroxide transferred', () => {
    const result = predictRoute('[Co(NH3)5(OH)]2+', CR2);
    expect(result.route).toBe('inner-sphere');
    expect(result.transferredLigand?.ligand).toBe('OH');
  });

  // Both aqua ions labile (Helm & Merbach, Chem. Rev. 2005, 105, 1923): transfer cannot be proved.
  it('two labile aqua ions stay "either"', () => {
    expect(predictRoute('[Fe(H2O)6]3+', '[Fe(H2O)6]2+').route).toBe('either');
  });
});

describe('remote attack through conjugated ligands', () => {
  // H. Taube & E. S. Gould, Acc. Chem. Res. 1969, 2, 321 (recalled): Cr(II) attacks the remote
  // carbonyl O of N-bound isonicotinamide and the remote carboxylate O of fumarate on Co(III)
  // ammines; pyrazine and 4-carboxypyridine (isonicotinato) conduct the same way.
  it.each([
    ['[Co(NH3)5(isn)]3+', 'isn', 'O'],
    ['[Co(NH3)5(fumarate)]+', 'fum', 'O'],
    ['[Co(NH3)5(pz)]3+', 'pz', 'N'],
  ])('%s + Cr(II): inner-sphere, remote attack on the far %s atom', (oxidant, _id, atom) => {
    const result = predictRoute(oxidant, CR2);
    expect(result.route).toBe('inner-sphere');
    expect(result.transferredLigand?.attack).toBe('remote');
    expect(result.transferredLigand?.bridgingAtom).toBe(atom);
    expect(result.bridgingCandidates[0]?.present).toBe(true);
    expect(result.bridgingCandidates[0]?.attack).toBe('remote');
  });
});

describe('the bridge on the complex ranks first', () => {
  // Candlin, Halpern & Trimm, J. Am. Chem. Soc. 1964, 86, 1019: Cl bridges [Co(NH3)5Cl]2+ + Cr(II).
  it('chloride on [Co(NH3)5Cl]2+ ranks first; installable ones follow, all marked', () => {
    const { bridgingCandidates } = predictRoute('[Co(NH3)5Cl]2+', CR2);
    expect(bridgingCandidates[0]).toMatchObject({ ligand: 'Cl', present: true });
    const firstInstallable = bridgingCandidates.findIndex((c) => !c.present);
    expect(firstInstallable).toBeGreaterThan(0);
    expect(bridgingCandidates.slice(firstInstallable).every((c) => !c.present)).toBe(true);
    // Iodide scores higher for soft attack but is not on the complex: it is listed apart.
    const iodide = bridgingCandidates.find((c) => c.ligand === 'I');
    expect(iodide?.present).toBe(false);
    expect(iodide?.reasons[0]).toMatch(/not on/);
  });
});

describe('five-coordinate reductants and binuclear products', () => {
  // Candlin, Halpern & Trimm, J. Am. Chem. Soc. 1964, 86, 1019: [Co(CN)5]3- takes the halide from
  // [Co(NH3)5X]2+ into its open sixth site, giving [Co(CN)5X]3-.
  it('[Co(CN)5]3- adds the bridge to its open site; nothing has to leave', () => {
    const result = predictRoute('[Co(NH3)5Cl]2+', '[Co(CN)5]3-');
    expect(result.route).toBe('inner-sphere');
    const products = result.expectedProducts.join(' ');
    expect(products).toMatch(/\[Co\(CN\)5Cl\]3-/);
    expect(products).not.toMatch(/could not be predicted/);
  });

  // A. Haim & W. K. Wilmarth, J. Am. Chem. Soc. 1961, 83, 509 (recalled): [Fe(CN)6]3- + [Co(CN)5]3-
  // gives the cyanide-bridged [(NC)5Fe–CN–Co(CN)5]6-, which persists: Fe(II) and Co(III) are both inert.
  it('[Fe(CN)6]3- + [Co(CN)5]3- keeps the cyanide-bridged binuclear product, which parses back to Fe(II) and Co(III)', () => {
    const result = predictRoute('[Fe(CN)6]3-', '[Co(CN)5]3-');
    expect(result.route).toBe('inner-sphere');
    const first = result.expectedProducts[0] ?? '';
    expect(first).toMatch(/binuclear complex is kept/);
    const formula = first.split(':')[0] ?? '';
    const parsed = classifyFormula(formula);
    expect(parsed.centres?.map((c) => [c.metal, c.oxidationState, c.verdict])).toEqual([
      ['Fe', 2, 'inert'],
      ['Co', 3, 'inert'],
    ]);
    expect(parsed.complexCharge).toBe(-6);
  });

  it('a product whose new metal is labile is not kept binuclear ([Co(NH3)5Cl]2+ + Cr(II): Co(II) labile)', () => {
    expect(predictRoute('[Co(NH3)5Cl]2+', CR2).expectedProducts.join(' ')).not.toMatch(/binuclear/);
  });
});

describe('self-exchange and reversed order', () => {
  // [Fe(CN)6]3-/4- self-exchange (e.g. Campion, Deck, King & Wahl, Inorg. Chem. 1967, 6, 672): ΔE° = 0 by definition.
  it('a self-exchange pair is worded as self-exchange, never "downhill (ΔE° = 0)"', () => {
    const result = predictRoute('[Fe(CN)6]3-', '[Fe(CN)6]4-');
    expect(result.roles.note).toMatch(/Self-exchange/);
    expect(result.roles.note).not.toMatch(/downhill/);
    expect(result.reasons.join(' ')).not.toMatch(/downhill \(ΔE° = 0/);
  });

  it('a reversed pair is swapped once, said once', () => {
    const result = predictRoute(CR2, '[Co(NH3)5Cl]2+');
    expect(result.roles.swapped).toBe(true);
    expect(result.oxidant.metal).toBe('Co');
    expect(result.reasons.filter((r) => /Order reversed/.test(r))).toHaveLength(1);
  });
});
