import fc from 'fast-check';
import { classifyFormula } from '@/lib/chem/classify';
import { parseFormula } from '@/lib/chem/formula-parser';
import { predictRoute, RouteInputError } from '@/lib/chem/route';
import { FormulaError } from '@/lib/chem/types';

/**
 * Hostile and random input through the engines: the only failure allowed is the engine's own
 * positioned error, and nothing may hang. ≥ 100 000 formulas in all.
 */
const REAL_FORMULAS = [
  '[Co(en)2(NO2)Cl]NO3', 'K3[Cr(ox)3]·3H2O', '[Cr(NH3)5(OH2)]3+', '[Rh(bpy)2Cl2]PF6', '[Mn(CO)5Br]',
  '[ReO4]-', '[Cu(en)2]2+', '[Co(NH3)6]2(SO4)3', 'Na2[Fe(CN)5NO]', '[Fe(H2O)6]^3+', '[Cr(H2O)6]³⁺',
  '(NH4)2[Fe(H2O)6](SO4)2', 'KMnO4', 'cis-[PtCl2(NH3)2]', '[Ni(CN)4]2-', '[Ru(bpy)3]Cl2·6H2O',
];

const ALPHABET = [...'[]()0123456789+-^·.*³⁺⁻²ABCDEFGHIKLMNOPRSTUVWXYZabcdefghiklmnoprstuvxyz ,\'η5'];
const formulaLikeString = fc
  .array(fc.constantFrom(...ALPHABET), { maxLength: 40 })
  .map((chars) => chars.join(''));

/** Mutations of real formulas: delete, duplicate, swap or replace one character (or a few). */
const mutatedFormula = fc
  .tuple(
    fc.constantFrom(...REAL_FORMULAS),
    fc.array(fc.tuple(fc.nat(), fc.constantFrom('delete', 'duplicate', 'replace', 'insert'), fc.constantFrom(...ALPHABET)), {
      minLength: 1,
      maxLength: 3,
    }),
  )
  .map(([formula, edits]) => {
    let text = formula;
    for (const [at, kind, ch] of edits) {
      const index = at % (text.length + 1);
      if (kind === 'delete') text = text.slice(0, index) + text.slice(index + 1);
      else if (kind === 'duplicate') text = text.slice(0, index) + text.slice(index, index + 1) + text.slice(index);
      else if (kind === 'replace') text = text.slice(0, index) + ch + text.slice(index + 1);
      else text = text.slice(0, index) + ch + text.slice(index);
    }
    return text;
  });

function expectOnlyPositionedErrors(formula: string, run: (formula: string) => unknown) {
  try {
    run(formula);
  } catch (error) {
    if (!(error instanceof FormulaError)) throw error;
    expect(error.position).toBeGreaterThanOrEqual(0);
    expect(error.position).toBeLessThanOrEqual(formula.length);
    expect(error.message.length).toBeGreaterThan(0);
  }
}

it('parses 60 000 random formula-like strings without any other failure', () => {
  fc.assert(fc.property(formulaLikeString, (formula) => expectOnlyPositionedErrors(formula, parseFormula)), {
    numRuns: 60_000,
  });
});

it('classifies 40 000 mutated real formulas without any other failure', () => {
  fc.assert(fc.property(mutatedFormula, (formula) => expectOnlyPositionedErrors(formula, classifyFormula)), {
    numRuns: 40_000,
  });
});

it('survives unicode tricks and huge inputs quickly', () => {
  const tricky = [
    '\u202E[Co(NH3)6]3+', '[Co(NH3)6]3+\u0000', '[Co(NH3)6]\uFE0F3+', '[Ｃo(NH3)6]3+', '[Co(NH3)6]3+'.repeat(30),
    '('.repeat(5000), '['.repeat(5000), '[Co' + '(NH3)'.repeat(2000) + ']', '\uD800', '🧪', ' ', '',
  ];
  for (const formula of tricky) {
    const started = performance.now();
    expectOnlyPositionedErrors(formula, classifyFormula);
    expect(performance.now() - started).toBeLessThan(500);
  }
});

it('routes 2 000 random pairs with only positioned route errors', () => {
  fc.assert(
    fc.property(fc.oneof(mutatedFormula, formulaLikeString), fc.oneof(mutatedFormula, formulaLikeString), (a, b) => {
      try {
        predictRoute(a, b);
      } catch (error) {
        if (!(error instanceof RouteInputError)) throw error;
        expect(['oxidant', 'reductant']).toContain(error.field);
      }
    }),
    { numRuns: 2_000 },
  );
});
