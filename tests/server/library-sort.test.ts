import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { complexListResponseSchema } from '@/lib/schemas/library';
import { createTestApp, type TestApp } from '../setup/test-app';
import { laurenczy1991, measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';

/**
 * Column orders of the library list (`sort`, `dir`) and the `ids` filter. Every expected order is
 * written by hand from the entries below; ties are settled by the entry id (uuid order = the
 * lower-case text order of the ids).
 */
let t: TestApp;
let w: LibraryWorld;
const id: Record<'coIII' | 'crIII' | 'coII' | 'rhIII' | 'niDraft' | 'foreign', string> = {
  coIII: '',
  crIII: '',
  coII: '',
  rhIII: '',
  niDraft: '',
  foreign: '',
};

/** Rh(III): k_ex = 2.2 × 10⁻⁹ s⁻¹ at 298 K (Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45). */
const RH_K_EX = 2.2e-9;

const byId = (...ids: string[]) => [...ids].sort();

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'sort');
  const accept = async (entryId: string) => {
    await w.author.post(`/api/complexes/${entryId}/submit`);
    const accepted = await w.curator.post(`/api/complexes/${entryId}/reviews`, { decision: 'accept' });
    if (accepted.status !== 201) throw new Error(JSON.stringify(accepted.body));
  };
  // Made and accepted in this order, so "updated" runs coIII, crIII, coII, rhIII.
  id.coIII = (await createEntry(w.author, w.groupId, { formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III)' })).id;
  await accept(id.coIII);
  id.crIII = (await createEntry(w.author, w.groupId, { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)', measurements: [measurementInput()] })).id;
  await accept(id.crIII);
  id.coII = (await createEntry(w.author, w.groupId, { formula: '[Co(H2O)6]2+', name: 'hexaaquacobalt(II)' })).id;
  await accept(id.coII);
  id.rhIII = (
    await createEntry(w.author, w.groupId, {
      formula: '[Rh(H2O)6]3+',
      name: 'hexaaquarhodium(III)',
      measurements: [
        // The same measurement as a half-life, t½ = ln 2 / k_ex ≈ 3.15 × 10⁸ s, listed first:
        // water exchange still decides the headline rate.
        measurementInput({ kind: 'half-life', value: 3.15e8, unit: 's', citation: laurenczy1991 }),
        measurementInput({ value: RH_K_EX, citation: laurenczy1991 }),
      ],
    })
  ).id;
  await accept(id.rhIII);
  id.niDraft = (await createEntry(w.author, w.groupId, { formula: '[Ni(NH3)6]2+', name: 'hexaamminenickel(II)' })).id;
  id.foreign = ((await w.outsider.post('/api/complexes', { groupId: w.otherGroupId, formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III) elsewhere' })).body as { id: string }).id;
});
afterAll(async () => {
  await t.close();
});

const list = async (who: 'viewer' | 'curator', query: string) => {
  const response = await w[who].get(`/api/complexes?groupId=${w.groupId}&pageSize=50&${query}`);
  if (response.status !== 200) throw new Error(`${response.status} ${JSON.stringify(response.body)}`);
  return complexListResponseSchema.parse(response.body);
};
const order = async (who: 'viewer' | 'curator', query: string) => (await list(who, query)).items.map((item) => item.id);

describe('sort by a column', () => {
  it('orders by formula, name, metal and oxidation state, d count, measurements and the last change', async () => {
    // Formula text, code point by code point: "[Co(H" < "[Co(N" < "[Cr" < "[Rh".
    expect(await order('viewer', 'sort=formula')).toEqual([id.coII, id.coIII, id.crIII, id.rhIII]);
    expect(await order('viewer', 'sort=name')).toEqual([id.coIII, id.crIII, id.coII, id.rhIII]);
    // Co(II), Co(III), Cr(III), Rh(III).
    expect(await order('viewer', 'sort=metal')).toEqual([id.coII, id.coIII, id.crIII, id.rhIII]);
    // d3 Cr(III); d6 Co(III) and Rh(III) (tie → id); d7 Co(II).
    expect(await order('viewer', 'sort=dCount')).toEqual([id.crIII, ...byId(id.coIII, id.rhIII), id.coII]);
    // 0, 0 (tie → id), 1, 2 measurements.
    expect(await order('viewer', 'sort=measurements')).toEqual([...byId(id.coIII, id.coII), id.crIII, id.rhIII]);
    expect(await order('viewer', 'sort=updated')).toEqual([id.coIII, id.crIII, id.coII, id.rhIII]);
  });

  it('puts labile before inert (high-spin d7 Co(II) labile; d3 Cr(III), low-spin d6 Co(III) and Rh(III) inert — Taube, Chem. Rev. 1952, 50, 69)', async () => {
    expect(await order('viewer', 'sort=verdict')).toEqual([id.coII, ...byId(id.coIII, id.crIII, id.rhIII)]);
  });

  it('desc is the exact reverse of asc, ties included', async () => {
    for (const sort of ['formula', 'dCount', 'measurements', 'verdict', 'updated']) {
      const up = await order('viewer', `sort=${sort}&dir=asc`);
      const down = await order('viewer', `sort=${sort}&dir=desc`);
      expect(down).toEqual([...up].reverse());
    }
  });

  it('orders status in the workflow order for a curator (draft first), and the viewer never sees the draft', async () => {
    expect(await order('curator', 'sort=status')).toEqual([id.niDraft, ...byId(id.coIII, id.crIII, id.coII, id.rhIII)]);
    expect(await order('viewer', 'sort=status')).not.toContain(id.niDraft);
  });

  it('is right across pages: pages of two read the same order as one page', async () => {
    const whole = await order('curator', 'sort=name&dir=desc');
    expect(whole).toEqual([id.rhIII, id.coII, id.crIII, id.niDraft, id.coIII]);
    const paged: string[] = [];
    for (let page = 1; page <= 3; page += 1) {
      const response = await w.curator.get(`/api/complexes?groupId=${w.groupId}&sort=name&dir=desc&page=${page}&pageSize=2`);
      const body = complexListResponseSchema.parse(response.body);
      expect(body.total).toBe(5);
      paged.push(...body.items.map((item) => item.id));
    }
    expect(paged).toEqual(whole);
  });

  it('with search text, sorts the matches by the column instead of the rank', async () => {
    expect(await order('viewer', 'q=hexaaqua&sort=formula')).toEqual([id.coII, id.crIII, id.rhIII]);
    expect(await order('viewer', 'q=hexaaqua&sort=formula&dir=desc')).toEqual([id.rhIII, id.crIII, id.coII]);
  });

  it('refuses an unknown column or direction with a 400 naming the parameter', async () => {
    for (const [query, field] of [['sort=colour', 'sort'], ['sort=name&dir=up', 'dir'], ['sort=name;drop table complex', 'sort']] as const) {
      const response = await w.viewer.get(`/api/complexes?${query}`);
      expect(response.status).toBe(400);
      const body = apiErrorBodySchema.parse(response.body);
      expect(body.error.code).toBe('VALIDATION_FAILED');
      expect(Object.keys(body.error.fields ?? {})).toContain(field);
    }
  });
});

describe('headline rate', () => {
  it('is the water-exchange k (preferred to a half-life), and null without a rate measurement', async () => {
    const items = (await list('viewer', 'sort=name')).items;
    const rh = items.find((item) => item.id === id.rhIII);
    expect(rh?.headlineRate?.kind).toBe('water-exchange');
    expect(rh?.headlineRate?.kPerSecond).toBeCloseTo(RH_K_EX, 15);
    // Cr(III): k_ex = 2.4 × 10⁻⁶ s⁻¹ (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
    expect(items.find((item) => item.id === id.crIII)?.headlineRate?.kPerSecond).toBeCloseTo(2.4e-6, 12);
    expect(items.find((item) => item.id === id.coIII)?.headlineRate).toBeNull();
  });
});

describe('ids: only the chosen entries, of those the person may see', () => {
  it('lists the chosen visible entries and leaves out a draft and another group’s entry', async () => {
    const chosen = [id.coIII, id.rhIII, id.niDraft, id.foreign].join(',');
    expect(await order('viewer', `ids=${chosen}&sort=name`)).toEqual([id.coIII, id.rhIII]);
    // hexaamminecobalt < hexaamminenickel < hexaaquarhodium.
    expect(await order('curator', `ids=${chosen}&sort=name`)).toEqual([id.coIII, id.niDraft, id.rhIII]);
  });

  it('exports only the chosen entries the person may see (CSV, BibTeX)', async () => {
    const chosen = [id.crIII, id.niDraft, id.foreign].join(',');
    const csv = await w.viewer.get(`/api/exports/library.csv?ids=${chosen}`);
    expect(csv.status).toBe(200);
    expect(csv.text).toContain('[Cr(H2O)6]3+');
    expect(csv.text).not.toContain('[Ni(NH3)6]2+');
    expect(csv.text).not.toContain('elsewhere');
    expect(csv.text).not.toContain('[Rh(H2O)6]3+');
    const bib = await w.viewer.get(`/api/exports/citations.bib?ids=${id.rhIII}`);
    expect(bib.status).toBe(200);
    expect(bib.text).toContain('Laurenczy');
    expect(bib.text).not.toContain('Swaddle');
  });

  it('refuses ids that are not entry ids, and more than 200', async () => {
    expect((await w.viewer.get('/api/complexes?ids=1,2')).status).toBe(400);
    expect((await w.viewer.get('/api/exports/library.csv?ids=')).status).toBe(400);
    const many = Array.from({ length: 201 }, (_, i) => `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`).join(',');
    expect((await w.viewer.get(`/api/complexes?ids=${many}`)).status).toBe(400);
  });
});
