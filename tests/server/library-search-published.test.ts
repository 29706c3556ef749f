import { complexDetailSchema, complexListResponseSchema, type ComplexDetail } from '@/lib/schemas/library';
import { createTestApp, type TestApp } from '../setup/test-app';
import { measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';

/**
 * Search and filters over what each role may see. An accepted entry gets a pending edit that
 * renames it, changes its formula (so metal, oxidation state, d count, verdict and ligand change)
 * and changes its measurement's kind and citation, and is submitted. Viewers, and contributors for
 * entries they did not create, search the accepted snapshot: nothing of the pending edit finds it,
 * everything of the accepted content does. The author and the curators search the working copy.
 *
 * The values compared are the entry's own fields as the server stored them at each stage (read
 * back through the API), never constants computed here.
 */

let t: TestApp;
let w: LibraryWorld;
let accepted: ComplexDetail;
let pending: ComplexDetail;
let entryId: string;
/** A pending rename of an accepted entry of the second contributor (their own working copy). */
let ownId: string;

type Who = 'viewer' | 'contributor2' | 'author' | 'curator';
const RESTRICTED: Who[] = ['viewer', 'contributor2'];
const FULL: Who[] = ['author', 'curator'];

async function ok<T extends { status: number; body: unknown }>(promise: Promise<T>): Promise<T> {
  const response = await promise;
  if (response.status >= 300) throw new Error(`setup step failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response;
}

async function pendingRename(author: LibraryWorld['author'], id: string, change: { formula?: string; name: string; kind?: string }) {
  const before = complexDetailSchema.parse((await ok(author.get(`/api/complexes/${id}`))).body);
  const renamed = complexDetailSchema.parse(
    (await ok(author.patch(`/api/complexes/${id}`, { version: before.version, name: change.name, ...(change.formula ? { formula: change.formula } : {}) }))).body,
  );
  let current = renamed;
  const measurement = renamed.measurements[0];
  if (change.kind && measurement) {
    current = complexDetailSchema.parse(
      (await ok(author.patch(`/api/complexes/${id}/measurements/${measurement.id}`, { version: renamed.version, kind: change.kind, citation: null }))).body,
    );
  }
  await ok(author.post(`/api/complexes/${id}/submit`, { version: current.version }));
}

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'published');
  // Accepted content: [Cr(H2O)6]3+ with a cited water-exchange measurement (fixture values from
  // Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267; only the kind and the citation matter here).
  const created = await createEntry(w.author, w.groupId, { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III) Larkspur stock', measurements: [measurementInput()] });
  entryId = created.id;
  await ok(w.author.post(`/api/complexes/${entryId}/submit`));
  await ok(w.curator.post(`/api/complexes/${entryId}/reviews`, { decision: 'accept', comment: 'checked against the cited paper' }));
  accepted = complexDetailSchema.parse((await ok(w.curator.get(`/api/complexes/${entryId}`))).body);
  // The pending edit: another species, another name, another measurement kind, no citation.
  await pendingRename(w.author, entryId, { formula: '[Ni(NH3)6]2+', name: 'quillwort nickel batch', kind: 'ligand-exchange' });
  pending = complexDetailSchema.parse((await ok(w.curator.get(`/api/complexes/${entryId}`))).body);

  const own = await createEntry(w.contributor2, w.groupId, { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III) second stock' });
  ownId = own.id;
  await ok(w.contributor2.post(`/api/complexes/${ownId}/submit`));
  await ok(w.curator.post(`/api/complexes/${ownId}/reviews`, { decision: 'accept', comment: 'checked' }));
  await pendingRename(w.contributor2, ownId, { name: 'marshwort chromium batch' });
}, 60_000);
afterAll(async () => {
  await t.close();
});

const ids = async (who: Who, query: Record<string, string | number | boolean>) => {
  const params = new URLSearchParams({ groupId: w.groupId, pageSize: '100', ...Object.fromEntries(Object.entries(query).map(([k, v]) => [k, String(v)])) });
  const response = await w[who].get(`/api/complexes?${params.toString()}`);
  if (response.status !== 200) throw new Error(`${response.status} ${JSON.stringify(response.body)}`);
  return complexListResponseSchema.parse(response.body);
};

describe('the fixture really differs between accepted and pending content', () => {
  it('every searched field changed in the pending edit', () => {
    expect(pending.hasPendingRevision).toBe(true);
    expect(pending.status).toBe('in-review');
    const acceptedKinds = accepted.measurements.map((m) => m.kind);
    const pendingKinds = pending.measurements.map((m) => m.kind);
    expect(acceptedKinds).toEqual(['water-exchange']);
    expect(pendingKinds).toEqual(['ligand-exchange']);
    expect(accepted.measurements[0]?.citation).not.toBeNull();
    expect(pending.measurements[0]?.citation).toBeNull();
    expect(pending.metal).not.toBe(accepted.metal);
    expect(pending.oxidationState).not.toBe(accepted.oxidationState);
    expect(pending.dElectrons).not.toBe(accepted.dElectrons);
    expect(pending.verdict).not.toBe(accepted.verdict);
    expect(pending.ligandIds).not.toEqual(accepted.ligandIds);
  });
});

/** One probe per search parameter: the accepted value and the pending one. */
const probes = () => {
  const ligand = (d: ComplexDetail, other: ComplexDetail) => d.ligandIds.find((l) => !other.ligandIds.includes(l))!;
  return [
    { param: 'q', accepted: 'hexaaquachromium', pending: 'quillwort' },
    { param: 'q', accepted: 'Larkspur stock', pending: 'nickel batch' },
    { param: 'metal', accepted: accepted.metal, pending: pending.metal },
    { param: 'oxidationState', accepted: accepted.oxidationState, pending: pending.oxidationState },
    { param: 'dCount', accepted: accepted.dElectrons, pending: pending.dElectrons },
    { param: 'verdict', accepted: accepted.verdict, pending: pending.verdict },
    { param: 'ligand', accepted: ligand(accepted, pending), pending: ligand(pending, accepted) },
    { param: 'measurementKind', accepted: 'water-exchange', pending: 'ligand-exchange' },
    { param: 'hasCitation', accepted: true, pending: false },
    { param: 'status', accepted: 'accepted', pending: 'in-review' },
  ];
};

describe('role matrix: viewer, contributor (not the author), author, curator', () => {
  it.each(RESTRICTED)('%s: nothing of the pending edit finds the entry; every accepted value does', async (who) => {
    for (const probe of probes()) {
      const byAccepted = await ids(who, { [probe.param]: probe.accepted });
      expect({ probe, found: byAccepted.items.some((i) => i.id === entryId) }).toEqual({ probe, found: true });
      const byPending = await ids(who, { [probe.param]: probe.pending });
      expect({ probe, found: byPending.items.some((i) => i.id === entryId) }).toEqual({ probe, found: false });
    }
  });

  it.each(FULL)('%s: searches the working copy (the pending edit finds it, the replaced values do not)', async (who) => {
    for (const probe of probes()) {
      const byPending = await ids(who, { [probe.param]: probe.pending });
      expect({ probe, found: byPending.items.some((i) => i.id === entryId) }).toEqual({ probe, found: true });
      const byAccepted = await ids(who, { [probe.param]: probe.accepted });
      expect({ probe, found: byAccepted.items.some((i) => i.id === entryId) }).toEqual({ probe, found: false });
    }
  });

  it.each(RESTRICTED)('%s: the list shows the accepted content, and the order follows the accepted name', async (who) => {
    const list = await ids(who, {});
    const item = list.items.find((i) => i.id === entryId);
    expect(item).toMatchObject({ name: accepted.name, formula: accepted.formula, status: 'accepted', measurementKinds: ['water-exchange'], hasCitation: true });
    const names = list.items.map((i) => i.name.toLowerCase());
    expect(names).toEqual([...names].sort());
  });

  it('a text search ranks restricted readers by the accepted text', async () => {
    const viewer = await ids('viewer', { q: 'hexaaquachromium Larkspur' });
    expect(viewer.items[0]?.id).toBe(entryId);
    expect(viewer.items[0]?.rank).toBe(1);
  });

  it('a contributor searches the working copy of their own entries and the accepted copy of the others', async () => {
    const own = await ids('contributor2', { q: 'marshwort' });
    expect(own.items.map((i) => i.id)).toEqual([ownId]);
    const others = await ids('contributor2', { q: 'quillwort' });
    expect(others.items.map((i) => i.id)).not.toContain(entryId);
    // The viewer sees neither pending rename.
    expect((await ids('viewer', { q: 'marshwort' })).total).toBe(0);
    expect((await ids('viewer', { q: 'second stock' })).items.map((i) => i.id)).toEqual([ownId]);
    // Totals count each entry once, in whichever copy the reader sees it.
    const all = await ids('contributor2', { q: 'chromium' });
    expect(new Set(all.items.map((i) => i.id)).size).toBe(all.items.length);
    expect(all.total).toBe(all.items.length);
  });

  it('the typo pass also runs over the accepted text only', async () => {
    const typo = await ids('viewer', { q: 'quillwurt' });
    expect(typo.items.map((i) => i.id)).not.toContain(entryId);
    const acceptedTypo = await ids('viewer', { q: 'hexaaquachromim' });
    expect(acceptedTypo.items.map((i) => i.id)).toContain(entryId);
  });
});

describe('the published columns follow the accepted snapshot', () => {
  it('stay on the accepted content while an edit is pending, and move on when it is accepted', async () => {
    const em = t.orm.em.fork();
    const read = async () =>
      (await em.execute<{ published_name: string; published_search_text: string; published_measurement_kinds: string[] }[]>(
        'select published_name, published_search_text, published_measurement_kinds from complex where id = ?',
        [entryId],
      ))[0]!;
    const before = await read();
    expect(before.published_name).toBe(accepted.name);
    expect(before.published_search_text).not.toMatch(/quillwort/);
    expect(before.published_measurement_kinds).toEqual(['water-exchange']);
    const current = complexDetailSchema.parse((await ok(w.curator.get(`/api/complexes/${entryId}`))).body);
    await ok(w.admin.post(`/api/complexes/${entryId}/reviews`, { decision: 'accept', version: current.version, comment: 'fine' }));
    const after = await read();
    expect(after.published_name).toBe(pending.name);
    expect(after.published_search_text).toMatch(/quillwort/);
    expect(after.published_measurement_kinds).toEqual(['ligand-exchange']);
    expect((await ids('viewer', { q: 'quillwort' })).items.map((i) => i.id)).toEqual([entryId]);
  });
});
