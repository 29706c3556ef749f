import { duration, powerOfTen, roman, scientific, superscript } from '@/components/ui/format';

describe('number presentation', () => {
  it('writes exponents as superscripts', () => {
    expect(superscript('-12')).toBe('⁻¹²');
    expect(powerOfTen(-5.62)).toBe('10⁻⁵·⁶');
  });

  it('keeps ordinary magnitudes plain and large/small ones in scientific notation', () => {
    expect(scientific(2389.58)).toBe('2390');
    expect(scientific(0.0123)).toBe('0.0123');
    expect(scientific(2.4e-6)).toBe('2.4 × 10⁻⁶');
    expect(scientific(3.1e5)).toBe('3.1 × 10⁵');
  });

  it('gives half-lives in the largest sensible unit', () => {
    expect(duration(0.008)).toBe('8 ms');
    expect(duration(90)).toBe('1.5 min');
    expect(duration(3.3 * 86400)).toBe('3.3 days');
    expect(duration(Infinity)).toBe('forever');
  });

  it('writes oxidation states as Roman numerals', () => {
    expect([roman(2), roman(3), roman(4), roman(7), roman(0), roman(-1)]).toEqual(['II', 'III', 'IV', 'VII', '0', '−I']);
  });
});
