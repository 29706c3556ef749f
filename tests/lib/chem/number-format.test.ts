import fc from 'fast-check';
import { formatFixed } from '@/lib/chem/number-format';

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
