import { randomUUID } from 'node:crypto';
import { complexDetailSchema, revisionsResponseSchema } from '@/lib/schemas/library';
import { Complex } from '@/server/modules/library/complex.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';
import type { Browser } from './auth-helpers';

/**
 * Safe retries: a write sent again with the same Idempotency-Key — because its reply was lost, or
 * because it was answered 503 after it had in fact committed — returns the first result and
 * writes nothing more.
 */
let t: TestApp;
let w: LibraryWorld;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'idem');
});
afterAll(async () => {
  await t.close();
});

function withKey(browser: Browser, method: 'post' | 'put', path: string, key: string, body: unknown) {
  return browser.raw(method, path).set('Idempotency-Key', key).send(body as object);
}

const entriesNamed = (name: string) => t.orm.em.fork().count(Complex, { name });

async function storedBody(key: string): Promise<unknown> {
  for (let i = 0; i < 50; i += 1) {
    const [row] = await t.orm.em.getConnection().execute(`select body from idempotency_record where key = ?`, [key]);
    if (row?.body) return row.body;
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  return null;
}

describe('Idempotency-Key on library writes', () => {
  it('a retried create returns the first result and creates one entry', async () => {
    const key = randomUUID();
    const body = { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'retried create' };
    const first = await withKey(w.author, 'post', '/api/complexes', key, body);
    expect(first.status).toBe(201);
    await storedBody(key);
    const retry = await withKey(w.author, 'post', '/api/complexes', key, body);
    expect(retry.status).toBe(201);
    expect(retry.headers['idempotent-replayed']).toBe('true');
    expect(retry.body).toEqual(first.body);
    expect(await entriesNamed('retried create')).toBe(1);
  });

  it('after a commit whose reply never left (no stored result), the retry rebuilds the reply and still writes once', async () => {
    const key = randomUUID();
    const body = { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'commit then disconnect' };
    const first = await withKey(w.author, 'post', '/api/complexes', key, body);
    expect(first.status).toBe(201);
    await storedBody(key);
    // The process died between the commit and storing the reply: the record has the key only.
    await t.orm.em.getConnection().execute(`update idempotency_record set body = null where key = ?`, [key]);
    const retry = await withKey(w.author, 'post', '/api/complexes', key, body);
    expect(retry.status).toBe(201);
    expect(complexDetailSchema.parse(retry.body).id).toBe(first.body.id);
    expect(await entriesNamed('commit then disconnect')).toBe(1);
  });

  it('a retried save writes one revision', async () => {
    const entry = await createEntry(w.author, w.groupId);
    const key = randomUUID();
    const save = { version: entry.version, formula: entry.formula, name: 'saved once', notes: null, measurements: [] };
    expect((await withKey(w.author, 'put', `/api/complexes/${entry.id}`, key, save)).status).toBe(200);
    const retry = await withKey(w.author, 'put', `/api/complexes/${entry.id}`, key, save);
    // Without the key this retry would be a 409 (its version is stale); with it, the first result.
    expect(retry.status).toBe(200);
    expect(complexDetailSchema.parse(retry.body).name).toBe('saved once');
    const revisions = revisionsResponseSchema.parse((await w.author.get(`/api/complexes/${entry.id}/revisions`)).body).revisions;
    expect(revisions).toHaveLength(2);
  });

  it('simultaneous requests with one key write once', async () => {
    const key = randomUUID();
    const body = { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'simultaneous retries' };
    const responses = await Promise.all(Array.from({ length: 5 }, () => withKey(w.author, 'post', '/api/complexes', key, body)));
    expect(responses.every((r) => r.status === 201 || r.status === 409)).toBe(true);
    expect(responses.some((r) => r.status === 201)).toBe(true);
    expect(await entriesNamed('simultaneous retries')).toBe(1);
  });

  it('the same key with a different body is refused; a key is per person', async () => {
    const key = randomUUID();
    await withKey(w.author, 'post', '/api/complexes', key, { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'first body' });
    const other = await withKey(w.author, 'post', '/api/complexes', key, { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'second body' });
    expect(other.status).toBe(409);
    expect(other.body.error.message).toMatch(/different request/);
    expect(await entriesNamed('second body')).toBe(0);
    // Another person's request with the same key is theirs alone.
    const curator = await withKey(w.curator, 'post', '/api/complexes', key, { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'first body' });
    expect(curator.status).toBe(201);
    expect(await entriesNamed('first body')).toBe(2);
  });

  it('a refused write does not use up its key, and a malformed key is a 400', async () => {
    const key = randomUUID();
    const bad = await withKey(w.author, 'post', '/api/complexes', key, { groupId: w.groupId, formula: '[Zz(H2O)6]3+', name: 'bad formula' });
    expect(bad.status).toBe(400);
    const fixed = await withKey(w.author, 'post', '/api/complexes', key, { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'fixed formula' });
    expect(fixed.status).toBe(201);
    const short = await withKey(w.author, 'post', '/api/complexes', 'abc', { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'short key' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields['Idempotency-Key']).toBeDefined();
  });
});
