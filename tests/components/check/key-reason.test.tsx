import { capitalise, keyReason, totalSpin } from '@/components/check/key-reason';
import { classifyFormula } from '@/lib/chem/classify';

describe('the one reason under the verdict', () => {
  it('names the e_g electrons for an octahedral Ni(II) complex (common practice: σ-antibonding e_g electrons labilise)', () => {
    expect(keyReason(classifyFormula('[Ni(NH3)6]2+'))).toMatch(/σ-antibonding/);
  });

  it('names the filled or half-filled t2g set for low-spin d6 and d5 complexes, not the ligand class', () => {
    // Low-spin d6 Co(III) and d5 hexacyanoferrate(III): inert for want of an empty t2g or any e_g electron (Taube 1952).
    expect(keyReason(classifyFormula('[Co(NH3)5Cl]Cl2'))).toMatch(/t2g|t₂g/);
    expect(keyReason(classifyFormula('K3[Fe(CN)6]'))).toMatch(/t2g|t₂g/);
    expect(keyReason(classifyFormula('K3[Fe(CN)6]'))).not.toMatch(/^Low spin: cyanide/);
  });

  it('names the associative path of square-planar d8 (common practice)', () => {
    expect(keyReason(classifyFormula('[Pt(NH3)2Cl2]'))).toMatch(/square-planar d8/i);
  });

  it('capitalises a plain first word but keeps symbols as written', () => {
    expect(capitalise('only 2+: low charge density')).toBe('Only 2+: low charge density');
    expect(capitalise('square-planar d8: associative path')).toBe('Square-planar d8: associative path');
    expect(capitalise('d3 with 3+ charge')).toBe('d3 with 3+ charge');
    expect(capitalise('f-block ion: fast')).toBe('f-block ion: fast');
    expect(capitalise('2 σ-antibonding e_g electrons')).toBe('2 σ-antibonding e_g electrons');
  });

  it('writes the total spin S = n/2 as chemists do', () => {
    expect([0, 1, 2, 3, 5].map(totalSpin)).toEqual(['0', '1/2', '1', '3/2', '5/2']);
  });
});
