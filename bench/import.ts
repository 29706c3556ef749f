/**
 * Section 4: CSV import of 10 000 rows (5 000 entries × 2 measurements) through the real app —
 * POST /api/imports?dryRun=true&wait=true, then POST /api/imports?wait=true — on a throwaway
 * database, signed in as a contributor of a fresh group. The CSV is the one the exchange bulk
 * test uses (tests/factories/bulk-import-csv.ts).
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { importJobSchema } from '@/lib/schemas/exchange';
import { createApp } from '@/server/app';
import { startPrivateCluster } from '@/server/db/cluster';
import { migrate, openOrm } from '@/server/db/orm';
import { upload } from '@/tests/server/exchange-helpers';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser } from '@/tests/server/auth-helpers';
import { bulkImportCsv } from '@/tests/factories/bulk-import-csv';
import { round } from './stats';

export const IMPORT_TARGET_SECONDS = 10;

export interface ImportBenchResult {
  rows: number;
  entries: number;
  measurements: number;
  dryRunSeconds: number;
  importSeconds: number;
  rowsPerSecond: number;
}

export async function runImportBenchOn(options: { rows?: number; log?: (line: string) => void } = {}): Promise<ImportBenchResult> {
  const rows = options.rows ?? 10_000;
  const log = options.log ?? (() => {});
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-bench-import-pg-'));
  fs.chmodSync(dir, 0o755);
  const cluster = await startPrivateCluster(dir, { database: 'sphereline_bench', throwaway: true });
  const orm = await openOrm(cluster.url);
  try {
    await migrate(orm);
    const app = createApp({ orm });
    const user = await makeUser(orm, 'bench.importer@larkspur.example.org', { displayName: 'bench importer' });
    const group = await makeGroup(orm, 'Larkspur Coordination Lab (import bench)', [{ userId: user.id, role: 'contributor' }]);
    const browser = new Browser(app);
    await browser.signIn('bench.importer@larkspur.example.org', FIXTURE_PASSWORD);
    const csv = bulkImportCsv(rows);
    log(`import: ${rows} CSV rows (${(csv.length / 1024).toFixed(0)} KB): dry run, then the import …`);

    let started = performance.now();
    const dryResponse = await upload(app, browser, `/api/imports?groupId=${group.id}&dryRun=true&wait=true&duplicates=import`, csv);
    const dryRunSeconds = (performance.now() - started) / 1000;
    const dry = importJobSchema.parse(dryResponse.body);
    if (dry.state !== 'succeeded') throw new Error(`import bench: the dry run ended ${dry.state}`);

    started = performance.now();
    const importResponse = await upload(app, browser, `/api/imports?groupId=${group.id}&wait=true&duplicates=import`, csv);
    const importSeconds = (performance.now() - started) / 1000;
    const job = importJobSchema.parse(importResponse.body);
    if (job.state !== 'succeeded') throw new Error(`import bench: the import ended ${job.state}`);
    return {
      rows,
      entries: job.entryCount,
      measurements: job.measurementCount,
      dryRunSeconds: round(dryRunSeconds, 2),
      importSeconds: round(importSeconds, 2),
      rowsPerSecond: round(rows / importSeconds),
    };
  } finally {
    await orm.close(true);
    await cluster.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
