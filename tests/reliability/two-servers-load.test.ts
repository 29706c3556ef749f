import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { queryRows } from './helpers/database-state';
import { HttpClient } from './helpers/http-client';
import { runLoad, summarise, type Persona } from './helpers/load-driver';
import { standInWebDir, startServerProcess, type ServerProcess } from './helpers/server-process';
import { startThrowawayCluster, type ThrowawayCluster } from './helpers/throwaway-cluster';

/**
 * Two REAL server processes (tsx server/index.ts) over one PostgreSQL, 200
 * concurrent connections spread over both for RELIABILITY_LOAD_SECONDS (default 15 s to keep the
 * suite within CI's few minutes on 2 cores; 30 s when run by hand with RELIABILITY_LOAD_SECONDS=30):
 * reads, searches, filters, classifications, creates and versioned edits by six signed-in people.
 * Then: 0 failed requests, 0 5xx, every acknowledged write found in the database; and the state
 * that must be shared really is (sessions, sign-in throttles, import progress, review transitions).
 */
const LOAD_SECONDS = Number(process.env.RELIABILITY_LOAD_SECONDS ?? 15);
const CONNECTIONS = 200;

let cluster: ThrowawayCluster;
let dataDir: string;
let webDir: string;
let a: ServerProcess;
let b: ServerProcess;

const people = [
  { email: 'contributor@larkspur.example.org', canWrite: true },
  { email: 'contributor2@larkspur.example.org', canWrite: true },
  { email: 'curator@larkspur.example.org', canWrite: true },
  { email: 'admin@larkspur.example.org', canWrite: true },
  { email: 'fenwick-admin@fenwick.example.org', canWrite: true },
  { email: 'viewer@larkspur.example.org', canWrite: false },
];

beforeAll(async () => {
  cluster = await startThrowawayCluster('two-servers');
  dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-data-'));
  webDir = standInWebDir();
  // A first (migrates and seeds), then B over the same database.
  a = await startServerProcess({ name: 'server A', databaseUrl: cluster.url, dataDir, webDir });
  b = await startServerProcess({ name: 'server B', databaseUrl: cluster.url, dataDir, webDir });
}, 180_000);

afterAll(async () => {
  await a?.kill('SIGTERM');
  await b?.kill('SIGTERM');
  await cluster?.remove();
  fs.rmSync(dataDir, { recursive: true, force: true });
  fs.rmSync(webDir, { recursive: true, force: true });
}, 60_000);

it(`serves ${CONNECTIONS} concurrent connections over two processes with no errors and loses no acknowledged write`, async () => {
  // Half the people sign in on A, half on B; every worker then uses its session on either process.
  const personas: Persona[] = [];
  for (const [i, person] of people.entries()) {
    const client = new HttpClient((i % 2 === 0 ? a : b).baseUrl);
    await client.signIn(person.email, DEMO_PASSWORD);
    personas.push({ email: person.email, cookie: client.cookie ?? '', canWrite: person.canWrite });
  }
  const report = await runLoad({ servers: [a.baseUrl, b.baseUrl], personas, workers: CONNECTIONS, durationMs: LOAD_SECONDS * 1000, timeoutMs: 30_000 });
  const summary = summarise(report);
  const perServer = [0, 1].map((s) => report.samples.filter((x) => x.server === s).length);

  // Every acknowledged create is stored; every acknowledged edit left its revision and the entry at least that version.
  const createdIds = report.acknowledgedCreates;
  const found = await queryRows<{ n: string }>(cluster.url, 'select count(*) as n from complex where id = any($1::uuid[])', [createdIds]);
  const foundCreates = Number(found[0]?.n ?? 0);
  const revisionRows = await queryRows<{ complex_id: string; number: number }>(
    cluster.url,
    'select complex_id, number from complex_revision where complex_id = any($1::uuid[])',
    [[...new Set(report.acknowledgedEditVersions.map((e) => e.id))]],
  );
  const revisions = new Set(revisionRows.map((r) => `${r.complex_id}#${r.number}`));
  const foundEdits = report.acknowledgedEditVersions.filter((e) => revisions.has(`${e.id}#${e.version}`)).length;
  const versions = await queryRows<{ id: string; version: number }>(cluster.url, 'select id, version from complex where id = any($1::uuid[])', [
    [...report.acknowledgedEdits.keys()],
  ]);
  const behind = versions.filter((row) => row.version < (report.acknowledgedEdits.get(row.id) ?? 0));

  console.log(
    `load (${CONNECTIONS} connections, ${LOAD_SECONDS} s, 2 processes): ${summary.requests} requests ` +
      `(A ${perServer[0]}, B ${perServer[1]}; ${Math.round(summary.requests / LOAD_SECONDS)}/s), statuses ${JSON.stringify(summary.byStatus)}, ` +
      `no answer ${summary.noAnswer}, 5xx ${summary.serverErrors}, p50 ${summary.p50Ms} ms, p99 ${summary.p99Ms} ms, max ${summary.maxMs} ms; ` +
      `creates acknowledged ${createdIds.length} / found ${foundCreates}; edits acknowledged ${report.acknowledgedEditVersions.length} / found ${foundEdits}`,
  );
  expect(report.failures).toEqual([]);
  expect(summary.serverErrors).toBe(0);
  expect(summary.noAnswer).toBe(0);
  expect(perServer[0]).toBeGreaterThan(0);
  expect(perServer[1]).toBeGreaterThan(0);
  expect(createdIds.length).toBeGreaterThan(50);
  expect(foundCreates).toBe(createdIds.length);
  expect(foundEdits).toBe(report.acknowledgedEditVersions.length);
  expect(behind).toEqual([]);
  expect(a.alive() && b.alive()).toBe(true);
}, 240_000);

describe('state shared between the two processes', () => {
  it('a session started on A works on B, and signing out on B ends it on A', async () => {
    const onA = new HttpClient(a.baseUrl);
    await onA.signIn('curator@larkspur.example.org', DEMO_PASSWORD);
    const onB = new HttpClient(b.baseUrl);
    onB.cookie = onA.cookie;
    expect((await onB.get('/api/auth/me')).status).toBe(200);
    expect((await onB.post('/api/auth/sign-out')).status).toBe(204);
    const afterOnA = await onA.get('/api/auth/me');
    expect(afterOnA.status).toBe(401);
    apiErrorBodySchema.parse(afterOnA.body);
  });

  it('sign-in failures on A count on B (throttle in the database, 5 per address)', async () => {
    const email = 'viewer@larkspur.example.org';
    const onA = new HttpClient(a.baseUrl);
    const onB = new HttpClient(b.baseUrl);
    for (let i = 0; i < 3; i += 1) expect((await onA.post('/api/auth/sign-in', { email, password: `wrong-${i}` })).status).toBe(401);
    for (let i = 0; i < 2; i += 1) expect((await onB.post('/api/auth/sign-in', { email, password: `wrong-b-${i}` })).status).toBe(401);
    // The sixth attempt — even with the right password — is refused on either process.
    const onBRight = await onB.post('/api/auth/sign-in', { email, password: DEMO_PASSWORD });
    expect(onBRight.status).toBe(429);
    expect(Number(onBRight.headers.get('retry-after'))).toBeGreaterThan(0);
    expect((await onA.post('/api/auth/sign-in', { email, password: DEMO_PASSWORD })).status).toBe(429);
  });

  it('an import started on A is followed to the end on B', async () => {
    const contributor = new HttpClient(a.baseUrl);
    await contributor.signIn('contributor@larkspur.example.org', DEMO_PASSWORD);
    const rows = Array.from({ length: 400 }, (_, i) => `two-servers-${i},[Co(NH3)5Cl]2+,pentaamminechloridocobalt(III) import ${i},,water-exchange,${(1 + (i % 9)) * 1e-6},s-1`);
    const csv = `entry,formula,name,notes,kind,value,unit\n${rows.join('\n')}\n`;
    const started = await contributor.request('POST', '/api/imports?fileName=two-servers.csv&duplicates=import', undefined, { raw: csv, headers: { 'Content-Type': 'text/csv' } });
    expect(started.status).toBe(202);
    const jobId = (started.body as { id: string }).id;
    const pollerOnB = new HttpClient(b.baseUrl);
    pollerOnB.cookie = contributor.cookie;
    type Job = { state: string; processed: number; total: number; entryCount: number };
    let job: Job | null = null as Job | null;
    const seenStates = new Set<string>();
    for (let attempt = 0; attempt < 120; attempt += 1) {
      const poll = await pollerOnB.get(`/api/imports/${jobId}`);
      expect(poll.status).toBe(200);
      job = poll.body as Job;
      seenStates.add(job?.state ?? '');
      if (job?.state === 'succeeded' || job?.state === 'failed') break;
      await new Promise((r) => setTimeout(r, 250));
    }
    expect(job?.state).toBe('succeeded');
    expect(job?.total).toBe(400);
    expect(job?.entryCount).toBe(400);
    const stored = await queryRows<{ n: string }>(cluster.url, "select count(*) as n from complex where name like 'pentaamminechloridocobalt(III) import %'");
    expect(Number(stored[0]?.n)).toBe(400);
  }, 60_000);

  it('a submission on A is reviewed on B, with one revision and one audit event per transition', async () => {
    const contributor = new HttpClient(a.baseUrl);
    await contributor.signIn('contributor2@larkspur.example.org', DEMO_PASSWORD);
    const created = await contributor.post('/api/complexes', { formula: '[Ni(en)3]2+', name: 'tris(ethylenediamine)nickel(II) two-server review' });
    expect(created.status).toBe(201);
    const { id, version } = created.body as { id: string; version: number };
    expect((await contributor.post(`/api/complexes/${id}/submit`, { version })).status).toBe(200);
    const curator = new HttpClient(b.baseUrl);
    await curator.signIn('curator@larkspur.example.org', DEMO_PASSWORD);
    const reviewed = await curator.post(`/api/complexes/${id}/reviews`, { decision: 'accept', version: version + 1 });
    expect(reviewed.status).toBe(201);
    // Seen as accepted from A too.
    expect(((await contributor.get(`/api/complexes/${id}`)).body as { status: string }).status).toBe('accepted');
    const revisions = await queryRows<{ number: number; kind: string; status: string }>(cluster.url, 'select number, kind, status from complex_revision where complex_id = $1 order by number', [id]);
    expect(revisions.map((r) => `${r.number}:${r.kind}:${r.status}`)).toEqual(['1:create:draft', '2:submit:in-review', '3:review:accepted']);
    const audit = await queryRows<{ action: string; version: number }>(cluster.url, "select action, (details->>'version')::int as version from audit_event where subject_id = $1 order by created_at", [id]);
    expect(audit.map((e) => `${e.version}:${e.action}`)).toEqual(['1:library.entry.created', '2:library.entry.submitted', '3:library.entry.accepted']);
  });
});
