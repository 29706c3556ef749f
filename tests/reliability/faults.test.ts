import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { queryRows } from './helpers/database-state';
import { HttpClient, pool } from './helpers/http-client';
import { runLoad, summarise, type Persona } from './helpers/load-driver';
import { standInWebDir, startServerProcess, type ServerProcess } from './helpers/server-process';
import { startThrowawayCluster, type ThrowawayCluster } from './helpers/throwaway-cluster';

/**
 * Faults against the REAL server process over a PostgreSQL of this file's own:
 * PostgreSQL stopped in the middle of a load run (503 in the error shape, no hang, no crash,
 * recovery by itself — timed), and SIGKILL of the server in the middle of review transitions and
 * of a CSV import (after a restart nothing is half written and the audit trail matches the
 * revisions: every status change has its audit event and every audit event its revision).
 */
let cluster: ThrowawayCluster;
let dataDir: string;
let webDir: string;
let server: ServerProcess;

const start = (name: string) => startServerProcess({ name, databaseUrl: cluster.url, dataDir, webDir });

beforeAll(async () => {
  cluster = await startThrowawayCluster('faults');
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-data-'));
  webDir = standInWebDir();
  server = await start('server');
}, 180_000);

afterAll(async () => {
  await server?.kill('SIGKILL');
  await cluster?.remove();
  fs.rmSync(dataDir, { recursive: true, force: true });
  fs.rmSync(webDir, { recursive: true, force: true });
}, 60_000);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

async function personas(baseUrl: string): Promise<Persona[]> {
  const out: Persona[] = [];
  for (const [email, canWrite] of [['contributor@larkspur.example.org', true], ['curator@larkspur.example.org', true], ['viewer@larkspur.example.org', false]] as const) {
    const client = new HttpClient(baseUrl);
    await client.signIn(email, DEMO_PASSWORD);
    out.push({ email, cookie: client.cookie ?? '', canWrite });
  }
  return out;
}

it('answers 503 (never another 5xx, never a hang) while PostgreSQL is stopped mid-load, stays up, and recovers by itself', async () => {
  const LOAD_MS = 16_000;
  const STOP_AT_MS = 4_000;
  const DOWN_FOR_MS = 5_000;
  const load = runLoad({ servers: [server.baseUrl], personas: await personas(server.baseUrl), workers: 40, durationMs: LOAD_MS, timeoutMs: 15_000, tolerated: [503] });

  let restartedAt = 0;
  let recoveredAfterMs = -1;
  const fault = (async () => {
    await sleep(STOP_AT_MS);
    await cluster.stop();
    await sleep(DOWN_FOR_MS);
    await cluster.start();
    restartedAt = Date.now();
    // A signed-in read that needs the database, every 100 ms until it works again.
    const probe = new HttpClient(server.baseUrl, 10_000);
    await probe.signIn('viewer@larkspur.example.org', DEMO_PASSWORD).catch(() => {});
    for (let i = 0; i < 300; i += 1) {
      const health = await fetch(`${server.baseUrl}/api/health`, { signal: AbortSignal.timeout(5000) }).catch(() => null);
      if (health?.status === 200) {
        recoveredAfterMs = Date.now() - restartedAt;
        break;
      }
      await sleep(100);
    }
  })();
  const [report] = await Promise.all([load, fault]);
  const summary = summarise(report);
  const unavailable = report.samples.filter((s) => s.status === 503);
  const others = report.samples.filter((s) => s.status !== 503 && (s.status === 0 || s.status >= 400));
  const conflicts = report.conflictsAfterUnansweredChange;

  // Acknowledged writes (before, around and after the outage) are all there.
  const found = await queryRows<{ n: string }>(cluster.url, 'select count(*) as n from complex where id = any($1::uuid[])', [report.acknowledgedCreates]);
  console.log(
    `database stop: ${summary.requests} requests, statuses ${JSON.stringify(summary.byStatus)}, 503 ${unavailable.length}, ` +
      `slowest ${summary.maxMs} ms, recovered ${recoveredAfterMs} ms after PostgreSQL was back; ` +
      `creates acknowledged ${report.acknowledgedCreates.length} / found ${found[0]?.n}; 409 after an unanswered change ${conflicts}`,
  );
  expect(server.alive()).toBe(true);
  expect(unavailable.length).toBeGreaterThan(0);
  expect(unavailable.every((s) => s.errorCode === 'UNAVAILABLE')).toBe(true);
  // 409s are allowed only right after an unanswered change of the same entry (committed, then the read-back failed).
  expect(report.failures).toEqual([]);
  expect(others.length).toBe(conflicts);
  expect(summary.maxMs).toBeLessThan(10_000);
  expect(recoveredAfterMs).toBeGreaterThanOrEqual(0);
  expect(recoveredAfterMs).toBeLessThan(10_000);
  expect(Number(found[0]?.n)).toBe(report.acknowledgedCreates.length);
  // Safe retries: every create answered 503 (or not at all) is sent again with its Idempotency-Key,
  // as a client does after Retry-After. Those that had in fact committed must not be written twice.
  const names = report.unansweredCreates.map((u) => u.body.name);
  const committedBefore = await queryRows<{ name: string }>(cluster.url, 'select name from complex where name = any($1)', [names]);
  const retried = [];
  for (const unanswered of report.unansweredCreates) {
    retried.push((await unanswered.client.request('POST', '/api/complexes', unanswered.body, { headers: { 'Idempotency-Key': unanswered.key } })).status);
  }
  const duplicates = await queryRows<{ name: string; n: string }>(
    cluster.url,
    'select name, count(*) as n from complex where name = any($1) group by name having count(*) > 1',
    [names],
  );
  console.log(
    `retries after the outage: ${report.unansweredCreates.length} creates answered 503 or not at all, ${committedBefore.length} of them had committed; ` +
      `retried with their keys: ${retried.filter((s) => s === 201).length} × 201; duplicated by the retry: ${duplicates.length}`,
  );
  expect(retried.every((status) => status === 201)).toBe(true);
  expect(duplicates).toEqual([]);

  // And it really works again: a write after recovery.
  const after = new HttpClient(server.baseUrl);
  await after.signIn('contributor@larkspur.example.org', DEMO_PASSWORD);
  expect((await after.post('/api/complexes', { formula: '[Cr(H2O)6]3+', name: 'after the outage' })).status).toBe(201);
}, 120_000);

/** SQL over the entries whose name starts with `prefix`: every way revisions and audit events can disagree. */
async function auditInconsistencies(prefix: string): Promise<string[]> {
  const problems: string[] = [];
  const gaps = await queryRows<{ id: string; version: number; n: string; max: number }>(
    cluster.url,
    `select c.id, c.version, count(r.id) as n, max(r.number) as max
       from complex c left join complex_revision r on r.complex_id = c.id
      where c.name like $1 group by c.id, c.version
     having count(r.id) <> c.version or max(r.number) <> c.version or min(r.number) <> 1`,
    [`${prefix}%`],
  );
  for (const g of gaps) problems.push(`entry ${g.id}: version ${g.version} but ${g.n} revisions (max ${g.max})`);
  const statusMismatch = await queryRows<{ id: string }>(
    cluster.url,
    `select c.id from complex c join complex_revision r on r.complex_id = c.id and r.number = c.version
      where c.name like $1 and r.status <> c.status`,
    [`${prefix}%`],
  );
  for (const s of statusMismatch) problems.push(`entry ${s.id}: status differs from its latest revision`);
  // A status change (or the creation) without an audit event with that version …
  const unaudited = await queryRows<{ id: string; number: number }>(
    cluster.url,
    `select r.complex_id as id, r.number from complex_revision r
       join complex c on c.id = r.complex_id
       left join complex_revision p on p.complex_id = r.complex_id and p.number = r.number - 1
      where c.name like $1 and (p.id is null or p.status <> r.status)
        and not exists (select 1 from audit_event a where a.subject_id = r.complex_id::text and a.action like 'library.entry.%'
                          and (a.details->>'version')::int = r.number)`,
    [`${prefix}%`],
  );
  for (const u of unaudited) problems.push(`entry ${u.id}: revision ${u.number} changed the status without an audit event`);
  // … and an audit event without its revision.
  const orphans = await queryRows<{ id: string; action: string }>(
    cluster.url,
    `select a.subject_id as id, a.action from audit_event a join complex c on c.id::text = a.subject_id
      where c.name like $1 and a.action like 'library.entry.%'
        and not exists (select 1 from complex_revision r where r.complex_id = c.id and r.number = (a.details->>'version')::int)`,
    [`${prefix}%`],
  );
  for (const o of orphans) problems.push(`entry ${o.id}: audit event ${o.action} without its revision`);
  return problems;
}

it('SIGKILL in the middle of review transitions leaves every entry fully transitioned or not at all', async () => {
  const prefix = 'kill-transition';
  const contributor = new HttpClient(server.baseUrl);
  await contributor.signIn('contributor@larkspur.example.org', DEMO_PASSWORD);
  const curator = new HttpClient(server.baseUrl);
  await curator.signIn('curator@larkspur.example.org', DEMO_PASSWORD);
  const entries: { id: string; version: number }[] = [];
  await pool(Array.from({ length: 24 }, (_, i) => i), 6, async (i) => {
    const created = await contributor.post('/api/complexes', { formula: '[Co(NH3)5Cl]2+', name: `${prefix} ${i}` });
    expect(created.status).toBe(201);
    entries.push({ id: (created.body as { id: string }).id, version: (created.body as { version: number }).version });
  });

  // Each entry cycles: submit → return → edit → submit → accept → edit → … until the process dies.
  let acknowledged = 0;
  const cycle = async (entry: { id: string; version: number }) => {
    for (let step = 0; step < 1000; step += 1) {
      const result =
        step % 3 === 0
          ? await contributor.post(`/api/complexes/${entry.id}/submit`, { version: entry.version })
          : step % 3 === 1
            ? await curator.post(`/api/complexes/${entry.id}/reviews`, step % 2 === 0 ? { decision: 'accept', version: entry.version } : { decision: 'return', comment: 'tighten the temperature', version: entry.version })
            : await contributor.patch(`/api/complexes/${entry.id}`, { version: entry.version, notes: `step ${step}` });
      const body = result.body as { version?: number; complex?: { version: number } };
      const version = body.complex?.version ?? body.version;
      if (result.status >= 300 || typeof version !== 'number') throw new Error(`step ${step}: ${result.status} ${JSON.stringify(result.body).slice(0, 200)}`);
      entry.version = version;
      acknowledged += 1;
    }
  };
  const running = Promise.allSettled(entries.map(cycle));
  await sleep(2500);
  expect(server.alive()).toBe(true);
  await server.kill('SIGKILL');
  const outcomes = await running;
  // They stopped because the process died (no answer), not because the server refused something.
  for (const outcome of outcomes) {
    expect(outcome.status).toBe('rejected');
    if (outcome.status === 'rejected') expect(String(outcome.reason)).toMatch(/fetch failed|aborted|ECONNRESET|socket|other side closed/i);
  }

  server = await start('server (restarted)');
  const problems = await auditInconsistencies(prefix);
  const transitions = await queryRows<{ n: string }>(cluster.url, `select count(*) as n from complex_revision r join complex c on c.id = r.complex_id where c.name like $1 and r.number > 1`, [`${prefix}%`]);
  console.log(`kill mid-transition: ${acknowledged} transitions acknowledged before SIGKILL, ${transitions[0]?.n} stored, inconsistencies ${problems.length}`);
  expect(problems).toEqual([]);
  expect(Number(transitions[0]?.n)).toBeGreaterThanOrEqual(acknowledged);
  expect(acknowledged).toBeGreaterThan(0);
  // Every entry still reads and can move on from where it is.
  const again = new HttpClient(server.baseUrl);
  await again.signIn('curator@larkspur.example.org', DEMO_PASSWORD);
  for (const entry of entries) expect((await again.get(`/api/complexes/${entry.id}`)).status).toBe(200);
}, 180_000);

it('SIGKILL in the middle of a CSV import writes all rows or none', async () => {
  const contributor = new HttpClient(server.baseUrl);
  await contributor.signIn('contributor2@larkspur.example.org', DEMO_PASSWORD);
  const ROWS = 20_000;
  const lines = Array.from({ length: ROWS }, (_, i) => `kill-import-${i},[Cr(H2O)6]3+,kill-import hexaaquachromium(III) ${i},,water-exchange,${(1 + (i % 9)) * 1e-6},s-1,298.15`);
  const csv = `entry,formula,name,notes,kind,value,unit,temperature_K\n${lines.join('\n')}\n`;
  const countImported = async () => Number((await queryRows<{ n: string }>(cluster.url, "select count(*) as n from complex where name like 'kill-import %'"))[0]?.n);
  expect(await countImported()).toBe(0);

  const started = await contributor.request('POST', '/api/imports?fileName=kill.csv&duplicates=import', undefined, { raw: csv, headers: { 'Content-Type': 'text/csv' }, timeoutMs: 60_000 });
  expect(started.status).toBe(202);
  const jobId = (started.body as { id: string }).id;
  // Kill as soon as the job is writing (or, if it is quicker than the poll, whenever it is seen running).
  let lastState = '';
  for (let i = 0; i < 400; i += 1) {
    const job = await contributor.get(`/api/imports/${jobId}`);
    lastState = (job.body as { state: string }).state;
    if (lastState === 'importing' || lastState === 'succeeded' || lastState === 'failed') break;
    await sleep(25);
  }
  await server.kill('SIGKILL');
  server = await start('server (restarted after import kill)');
  const imported = await countImported();
  const entriesWithoutRevision = await queryRows<{ n: string }>(
    cluster.url,
    "select count(*) as n from complex c where c.name like 'kill-import %' and not exists (select 1 from complex_revision r where r.complex_id = c.id)",
  );
  const measurements = await queryRows<{ n: string }>(cluster.url, "select count(*) as n from measurement m join complex c on c.id = m.complex_id where c.name like 'kill-import %'");
  console.log(`kill mid-import: killed while "${lastState}", ${imported} of ${ROWS} entries stored afterwards (all or none)`);
  expect([0, ROWS]).toContain(imported);
  expect(Number(measurements[0]?.n)).toBe(imported);
  expect(Number(entriesWithoutRevision[0]?.n)).toBe(0);
  // The job is not left "running" for ever: it reads as failed once its heartbeat is old (or it succeeded).
  const job = (await queryRows<{ state: string }>(cluster.url, 'select state from import_job where id = $1', [jobId]))[0];
  if (imported === 0) expect(['queued', 'validating', 'importing', 'failed']).toContain(job?.state);
  else expect(job?.state).toBe('succeeded');
}, 180_000);
