import request from 'supertest';
import type { Express } from 'express';
import { importJobSchema, type ImportJob } from '@/lib/schemas/exchange';
import type { Orm } from '@/server/db/orm';
import { SESSION_COOKIE, TEST_HOST, TEST_ORIGIN, type Browser } from './auth-helpers';

/** A raw-body upload as the app sends it (same origin, the browser's session cookie). */
export function upload(app: Express, who: Browser | null, path: string, body: Buffer | string, contentType = 'text/csv') {
  let req = request(app).post(path).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN).set('Content-Type', contentType);
  if (who?.cookie) req = req.set('Cookie', `${SESSION_COOKIE}=${who.cookie}`);
  return req.send(Buffer.isBuffer(body) ? body : Buffer.from(body, 'utf8'));
}

export function download(app: Express, who: Browser | null, path: string) {
  let req = request(app).get(path).set('Host', TEST_HOST);
  if (who?.cookie) req = req.set('Cookie', `${SESSION_COOKIE}=${who.cookie}`);
  return req.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

/** Polls GET /api/imports/:id until the job has finished. */
export async function waitForJob(who: Browser, id: string, timeoutMs = 60_000): Promise<ImportJob> {
  const started = Date.now();
  for (;;) {
    const response = await who.get(`/api/imports/${id}`);
    if (response.status !== 200) throw new Error(`poll: ${response.status} ${JSON.stringify(response.body)}`);
    const job = importJobSchema.parse(response.body);
    if (job.state === 'succeeded' || job.state === 'failed') return job;
    if (Date.now() - started > timeoutMs) throw new Error(`job ${id} still ${job.state}`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

/** Row counts of the tables an import writes, for "nothing was written" checks. */
export async function libraryCounts(orm: Orm) {
  const rows = await orm.em.fork().execute<{ table: string; n: string }[]>(
    `select 'complex' as table, count(*) as n from complex union all select 'measurement', count(*) from measurement
     union all select 'citation', count(*) from citation union all select 'complex_revision', count(*) from complex_revision
     union all select 'audit_event', count(*) from audit_event`,
  );
  return Object.fromEntries(rows.map((r) => [r.table, Number(r.n)]));
}
