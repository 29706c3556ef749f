import { execFileSync } from 'node:child_process';
import { createHash, randomUUID } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { findPostgresBinaries } from '@/server/db/cluster';
import { seedDemo } from '@/server/db/seed';
import { Attachment } from '@/server/modules/attachments/attachment.entity';
import { Complex } from '@/server/modules/library/complex.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { adminQuery, requireDatabaseUrl, withDatabase } from '../setup/test-database';

/**
 * The backup the README prescribes (pg_dump in custom format, pg_restore into an empty database)
 * brings back every entry, measurement, citation, revision, review, attachment record, person,
 * group and membership, row for row.
 */
const TABLES = ['complex', 'measurement', 'citation', 'complex_revision', 'complex_review', 'attachment', 'app_user', 'research_group', 'group_membership'];

let t: TestApp;
let dumpDir: string;
const restoredName = `sphereline_restore_${randomUUID().slice(0, 8)}`;

beforeAll(async () => {
  t = await createTestApp();
  await seedDemo(t.orm);
  const em = t.orm.em.fork();
  const [entry] = await em.find(Complex, {}, { orderBy: { id: 'asc' }, limit: 1 });
  if (!entry) throw new Error('the demo seeded no entries');
  em.create(Attachment, {
    complex: entry.id,
    groupId: entry.groupId,
    objectKey: `attachments/${randomUUID()}`,
    fileName: 'spectrum.csv',
    kind: 'csv',
    contentType: 'text/csv',
    sizeBytes: 120,
    sha256: 'a'.repeat(64),
    description: 'UV–vis spectrum',
    uploadedById: null,
  });
  await em.flush();
  dumpDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-backup-'));
});
afterAll(async () => {
  await adminQuery(`drop database if exists "${restoredName}" with (force)`);
  if (dumpDir) fs.rmSync(dumpDir, { recursive: true, force: true });
  await t.close();
});

/** Row count and a digest of every row (as JSON, in primary-key order) of each table. */
async function fingerprint(url: string): Promise<Record<string, { rows: number; digest: string }>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const result: Record<string, { rows: number; digest: string }> = {};
    for (const table of TABLES) {
      const rows = (await client.query(`select to_jsonb(x) as row from "${table}" x order by 1`)).rows as { row: unknown }[];
      const digest = createHash('sha256').update(JSON.stringify(rows.map((r) => r.row))).digest('hex');
      result[table] = { rows: rows.length, digest };
    }
    return result;
  } finally {
    await client.end();
  }
}

it('pg_dump then pg_restore into a new database finds every entry, revision and attachment record', async () => {
  const bin = findPostgresBinaries();
  const dumpFile = path.join(dumpDir, 'sphereline.dump');
  execFileSync(path.join(bin, 'pg_dump'), ['--format=custom', `--file=${dumpFile}`, `--dbname=${t.databaseUrl}`]);
  expect(fs.statSync(dumpFile).size).toBeGreaterThan(1000);

  await adminQuery(`create database "${restoredName}"`);
  const restoredUrl = withDatabase(requireDatabaseUrl(), restoredName);
  execFileSync(path.join(bin, 'pg_restore'), ['--no-owner', '--exit-on-error', `--dbname=${restoredUrl}`, dumpFile]);

  const before = await fingerprint(t.databaseUrl);
  const after = await fingerprint(restoredUrl);
  expect(before.complex?.rows).toBeGreaterThan(10);
  expect(before.complex_revision?.rows).toBeGreaterThan(0);
  expect(before.attachment?.rows).toBe(1);
  expect(after).toEqual(before);
});
