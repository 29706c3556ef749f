import { complexDetailSchema, complexListResponseSchema, complexStatuses, measurementKinds, type ComplexDetail } from '@/lib/schemas/library';
import { complexFacetsSchema, type ComplexFacets } from '@/lib/schemas/library-facets';
import { createTestApp, type TestApp } from '../setup/test-app';
import { measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';
import { Browser, FIXTURE_PASSWORD } from './auth-helpers';

/**
 * Filter options from the server (GET /api/complexes/facets) and a stable order. The expected
 * options are read from the entries' own details (as each role sees them), never from the code
 * under test. Fixture values: Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267 (only the kind matters).
 */

let t: TestApp;
let w: LibraryWorld;
type Who = 'viewer' | 'contributor2' | 'author' | 'curator';
/** What a restricted reader sees of each entry, and what a full reader sees. */
const published: ComplexDetail[] = [];
const working: ComplexDetail[] = [];
let secondViewer: Browser;

async function ok<T extends { status: number; body: unknown }>(promise: Promise<T>): Promise<T> {
  const response = await promise;
  if (response.status >= 300) throw new Error(`setup step failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response;
}

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'facets');
  const accept = async (id: string) => {
    await ok(w.author.post(`/api/complexes/${id}/submit`));
    await ok(w.curator.post(`/api/complexes/${id}/reviews`, { decision: 'accept', comment: 'checked' }));
  };
  const cr = await createEntry(w.author, w.groupId, { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III) batch', measurements: [measurementInput()] });
  await accept(cr.id);
  // Three entries with the same name: the order between them is their id order, for everyone.
  for (let i = 0; i < 3; i += 1) {
    const co = await createEntry(w.author, w.groupId, { formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III) batch' });
    await accept(co.id);
  }
  // A pending edit of the chromium entry: another species and another measurement kind.
  const accepted = complexDetailSchema.parse((await ok(w.author.get(`/api/complexes/${cr.id}`))).body);
  await ok(w.author.patch(`/api/complexes/${cr.id}`, { version: accepted.version, formula: '[Ni(NH3)6]2+', name: 'hexaamminenickel(II) batch' }));
  await ok(w.author.patch(`/api/complexes/${cr.id}/measurements/${accepted.measurements[0]!.id}`, { version: accepted.version + 1, kind: 'ligand-exchange' }));
  // A draft nobody restricted sees.
  await createEntry(w.author, w.groupId, { formula: '[Rh(H2O)6]3+', name: 'hexaaquarhodium(III) draft' });

  const list = complexListResponseSchema.parse((await ok(w.curator.get(`/api/complexes?groupId=${w.groupId}&pageSize=100`))).body);
  for (const item of list.items) {
    working.push(complexDetailSchema.parse((await ok(w.curator.get(`/api/complexes/${item.id}`))).body));
    const seen = await w.viewer.get(`/api/complexes/${item.id}`);
    if (seen.status === 200) published.push(complexDetailSchema.parse(seen.body));
  }
  secondViewer = new Browser(t.app);
  await secondViewer.signIn('viewer.facets@larkspur.example.org', FIXTURE_PASSWORD);
}, 60_000);
afterAll(async () => {
  await t.close();
});

const facetsOf = async (browser: Browser, query = `?groupId=${w.groupId}`) => {
  const response = await browser.get(`/api/complexes/facets${query}`);
  if (response.status !== 200) throw new Error(`${response.status} ${JSON.stringify(response.body)}`);
  return complexFacetsSchema.parse(response.body);
};

/** The options expected from a set of entries as a reader sees them, counted here. */
function expectedFacets(entries: readonly ComplexDetail[]): ComplexFacets {
  const count = <T extends string | number>(values: T[]) => {
    const counts = new Map<T, number>();
    for (const v of values) counts.set(v, (counts.get(v) ?? 0) + 1);
    return counts;
  };
  const asc = <T extends string | number>(counts: Map<T, number>) =>
    [...counts.entries()].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0)).map(([value, n]) => ({ value, count: n }));
  const kinds = count(entries.flatMap((e) => [...new Set(e.measurements.map((m) => m.kind))]));
  const statuses = count(entries.map((e) => e.status));
  return {
    metals: asc(count(entries.map((e) => e.metal))),
    oxidationStates: asc(count(entries.map((e) => e.oxidationState))),
    dCounts: asc(count(entries.map((e) => e.dElectrons))),
    ligands: asc(count(entries.flatMap((e) => e.ligandIds))),
    measurementKinds: measurementKinds.filter((k) => kinds.has(k)).map((k) => ({ value: k, count: kinds.get(k)! })),
    statuses: complexStatuses.filter((s) => statuses.has(s)).map((s) => ({ value: s, count: statuses.get(s)! })),
  };
}

describe('GET /api/complexes/facets', () => {
  it('the fixture differs between the accepted and the working content', () => {
    expect(published).toHaveLength(4);
    expect(working).toHaveLength(5);
    expect(new Set(working.map((e) => e.metal))).not.toEqual(new Set(published.map((e) => e.metal)));
  });

  it.each(['viewer', 'contributor2'] as Who[])('%s: the options of the accepted content only', async (who) => {
    const facets = await facetsOf(w[who]);
    expect(facets).toEqual(expectedFacets(published));
    expect(facets.metals.map((m) => m.value)).not.toContain('Ni');
    expect(facets.statuses.map((s) => s.value)).toEqual(['accepted']);
  });

  it.each(['author', 'curator'] as Who[])('%s: the options of the working copy', async (who) => {
    const facets = await facetsOf(w[who]);
    expect(facets).toEqual(expectedFacets(working));
    expect(facets.statuses.map((s) => s.value)).toEqual(['draft', 'accepted']);
  });

  it('offers a metal no loaded page holds (the list page is 1 entry long)', async () => {
    const page = complexListResponseSchema.parse((await ok(w.viewer.get(`/api/complexes?groupId=${w.groupId}&pageSize=1`))).body);
    const onPage = new Set(page.items.map((i) => i.metal));
    const offered = (await facetsOf(w.viewer)).metals.map((m) => m.value);
    expect(offered.filter((m) => !onPage.has(m)).length).toBeGreaterThan(0);
  });

  it('without groupId: every group of the person; a group they are not in: 404; a bad id: 400', async () => {
    expect(await facetsOf(w.viewer, '')).toEqual(expectedFacets(published));
    expect((await w.viewer.get(`/api/complexes/facets?groupId=${w.otherGroupId}`)).status).toBe(404);
    expect((await w.viewer.get('/api/complexes/facets?groupId=nope')).status).toBe(400);
    expect((await w.viewer.get('/api/complexes/facets?metal=Co')).status).toBe(400);
  });
});

describe('the same query gives the same order, in every session', () => {
  const order = async (browser: Browser, query: string) => {
    const ids: string[] = [];
    for (let page = 1; page <= 5; page += 1) {
      const response = complexListResponseSchema.parse((await ok(browser.get(`/api/complexes?groupId=${w.groupId}&pageSize=2&page=${page}&${query}`))).body);
      ids.push(...response.items.map((i) => i.id));
      if (response.items.length < 2) break;
    }
    return ids;
  };
  const queries = ['', 'q=batch', 'q=Co', 'metal=Co', 'q=hexaammine'];

  it('two sessions of the viewer, and a contributor who sees the same entries, get one order', async () => {
    for (const query of queries) {
      const first = await order(w.viewer, query);
      expect(await order(secondViewer, query)).toEqual(first);
      expect(await order(w.contributor2, query)).toEqual(first);
      expect(await order(w.viewer, query)).toEqual(first);
    }
    expect(await facetsOf(secondViewer)).toEqual(await facetsOf(w.viewer));
  });

  it('entries that tie are in id order; a curator sees the shared entries in the same order', async () => {
    const cobalt = published.filter((e) => e.metal === 'Co').map((e) => e.id);
    for (const query of ['', 'q=batch', 'metal=Co']) {
      const viewerOrder = await order(w.viewer, query);
      expect(viewerOrder.filter((id) => cobalt.includes(id))).toEqual([...cobalt].sort());
      const curatorOrder = (await order(w.curator, query)).filter((id) => viewerOrder.includes(id));
      const shared = viewerOrder.filter((id) => curatorOrder.includes(id) && cobalt.includes(id));
      expect(curatorOrder.filter((id) => shared.includes(id))).toEqual(shared);
    }
  });
});
