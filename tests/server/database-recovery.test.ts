import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '@/server/app';
import { startPrivateCluster, findPostgresBinaries, type PrivateCluster } from '@/server/db/cluster';
import { openOrm, type Orm } from '@/server/db/orm';

/** A cluster of its own, so stopping it does not disturb the other test files. */
let dir: string;
let cluster: PrivateCluster;
let orm: Orm;

beforeAll(async () => {
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-recovery-'));
  fs.chmodSync(dir, 0o755);
  cluster = await startPrivateCluster(dir, { database: 'recovery', throwaway: true });
  orm = await openOrm(cluster.url);
}, 60_000);

afterAll(async () => {
  await orm?.close(true);
  await cluster?.stop().catch(() => {});
  fs.rmSync(dir, { recursive: true, force: true });
});

it('answers 503 while PostgreSQL is stopped and recovers by itself when it returns', async () => {
  const app = createApp({ orm });
  expect((await request(app).get('/api/health')).status).toBe(200);

  await cluster.stop();
  const down = await request(app).get('/api/health');
  expect(down.status).toBe(503);
  expect(down.body.db).toBe('down');

  // Start it again by hand (same folder: the cluster and its data are reused).
  cluster = await startPrivateCluster(dir, { database: 'recovery', throwaway: true });
  let status = 0;
  for (let attempt = 0; attempt < 20 && status !== 200; attempt += 1) {
    status = (await request(app).get('/api/health')).status;
    if (status !== 200) await new Promise((r) => setTimeout(r, 250));
  }
  expect(status).toBe(200);
}, 60_000);

it('says which Debian package to install when the binaries are missing', () => {
  const empty = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-no-pg-'));
  try {
    expect(() => findPostgresBinaries(empty)).toThrow(/Debian package "postgresql"/);
  } finally {
    fs.rmSync(empty, { recursive: true, force: true });
  }
  expect(findPostgresBinaries()).toMatch(/\/usr\/lib\/postgresql\/\d+\/bin$/);
});
