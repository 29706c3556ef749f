import { planSequence, SequenceInputError } from '@/lib/chem/sequence-planner';
import { classifyFormula } from '@/lib/chem/classify';

/**
 * Square-planar substitution sequences with the products found in the laboratory. Sources:
 *   BP1967 = F. Basolo & R. G. Pearson, Mechanisms of Inorganic Reactions, 2nd edn, Wiley, 1967
 *            (the trans-effect syntheses of the cis and trans isomers and the order-dependent
 *            [PtCl2(NH3)(NO2)]⁻ pair);
 *   Peyrone 1844 (cis-[PtCl2(NH3)2] from [PtCl4]²⁻ and ammonia), Reiset 1844 (trans from
 *   [Pt(NH3)4]²⁺ and chloride), Kurnakov 1894 (thiourea test: cis gives [Pt(tu)4]²⁺, trans gives
 *   trans-[Pt(NH3)2(tu)2]²⁺), all as retold in BP1967; recalled.
 */
const sequences: [string, string[], string, 'cis' | 'trans' | null, string][] = [
  ['[PtCl4]2-', ['NH3', 'NH3'], '[PtCl2(NH3)2]', 'cis', 'Peyrone 1844; BP1967'],
  ['[Pt(NH3)4]2+', ['Cl', 'Cl'], '[PtCl2(NH3)2]', 'trans', 'Reiset 1844; BP1967'],
  ['[PtCl4]2-', ['NH3', 'NO2'], '[PtCl2(NH3)(NO2)]-', 'cis', 'BP1967: NH3 first, then nitrite'],
  ['[PtCl4]2-', ['NO2', 'NH3'], '[PtCl2(NH3)(NO2)]-', 'trans', 'BP1967: nitrite first, then NH3'],
  ['[PtCl4]2-', ['NH3', 'py'], '[PtCl2(NH3)(py)]', 'cis', 'BP1967: two weak trans directors, order does not matter'],
  ['[PtCl4]2-', ['py', 'NH3'], '[PtCl2(NH3)(py)]', 'cis', 'BP1967: two weak trans directors, order does not matter'],
  ['cis-[PtCl2(NH3)2]', ['tu', 'tu', 'tu', 'tu'], '[Pt(tu)4]2+', null, 'Kurnakov 1894: the cis isomer loses everything'],
  ['trans-[PtCl2(NH3)2]', ['tu', 'tu'], '[Pt(NH3)2(tu)2]2+', 'trans', 'Kurnakov 1894: the trans isomer keeps both NH3'],
  ['[PtCl4]2-', ['C2H4', 'NH3'], '[Pt(C2H4)Cl2(NH3)]', 'trans', 'BP1967: NH3 enters trans to ethylene in Zeise’s anion'],
];

describe('square-planar sequence planner (at least 6 sequences)', () => {
  it('holds at least 6 sequences, including the two classic isomer syntheses and an order-dependent pair', () => {
    expect(sequences.length).toBeGreaterThanOrEqual(6);
  });

  it.each(sequences)('%s + %j → %s, %s (%s)', (start, ligands, product, isomer) => {
    const result = planSequence(start, ligands);
    expect(result.steps).toHaveLength(ligands.length);
    // The product is the same species as the published one, however the formula is ordered.
    const expected = classifyFormula(product);
    const got = classifyFormula(result.product);
    expect(got.ligands.map((l) => `${l.id}${l.count}`).sort()).toEqual(expected.ligands.map((l) => `${l.id}${l.count}`).sort());
    expect(got.complexCharge).toBe(expected.complexCharge);
    expect(result.isomer).toBe(isomer);
  });

  it('the order of addition decides the isomer: nitrite and ammonia on [PtCl4]2- (BP1967)', () => {
    expect(planSequence('[PtCl4]2-', ['NH3', 'NO2']).isomer).toBe('cis');
    expect(planSequence('[PtCl4]2-', ['NO2', 'NH3']).isomer).toBe('trans');
  });

  it('each step names the leaving ligand, the trans director and the sites for the picture', () => {
    const [first, second] = planSequence('[PtCl4]2-', ['NO2', 'NH3']).steps;
    expect(first).toMatchObject({ entering: 'NO2', leaving: 'Cl', isomer: null });
    // Second step: the Cl trans to NO2 leaves (NO2 > Cl in the series).
    expect(second).toMatchObject({ entering: 'NH3', leaving: 'Cl', transDirector: 'NO2', isomer: 'trans' });
    expect(second?.sites[second.site]).toBe('NH3');
    expect(second?.sites[second.transDirectorSite]).toBe('NO2');
    expect(Math.abs((second?.site ?? 0) - (second?.transDirectorSite ?? 0))).toBe(2);
    expect(second?.reasons.join(' ')).toMatch(/trans to NO2/);
  });

  it('Pd(II) gets a note that its kinetic isomer may isomerise (Pd(II) reacts ~10^5 times faster; BP1967)', () => {
    const result = planSequence('[PdCl4]2-', ['NH3', 'NH3']);
    expect(result.isomer).toBe('cis');
    expect(result.notes.join(' ')).toMatch(/isomerise/);
  });

  it('two phosphines end up trans by the series, with the catalysed isomerisation named as the exception', () => {
    const result = planSequence('[PtCl4]2-', ['PPh3', 'PPh3']);
    expect(result.isomer).toBe('trans');
    expect(result.steps[1]?.reasons.join(' ')).toMatch(/isomerisation/);
  });
});

describe('what the planner refuses, and says why', () => {
  it.each([
    ['[PtCl2(NH3)2]', ['py'], 'start', /cis-.*trans-/],
    ['[Co(NH3)6]3+', ['Cl'], 'start', /square-planar d8/],
    ['[PtCl4]2-', ['en'], 'ligands[0]', /monodentate/],
    ['[PtCl4]2-', ['NH3', 'XYZ'], 'ligands[1]', /XYZ/],
    ['[PtCl4]2-', ['Cl'], 'ligands[0]', /nothing to replace/],
    ['[PtCl4', ['NH3'], 'start', /Unclosed|character/],
  ])('%s + %j → error on %s', (start, ligands, field, message) => {
    try {
      planSequence(start, ligands);
      throw new Error('expected an error');
    } catch (error) {
      expect(error).toBeInstanceOf(SequenceInputError);
      expect((error as SequenceInputError).field).toBe(field);
      expect((error as Error).message).toMatch(message);
    }
  });
});
