import { groupedInteger } from '@/components/ui/format';

// Expected strings written by hand: the English convention of commas between groups of three digits
// (common practice), which is what the Check card showed through toLocaleString('en') before.
describe('groupedInteger', () => {
  it('puts a comma between groups of three digits', () => {
    expect(groupedInteger(0)).toBe('0');
    expect(groupedInteger(999)).toBe('999');
    expect(groupedInteger(1000)).toBe('1,000');
    expect(groupedInteger(22870)).toBe('22,870');
    expect(groupedInteger(1234567)).toBe('1,234,567');
  });

  it('rounds to a whole number first and keeps the sign', () => {
    expect(groupedInteger(17399.6)).toBe('17,400');
    expect(groupedInteger(-1500.2)).toBe('−1,500'); // the real minus sign (U+2212), common practice
  });
});
