import demoLibrary from '@/data/demo-library.json';
import { classifyFormula } from '@/lib/chem/classify';
import { predictRoute } from '@/lib/chem/route';
import checkSet from './check-set/formulas.json';

/**
 * One notation in everything the engines write for people (common practice for the notation; IUPAC
 * Green Book, 3rd ed. 2007, §1.3 for unit symbols): over the demo library, the check set and a few
 * redox pairs and temperatures, no reason uses the ad-hoc forms the screens used to mix, and every
 * reason starts as a sentence.
 */
const AD_HOC: [RegExp, string][] = [
  [/10\^/, 'caret power "10^x"'],
  [/\d(?:\.\d+)?e[+-]?\d/, 'computer exponent "1e-9"'],
  [/k_ex|e_g/, 'underscore subscript'],
  [/kJ\/mol|g\/mol|cm3 mol-1|cm3\/mol|s\^-1|s-1\b|M-1/, 'unit not in the one style'],
  [/[⁰¹²³⁴⁵⁶⁷⁸⁹]·[⁰¹²³⁴⁵⁶⁷⁸⁹]|\d·\d+(?![\dA-Za-z(])/, 'middle dot as a decimal point'],
  [/0\.00\d+ µs/, 'duration in a unit too large'],
  [/\b\d+(?:\.\d+)? (?:days|years)\b/, 'duration outside the ladder (d, y)'],
];
// A sentence starts with a capital, a digit, a symbol or a formula (a bracket).
const SENTENCE_START = /^(?:[A-ZΔΣµηκ[(0-9]|[dfp]\d|t2g|eg\b|k\b|k\d|kₑₓ|cis-|trans-|fac-|mer-)/u;

function problems(texts: readonly string[], where: string): string[] {
  const found: string[] = [];
  for (const text of texts) {
    for (const [pattern, what] of AD_HOC) if (pattern.test(text)) found.push(`${where}: ${what}: ${text}`);
    if (!SENTENCE_START.test(text)) found.push(`${where}: not a sentence start: ${text}`);
  }
  return found;
}

const formulas = [...new Set([...demoLibrary.complexes.map((entry) => entry.formula), ...checkSet.formulas.map((entry) => entry.formula)])];

describe('one notation in the engines’ copy', () => {
  it('every classification reason, at 25 °C and at 80 °C', () => {
    const found: string[] = [];
    let classified = 0;
    for (const formula of formulas) {
      for (const temperatureC of [25, 80]) {
        try {
          const result = classifyFormula(formula, { temperatureC });
          classified++;
          found.push(...problems(result.reasons, formula));
        } catch {
          // The check set's own test holds which formulas must parse.
        }
      }
    }
    expect(classified).toBeGreaterThan(200);
    expect(found).toEqual([]);
  });

  it('every route reason and product line', () => {
    const pairs: [string, string][] = [
      ['[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+'],
      ['[Co(NH3)5(OH2)]3+', '[Cr(H2O)6]2+'],
      ['[Fe(CN)6]3-', '[Fe(CN)6]4-'],
      ['[Co(NH3)6]3+', '[Ru(NH3)6]2+'],
      ['[IrCl6]2-', '[Co(CN)5]3-'],
      ['[Co(NH3)5(pz)]3+', '[Cr(H2O)6]2+'],
    ];
    const found: string[] = [];
    for (const [oxidant, reductant] of pairs) {
      const result = predictRoute(oxidant, reductant);
      found.push(...problems(result.reasons, `${oxidant} + ${reductant}`), ...problems(result.expectedProducts, `${oxidant} + ${reductant} products`));
    }
    expect(found).toEqual([]);
  });
});
