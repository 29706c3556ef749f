import { complexListResponseSchema, complexSearchQuerySchema } from '@/lib/schemas/library';
import { SEARCH_COUNT_CAP, searchComplexes } from '@/server/modules/library/complex-search';
import { generateSyntheticEntries } from '@/server/modules/library/generate';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, type LibraryWorld } from '../factories/library-world';

/**
 * Section 3 of the 100 000-entry issue: totals are counted up to SEARCH_COUNT_CAP (or the end of
 * the page asked for), and the index-ordered page must be the very page that ranking every match
 * gives. The library is filled with the benchmark generator (accepted entries by the curator).
 */

let t: TestApp;
let w: LibraryWorld;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'cap');
  await generateSyntheticEntries(t.orm.em.fork(), { groupId: w.groupId, count: 1000, createdById: w.ids.curator });
}, 120_000);
afterAll(async () => {
  await t.close();
});

const list = async (who: 'viewer' | 'curator', query: string) => {
  const response = await w[who].get(`/api/complexes?groupId=${w.groupId}&${query}`);
  if (response.status !== 200) throw new Error(`${response.status} ${JSON.stringify(response.body)}`);
  return complexListResponseSchema.parse(response.body);
};

/** The group's entries in the no-text order, straight from the table. */
const idsByName = async () =>
  (await t.orm.em.fork().execute<{ id: string }[]>('select id from complex where group_id = ? order by lower(name), id', [w.groupId])).map((r) => r.id);

describe('the total is exact up to the cap, then a lower bound', () => {
  it('the cap is 1 000', () => {
    expect(SEARCH_COUNT_CAP).toBe(1000);
  });

  it('exactly at the cap: the exact total, not a lower bound', async () => {
    for (const who of ['viewer', 'curator'] as const) {
      const all = await list(who, 'pageSize=20');
      expect([all.total, all.totalIsLowerBound, all.items.length]).toEqual([1000, false, 20]);
      const text = await list(who, 'q=synthetic&pageSize=20');
      expect([text.total, text.totalIsLowerBound]).toEqual([1000, false]);
    }
  });

  it('one above the cap: 1 000 as a lower bound; the last pages count exactly again', async () => {
    await generateSyntheticEntries(t.orm.em.fork(), { groupId: w.groupId, count: 1, createdById: w.ids.curator });
    for (const who of ['viewer', 'curator'] as const) {
      const first = await list(who, 'pageSize=20');
      expect([first.total, first.totalIsLowerBound]).toEqual([1000, true]);
      const text = await list(who, `q=${encodeURIComponent('synthetic')}&pageSize=20&page=2`);
      expect([text.total, text.totalIsLowerBound, text.items.length]).toEqual([1000, true, 20]);
      // Page 50 ends at entry 1 000: still more than that.
      const fiftieth = await list(who, 'pageSize=20&page=50');
      expect([fiftieth.total, fiftieth.totalIsLowerBound, fiftieth.items.length]).toEqual([1000, true, 20]);
      // Page 51 reaches past the cap: counted to its end, so exact.
      const last = await list(who, 'pageSize=20&page=51');
      expect([last.total, last.totalIsLowerBound, last.items.length]).toEqual([1001, false, 1]);
      // A page beyond the last entry: empty, with the exact total.
      const beyond = await list(who, 'pageSize=20&page=60');
      expect([beyond.total, beyond.totalIsLowerBound, beyond.items.length]).toEqual([1001, false, 0]);
    }
  });

  it('pages past the cap continue the same order and cover every entry once', async () => {
    const ids: string[] = [];
    for (let page = 1; page <= 11; page += 1) ids.push(...(await list('curator', `pageSize=100&page=${page}`)).items.map((i) => i.id));
    expect(ids).toEqual(await idsByName());
  });
});

describe('index-ordered pages equal the pages of ranking every match', () => {
  beforeAll(async () => {
    // More accepted entries, and drafts of the contributor's own that only they and curators see.
    await generateSyntheticEntries(t.orm.em.fork(), { groupId: w.groupId, count: 1500, createdById: w.ids.curator });
    await generateSyntheticEntries(t.orm.em.fork(), { groupId: w.groupId, count: 300, createdById: w.ids.author, status: 'draft' });
  }, 120_000);

  const searches: Record<string, string>[] = [
    { q: 'Co amm' },
    { q: 'ammine' },
    { q: 'hexa' },
    { q: 'amm' },
    { q: 'aqua ii' },
    { q: 'co h2o 6' },
    { q: 'synthetic' },
    { q: 'cobalt en' },
    { q: 'ammine', metal: 'Co', verdict: 'inert' },
    { q: 'iii', status: 'draft' },
    { ligand: 'NH3', measurementKind: 'water-exchange' },
    { metal: 'Co' },
    {},
  ];

  it('same entries, order, ranks and totals for viewer, contributor and curator, on early, late and empty pages', async () => {
    let lowerBounds = 0;
    for (const who of ['viewer', 'author', 'curator'] as const) {
      for (const raw of searches) {
        for (const page of [1, 2, 9, 51, 140]) {
          const query = complexSearchQuerySchema.parse({ ...raw, groupId: w.groupId, pageSize: '20', page: String(page) });
          const indexed = await searchComplexes(t.orm.em.fork(), w.ids[who], query);
          const reference = await searchComplexes(t.orm.em.fork(), w.ids[who], query, { strategy: 'single-pass' });
          expect({ who, raw, asked: page, ...indexed }).toEqual({ who, raw, asked: page, ...reference });
          if (indexed.totalIsLowerBound) lowerBounds += 1;
        }
      }
    }
    // The comparison must have covered the capped case (the index-ordered plans run only there).
    expect(lowerBounds).toBeGreaterThan(50);
  }, 180_000);

  it('viewers see accepted entries only; the contributor also their drafts', async () => {
    const viewer = await list('viewer', 'status=draft');
    expect([viewer.total, viewer.totalIsLowerBound]).toEqual([0, false]);
    const author = await w.author.get(`/api/complexes?groupId=${w.groupId}&status=draft`);
    expect(complexListResponseSchema.parse(author.body).total).toBe(300);
  });

  it('ranks fall page after page; equal ranks are in id order', async () => {
    const items = [];
    for (let page = 1; page <= 3; page += 1) items.push(...(await list('curator', `q=${encodeURIComponent('Co amm')}&pageSize=100&page=${page}`)).items);
    for (let i = 1; i < items.length; i += 1) {
      const [a, b] = [items[i - 1]!, items[i]!];
      expect(a.rank! > b.rank! || (a.rank === b.rank && a.id < b.id)).toBe(true);
    }
  });
});
