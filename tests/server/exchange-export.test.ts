import fs from 'node:fs';
import path from 'node:path';
import { Cite } from '@citation-js/core';
import '@citation-js/plugin-bibtex';
import '@citation-js/plugin-ris';
import { parse } from 'csv-parse/sync';
import { csvColumns } from '@/lib/schemas/exchange';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, entryInState, type LibraryWorld } from '../factories/library-world';
import { measurementInput } from '../factories/library';
import { makeGroup } from './auth-helpers';
import { download, upload } from './exchange-helpers';

let t: TestApp;
let w: LibraryWorld;
beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'exp');
  const csv = fs.readFileSync(path.join(__dirname, '../fixtures/import-valid.csv'));
  const imported = await upload(t.app, w.author, `/api/imports?groupId=${w.groupId}&wait=true`, csv);
  if (imported.body.state !== 'succeeded') throw new Error(JSON.stringify(imported.body));
  // One entry made through the forms, accepted, so viewers have something to export.
  await entryInState(w, 'accepted', { formula: '[V(H2O)6]2+', name: 'hexaaquavanadium(II)', measurements: [measurementInput({ value: 87, citation: null })] });
}, 30_000);
afterAll(async () => {
  await t.close();
});

const rowsOf = (csv: string) => parse(csv, { columns: true }) as Record<string, string>[];
/** The rows without the entry label and the review state (imported entries wait for review). */
const withoutEntry = (rows: Record<string, string>[]) =>
  rows.map(({ entry: _entry, status: _status, ...rest }) => JSON.stringify(rest)).sort();

describe('CSV export', () => {
  it('writes the importer’s columns, one row per measurement, numbers as written', async () => {
    const response = await download(t.app, w.curator, `/api/exports/library.csv?groupId=${w.groupId}`);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toContain('text/csv');
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename="sphereline-library-\d{4}-\d{2}-\d{2}\.csv"$/);
    const text = (response.body as Buffer).toString('utf8');
    // The importer's columns with the review state after the name (the importer ignores it).
    expect(text.split('\r\n')[0]).toBe([...csvColumns.slice(0, 3), 'status', ...csvColumns.slice(3)].join(','));
    const rows = rowsOf(text);
    // 3 measurements + 1 entry without any (fixture) + the vanadium entry.
    expect(rows).toHaveLength(5);
    const chromium = rows.find((r) => r.formula === '[Cr(H2O)6]3+');
    // Xu, Krouse & Swaddle 1985 (water_exchange.json): 2.4e-6 s-1 at 298.15 K.
    expect(chromium).toMatchObject({ kind: 'water-exchange', value: '0.0000024', unit: 's-1', temperature_K: '298.15', journal: 'Inorg. Chem.', year: '1985' });
    expect(Number(chromium?.value)).toBe(2.4e-6);
  });

  it('round-trips: export → import into another group → export gives the same rows', async () => {
    const first = (await download(t.app, w.curator, `/api/exports/library.csv?groupId=${w.groupId}`)).body as Buffer;
    const second = await makeGroup(t.orm, 'Larkspur round-trip copy', [{ userId: w.ids.curator, role: 'curator' }]);
    const imported = await upload(t.app, w.curator, `/api/imports?groupId=${second.id}&wait=true`, first);
    expect(imported.body.state).toBe('succeeded');
    const again = (await download(t.app, w.curator, `/api/exports/library.csv?groupId=${second.id}`)).body as Buffer;
    expect(withoutEntry(rowsOf(again.toString('utf8')))).toEqual(withoutEntry(rowsOf(first.toString('utf8'))));
    expect(new Set(rowsOf(again.toString('utf8')).map((r) => r.status))).toEqual(new Set(['in-review']));
  });

  it('exports what the reader may see: a viewer gets the accepted entries only', async () => {
    const rows = rowsOf(((await download(t.app, w.viewer, `/api/exports/library.csv?groupId=${w.groupId}`)).body as Buffer).toString('utf8'));
    expect(rows.map((r) => r.formula)).toEqual(['[V(H2O)6]2+']);
  });

  it('honours the library filters', async () => {
    const rows = rowsOf(((await download(t.app, w.curator, `/api/exports/library.csv?groupId=${w.groupId}&metal=Rh`)).body as Buffer).toString('utf8'));
    expect(new Set(rows.map((r) => r.formula))).toEqual(new Set(['[Rh(H2O)6]3+']));
  });
});

describe('citations as BibTeX and RIS, read back by the same citation library', () => {
  // Expected values: the fixture's citations (Laurenczy et al. 1991; Xu, Krouse & Swaddle 1985 — water_exchange.json).
  const expectCitations = (items: { title?: string; DOI?: string; author?: { family?: string }[]; issued?: { 'date-parts': number[][] }; page?: string; volume?: string; 'container-title'?: string }[]) => {
    const rhodium = items.find((i) => i.DOI === '10.1002/mrc.1260291311');
    expect(rhodium?.title).toBe('Variable-pressure oxygen-17 NMR study of water exchange on hexaaquarhodium(III)');
    expect(rhodium?.author?.map((a) => a.family)).toEqual(['Laurenczy', 'Rapaport', 'Zbinden', 'Merbach']);
    expect(rhodium?.issued?.['date-parts'][0]?.[0]).toBe(1991);
    expect(rhodium?.volume).toBe('29');
    expect(rhodium?.page).toBe('S45-S51');
    expect(rhodium?.['container-title']).toBe('Magn. Reson. Chem.');
    const chromium = items.find((i) => i['container-title'] === 'Inorg. Chem.');
    expect(chromium?.author?.map((a) => a.family)).toEqual(['Xu', 'Krouse', 'Swaddle']);
    expect(chromium?.page).toBe('267-270');
    expect(items).toHaveLength(2);
  };

  it('BibTeX', async () => {
    const response = await download(t.app, w.curator, `/api/exports/citations.bib?groupId=${w.groupId}`);
    expect(response.status).toBe(200);
    expect(response.headers['content-disposition']).toContain('.bib');
    const text = (response.body as Buffer).toString('utf8');
    expect(text).toMatch(/^@article\{/m);
    expectCitations(new Cite(text).data);
  });

  it('RIS', async () => {
    const response = await download(t.app, w.curator, `/api/exports/citations.ris?groupId=${w.groupId}`);
    expect(response.status).toBe(200);
    const text = (response.body as Buffer).toString('utf8');
    expect(text).toMatch(/^TY {2}- JOUR/m);
    expectCitations(new Cite(text).data);
  });
});

describe('who may export', () => {
  const paths = ['/api/exports/library.csv', '/api/exports/citations.bib', '/api/exports/citations.ris'];
  const cases: [string, keyof LibraryWorld | null, number][] = [
    ['signed out', null, 401],
    ['viewer', 'viewer', 200],
    ['contributor', 'author', 200],
    ['curator', 'curator', 200],
    ['admin', 'admin', 200],
    ['non-member', 'outsider', 404],
  ];
  it.each(cases)('%s → %s', async (_label, who, status) => {
    for (const p of paths) {
      const response = await download(t.app, who ? (w[who] as LibraryWorld['author']) : null, `${p}?groupId=${w.groupId}`);
      expect(response.status).toBe(status);
    }
  });
});
