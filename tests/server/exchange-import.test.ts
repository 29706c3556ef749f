import fs from 'node:fs';
import path from 'node:path';
import { importJobSchema } from '@/lib/schemas/exchange';
import { complexDetailSchema, revisionsResponseSchema } from '@/lib/schemas/library';
import { ABANDONED_AFTER_MS, failAbandonedImports } from '@/server/modules/exchange/import.service';
import { ImportJob } from '@/server/modules/exchange/import-job.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, type LibraryWorld } from '../factories/library-world';
import { libraryCounts, upload, waitForJob } from './exchange-helpers';

const fixture = (name: string) => fs.readFileSync(path.join(__dirname, '../fixtures', name));

let t: TestApp;
let w: LibraryWorld;
beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'imp');
});
afterAll(async () => {
  await t.close();
});

const importPath = (query: Record<string, string> = {}) => `/api/imports?${new URLSearchParams({ groupId: w.groupId, wait: 'true', ...query })}`;

describe('dry run', () => {
  it('reports every mistake with its row, column (as headed in the file) and message, and writes nothing', async () => {
    const before = await libraryCounts(t.orm);
    const response = await upload(t.app, w.author, importPath({ dryRun: 'true', fileName: 'mistakes.csv' }), fixture('import-mistakes.csv'));
    expect(response.status).toBe(200);
    const job = importJobSchema.parse(response.body);
    expect(job.state).toBe('failed');
    expect(job.dryRun).toBe(true);
    expect(job.total).toBe(7);
    // Synonym headers were recognised.
    expect(job.columns).toEqual(
      expect.arrayContaining([
        { header: 'Complex', column: 'formula' },
        { header: 'Compound name', column: 'name' },
        { header: 'Units', column: 'unit' },
        { header: 'Temperature (K)', column: 'temperature_K' },
      ]),
    );
    const at = (row: number) => job.errors.filter((e) => e.row === row);
    expect(at(2)).toEqual([]);
    // "[Co(NH3)6": the bracket is never closed; the engine says where.
    expect(at(3)).toHaveLength(1);
    expect(at(3)[0]).toMatchObject({ column: 'Complex' });
    expect(at(3)[0]?.position).toBeGreaterThan(0);
    expect(at(4)).toEqual([{ row: 4, column: 'Value', message: 'The value must be a number.' }]);
    expect(at(5)).toHaveLength(1);
    expect(at(5)[0]).toMatchObject({ column: 'Units' });
    expect(at(5)[0]?.message).toContain('s-1');
    expect(at(6).map((e) => e.column).sort()).toEqual(['Compound name', 'Temperature (K)']);
    expect(at(7)).toHaveLength(1);
    expect(at(7)[0]).toMatchObject({ column: 'Measurement' });
    expect(at(8)).toHaveLength(1);
    expect(at(8)[0]).toMatchObject({ column: 'Authors' });
    expect(job.errorCount).toBe(7);
    expect(await libraryCounts(t.orm)).toEqual(before);
  });

  it('says all is well for a valid file without writing it', async () => {
    const before = await libraryCounts(t.orm);
    const response = await upload(t.app, w.author, importPath({ dryRun: 'true' }), fixture('import-valid.csv'));
    const job = importJobSchema.parse(response.body);
    expect(job).toMatchObject({ state: 'succeeded', errorCount: 0, entryCount: 3, measurementCount: 3, complexIds: [] });
    expect(await libraryCounts(t.orm)).toEqual(before);
  });

  it('follows a mapping the person sends for headers it cannot guess', async () => {
    const csv = 'Ion,Label\n[Cr(H2O)6]3+,hexaaquachromium(III)\n';
    const refused = await upload(t.app, w.author, importPath({ dryRun: 'true' }), csv);
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.formula).toContain('No column for "formula"');
    const mapped = await upload(t.app, w.author, importPath({ dryRun: 'true', mapping: JSON.stringify({ formula: 'Ion', name: 'Label' }) }), csv);
    expect(mapped.status).toBe(200);
    expect(mapped.body.state).toBe('succeeded');
  });
});

describe('import', () => {
  it('writes every entry as submitted, with a revision and an audit event each, in one go; progress is polled', async () => {
    const before = await libraryCounts(t.orm);
    const response = await upload(t.app, w.author, `/api/imports?groupId=${w.groupId}&fileName=larkspur.csv`, fixture('import-valid.csv'));
    expect(response.status).toBe(202);
    expect(response.headers.location).toBe(`/api/imports/${response.body.id}`);
    const job = await waitForJob(w.author, response.body.id);
    expect(job).toMatchObject({ state: 'succeeded', entryCount: 3, measurementCount: 3, processed: 4, total: 4 });
    expect(job.complexIds).toHaveLength(3);
    const after = await libraryCounts(t.orm);
    expect(after.complex).toBe((before.complex ?? 0) + 3);
    expect(after.measurement).toBe((before.measurement ?? 0) + 3);
    expect(after.complex_revision).toBe((before.complex_revision ?? 0) + 3);
    // One audit event per entry, and one for the import.
    expect(after.audit_event).toBe((before.audit_event ?? 0) + 4);

    const rh = await Promise.all(job.complexIds.map(async (id) => complexDetailSchema.parse((await w.curator.get(`/api/complexes/${id}`)).body)));
    const rhodium = rh.find((c) => c.formula === '[Rh(H2O)6]3+');
    expect(rhodium?.status).toBe('in-review');
    expect(rhodium?.measurements.map((m) => [m.kind, m.value, m.unit])).toEqual([
      ['water-exchange', 2.2e-9, 's-1'],
      ['activation-enthalpy', 131, 'kJ/mol'],
    ]);
    // Both measurements share one citation record (de-duplicated by DOI).
    expect(new Set(rhodium?.measurements.map((m) => m.citation?.id)).size).toBe(1);
    expect(rhodium?.measurements[0]?.citation?.doi).toBe('10.1002/mrc.1260291311');
    const history = revisionsResponseSchema.parse((await w.curator.get(`/api/complexes/${rhodium?.id}/revisions`)).body);
    expect(history.revisions).toHaveLength(1);
    expect(history.revisions[0]?.message).toContain('larkspur.csv');
    // The imported entries wait in the curators' queue.
    const queue = (await w.curator.get('/api/review-queue')).body as { items: { id: string }[] };
    expect(queue.items.map((i) => i.id)).toEqual(expect.arrayContaining(job.complexIds));
  });

  it('the finished job names each entry it created (id, file row, formula, name, status); each opens for the contributor who imported it', async () => {
    const file = Buffer.from(
      [
        'entry,formula,name,kind,value,unit,temperature_K',
        'a,[Ni(H2O)6]2+,created list nickel,water-exchange,3.2e4,s-1,298.15',
        'b,[V(H2O)6]2+,created list vanadium,,,,',
        'b,[V(H2O)6]2+,created list vanadium,water-exchange,87,s-1,298.15',
        'c,[Mn(H2O)6]2+,created list manganese,,,,',
      ].join('\n') + '\n',
    );
    // [Ni(H2O)6]2+ 3.2e4 s-1 and [V(H2O)6]2+ 87 s-1 at 298 K: water exchange (Helm & Merbach, Chem. Rev. 2005, 105, 1923; from memory).
    const dry = importJobSchema.parse((await upload(t.app, w.author, importPath({ dryRun: 'true' }), file)).body);
    expect(dry.created).toEqual([]);
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath(), file)).body);
    expect(job.state).toBe('succeeded');
    expect(job.created.map(({ row, formula, name, status }) => ({ row, formula, name, status }))).toEqual([
      { row: 2, formula: '[Ni(H2O)6]2+', name: 'created list nickel', status: 'in-review' },
      { row: 3, formula: '[V(H2O)6]2+', name: 'created list vanadium', status: 'in-review' },
      { row: 5, formula: '[Mn(H2O)6]2+', name: 'created list manganese', status: 'in-review' },
    ]);
    expect(job.created.map((c) => c.id)).toEqual(job.complexIds);
    for (const entry of job.created) {
      const opened = await w.author.get(`/api/complexes/${entry.id}`);
      expect(opened.status).toBe(200);
      expect(complexDetailSchema.parse(opened.body)).toMatchObject({ formula: entry.formula, name: entry.name, status: 'in-review' });
    }
    // Polling later gives the same list.
    expect(importJobSchema.parse((await w.author.get(`/api/imports/${job.id}`)).body).created).toEqual(job.created);
  });

  it('an empty name cell takes the name suggested from the formula, said in the dry run; a formula it cannot name still needs one', async () => {
    const rows = [
      'entry,formula,name,kind,value,unit,temperature_K',
      'p,[PtCl4]2-,,,,,',
      'q,[Co(NH3)5Cl]2+,,substitution,1.7e-6,s-1,298.15',
      'q,[Co(NH3)5Cl]2+,,,,,',
      'r,[Ga(H2O)6]3+,named in file for suggestion test,,,,',
    ];
    // [Co(NH3)5Cl]2+ aquation 1.7e-6 s-1 at 298 K (Basolo & Pearson, Mechanisms of Inorganic Reactions, 2nd ed., 1967; from memory) — only needs to be valid here.
    const file = Buffer.from(rows.join('\n') + '\n');
    const dry = importJobSchema.parse((await upload(t.app, w.author, importPath({ dryRun: 'true' }), file)).body);
    expect(dry.state).toBe('succeeded');
    // IUPAC 2005 Recommendations, IR-9 (from memory): the names below.
    expect(dry.suggestedNames).toEqual([
      { row: 2, name: 'tetrachloridoplatinate(II)' },
      { row: 3, name: 'pentaamminechloridocobalt(III)' },
    ]);
    expect(dry.message).toMatch(/2 entries have no name and take the one suggested from the formula \(row 2, 3\)/);
    const job = importJobSchema.parse((await upload(t.app, w.author, importPath(), file)).body);
    expect(job.created.map((c) => [c.row, c.name])).toEqual([
      [2, 'tetrachloridoplatinate(II)'],
      [3, 'pentaamminechloridocobalt(III)'],
      [5, 'named in file for suggestion test'],
    ]);

    const unnamed = Buffer.from(['formula,name', '[Fe(Cp)2],'].join('\n') + '\n');
    const refused = importJobSchema.parse((await upload(t.app, w.author, importPath({ dryRun: 'true' }), unnamed)).body);
    expect(refused.state).toBe('failed');
    expect(refused.errors).toEqual([expect.objectContaining({ row: 2, column: 'name' })]);
    expect(refused.suggestedNames).toEqual([]);
  });

  it('a curator’s import names its created entries too; skipped repeats are left out of the list and stay in duplicates', async () => {
    const file = Buffer.from(['formula,name', '[Rh(NH3)5Cl]2+,curator created rhodium', '[Rh(NH3)5Cl]2+,curator created rhodium again'].join('\n') + '\n');
    const job = importJobSchema.parse((await upload(t.app, w.curator, importPath(), file)).body);
    expect(job.state).toBe('succeeded');
    expect(job.created.map((c) => [c.row, c.name])).toEqual([[2, 'curator created rhodium']]);
    expect(job.duplicates.map((d) => [d.row, d.choice, d.sameAsRow])).toEqual([[3, 'skip', 2]]);
  });

  it('is all or nothing: a mistake on the last row writes nothing at all', async () => {
    const good = fixture('import-valid.csv').toString('utf8').trimEnd();
    const csv = `${good}\n4,[Fe(H2O)6]3+,hexaaquairon(III),,water-exchange,160,M-1 s-1,298,,,,,,,,,,,,\n`;
    const before = await libraryCounts(t.orm);
    const response = await upload(t.app, w.author, importPath(), csv);
    const job = importJobSchema.parse(response.body);
    expect(job.state).toBe('failed');
    expect(job.errors).toEqual([expect.objectContaining({ row: 6, column: 'unit' })]);
    expect(await libraryCounts(t.orm)).toEqual(before);
  });
});

describe('files that cannot be read are refused before any row, and nothing is written', () => {
  const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
  const pdf = Buffer.from('%PDF-1.7\n1 0 obj\n<<>>\nendobj\n', 'latin1');
  const header = 'formula,name\n';
  // "hexaaquachromium" with a Latin-1 "é" (0xE9) — invalid in UTF-8 (RFC 3629).
  const latin1 = Buffer.concat([Buffer.from(`${header}[Cr(H2O)6]3+,hexaaquachromium(III) `), Buffer.from([0xe9]), Buffer.from('\n')]);
  const utf16NoBom = Buffer.from(`${header}[Cr(H2O)6]3+,x\n`, 'utf16le');
  const cases: [string, Buffer | string, number, string, RegExp][] = [
    ['a PNG image', png, 415, 'UNSUPPORTED_MEDIA', /PNG image/],
    ['a PDF document', pdf, 415, 'UNSUPPORTED_MEDIA', /PDF document/],
    ['Latin-1 text', latin1, 415, 'UNSUPPORTED_MEDIA', /not valid UTF-8: byte \d+ \(line 2\)/],
    ['UTF-16 without a BOM', utf16NoBom, 415, 'UNSUPPORTED_MEDIA', /UTF-16 text without a byte-order mark/],
    ['an empty file', '', 400, 'VALIDATION_FAILED', /empty/],
    ['a file without the needed headers', 'colour,mass\nred,12\n', 400, 'VALIDATION_FAILED', /No column for "formula"/],
    ['a header only', header, 400, 'VALIDATION_FAILED', /no data rows/],
    ['ragged rows', `${header}[Cr(H2O)6]3+,a\n[Co(NH3)6]3+,b,extra\n[Ni(H2O)6]2+\n`, 400, 'VALIDATION_FAILED', /2 row\(s\).*first is row 3/],
    ['an unclosed quote', `${header}[Cr(H2O)6]3+,"hexaaqua\n`, 400, 'VALIDATION_FAILED', /quoted cell is never closed/],
  ];
  it.each(cases)('%s', async (_what, body, status, code, message) => {
    const before = await libraryCounts(t.orm);
    const jobsBefore = await t.orm.em.fork().count(ImportJob, {});
    const response = await upload(t.app, w.author, importPath(), body);
    expect(response.status).toBe(status);
    expect(response.body.error.code).toBe(code);
    expect(response.body.error.message).toMatch(message);
    expect(await libraryCounts(t.orm)).toEqual(before);
    expect(await t.orm.em.fork().count(ImportJob, {})).toBe(jobsBefore);
  });

  it('lists every ragged row in the report', async () => {
    const response = await upload(t.app, w.author, importPath(), `${header}[Cr(H2O)6]3+,a\n[Co(NH3)6]3+,b,extra\n`);
    expect(response.body.error.issues).toEqual([expect.objectContaining({ row: 3, column: null })]);
  });

  it('a file over 5 MB → 413', async () => {
    const big = Buffer.alloc(5 * 1024 * 1024 + 1, 0x61);
    const response = await upload(t.app, w.author, importPath(), big);
    expect(response.status).toBe(413);
    expect(response.body.error.code).toBe('PAYLOAD_TOO_LARGE');
    expect(response.body.error.message).toContain('5 MB');
  });

  it('UTF-16 with its byte-order mark and UTF-8 with a BOM are read', async () => {
    const text = `${header}[Cr(H2O)6]3+,hexaaquachromium(III)\n`;
    const utf16 = Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from(text, 'utf16le')]);
    const utf8Bom = Buffer.concat([Buffer.from([0xef, 0xbb, 0xbf]), Buffer.from(text)]);
    for (const body of [utf16, utf8Bom]) {
      const response = await upload(t.app, w.author, importPath({ dryRun: 'true' }), body);
      expect(response.status).toBe(200);
      expect(response.body.state).toBe('succeeded');
    }
  });

  it('semicolon-separated files (European spreadsheets) are read', async () => {
    const response = await upload(t.app, w.author, importPath({ dryRun: 'true' }), 'formula;name\n[Cr(H2O)6]3+;hexaaquachromium(III)\n');
    expect(response.body.state).toBe('succeeded');
  });
});

describe('interrupted imports', () => {
  it('a job whose server stopped beating is reported failed, and marked so by the start-up sweep', async () => {
    const em = t.orm.em.fork();
    const old = new Date(Date.now() - ABANDONED_AFTER_MS - 1000);
    const job = em.create(ImportJob, {
      groupId: w.groupId, createdById: w.ids.author, fileName: 'killed.csv', dryRun: false, state: 'importing', processed: 10, total: 100,
      columns: [], errorCount: 0, errors: [], entryCount: 0, measurementCount: 0, complexIds: [], created: [], suggestedNames: [], message: null, heartbeatAt: old, finishedAt: null,
    });
    const fresh = em.create(ImportJob, {
      groupId: w.groupId, createdById: w.ids.author, fileName: 'running.csv', dryRun: false, state: 'importing', processed: 10, total: 100,
      columns: [], errorCount: 0, errors: [], entryCount: 0, measurementCount: 0, complexIds: [], created: [], suggestedNames: [], message: null, heartbeatAt: new Date(), finishedAt: null,
    });
    await em.flush();
    const polled = (await w.author.get(`/api/imports/${job.id}`)).body;
    expect(polled.state).toBe('failed');
    expect(polled.message).toContain('nothing was written');
    expect(await failAbandonedImports(t.orm)).toBe(1);
    const rows = await t.orm.em.fork().find(ImportJob, { id: { $in: [job.id, fresh.id] } });
    expect(Object.fromEntries(rows.map((r) => [r.fileName, r.state]))).toEqual({ 'killed.csv': 'failed', 'running.csv': 'importing' });
  });
});

describe('who may import and poll', () => {
  const cases: [string, keyof LibraryWorld | null, number][] = [
    ['signed out', null, 401],
    ['viewer', 'viewer', 403],
    ['contributor', 'author', 200],
    ['curator', 'curator', 200],
    ['admin', 'admin', 200],
    ['non-member', 'outsider', 404],
  ];
  it.each(cases)('POST /api/imports as %s → %s', async (_label, who, status) => {
    const browser = who ? (w[who] as LibraryWorld['author']) : null;
    const response = await upload(t.app, browser, importPath({ dryRun: 'true' }), 'formula,name\n[Cr(H2O)6]3+,x\n');
    expect(response.status).toBe(status);
  });

  it('GET /api/imports/:id: the creator and curators see it; other members, outsiders and strangers do not', async () => {
    const response = await upload(t.app, w.author, importPath({ dryRun: 'true' }), 'formula,name\n[Cr(H2O)6]3+,x\n');
    const id = response.body.id as string;
    expect((await w.author.get(`/api/imports/${id}`)).status).toBe(200);
    expect((await w.curator.get(`/api/imports/${id}`)).status).toBe(200);
    expect((await w.admin.get(`/api/imports/${id}`)).status).toBe(200);
    expect((await w.contributor2.get(`/api/imports/${id}`)).status).toBe(404);
    expect((await w.viewer.get(`/api/imports/${id}`)).status).toBe(404);
    expect((await w.outsider.get(`/api/imports/${id}`)).status).toBe(404);
    expect((await w.author.get('/api/imports/not-a-uuid')).status).toBe(404);
  });
});
