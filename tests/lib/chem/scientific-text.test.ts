import { scientificText } from '@/lib/chem/scientific-text';

// The notation of the screens (components/ui/format.ts): superscript exponents, plain numbers in between (common practice).
describe('scientificText', () => {
  it.each([
    [32359, '3.2 × 10⁴'],
    [1.7e-6, '1.7 × 10⁻⁶'],
    [3918, '3900'],
    [0.85, '0.85'],
    [9.96e7, '1.0 × 10⁸'],
    [-2.5e5, '-2.5 × 10⁵'],
  ])('%f → %s', (value, text) => {
    expect(scientificText(value)).toBe(text);
  });
});
