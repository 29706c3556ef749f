import { classifyFormula } from '@/lib/chem/classify';
import { decideByLibrary } from '@/lib/chem/library-decision';
import validation from './rate-validation/rates.json';

/**
 * Out-of-sample rate error per class. The rate model is calibrated on the aqua ions only
 * (tests/lib/chem/lability.test.ts, data/measured-rates.json); the rates here are an independent
 * validation set, each with its published source in rates.json (most still "recalled", not yet
 * checked against the paper). Nothing here is fitted: the bounds below record the model's present
 * out-of-sample error per class (mean |Δlog10 k|), so a change that makes a class worse fails, and
 * the classes above 3 log units are the ones still to be modelled (README: "Rates outside the
 * calibration set").
 */
interface ValidationRate {
  formula: string;
  class: string;
  kPerSecond: number;
  source: string;
  checked: string;
}

const rates = validation.rates as ValidationRate[];

/** Validation rates answered with a range, and how many of them the range holds (recorded; README). */
const RANGE_COVERAGE = { weak: 10, inside: 2 };

/** Present mean |Δlog10 k| per class, rounded up to the next half unit. */
const BOUND_PER_CLASS: Record<string, number> = {
  'ligand substitution': 3.5,
  'CO dissociation': 5.0,
  'square-planar substitution': 1.0,
  'Rh(I) phosphine loss': 5.0,
  'oxoanion oxygen exchange': 9.5,
  'macrocycle dissociation': 12.0,
  'cyanide exchange': 7.5,
};
/** Classes the model does not yet describe (error above 3 log units): the weak ones. */
const WEAK = ['CO dissociation', 'Rh(I) phosphine loss', 'oxoanion oxygen exchange', 'macrocycle dissociation', 'cyanide exchange', 'ligand substitution'];

function errorsByClass(): Map<string, number[]> {
  const byClass = new Map<string, number[]>();
  for (const rate of rates) {
    const predicted = classifyFormula(rate.formula).predictedLogKPerSecond ?? Number.NaN;
    const error = Math.abs(predicted - Math.log10(rate.kPerSecond));
    byClass.set(rate.class, [...(byClass.get(rate.class) ?? []), error]);
  }
  return byClass;
}

describe('rates outside the calibration set (validation only, never fitted)', () => {
  it('every validation rate names its source and how well it was checked', () => {
    expect(rates.length).toBeGreaterThanOrEqual(15);
    for (const rate of rates) {
      expect(rate.source.length).toBeGreaterThan(10);
      expect(['primary', 'review', 'secondary', 'recalled']).toContain(rate.checked);
    }
  });

  it('no validation species is in the calibration set (aqua ions)', () => {
    for (const rate of rates) expect(rate.formula).not.toMatch(/^\[[A-Z][a-z]?\(H2O\)\d\]\d?\+$/);
  });

  const byClass = errorsByClass();
  it.each(Object.keys(BOUND_PER_CLASS))('%s: mean out-of-sample |Δlog10 k| within its recorded bound', (name) => {
    const errors = byClass.get(name) ?? [];
    expect(errors.length).toBeGreaterThan(0);
    const mean = errors.reduce((sum, value) => sum + value, 0) / errors.length;
    // The table printed by `npm test -- rate-validation` goes into README.
    console.log(`${name}: n = ${errors.length}, mean |Δlog10 k| = ${mean.toFixed(1)}`);
    expect(mean).toBeLessThanOrEqual(BOUND_PER_CLASS[name] ?? 0);
    if (mean > 3) expect(WEAK).toContain(name);
  });
});

describe('weak classes say so', () => {
  it.each([['[MnO4]-'], ['[CrO4]2-'], ['[Ni(cyclam)]2+'], ['[Cu(cyclam)]2+']])('%s: low confidence and a line saying the rate is only a guess (validation errors above 7 log units)', (formula) => {
    const result = classifyFormula(formula);
    expect(result.confidence).toBe('low');
    expect(result.reasons.join(' ')).toMatch(/the rate is only a guess/);
  });
});

describe('where the model is weak, no precise half-life: an order-of-magnitude range with low confidence', () => {
  // One formula per weak class of the validation table (README, "Rates outside the calibration set").
  it.each([
    ['[Cr(CO)6]', 'organometallic'],
    ['[Ni(CO)4]', 'organometallic'],
    ['[RhCl(PPh3)3]', 'low-valent-square-planar'],
    ['[MnO4]-', 'oxoanion'],
    ['[CrO4]2-', 'oxoanion'],
    ['[Ni(cyclam)]2+', 'macrocycle'],
    ['[Mo(CN)8]4-', 'cyanide'],
  ])('%s (%s): a range of six orders of magnitude, low confidence, no "t½ ≈", and the reason says why', (formula, weakClass) => {
    const result = classifyFormula(formula);
    expect(result.weakClass).toBe(weakClass);
    expect(result.confidence).toBe('low');
    const range = result.halfLifeRangeSeconds;
    expect(range).toBeDefined();
    // log k ± 3 around the model's own estimate: the range is 10⁶ wide and holds the central value.
    expect(Math.log10((range?.longest ?? 0) / (range?.shortest ?? 1))).toBeCloseTo(6, 6);
    expect(range?.shortest).toBeLessThan(result.halfLifeSeconds);
    expect(range?.longest).toBeGreaterThan(result.halfLifeSeconds);
    const text = result.reasons.join(' ');
    expect(text).not.toMatch(/t½ ≈/);
    expect(text).toMatch(/only the order of magnitude is known: k between .* s⁻¹, t½ between /);
    expect(text).toMatch(/only an order of magnitude is given|the rate is only a guess/);
  });

  it('classes the model describes keep a half-life and no range ([Co(NH3)6]3+, [Pt(NH3)4]2+, [Cr(H2O)6]3+)', () => {
    for (const formula of ['[Co(NH3)6]3+', '[Pt(NH3)4]2+', '[Cr(H2O)6]3+']) {
      const result = classifyFormula(formula);
      expect(result.halfLifeRangeSeconds).toBeUndefined();
      expect(result.reasons.join(' ')).toMatch(/t½ ≈/);
    }
  });

  it('a range that crosses a band edge says the verdict itself is uncertain', () => {
    // [Ni(CO)4]: the model's range runs from under a minute to hours.
    expect(classifyFormula('[Ni(CO)4]').reasons.join(' ')).toMatch(/the verdict itself is uncertain/);
  });

  it('a group measurement decides and leaves no model range beside it', () => {
    // A measured value for the sake of the rule (not a published rate): any accepted first-order k decides.
    const decided = decideByLibrary(classifyFormula('[Cr(CO)6]'), { entryId: 'e', entryName: 'n', entryFormula: '[Cr(CO)6]', kind: 'substitution', kPerSecond: 1e-10, temperatureK: 298.15, citation: null });
    expect(decided.halfLifeRangeSeconds).toBeUndefined();
    expect(decided.weakClass).toBeUndefined();
    expect(decided.confidence).toBe('high');
  });

  it('reports how many validation rates fall inside the range the answer prints (recorded, so a change that loses coverage fails)', () => {
    let weak = 0;
    let inside = 0;
    for (const rate of rates) {
      const result = classifyFormula(rate.formula);
      if (!result.halfLifeRangeSeconds) continue;
      weak++;
      const halfLife = Math.LN2 / rate.kPerSecond;
      if (halfLife >= result.halfLifeRangeSeconds.shortest && halfLife <= result.halfLifeRangeSeconds.longest) inside++;
    }
    console.log(`weak-class ranges: ${inside} of ${weak} validation rates inside the printed range`);
    expect(weak).toBeGreaterThanOrEqual(RANGE_COVERAGE.weak);
    expect(inside).toBeGreaterThanOrEqual(RANGE_COVERAGE.inside);
  });
});
