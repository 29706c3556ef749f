import { duration, estimate, powerOfTen, roman, scientific, superscript } from '@/components/ui/format';

// The screens' names for the one notation (lib/chem/number-format.ts; its own tests hold the rules).
describe('number presentation on the screens', () => {
  it('writes exponents as superscripts with the real minus, and 10^x as a × 10ⁿ (never a middle-dot decimal)', () => {
    expect(superscript('-12')).toBe('⁻¹²');
    // 10^−5.62 = 2.399 × 10⁻⁶ (hand arithmetic), two significant figures.
    expect(powerOfTen(-5.62)).toBe('2.4 × 10⁻⁶');
    expect(powerOfTen(-5.62)).not.toMatch(/·/);
  });

  it('keeps recorded values as recorded (up to four figures) and estimates to set figures', () => {
    expect(scientific(2389.58)).toBe('2390');
    expect(scientific(0.0123)).toBe('0.0123');
    expect(scientific(2.4e-6)).toBe('2.4 × 10⁻⁶');
    expect(scientific(3.1e5)).toBe('3.1 × 10⁵');
    expect(estimate(1.234e5)).toBe('1.2 × 10⁵');
    expect(estimate(0.2468, 3)).toBe('0.247');
  });

  it('gives half-lives on the one ladder (ps … y) with two or three figures', () => {
    expect(duration(0.008)).toBe('8.0 ms');
    expect(duration(90)).toBe('1.5 min');
    expect(duration(3.3 * 86400)).toBe('3.3 d');
    expect(duration(Infinity)).toBe('forever');
  });

  it('writes oxidation states as Roman numerals', () => {
    expect([roman(2), roman(3), roman(4), roman(7), roman(0), roman(-1)]).toEqual(['II', 'III', 'IV', 'VII', '0', '−I']);
  });
});
