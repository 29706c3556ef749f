import { complexListResponseSchema } from '@/lib/schemas/library';

/** The list reply's total is exact up to the server's cap; past it the reply says it is a lower bound. */
describe('complexListResponseSchema: totalIsLowerBound', () => {
  it('keeps the flag as sent', () => {
    const capped = complexListResponseSchema.parse({ items: [], total: 1000, totalIsLowerBound: true, page: 1, pageSize: 20 });
    expect(capped.totalIsLowerBound).toBe(true);
    const exact = complexListResponseSchema.parse({ items: [], total: 12, totalIsLowerBound: false, page: 1, pageSize: 20 });
    expect(exact.totalIsLowerBound).toBe(false);
  });

  it('reads a reply without the flag as an exact total', () => {
    expect(complexListResponseSchema.parse({ items: [], total: 3, page: 1, pageSize: 20 }).totalIsLowerBound).toBe(false);
  });

  it('rejects a flag that is not a boolean', () => {
    expect(complexListResponseSchema.safeParse({ items: [], total: 3, totalIsLowerBound: 'yes', page: 1, pageSize: 20 }).success).toBe(false);
  });
});
