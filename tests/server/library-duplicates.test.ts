import { csvColumns, importJobSchema } from '@/lib/schemas/exchange';
import { complexDetailSchema, duplicatesResponseSchema, revisionsResponseSchema } from '@/lib/schemas/library';
import { Complex } from '@/server/modules/library/complex.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';
import { upload } from './exchange-helpers';

/**
 * The same species twice (same metal centre, oxidation state and ligand set, however written) is
 * caught: the form asks before a second entry is made, and an import reports duplicates — against
 * the library and within the file — and skips, merges or imports them as the person chooses.
 */
let t: TestApp;
let w: LibraryWorld;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'dupes');
});
afterAll(async () => {
  await t.close();
});

const HEADER = 'entry,formula,name,kind,value,unit,temperature_K';
// [V(H2O)6]3+ water exchange 5e2 s-1 (Helm & Merbach, Chem. Rev. 2005, 105, 1923 — order of magnitude, from memory);
// [Ni(NH3)6]2+ and [Mn(H2O)6]2+ only need to be valid species here.
const csv = (...rows: string[]) => Buffer.from([HEADER, ...rows].join('\n') + '\n');
const duplicatesOf = async (who: LibraryWorld['author'], formula: string, extra = '') =>
  duplicatesResponseSchema.parse((await who.get(`/api/complexes/duplicates?groupId=${w.groupId}&formula=${encodeURIComponent(formula)}${extra}`)).body)
    .duplicates;
const countNamed = (name: string) => t.orm.em.fork().count(Complex, { groupId: w.groupId, name });
const importPath = (query: Record<string, string>) => `/api/imports?${new URLSearchParams({ groupId: w.groupId, wait: 'true', ...query })}`;

describe('the form: GET /api/complexes/duplicates', () => {
  it('finds the same species however the formula is written, and only what the person may see', async () => {
    const entry = await createEntry(w.author, w.groupId, { formula: '[Fe(H2O)6]3+', name: 'hexaaquairon(III)' });
    for (const written of ['[Fe(H2O)6]3+', '[Fe(OH2)6]3+', '[Fe(H2O)6](ClO4)3']) {
      expect((await duplicatesOf(w.author, written)).map((d) => d.id)).toEqual([entry.id]);
    }
    expect(await duplicatesOf(w.author, '[Fe(H2O)6]2+')).toEqual([]);
    expect(await duplicatesOf(w.author, '[Fe(CN)6]3-')).toEqual([]);
    // A draft is the author's and the curators' to know about.
    expect((await duplicatesOf(w.curator, '[Fe(H2O)6]3+')).map((d) => d.id)).toEqual([entry.id]);
    expect(await duplicatesOf(w.viewer, '[Fe(H2O)6]3+')).toEqual([]);
    expect(await duplicatesOf(w.contributor2, '[Fe(H2O)6]3+')).toEqual([]);
    // Editing the entry itself is not a duplicate of itself.
    expect(await duplicatesOf(w.author, '[Fe(H2O)6]3+', `&exceptId=${entry.id}`)).toEqual([]);
  });

  it('a formula the engine cannot read is a 400 on the formula', async () => {
    const response = await w.author.get(`/api/complexes/duplicates?groupId=${w.groupId}&formula=${encodeURIComponent('[Qq(H2O)6]3+')}`);
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields ?? {})).toContain('formula');
  });
});

describe('CSV import', () => {
  it('a dry run reports duplicates against the library and within the file, and writes nothing', async () => {
    const existing = await createEntry(w.author, w.groupId, { formula: '[V(H2O)6]3+', name: 'hexaaquavanadium(III) dry' });
    const file = csv(
      '1,[V(OH2)6]3+,vanadium dry-run row,water-exchange,500,s-1,298.15',
      '2,[Ni(NH3)6]2+,nickel dry-run first,,,,',
      '3,[Ni(NH3)6](ClO4)2,nickel dry-run second,,,,',
    );
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ dryRun: 'true' }), file)).body);
    expect(job.state).toBe('succeeded');
    expect(job.duplicates).toEqual([
      expect.objectContaining({ row: 2, existing: expect.objectContaining({ id: existing.id }), sameAsRow: null, choice: 'skip' }),
      expect.objectContaining({ row: 4, existing: null, sameAsRow: 3, choice: 'skip' }),
    ]);
    expect(job.message).toMatch(/2 of them name a species already in the library or earlier in the file/);
    expect(await countNamed('nickel dry-run first')).toBe(0);
  });

  it('the same file imported four times makes its entries once (duplicates skipped by default)', async () => {
    const file = csv('1,[Mn(H2O)6]2+,repeat manganese,water-exchange,2.1e7,s-1,298.15', '2,[Ni(NH3)6]2+,repeat nickel,,,,');
    const jobs = [];
    for (let i = 0; i < 4; i += 1) jobs.push(importJobSchema.parse((await upload(t.app, w.author, importPath({}), file)).body));
    expect(jobs.map((j) => j.state)).toEqual(['succeeded', 'succeeded', 'succeeded', 'succeeded']);
    expect(await countNamed('repeat manganese')).toBe(1);
    expect(jobs[3]!.entryCount).toBe(0);
    expect(jobs[3]!.duplicates.map((d) => d.choice)).toEqual(['skip', 'skip']);
  });

  it('per row: merge into the existing entry (one revision), import anyway, or merge within the file', async () => {
    const existing = await createEntry(w.author, w.groupId, { formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III) merge target', measurements: [] });
    const file = csv(
      '1,[Co(NH3)6]Cl3,cobalt merge row,substitution,8.9e-7,s-1,298.15',
      '2,[Cr(NH3)6]3+,chromium first,,,,',
      '3,[Cr(NH3)6]3+,chromium second,water-exchange,5.2e-6,s-1,298.15',
      '4,[Cr(en)3]3+,ethylenediamine anyway,,,,',
    );
    // Row 2 (Co) merges into the library entry; row 4 (Cr, again) merges into row 3's entry.
    const choices = JSON.stringify({ 2: 'merge', 4: 'merge' });
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ duplicates: 'import', duplicateChoices: choices }), file)).body);
    expect(job.state).toBe('succeeded');
    expect(job.entryCount).toBe(2);
    const merged = complexDetailSchema.parse((await w.author.get(`/api/complexes/${existing.id}`)).body);
    expect(merged.measurements.map((m) => m.kind)).toEqual(['substitution']);
    const history = revisionsResponseSchema.parse((await w.author.get(`/api/complexes/${existing.id}/revisions`)).body).revisions;
    expect(history[0]!.message).toBe('Added a substitution measurement — Merged from a CSV import (row 2)');
    expect(await countNamed('chromium second')).toBe(0);
    const [chromium] = await t.orm.em.fork().find(Complex, { groupId: w.groupId, name: 'chromium first' });
    expect(chromium!.measurementKinds).toEqual(['water-exchange']);
  });

  it('import anyway writes a second entry of the same species', async () => {
    await createEntry(w.author, w.groupId, { formula: '[Ru(NH3)6]3+', name: 'ruthenium first' });
    const file = csv('1,[Ru(NH3)6]3+,ruthenium anyway,,,,');
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ duplicates: 'import' }), file)).body);
    expect(job.entryCount).toBe(1);
    expect(job.duplicates[0]!.choice).toBe('import');
    expect(await countNamed('ruthenium anyway')).toBe(1);
  });

  it('another contributor’s draft, invisible to the author, is not reported as a duplicate', async () => {
    await createEntry(w.contributor2, w.groupId, { formula: '[Cu(NH3)4]2+', name: 'copper of someone else' });
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ duplicates: 'merge' }), csv('1,[Cu(NH3)4]2+,copper of the author,,,,'))).body);
    expect(job.duplicates).toEqual([]);
    expect(await countNamed('copper of the author')).toBe(1);
  });

  it('a merge the person may not make fails the whole import with the row named, and writes nothing', async () => {
    const accepted = await createEntry(w.curator, w.groupId, { formula: '[Zn(H2O)6]2+', name: 'zinc accepted' });
    expect((await w.curator.post(`/api/complexes/${accepted.id}/submit`)).status).toBe(200);
    expect((await w.admin.post(`/api/complexes/${accepted.id}/reviews`, { decision: 'accept' })).status).toBe(201);
    const file = csv('1,[Ni(H2O)6]2+,nickel alongside,,,,', '2,[Zn(OH2)6]2+,zinc of the author,water-exchange,5e7,s-1,298.15');
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ duplicates: 'merge' }), file)).body);
    expect(job.state).toBe('failed');
    expect(job.message).toMatch(/Row 3: the measurements cannot be merged into the existing entry/);
    expect(await countNamed('nickel alongside')).toBe(0);
    const zinc = complexDetailSchema.parse((await w.curator.get(`/api/complexes/${accepted.id}`)).body);
    expect(zinc.measurements).toEqual([]);
    // The same rights as the form: this person's save of that entry is refused as well.
    const seen = complexDetailSchema.parse((await w.author.get(`/api/complexes/${accepted.id}`)).body);
    const save = { version: seen.version, formula: seen.formula, name: seen.name, notes: seen.notes, measurements: [{ kind: 'water-exchange', value: 5e7, unit: 's-1', temperatureK: 298.15 }] };
    expect((await w.author.put(`/api/complexes/${accepted.id}`, save)).status).toBe(403);
  });
});

describe('isomers are different species', () => {
  // cis- and trans-[PtCl2(NH3)2] are two compounds with different properties (common practice).
  it('the form: a formula with another stereo descriptor is no duplicate; the same one, or none, is', async () => {
    const cis = await createEntry(w.author, w.groupId, { formula: 'cis-[PtCl2(NH3)2]', name: 'cis-diamminedichloridoplatinum(II)' });
    expect(await duplicatesOf(w.author, 'trans-[PtCl2(NH3)2]')).toEqual([]);
    expect((await duplicatesOf(w.author, 'cis-[PtCl2(NH3)2]')).map((d) => d.id)).toEqual([cis.id]);
    // Without a descriptor the formula may name either isomer: the existing entry is offered.
    expect((await duplicatesOf(w.author, '[PtCl2(NH3)2]')).map((d) => d.id)).toEqual([cis.id]);
  });

  it('the import: cis and trans in one file, and trans against a cis entry, are not reported', async () => {
    await createEntry(w.author, w.groupId, { formula: 'cis-[PtCl2(NH3)2]', name: 'cis platinum for the import' });
    const file = csv('1,trans-[PtCl2(NH3)2],trans platinum imported,,,,', '2,fac-[Co(NH3)3(NO2)3],fac cobalt imported,,,,', '3,mer-[Co(NH3)3(NO2)3],mer cobalt imported,,,,');
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ duplicates: 'skip' }), file)).body);
    expect(job.state).toBe('succeeded');
    expect(job.duplicates).toEqual([]);
    expect(job.entryCount).toBe(3);
    const again = importJobSchema.parse((await upload(t.app, w.author, importPath({ duplicates: 'skip', dryRun: 'true' }), csv('1,mer-[Co(NH3)3(NO2)3],mer cobalt again,,,,'))).body);
    expect(again.duplicates.map((d) => d.existing?.name)).toEqual(['mer cobalt imported']);
  });
});

describe('kinds as people write them', () => {
  it('the form’s labels, in any case and with spaces or underscores, are read as kinds', async () => {
    const file = Buffer.from(
      'entry,formula,name,kind,value,unit,temperature_K\n' +
        '1,[Ga(H2O)6]3+,gallium label kind,Water exchange,4e2,s-1,298.15\n' +
        '1,[Ga(H2O)6]3+,gallium label kind,ACTIVATION_VOLUME,5,cm3/mol,298.15\n' +
        '2,[In(H2O)6]3+,indium bad kind,fast exchange,4e4,s-1,298.15\n',
    );
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ dryRun: 'true' }), file)).body);
    // Only the made-up kind is refused, on its own row.
    expect(job.errors.map((e) => [e.row, e.column])).toEqual([[4, 'kind']]);
  });
});

describe('the import template', () => {
  it('is a CSV of every column with an example entry that passes its own dry run', async () => {
    const response = await w.author.get('/api/imports/template.csv');
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toMatch(/text\/csv/);
    expect(response.headers['content-disposition']).toMatch(/attachment; filename="?sphereline-import-template.csv"?/);
    const text = response.text;
    expect(text.split('\r\n')[0]).toBe(csvColumns.join(','));
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath({ dryRun: 'true', duplicates: 'import' }), Buffer.from(text))).body);
    expect(job).toMatchObject({ state: 'succeeded', errorCount: 0, entryCount: 1, measurementCount: 1 });
  });
});
