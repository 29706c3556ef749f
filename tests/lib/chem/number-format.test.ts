import fc from 'fast-check';
import { formatFixed, formatPrecision2 } from '@/lib/chem/number-format';

/**
 * formatFixed must write exactly what the runtime's own Number.prototype.toFixed writes (ECMA-262
 * §21.1.3.3 is the reference): the engine's reason texts depend on it character for character.
 */
describe('formatFixed agrees with Number.prototype.toFixed', () => {
  it.each([
    [0, 1], [-0, 1], [0.05, 1], [0.15, 1], [0.25, 2], [1.005, 2], [2.675, 2], [-0.04, 1], [-0.004, 2],
    [9.95, 1], [99.995, 2], [123456.785, 2], [1e9, 2], [1e21, 1], [Number.NaN, 1], [Number.POSITIVE_INFINITY, 2],
    [Number.NEGATIVE_INFINITY, 1], [Number.MIN_VALUE, 2], [0.45, 1], [1.45, 1], [2.5e-7, 2],
  ] as const)('%p with %p digits', (value, digits) => {
    expect(formatFixed(value, digits)).toBe(value.toFixed(digits));
  });

  it('on any double, with 1 or 2 digits', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: false }), fc.constantFrom(1 as const, 2 as const), (value, digits) => {
        expect(formatFixed(value, digits)).toBe(value.toFixed(digits));
      }),
      { numRuns: 20_000 },
    );
  });

  it('on values near the engine’s range and near rounding ties', () => {
    fc.assert(
      fc.property(fc.integer({ min: -2_000_000, max: 2_000_000 }), fc.integer({ min: -3, max: 3 }), fc.constantFrom(1 as const, 2 as const), (units, nudge, digits) => {
        // x.x5 / x.xx5 written in decimal are rarely exact in binary: the cases toFixed is famous for.
        const value = (units + 0.5) / (digits === 1 ? 10 : 100) + nudge * Number.EPSILON * Math.abs(units);
        expect(formatFixed(value, digits)).toBe(value.toFixed(digits));
      }),
      { numRuns: 20_000 },
    );
  });
});

/**
 * formatPrecision2 must write exactly what Number.prototype.toPrecision(2) writes (ECMA-262
 * §21.1.3.5 is the reference): the half-life in every verdict reason is written with it.
 */
describe('formatPrecision2 agrees with Number.prototype.toPrecision(2)', () => {
  it.each([
    0, -0, 1e-6, 9.9999e-7, 5e-7, 1e-7, 0.1, 0.01, 0.15, 0.25, 0.35, 1.25, 1.35, 9.95, 9.949999, 10, 15, 99.4, 99.5,
    99.49999999, 100, 123, 1e21, -0.5, -12, 6.931e-4, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY,
    Number.MIN_VALUE, Number.MAX_VALUE,
  ])('%p', (value) => {
    expect(formatPrecision2(value)).toBe(value.toPrecision(2));
  });

  it('on any double', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: false }), (value) => {
        expect(formatPrecision2(value)).toBe(value.toPrecision(2));
      }),
      { numRuns: 20_000 },
    );
  });

  it('on the magnitudes it handles itself (1e−6 to 100)', () => {
    fc.assert(
      fc.property(fc.double({ min: -15, max: 2.1, noNaN: true }), (exponent) => {
        const value = 10 ** exponent;
        expect(formatPrecision2(value)).toBe(value.toPrecision(2));
      }),
      { numRuns: 20_000 },
    );
  });

  it('near rounding ties and decade boundaries', () => {
    fc.assert(
      fc.property(fc.integer({ min: 10, max: 100 }), fc.integer({ min: -8, max: 2 }), fc.integer({ min: -3, max: 3 }), fc.boolean(), (units, exponent, nudge, tie) => {
        // n.5 × 10^e written in decimal is rarely exact in binary; 10^e itself sits on a boundary.
        const exact = ((tie ? units + 0.5 : units) * 10 ** exponent) / 10;
        const value = exact + nudge * Number.EPSILON * exact;
        expect(formatPrecision2(value)).toBe(value.toPrecision(2));
      }),
      { numRuns: 20_000 },
    );
  });
});
