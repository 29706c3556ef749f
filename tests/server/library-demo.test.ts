import demoLibrary from '@/data/demo-library.json';
import { complexListResponseSchema, complexDetailSchema, measuredResponseSchema } from '@/lib/schemas/library';
import { seedDemo } from '@/server/db/seed';
import { DEMO_GROUPS, DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser } from './auth-helpers';
import { generateSyntheticEntries } from '@/server/modules/library/generate';

let t: TestApp;
let groupId: string;

beforeAll(async () => {
  t = await createTestApp();
  await seedDemo(t.orm);
  groupId = (await t.orm.em.fork().findOneOrFail(ResearchGroup, { name: DEMO_GROUPS.larkspur })).id;
}, 120_000);
afterAll(async () => {
  await t.close();
});

const signedIn = async (email: string) => {
  const browser = new Browser(t.app);
  await browser.signIn(email, DEMO_PASSWORD);
  return browser;
};

const RESEARCH_MARKERS = /from memory|CONFLICT|conflict:|secondary page|mirror|\/work\/|shared\/science|\b\w+\.json\b|https?:\/\/(?!doi\.org)|tripod|studylib|zhenzhi|datapdf|numerade|provenance:/i;

describe('the Larkspur demo library', () => {
  it('exports and shows clean references only: no research notes in CSV, BibTeX, RIS or entry pages', async () => {
    const curator = await signedIn('curator@larkspur.example.org');
    for (const path of ['library.csv', 'citations.bib', 'citations.ris']) {
      const response = await curator.get(`/api/exports/${path}?groupId=${groupId}`);
      expect(response.status).toBe(200);
      const text = response.text || Buffer.from(response.body as Buffer).toString('utf8');
      expect(text.length).toBeGreaterThan(100);
      expect(text).not.toMatch(RESEARCH_MARKERS);
    }
    const all = complexListResponseSchema.parse((await curator.get(`/api/complexes?groupId=${groupId}&pageSize=100`)).body);
    for (const item of all.items) {
      const detail = await curator.get(`/api/complexes/${item.id}`);
      expect(JSON.stringify(detail.body)).not.toMatch(RESEARCH_MARKERS);
    }
  });

  it('holds every entry of data/demo-library.json, a few in each workflow state', async () => {
    const curator = await signedIn('curator@larkspur.example.org');
    const all = complexListResponseSchema.parse((await curator.get(`/api/complexes?groupId=${groupId}&pageSize=100`)).body);
    expect(all.total).toBe(demoLibrary.complexes.length);
    const statuses = new Set(all.items.map((i) => i.status));
    for (const status of ['draft', 'in-review', 'accepted', 'returned', 'declined', 'retired']) expect(statuses).toContain(status);
    expect(all.items.some((i) => i.hasPendingRevision)).toBe(true);
    const queue = (await curator.get('/api/review-queue')).body as { total: number };
    expect(queue.total).toBeGreaterThanOrEqual(2);
  });

  it('uses DOIs only where the science reference files give one', () => {
    const dois = demoLibrary.citations.map((c) => c.doi).filter((d): d is string => typeof d === 'string').sort();
    // The DOIs printed in water_exchange.json (Rapaport 1988, Laurenczy 1991, Cusanelli 1996, Helm 1984,
    // Powell 1995, Can. J. Chem. 1973); no other citation of the demo carries one.
    expect(dois).toEqual(
      ['10.1002/hlca.19840670605', '10.1002/mrc.1260291311', '10.1021/ic00278a025', '10.1021/j100045a022', '10.1021/ja954071n', '10.1139/v73-123'].sort(),
    );
  });

  it('marks every value without a citation as invented or names where it was taken from', () => {
    for (const entry of demoLibrary.complexes) {
      for (const m of entry.measurements) {
        expect(typeof m.source).toBe('string');
        if (m.citation === null) expect(m.source.length).toBeGreaterThan(10);
        if (m.source.startsWith('Invented')) expect(m.notes).toContain('Invented demo value — Larkspur Coordination Lab (fictional)');
      }
    }
  });

  it('the visiting collaborator (viewer) finds cobalt ammines with "Co amm" and sees accepted entries only', async () => {
    const viewer = await signedIn('viewer@larkspur.example.org');
    const result = complexListResponseSchema.parse((await viewer.get(`/api/complexes?q=${encodeURIComponent('Co amm')}&pageSize=10`)).body);
    expect(result.items.slice(0, 5).every((i) => i.metal === 'Co' && i.ligandIds.includes('NH3'))).toBe(true);
    expect(result.items.every((i) => i.status === 'accepted')).toBe(true);
    // [Ni(H2O)6]2+ has an in-house edit pending: the viewer still sees the accepted snapshot.
    const ni = complexListResponseSchema.parse((await viewer.get(`/api/complexes?q=${encodeURIComponent('[Ni(H2O)6]2+')}`)).body).items[0]!;
    const detail = complexDetailSchema.parse((await viewer.get(`/api/complexes/${ni.id}`)).body);
    expect(detail.view).toBe('published');
    expect(detail.measurements.some((m) => (m.notes ?? '').includes('Invented'))).toBe(false);
  });

  it('measured meets predicted on the demo data: [Cr(H2O)6]3+ water exchange 2.4e-6 s-1', async () => {
    const viewer = await signedIn('viewer@larkspur.example.org');
    const body = measuredResponseSchema.parse((await viewer.get(`/api/groups/${groupId}/measured?formula=${encodeURIComponent('[Cr(OH2)6](ClO4)3')}`)).body);
    // k_ex = 2.4e-6 s-1 at 298 K: Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267 (water_exchange.json, recalled there).
    const kex = body.libraryMeasurements.find((m) => m.kind === 'water-exchange');
    expect(kex?.value).toBe(2.4e-6);
    expect(kex?.citation?.journal).toBe('Inorg. Chem.');
    expect(kex?.citation?.year).toBe(1985);
  });

  it('seeding again changes nothing', async () => {
    await seedDemo(t.orm);
    const curator = await signedIn('curator@larkspur.example.org');
    const all = complexListResponseSchema.parse((await curator.get(`/api/complexes?groupId=${groupId}&pageSize=100`)).body);
    expect(all.total).toBe(demoLibrary.complexes.length);
  });

  it('the benchmark generator adds N accepted, searchable entries to a group in one go', async () => {
    const fenwick = await t.orm.em.fork().findOneOrFail(ResearchGroup, { name: DEMO_GROUPS.fenwick });
    await generateSyntheticEntries(t.orm.em.fork(), { groupId: fenwick.id, count: 150 });
    const admin = await signedIn('fenwick-admin@fenwick.example.org');
    const all = complexListResponseSchema.parse((await admin.get(`/api/complexes?groupId=${fenwick.id}&pageSize=5`)).body);
    expect(all.total).toBe(150);
    const cobalt = complexListResponseSchema.parse((await admin.get(`/api/complexes?groupId=${fenwick.id}&metal=Co&measurementKind=water-exchange`)).body);
    expect(cobalt.items.every((i) => i.metal === 'Co' && i.measurementKinds.includes('water-exchange'))).toBe(true);
    // Nothing leaks into the Larkspur library.
    const curator = await signedIn('curator@larkspur.example.org');
    const larkspur = complexListResponseSchema.parse((await curator.get(`/api/complexes?groupId=${groupId}&pageSize=1`)).body);
    expect(larkspur.total).toBe(demoLibrary.complexes.length);
  });
});
