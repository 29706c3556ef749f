import { Cite } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import { parse } from 'csv-parse/sync';
import { citationSchema, complexDetailSchema, revisionDetailSchema, revisionsResponseSchema, type Citation } from '@/lib/schemas/library';
import { createTestApp, type TestApp } from '../setup/test-app';
import { laurenczy1991, measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';
import { download } from './exchange-helpers';

/**
 * Role matrix over exports, revision history and citations: restricted readers (a viewer, and a
 * contributor who is not the author) get only accepted content; the author and the curators
 * the working copy. Fixture values: Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267 (cited by
 * the accepted content) and Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45 (cited only by
 * a pending edit and by a draft); only who may see them is tested here.
 */

let t: TestApp;
let w: LibraryWorld;
type Who = 'viewer' | 'contributor2' | 'author' | 'curator';
const RESTRICTED: Who[] = ['viewer', 'contributor2'];
const FULL: Who[] = ['author', 'curator'];

/** Accepted, then a pending edit (renamed, another kind, cited to the 1991 paper) waiting for review. */
let pendingId: string;
/** Accepted; an edit declined (and the accepted content restored); another edit accepted. */
let historyId: string;
let declinedRevision: number;
let returnedRevision: number;

async function ok<T extends { status: number; body: unknown }>(promise: Promise<T>): Promise<T> {
  const response = await promise;
  if (response.status >= 300) throw new Error(`setup step failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response;
}
const detail = async (id: string) => complexDetailSchema.parse((await ok(w.curator.get(`/api/complexes/${id}`))).body);
const review = (id: string, decision: string, version: number) => ok(w.curator.post(`/api/complexes/${id}/reviews`, { decision, version, comment: 'checked against the paper' }));
const rename = async (id: string, name: string) => {
  const current = await detail(id);
  await ok(w.author.patch(`/api/complexes/${id}`, { version: current.version, name }));
  await ok(w.author.post(`/api/complexes/${id}/submit`, { version: current.version + 1 }));
  return current.version + 2;
};

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'vis');
  const a = await createEntry(w.author, w.groupId, { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III) Larkspur stock', measurements: [measurementInput()] });
  pendingId = a.id;
  await ok(w.author.post(`/api/complexes/${pendingId}/submit`));
  await review(pendingId, 'accept', 2);
  const accepted = await detail(pendingId);
  await ok(w.author.patch(`/api/complexes/${pendingId}`, { version: accepted.version, name: 'quillwort chromium batch' }));
  await ok(w.author.patch(`/api/complexes/${pendingId}/measurements/${accepted.measurements[0]!.id}`, { version: accepted.version + 1, kind: 'ligand-exchange', citation: laurenczy1991 }));
  await ok(w.author.post(`/api/complexes/${pendingId}/submit`, { version: accepted.version + 2 }));

  const b = await createEntry(w.author, w.groupId, { formula: '[Ni(H2O)6]2+', name: 'hexaaquanickel(II) stock' });
  historyId = b.id;
  await ok(w.author.post(`/api/complexes/${historyId}/submit`));
  await review(historyId, 'accept', 2);
  let version = await rename(historyId, 'marshwort nickel declined');
  declinedRevision = version - 1; // the submitted declined edit
  await review(historyId, 'decline', version);
  version = await rename(historyId, 'sedgewort nickel returned');
  await review(historyId, 'return', version);
  returnedRevision = version + 1;
  const current = await detail(historyId);
  await ok(w.author.patch(`/api/complexes/${historyId}`, { version: current.version, name: 'hexaaquanickel(II) second stock' }));
  await ok(w.author.post(`/api/complexes/${historyId}/submit`, { version: current.version + 1 }));
  await review(historyId, 'accept', current.version + 2);

  // A draft citing the 1991 paper only.
  await createEntry(w.author, w.groupId, { formula: '[Rh(H2O)6]3+', name: 'hexaaquarhodium(III) draft', measurements: [measurementInput({ value: 2.2e-9, citation: laurenczy1991 })] });
}, 60_000);
afterAll(async () => {
  await t.close();
});

const csvRows = async (who: Who, query = '') =>
  parse(((await download(t.app, w[who], `/api/exports/library.csv?groupId=${w.groupId}${query}`)).body as Buffer).toString('utf8'), { columns: true }) as Record<string, string>[];

describe('CSV and citation export', () => {
  it.each(RESTRICTED)('%s: accepted content only, with its status', async (who) => {
    const rows = await csvRows(who);
    const stock = rows.filter((r) => r.formula === '[Cr(H2O)6]3+');
    expect(stock.map((r) => [r.name, r.status, r.kind, r.journal])).toEqual([['hexaaquachromium(III) Larkspur stock', 'accepted', 'water-exchange', 'Inorg. Chem.']]);
    expect(rows.map((r) => r.name).join(' ')).not.toMatch(/quillwort|marshwort|sedgewort|draft/);
    expect(new Set(rows.map((r) => r.status))).toEqual(new Set(['accepted']));
    // Filtering by pending content finds nothing; by accepted content, the entry.
    expect(await csvRows(who, '&q=quillwort')).toEqual([]);
    expect(await csvRows(who, '&measurementKind=ligand-exchange')).toEqual([]);
    expect((await csvRows(who, '&q=Larkspur')).map((r) => r.name)).toEqual(['hexaaquachromium(III) Larkspur stock']);
  });

  it.each(FULL)('%s: the working copy, with its status', async (who) => {
    const rows = await csvRows(who);
    const stock = rows.filter((r) => r.formula === '[Cr(H2O)6]3+');
    expect(stock.map((r) => [r.name, r.status, r.kind, r.journal])).toEqual([['quillwort chromium batch', 'in-review', 'ligand-exchange', 'Magn. Reson. Chem.']]);
    expect(rows.some((r) => r.status === 'draft' && r.name === 'hexaaquarhodium(III) draft')).toBe(true);
  });

  it.each(RESTRICTED)('%s: BibTeX holds the accepted citation, not the one only pending or draft content cites', async (who) => {
    const bib = ((await download(t.app, w[who], `/api/exports/citations.bib?groupId=${w.groupId}`)).body as Buffer).toString('utf8');
    const items = new Cite(bib).data as { DOI?: string; 'container-title'?: string }[];
    expect(items.map((i) => i['container-title'])).toEqual(['Inorg. Chem.']);
    expect(bib).not.toContain(laurenczy1991.doi!);
  });

  it('the author’s BibTeX holds the pending edit’s citation', async () => {
    const bib = ((await download(t.app, w.author, `/api/exports/citations.bib?groupId=${w.groupId}`)).body as Buffer).toString('utf8');
    expect(bib).toContain(laurenczy1991.doi!);
  });
});

describe('revision history', () => {
  const revisions = async (who: Who) => revisionsResponseSchema.parse((await ok(w[who].get(`/api/complexes/${historyId}/revisions`))).body).revisions;

  it.each(RESTRICTED)('%s: only the accepted states, none of the declined or returned edits', async (who) => {
    const list = await revisions(who);
    expect(list.length).toBe(2);
    expect(list.every((r) => r.status === 'accepted' && r.kind === 'review')).toBe(true);
    for (const r of list) {
      const one = revisionDetailSchema.parse((await ok(w[who].get(`/api/complexes/${historyId}/revisions/${r.number}`))).body);
      expect(one.snapshot.name).toMatch(/^hexaaquanickel\(II\) (second )?stock$/);
    }
    expect(JSON.stringify(list)).not.toMatch(/marshwort|sedgewort|checked against/);
    for (const hidden of [1, declinedRevision, declinedRevision + 1, declinedRevision + 2, returnedRevision]) {
      expect((await w[who].get(`/api/complexes/${historyId}/revisions/${hidden}`)).status).toBe(404);
    }
    const [newer, older] = list;
    const diff = await w[who].get(`/api/complexes/${historyId}/revisions/diff?from=${older!.number}&to=${newer!.number}`);
    expect(diff.status).toBe(200);
    expect((await w[who].get(`/api/complexes/${historyId}/revisions/diff?from=${declinedRevision}&to=${newer!.number}`)).status).toBe(404);
  });

  it.each(FULL)('%s: every revision, the declined and returned edits included', async (who) => {
    const list = await revisions(who);
    expect(list.map((r) => r.number)).toEqual([...Array(list.length).keys()].map((i) => list.length - i));
    const declined = revisionDetailSchema.parse((await ok(w[who].get(`/api/complexes/${historyId}/revisions/${declinedRevision}`))).body);
    expect(declined.snapshot.name).toBe('marshwort nickel declined');
    const returned = revisionDetailSchema.parse((await ok(w[who].get(`/api/complexes/${historyId}/revisions/${returnedRevision}`))).body);
    expect(returned.status).toBe('returned');
  });
});

describe('citations', () => {
  const citations = async (who: Who) => ((await ok(w[who].get(`/api/citations?groupId=${w.groupId}`))).body as { citations: Citation[] }).citations;

  it.each(RESTRICTED)('%s: sees only citations of content they may see', async (who) => {
    const list = await citations(who);
    expect(list.map((c) => c.journal)).toEqual(['Inorg. Chem.']);
  });

  it.each(FULL)('%s: also sees the citation of the pending edit and the draft', async (who) => {
    const list = await citations(who);
    expect(list.map((c) => c.journal).sort()).toEqual(['Inorg. Chem.', 'Magn. Reson. Chem.']);
  });

  it('a contributor posting a DOI only hidden content cites gets the record id with their own fields, never the stored ones', async () => {
    const stored = (await citations('curator')).find((c) => c.doi === laurenczy1991.doi)!;
    const response = await w.contributor2.post('/api/citations', {
      groupId: w.groupId,
      doi: laurenczy1991.doi!.toUpperCase(),
      authors: 'G. Laurenczy et al.',
      journal: 'Magnetic Resonance in Chemistry',
      year: 1991,
    });
    expect(response.status).toBe(200);
    const body = citationSchema.parse(response.body);
    expect(body.id).toBe(stored.id);
    expect(body).toMatchObject({ authors: 'G. Laurenczy et al.', journal: 'Magnetic Resonance in Chemistry', title: null, volume: null, pages: null });
    expect(JSON.stringify(body)).not.toContain(stored.title!);
    // Still not listed for them: nothing they may see cites it.
    expect((await citations('contributor2')).map((c) => c.id)).not.toContain(stored.id);
  });

  it('the author posting the same DOI gets the stored record (their own entry cites it)', async () => {
    const response = await w.author.post('/api/citations', { groupId: w.groupId, doi: laurenczy1991.doi, authors: 'someone', journal: 'somewhere' });
    expect(response.status).toBe(200);
    expect(citationSchema.parse(response.body)).toMatchObject({ authors: laurenczy1991.authors, title: laurenczy1991.title });
  });

  it('a citation a contributor entered is listed for them', async () => {
    const created = await w.contributor2.post('/api/citations', { groupId: w.groupId, authors: 'A. Fenwright', journal: 'Larkspur Lab Notes', year: 2026 });
    expect(created.status).toBe(201);
    expect((await citations('contributor2')).map((c) => c.journal)).toContain('Larkspur Lab Notes');
    expect((await citations('viewer')).map((c) => c.journal)).not.toContain('Larkspur Lab Notes');
  });
});
