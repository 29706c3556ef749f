import request from 'supertest';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { complexDetailSchema, complexListResponseSchema, measuredResponseSchema, ligandsResponseSchema, citationSchema } from '@/lib/schemas/library';
import { createTestApp, type TestApp } from '../setup/test-app';
import { laurenczy1991, measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';

let t: TestApp;
let w: LibraryWorld;
const ids: Record<string, string> = {};

/** Entries (all accepted unless noted) spanning metals, ammines and aqua ions. */
const entries: { key: string; formula: string; name: string; accept?: boolean; measurements?: unknown[] }[] = [
  { key: 'coHexaammine', formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III)' },
  { key: 'coChloro', formula: '[Co(NH3)5Cl]2+', name: 'pentaamminechloridocobalt(III)' },
  { key: 'coAqua', formula: '[Co(H2O)6]2+', name: 'hexaaquacobalt(II)' },
  { key: 'crAmmine', formula: '[Cr(NH3)6]3+', name: 'hexaamminechromium(III)' },
  { key: 'crAqua', formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)', measurements: [measurementInput()] },
  {
    key: 'rhAqua',
    formula: '[Rh(H2O)6]3+',
    name: 'hexaaquarhodium(III)',
    // k_ex = 2.2e-9 s-1 at 298 K (Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45; water_exchange.json).
    measurements: [measurementInput({ value: 2.2e-9, citation: laurenczy1991 })],
  },
  { key: 'niAmmine', formula: '[Ni(NH3)6]2+', name: 'hexaamminenickel(II)' },
  { key: 'coEnDraft', formula: '[Co(en)3]3+', name: 'tris(ethane-1,2-diamine)cobalt(III)', accept: false },
];

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'search');
  for (const e of entries) {
    const created = await createEntry(w.author, w.groupId, { formula: e.formula, name: e.name, measurements: e.measurements ?? [] });
    ids[e.key] = created.id;
    if (e.accept === false) continue;
    await w.author.post(`/api/complexes/${created.id}/submit`);
    const accepted = await w.curator.post(`/api/complexes/${created.id}/reviews`, { decision: 'accept' });
    if (accepted.status !== 201) throw new Error(JSON.stringify(accepted.body));
  }
  // The other group holds a cobalt ammine of its own.
  const foreign = await w.outsider.post('/api/complexes', { groupId: w.otherGroupId, formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III) — Fenwick copy' });
  ids.foreign = (foreign.body as { id: string }).id;
});
afterAll(async () => {
  await t.close();
});

const search = async (who: keyof Pick<LibraryWorld, 'viewer' | 'author' | 'curator' | 'outsider'>, query: string) => {
  const response = await w[who].get(`/api/complexes?${query}`);
  if (response.status !== 200) throw new Error(`${response.status} ${JSON.stringify(response.body)}`);
  return complexListResponseSchema.parse(response.body);
};

describe('text search', () => {
  it('"Co amm" finds the cobalt ammines first', async () => {
    const result = await search('viewer', `groupId=${w.groupId}&q=${encodeURIComponent('Co amm')}`);
    const top = result.items.slice(0, 2).map((i) => i.id).sort();
    expect(top).toEqual([ids.coHexaammine, ids.coChloro].sort());
    const ranks = result.items.map((i) => i.rank ?? 0);
    expect([...ranks].sort((a, b) => b - a)).toEqual(ranks);
    // Partial matches (cobalt without ammine, ammines of other metals) rank below.
    const crIndex = result.items.findIndex((i) => i.id === ids.crAmmine);
    if (crIndex >= 0) expect(crIndex).toBeGreaterThanOrEqual(2);
  });

  it('finds by element name, ligand name, and formula', async () => {
    const byName = await search('viewer', `q=rhodium`);
    expect(byName.items[0]?.id).toBe(ids.rhAqua);
    const byFormula = await search('viewer', `q=${encodeURIComponent('[Cr(H2O)6]3+')}`);
    expect(byFormula.items[0]?.id).toBe(ids.crAqua);
    const typo = await search('viewer', `q=${encodeURIComponent('chromium amine')}`);
    expect(typo.items[0]?.id).toBe(ids.crAmmine);
  });

  it('viewers never see drafts; the author does', async () => {
    const viewer = await search('viewer', `q=${encodeURIComponent('cobalt en')}`);
    expect(viewer.items.map((i) => i.id)).not.toContain(ids.coEnDraft);
    const author = await search('author', `q=${encodeURIComponent('cobalt en')}`);
    expect(author.items.map((i) => i.id)).toContain(ids.coEnDraft);
  });
});

describe('filters combine, pages are stable', () => {
  it('metal + verdict + oxidation state + d count', async () => {
    const result = await search('viewer', `groupId=${w.groupId}&metal=Co&oxidationState=3&verdict=inert`);
    expect(result.items.map((i) => i.id).sort()).toEqual([ids.coHexaammine, ids.coChloro].sort());
    // Co(III) and Cr(III) ammines: d6 and d3 (common practice: electron counting).
    const d3 = await search('viewer', `dCount=3&ligand=NH3`);
    expect(d3.items.map((i) => i.id)).toEqual([ids.crAmmine]);
  });

  it('measurementKind and hasCitation', async () => {
    const measured = await search('viewer', `measurementKind=water-exchange&hasCitation=true`);
    expect(measured.items.map((i) => i.id).sort()).toEqual([ids.crAqua, ids.rhAqua].sort());
    const cited = await search('viewer', `hasCitation=false&metal=Cr`);
    expect(cited.items.map((i) => i.id)).toEqual([ids.crAmmine]);
  });

  it('status filter as the reader sees it', async () => {
    const drafts = await search('curator', `groupId=${w.groupId}&status=draft`);
    expect(drafts.items.map((i) => i.id)).toEqual([ids.coEnDraft]);
    const viewerDrafts = await search('viewer', `status=draft`);
    expect(viewerDrafts.total).toBe(0);
  });

  it('pagination: pageSize ≤ 100, pages do not overlap and cover the total', async () => {
    const all = await search('curator', `groupId=${w.groupId}&pageSize=100`);
    const pages = [];
    for (let page = 1; page <= Math.ceil(all.total / 3); page += 1) {
      pages.push(...(await search('curator', `groupId=${w.groupId}&pageSize=3&page=${page}`)).items.map((i) => i.id));
    }
    expect(pages).toEqual(all.items.map((i) => i.id));
    expect(all.total).toBe(entries.length);
    const tooBig = await w.curator.get('/api/complexes?pageSize=101');
    expect(tooBig.status).toBe(400);
    expect(apiErrorBodySchema.parse(tooBig.body).error.fields?.pageSize).toMatch(/at most 100/);
    const badVerdict = await w.curator.get('/api/complexes?verdict=slow');
    expect(badVerdict.status).toBe(400);
  });
});

describe('group isolation', () => {
  it('a member of another group gets 404 on our entries and never finds them', async () => {
    for (const key of ['coHexaammine', 'coEnDraft']) {
      expect((await w.outsider.get(`/api/complexes/${ids[key]}`)).status).toBe(404);
      expect((await w.outsider.get(`/api/complexes/${ids[key]}/revisions`)).status).toBe(404);
    }
    const theirs = await search('outsider', `q=${encodeURIComponent('Co amm')}`);
    expect(theirs.items.map((i) => i.id)).toEqual([ids.foreign]);
    const ours = await search('viewer', `q=${encodeURIComponent('Co amm')}`);
    expect(ours.items.map((i) => i.id)).not.toContain(ids.foreign);
    expect((await w.outsider.get(`/api/complexes?groupId=${w.groupId}`)).status).toBe(404);
    expect((await w.outsider.post('/api/complexes', { groupId: w.groupId, formula: '[Co(NH3)6]3+', name: 'x' })).status).toBe(404);
    expect((await w.outsider.get('/api/complexes/not-a-uuid')).status).toBe(404);
  });

  it('signed-out requests get 401', async () => {
    const response = await request(t.app).get('/api/complexes');
    expect(response.status).toBe(401);
  });
});

describe('validation: clear 400s, never 500', () => {
  const bad: [string, Record<string, unknown>, string, RegExp][] = [
    ['unparseable formula', { formula: '[Co(NH3)6', name: 'x' }, 'formula', /character \d+/],
    ['unknown ligand', { formula: '[Co(XYZ)6]3+', name: 'x' }, 'formula', /character \d+/],
    ['wrong unit for the kind', { formula: '[Cr(H2O)6]3+', name: 'x', measurements: [{ kind: 'self-exchange', value: 4, unit: 's-1' }] }, 'measurements.0.unit', /M-1 s-1/],
    ['negative rate constant', { formula: '[Cr(H2O)6]3+', name: 'x', measurements: [{ kind: 'water-exchange', value: -1, unit: 's-1' }] }, 'measurements.0.value', /greater than zero/],
    ['unknown unit', { formula: '[Cr(H2O)6]3+', name: 'x', measurements: [{ kind: 'reduction-potential', value: 0.7, unit: 'mV' }] }, 'measurements.0.unit', /"V"/],
    ['cross reaction without its partner', { formula: '[Co(NH3)5Cl]2+', name: 'x', measurements: [{ kind: 'cross-reaction', value: 6e5, unit: 'M-1 s-1' }] }, 'measurements.0.partnerFormula', /partner/],
    ['unreadable partner formula', { formula: '[Co(NH3)5Cl]2+', name: 'x', measurements: [{ kind: 'cross-reaction', value: 6e5, unit: 'M-1 s-1', partnerFormula: '[Cr(H2O6]2+' }] }, 'measurements.0.partnerFormula', /character \d+/],
    ['malformed DOI', { formula: '[Cr(H2O)6]3+', name: 'x', measurements: [{ kind: 'water-exchange', value: 1e-6, unit: 's-1', citation: { doi: '10.12/abc', authors: 'A. B.', journal: 'J.', year: 1990 } }] }, 'measurements.0.citation.doi', /10\./],
    ['missing name', { formula: '[Cr(H2O)6]3+' }, 'name', /.+/],
  ];
  it.each(bad.map(([label, body, field, message]) => ({ label, body, field, message })))('$label → 400 on $field', async ({ body, field, message }) => {
    const response = await w.author.post('/api/complexes', { groupId: w.groupId, ...body });
    expect(response.status).toBe(400);
    const error = apiErrorBodySchema.parse(response.body).error;
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(error.fields?.[field]).toMatch(message);
  });

  it('unit aliases are accepted and stored canonically; DOIs are de-duplicated per group', async () => {
    const first = await createEntry(w.author, w.groupId, {
      formula: '[Rh(H2O)5(OH)]2+',
      name: 'pentaaquahydroxidorhodium(III)',
      // k_ex = 4.2e-5 s-1 (Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45; water_exchange.json).
      measurements: [measurementInput({ value: 4.2e-5, unit: 's⁻¹', citation: { ...laurenczy1991, doi: 'https://doi.org/10.1002/MRC.1260291311' } })],
    });
    expect(first.measurements[0]?.unit).toBe('s-1');
    const listed = (await w.author.get(`/api/citations?groupId=${w.groupId}`)).body as { citations: unknown[] };
    const withDoi = listed.citations.map((c) => citationSchema.parse(c)).filter((c) => c.doi?.toLowerCase() === '10.1002/mrc.1260291311');
    expect(withDoi).toHaveLength(1);
    const again = await w.author.post('/api/citations', { groupId: w.groupId, ...laurenczy1991 });
    expect(again.status).toBe(200);
    expect(citationSchema.parse(again.body).id).toBe(withDoi[0]!.id);
  });
});

describe('measured meets predicted', () => {
  it('finds accepted measurements of the same complex by metal, oxidation state and ligand set', async () => {
    const response = await w.viewer.get(`/api/groups/${w.groupId}/measured?formula=${encodeURIComponent('[Rh(OH2)6](ClO4)3')}`);
    expect(response.status).toBe(200);
    const body = measuredResponseSchema.parse(response.body);
    expect(body.libraryMeasurements.map((m) => [m.complexId, m.kind, m.value])).toEqual([[ids.rhAqua, 'water-exchange', 2.2e-9]]);
    expect(body.libraryMeasurements[0]?.citation?.doi).toBe('10.1002/mrc.1260291311');
    const none = measuredResponseSchema.parse((await w.viewer.get(`/api/groups/${w.groupId}/measured?formula=${encodeURIComponent('[Rh(H2O)5Cl]2+')}`)).body);
    expect(none.libraryMeasurements).toEqual([]);
    expect((await w.outsider.get(`/api/groups/${w.groupId}/measured?formula=${encodeURIComponent('[Rh(H2O)6]3+')}`)).status).toBe(404);
    const bad = await w.viewer.get(`/api/groups/${w.groupId}/measured?formula=${encodeURIComponent('[Rh(H2O)6')}`);
    expect(bad.status).toBe(400);
  });
});

describe('ligand catalogue', () => {
  it('lists the reference ligands plus the group’s additions; only curators add', async () => {
    const reference = ligandsResponseSchema.parse((await w.viewer.get(`/api/ligands?groupId=${w.groupId}`)).body).ligands;
    // NH3 is "ammine" as a ligand (IUPAC nomenclature; data/ligands.json).
    expect(reference.find((l) => l.id === 'NH3')).toMatchObject({ name: 'ammine', origin: 'reference' });
    // An invented in-house ligand: real abbreviations may join the reference catalogue later.
    const ligand = { abbreviation: 'LkPyOx', name: 'Larkspur pyridyl-oxime (invented)', charge: 0, denticity: 3, donorAtoms: ['N', 'N', 'O'], source: 'Invented demo value — Larkspur Coordination Lab (fictional)' };
    expect((await w.author.post(`/api/groups/${w.groupId}/ligands`, ligand)).status).toBe(403);
    expect((await w.curator.post(`/api/groups/${w.groupId}/ligands`, ligand)).status).toBe(201);
    expect((await w.curator.post(`/api/groups/${w.groupId}/ligands`, ligand)).status).toBe(409);
    expect((await w.curator.post(`/api/groups/${w.groupId}/ligands`, { ...ligand, abbreviation: 'en' })).status).toBe(409);
    expect((await w.curator.post(`/api/groups/${w.groupId}/ligands`, { ...ligand, abbreviation: 'x2', donorAtoms: ['N'] })).status).toBe(400);
    const after = ligandsResponseSchema.parse((await w.viewer.get(`/api/ligands?groupId=${w.groupId}`)).body).ligands;
    expect(after.filter((l) => l.origin === 'group').map((l) => l.abbreviation)).toEqual(['LkPyOx']);
    const theirs = ligandsResponseSchema.parse((await w.outsider.get(`/api/ligands?groupId=${w.otherGroupId}`)).body).ligands;
    expect(theirs.some((l) => l.abbreviation === 'LkPyOx')).toBe(false);
    expect((await w.outsider.get(`/api/ligands?groupId=${w.groupId}`)).status).toBe(404);
  });
});

describe('the stored derived fields come from the engine', () => {
  it('formula edits re-derive metal, oxidation state and verdict', async () => {
    const entry = await createEntry(w.author, w.groupId, { formula: '[Cr(H2O)6]3+', name: 'to be changed' });
    const patched = complexDetailSchema.parse((await w.author.patch(`/api/complexes/${entry.id}`, { version: 1, formula: '[Ni(H2O)6]2+' })).body);
    // [Ni(H2O)6]2+: Ni(II), d8, labile (k_ex ≈ 3.2e4 s-1, Ducommun, Newman & Merbach 1980; water_exchange.json).
    expect(patched).toMatchObject({ metal: 'Ni', oxidationState: 2, dElectrons: 8, verdict: 'labile' });
  });
});
