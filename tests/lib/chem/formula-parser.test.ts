import fc from 'fast-check';
import { isomerDescriptor, parseFormula } from '@/lib/chem/formula-parser';
import { FormulaError } from '@/lib/chem/types';

function ligandCounts(formula: string): Record<string, number> {
  const parsed = parseFormula(formula);
  return Object.fromEntries(parsed.ligands.map((instance) => [instance.ligand.id, instance.count]));
}

describe('parseFormula: formulas as chemists write them', () => {
  // Oxidation states by charge balance (common practice).
  it.each([
    ['[Co(en)2(NO2)Cl]NO3', 'Co', 3, 1],
    ['K3[Cr(ox)3]·3H2O', 'Cr', 3, -3],
    ['[Cr(NH3)5(OH2)]3+', 'Cr', 3, 3],
    ['[Rh(bpy)2Cl2]PF6', 'Rh', 3, 1],
    ['[Mn(CO)5Br]', 'Mn', 1, 0],
    ['[ReO4]-', 'Re', 7, -1],
    ['[Cu(en)2]2+', 'Cu', 2, 2],
    ['[Co(NH3)6]2(SO4)3', 'Co', 3, 3],
    ['[Pt(NH3)2Cl2]', 'Pt', 2, 0],
    ['Na2[Fe(CN)5NO]', 'Fe', 2, -2],
    ['[Fe(H2O)6]2+', 'Fe', 2, 2],
    ['[Ni(CN)4]2-', 'Ni', 2, -2],
    ['[Fe(Cp)2]', 'Fe', 2, 0],
    ['[Fe(C5H5)2]', 'Fe', 2, 0],
    ['[Ru(bpy)3]Cl2·6H2O', 'Ru', 2, 2],
    ['[Cr(H2O)6](ClO4)3', 'Cr', 3, 3],
    ['[Cr(H2O)6]^3+', 'Cr', 3, 3],
    ['[Cr(H2O)6]³⁺', 'Cr', 3, 3],
    ['[Co(NH3)6]+3', 'Co', 3, 3],
    ['[PtCl4]2-', 'Pt', 2, -2],
    ['[CoCl4]2-', 'Co', 2, -2],
    ['[Co(NH3)5Cl]Cl2', 'Co', 3, 2],
    ['(NH4)2[PtCl6]', 'Pt', 4, -2],
    ['H[AuCl4]', 'Au', 3, -1],
    ['[Fe(CN)6]4-', 'Fe', 2, -4],
    ['[Mn(CO)5]-', 'Mn', -1, -1],
    ['Cr(H2O)6 3+', 'Cr', 3, 3],
  ])('%s → %s oxidation state %i, complex charge %i', (formula, metal, oxidationState, charge) => {
    const parsed = parseFormula(formula);
    expect(parsed.metal).toBe(metal);
    expect(parsed.oxidationState).toBe(oxidationState);
    expect(parsed.complexCharge).toBe(charge);
  });

  it('reads ligand sets, linkage isomers and bare ligands', () => {
    expect(ligandCounts('[Co(en)2(NO2)Cl]NO3')).toEqual({ en: 2, NO2: 1, Cl: 1 });
    expect(ligandCounts('[Co(NH3)5(ONO)]2+')).toEqual({ NH3: 5, ONO: 1 });
    expect(ligandCounts('[Co(NH3)5(NO2)]2+')).toEqual({ NH3: 5, NO2: 1 });
    expect(ligandCounts('[Co(NH3)5(NCS)]2+')).toEqual({ NH3: 5, NCS: 1 });
    expect(ligandCounts('[Co(NH3)5(SCN)]2+')).toEqual({ NH3: 5, SCN: 1 });
    expect(ligandCounts('[Cr(NH3)5(OH2)]3+')).toEqual({ NH3: 5, H2O: 1 });
    expect(ligandCounts('Na2[Fe(CN)5NO]')).toEqual({ CN: 5, NO: 1 });
    expect(ligandCounts('[Mn(CO)5Br]')).toEqual({ CO: 5, Br: 1 });
    expect(ligandCounts('[ReO4]-')).toEqual({ O: 4 });
    expect(ligandCounts('[Fe(C5H5)2]')).toEqual({ Cp: 2 });
    expect(ligandCounts('[Al(H2O)5OH]2+')).toEqual({ H2O: 5, OH: 1 });
  });

  it('counts hydrate waters written with ·, . or *', () => {
    expect(parseFormula('K3[Cr(ox)3]·3H2O').hydrateWaters).toBe(3);
    expect(parseFormula('[Co(NH3)6]Cl3.6H2O').hydrateWaters).toBe(6);
    expect(parseFormula('[Cu(H2O)6]SO4*H2O').hydrateWaters).toBe(1);
  });

  it('keeps the number of complex ions and the counter-ions', () => {
    const parsed = parseFormula('[Co(NH3)6]2(SO4)3');
    expect(parsed.complexCount).toBe(2);
    expect(parsed.counterIons).toEqual([expect.objectContaining({ formula: 'SO4', charge: -2, count: 3 })]);
    expect(parsed.composition).toEqual({ Co: 2, N: 12, H: 36, S: 3, O: 12 });
  });
});

describe('parseFormula: errors say what and where', () => {
  function errorOf(formula: string): FormulaError {
    try {
      parseFormula(formula);
    } catch (error) {
      if (error instanceof FormulaError) return error;
      throw error;
    }
    throw new Error(`no error for ${formula}`);
  }

  it.each([
    ['[Co(xyz)6]3+', 4, /Unknown ligand 'xyz' at character 5/],
    ['[Co(NH3)6', 0, /Unclosed '\[' opened at character 1/],
    ['[Co(nh3)6]3+', 4, /did you mean 'NH3'/],
    ['[Co(NH3)6]Cl2 3+', 14, /Charge 3\+ does not balance the counter-ions: they need the complex to be 2\+/],
    ['Fe3+', 0, /\[Fe\(H2O\)6\]3\+/],
    ['[Co2(CO)8]', 3, /Polynuclear/],
    ['[Co(NH3)6][Cr(CN)6]', 10, /second complex ion/],
    ['', 0, /empty/],
    ['[(NH3)6Co]3+', 1, /metal symbol/],
    ['[Co(NH3)6]3+ extra', 13, /Unexpected/],
    ['[Co(NH3)6]Cl3·xH2O', 14, /number of waters/],
    ['[Co(NH3)6]9+', 10, /impossible/],
    ['[Co(NH3)0]3+', 8, /Count 0/],
    ['[Co()6]', 3, /Empty parentheses/],
  ])('%s → position %i', (formula, position, message) => {
    const error = errorOf(formula);
    expect(error.position).toBe(position);
    expect(error.message).toMatch(message);
  });
});

describe('parseFormula: property tests', () => {
  const alphabet = [...'[]()CoNHFeClKrOx23456+-·.*^³⁺ enbpy'];
  const arbitraryFormula = fc.oneof(
    fc.string({ maxLength: 40 }),
    fc.array(fc.constantFrom(...alphabet), { maxLength: 30 }).map((chars) => chars.join('')),
    fc.constantFrom('[Co(NH3)6]Cl3', 'K3[Cr(ox)3]·3H2O', '[Fe(CN)6]4-').chain((base) =>
      fc.tuple(fc.nat(base.length), fc.string({ maxLength: 3 })).map(([at, insert]) => base.slice(0, at) + insert + base.slice(at)),
    ),
  );

  it('throws nothing but FormulaError, with a position inside the input, and never hangs', () => {
    fc.assert(
      fc.property(arbitraryFormula, (formula) => {
        const started = Date.now();
        try {
          parseFormula(formula);
        } catch (error) {
          expect(error).toBeInstanceOf(FormulaError);
          const position = (error as FormulaError).position;
          expect(position).toBeGreaterThanOrEqual(0);
          expect(position).toBeLessThanOrEqual(formula.length);
        }
        // A guard against runaway backtracking, not a speed target (those are in `npm run bench`):
        // generous enough for a busy shared machine, far below what a hang takes.
        expect(Date.now() - started).toBeLessThan(2000);
      }),
      { numRuns: 2000 },
    );
  });
});

describe('formulas as chemists also write them (common practice)', () => {
  it('skips isomer descriptors', () => {
    expect(parseFormula('cis-[PtCl2(NH3)2]').oxidationState).toBe(2);
    expect(parseFormula('trans-[Co(en)2Cl2]Cl').oxidationState).toBe(3);
    expect(parseFormula('fac-[Co(NH3)3(NO2)3]').complexCharge).toBe(0);
    expect(parseFormula('Δ-[Co(en)3]3+').metal).toBe('Co');
  });

  it('reads double salts with cations before and anions after the complex (Mohr’s salt)', () => {
    const mohr = parseFormula('(NH4)2[Fe(H2O)6](SO4)2');
    expect([mohr.metal, mohr.oxidationState, mohr.complexCharge]).toEqual(['Fe', 2, 2]);
  });

  it('reads salts written without brackets, with positions in the formula as written', () => {
    const permanganate = parseFormula('KMnO4');
    expect([permanganate.metal, permanganate.oxidationState, permanganate.complexCharge]).toEqual(['Mn', 7, -1]);
    expect(parseFormula('Na2WO4·2H2O')).toMatchObject({ metal: 'W', oxidationState: 6, hydrateWaters: 2 });
    let caught: unknown;
    try {
      parseFormula('KMnO4)');
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(FormulaError);
    expect((caught as FormulaError).position).toBe(5);
  });
});

describe('isomerDescriptor: the stereo descriptor a formula is written with (common practice)', () => {
  it.each([
    { formula: 'cis-[PtCl2(NH3)2]', descriptor: 'cis' },
    { formula: 'trans-[PtCl2(NH3)2]', descriptor: 'trans' },
    { formula: 'TRANS-[CoCl2(en)2]+', descriptor: 'trans' },
    { formula: 'fac-[Co(NH3)3(NO2)3]', descriptor: 'fac' },
    { formula: 'mer-[Co(NH3)3(NO2)3]', descriptor: 'mer' },
    { formula: 'Δ-[Co(en)3]3+', descriptor: 'Δ' },
    { formula: 'Λ-[Co(en)3]3+', descriptor: 'Λ' },
    { formula: '[PtCl2(NH3)2]', descriptor: null },
    { formula: '[Cr(H2O)6]3+', descriptor: null },
  ])('$formula → $descriptor', ({ formula, descriptor }) => {
    expect(isomerDescriptor(formula)).toBe(descriptor);
  });

  it('reads the same species with or without the descriptor (the engines do not depend on it)', () => {
    const plain = parseFormula('[PtCl2(NH3)2]');
    for (const written of ['cis-[PtCl2(NH3)2]', 'trans-[PtCl2(NH3)2]']) {
      const parsed = parseFormula(written);
      expect(parsed.metal).toBe('Pt');
      expect(parsed.oxidationState).toBe(2);
      expect(parsed.complexCharge).toBe(0);
      expect(ligandCounts(written)).toEqual(ligandCounts('[PtCl2(NH3)2]'));
      expect(parsed.oxidationState).toBe(plain.oxidationState);
    }
  });
});
