import { formulaFromQuery } from '@/components/check/formula-from-address';

describe('Check deep links keep a raw plus sign (RFC 3986: only percent-escapes are decoded in a query)', () => {
  it.each([
    ['?formula=[Co(NH3)6]3+', '[Co(NH3)6]3+'],
    ['?formula=%5BCo(NH3)6%5D3%2B', '[Co(NH3)6]3+'],
    ['?x=1&formula=[Fe(CN)6]4-&y=2', '[Fe(CN)6]4-'],
    ['?formula=%5BCo(NH%E2%82%83)%E2%82%86%5D%C2%B3%E2%81%BA', '[Co(NH₃)₆]³⁺'],
    ['?formula=100%', '100%'],
  ])('%s → %s', (search, formula) => {
    expect(formulaFromQuery(search)).toBe(formula);
  });

  it('returns null without the parameter', () => {
    expect(formulaFromQuery('?other=1')).toBeNull();
  });
});
