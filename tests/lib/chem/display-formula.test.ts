import { toDisplayFormula } from '@/lib/chem/display-formula';

// Expected strings are written out by hand in IUPAC formula style (Red Book 2005, IR-4: counts as
// right subscripts, ionic charge as a right superscript with the number before the sign, charge 1
// written as the sign alone; hydrate with a centred dot) — common practice.
describe('toDisplayFormula', () => {
  it.each([
    ['[Co(NH3)6]3+', '[Co(NH₃)₆]³⁺'],
    ['K3[Cr(ox)3]·3H2O', 'K₃[Cr(ox)₃]·3H₂O'],
    ['[Cr(H2O)6]^3+', '[Cr(H₂O)₆]³⁺'],
    ['[Co(NH3)6]+3', '[Co(NH₃)₆]³⁺'],
    ['[ReO4]-', '[ReO₄]⁻'],
    ['[Rh(bpy)2Cl2]PF6', '[Rh(bpy)₂Cl₂]PF₆'],
    ['[Fe(CN)6]4-', '[Fe(CN)₆]⁴⁻'],
    ['Na2[Fe(CN)5NO]', 'Na₂[Fe(CN)₅NO]'],
  ])('%s → %s', (typed, shown) => {
    expect(toDisplayFormula(typed)).toBe(shown);
  });

  it('leaves lowercase ligand abbreviations untouched', () => {
    expect(toDisplayFormula('[Co(en)3]3+')).toBe('[Co(en)₃]³⁺');
    expect(toDisplayFormula('[Fe(bpy)3]2+')).toBe('[Fe(bpy)₃]²⁺');
    expect(toDisplayFormula('[Co(en)2(NO2)Cl]NO3')).toBe('[Co(en)₂(NO₂)Cl]NO₃');
    expect(toDisplayFormula('[Cu(en)2]2+')).toContain('(en)');
  });

  it('accepts "." and "*" as hydrate separators and keeps the water coefficient full size', () => {
    expect(toDisplayFormula('K3[Cr(ox)3].3H2O')).toBe('K₃[Cr(ox)₃]·3H₂O');
    expect(toDisplayFormula('[Cr(H2O)6]Cl3*3H2O')).toBe('[Cr(H₂O)₆]Cl₃·3H₂O');
  });

  it('writes a charge of one as the sign alone, also after a caret', () => {
    expect(toDisplayFormula('[Ag(NH3)2]+')).toBe('[Ag(NH₃)₂]⁺');
    expect(toDisplayFormula('[Ag(NH3)2]1+')).toBe('[Ag(NH₃)₂]⁺');
    expect(toDisplayFormula('[Mn(CO)6]^+')).toBe('[Mn(CO)₆]⁺');
  });

  it('tells a count from a charge on unbracketed ions', () => {
    expect(toDisplayFormula('NH4+')).toBe('NH₄⁺');
    expect(toDisplayFormula('Fe3+')).toBe('Fe³⁺');
    expect(toDisplayFormula('[CuCl4] 2-')).toBe('[CuCl₄]²⁻');
  });

  it('passes through formulas without counts or charge, and already converted text', () => {
    expect(toDisplayFormula('[Mn(CO)5Br]')).toBe('[Mn(CO)₅Br]');
    expect(toDisplayFormula('[Co(NH₃)₆]³⁺')).toBe('[Co(NH₃)₆]³⁺');
    expect(toDisplayFormula('')).toBe('');
  });

  it('writes hapticity as a superscript', () => {
    expect(toDisplayFormula('[Fe(η5-C5H5)2]')).toBe('[Fe(η⁵-C₅H₅)₂]');
  });
});
