import { importJobSchema } from '@/lib/schemas/exchange';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, type LibraryWorld } from '../factories/library-world';
import { libraryCounts, upload, waitForJob } from './exchange-helpers';

let t: TestApp;
let w: LibraryWorld;
beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'bulk');
});
afterAll(async () => {
  await t.close();
});

/** 10 000 rows: 5 000 entries with 2 measurements each, over a handful of textbook formulas. */
function bigCsv(rows: number): string {
  const formulas = ['[Cr(H2O)6]3+', '[Co(NH3)6]3+', '[Ni(H2O)6]2+', '[Rh(H2O)6]3+', '[Co(en)2(NO2)Cl]NO3', 'K3[Cr(ox)3]·3H2O'];
  const lines = ['entry,formula,name,kind,value,unit,temperature_K,doi,authors,journal,year'];
  for (let i = 0; i < rows; i += 1) {
    const entry = Math.floor(i / 2);
    const formula = formulas[entry % formulas.length];
    const measurement = i % 2 === 0 ? `water-exchange,${(1 + (i % 97)) * 1e-6},s-1,298.15` : `activation-enthalpy,${60 + (i % 50)},kJ/mol,`;
    lines.push(`${entry},"${formula}",bulk entry ${entry},${measurement},10.5555/bulk.${entry % 300},"A. Author, B. Writer",J. Demo Chem.,2001`);
  }
  return `${lines.join('\n')}\n`;
}

it('imports 10 000 rows in seconds (dry run, then the import, polled)', async () => {
  const csv = bigCsv(10_000);
  const before = await libraryCounts(t.orm);

  let started = performance.now();
  const dry = importJobSchema.parse((await upload(t.app, w.author, `/api/imports?groupId=${w.groupId}&dryRun=true&wait=true`, csv)).body);
  const dryMs = performance.now() - started;
  expect(dry).toMatchObject({ state: 'succeeded', entryCount: 5000, measurementCount: 10_000 });

  started = performance.now();
  const posted = await upload(t.app, w.author, `/api/imports?groupId=${w.groupId}`, csv);
  expect(posted.status).toBe(202);
  const seen = new Set<string>();
  const job = await waitForJob(w.author, posted.body.id, 120_000);
  const importMs = performance.now() - started;
  seen.add(job.state);
  expect(job).toMatchObject({ state: 'succeeded', entryCount: 5000, measurementCount: 10_000 });

  const after = await libraryCounts(t.orm);
  expect(after.complex).toBe((before.complex ?? 0) + 5000);
  expect(after.measurement).toBe((before.measurement ?? 0) + 10_000);
  expect(after.citation).toBe((before.citation ?? 0) + 300);
  console.log(`[bench] 10 000 CSV rows (5 000 entries): dry run ${Math.round(dryMs)} ms, import ${Math.round(importMs)} ms (POST to finished job, polled)`);
  // Generous bounds for a 2-core machine; the measured figures are printed above.
  expect(dryMs).toBeLessThan(20_000);
  expect(importMs).toBeLessThan(30_000);
}, 120_000);
