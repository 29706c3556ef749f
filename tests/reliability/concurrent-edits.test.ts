import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { staleVersionErrorSchema } from '@/lib/schemas/library';
import { seedDemo } from '@/server/db/seed';
import { DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { createTestApp, type TestApp } from '../setup/test-app';
import { queryRows } from './helpers/database-state';
import { HttpClient } from './helpers/http-client';

/**
 * Many clients change the same entry from the same version at the same moment:
 * exactly one wins, every other one gets 409 with the current version (and the entry as it is),
 * and the stored entry is the winner's (no lost update, one revision for the one change).
 */
let t: TestApp;
let server: Server;
let baseUrl: string;
const clients: HttpClient[] = [];
const CLIENTS = 24;

beforeAll(async () => {
  t = await createTestApp();
  await seedDemo(t.orm);
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  // Two curators' sessions (curator, admin) shared by many clients: curators may edit any entry.
  for (const email of ['curator@larkspur.example.org', 'admin@larkspur.example.org']) {
    const signedIn = new HttpClient(baseUrl);
    await signedIn.signIn(email, DEMO_PASSWORD);
    for (let i = 0; i < CLIENTS / 2; i += 1) {
      const client = new HttpClient(baseUrl);
      client.cookie = signedIn.cookie;
      clients.push(client);
    }
  }
}, 60_000);

afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await t.close();
});

async function freshEntry(name: string) {
  const created = await clients[0]!.post('/api/complexes', {
    formula: '[Cr(H2O)6]3+',
    name,
    measurements: [{ kind: 'water-exchange', value: 2.4e-6, unit: 's-1', temperatureK: 298.15 }],
  });
  expect(created.status).toBe(201);
  return created.body as { id: string; version: number; measurements: { id: string }[] };
}

type Change = (client: HttpClient, i: number, entry: { id: string; version: number; measurements: { id: string }[] }) => Promise<{ status: number; body: unknown }>;

const changes: [string, Change][] = [
  ['PATCH the entry', (c, i, e) => c.patch(`/api/complexes/${e.id}`, { version: e.version, notes: `written by client ${i}`, message: `client ${i}` })],
  ['add a measurement', (c, i, e) => c.post(`/api/complexes/${e.id}/measurements`, { version: e.version, kind: 'ligand-field-splitting', value: 17400 + i, unit: 'cm-1' })],
  ['PATCH a measurement', (c, i, e) => c.patch(`/api/complexes/${e.id}/measurements/${e.measurements[0]!.id}`, { version: e.version, value: 2.4e-6 + (i + 1) * 1e-8 })], // never the stored value: a save that changes nothing is a no-op 200
  ['submit', (c, i, e) => c.post(`/api/complexes/${e.id}/submit`, { version: e.version, message: `client ${i}` })],
  ['retire', (c, i, e) => c.post(`/api/complexes/${e.id}/retire`, { version: e.version, message: `client ${i}` })],
];

describe.each(changes)('%s from the same version by %#', (label, change) => {
  it(`${CLIENTS} at once: one 2xx, ${CLIENTS - 1} × 409 with the current version, the winner's state stored`, async () => {
    const entry = await freshEntry(`concurrent ${label}`);
    const results = await Promise.all(clients.map((client, i) => change(client, i, entry)));
    const winners = results.map((r, i) => ({ ...r, i })).filter((r) => r.status < 300);
    const losers = results.filter((r) => r.status === 409);
    expect(winners).toHaveLength(1);
    expect(losers).toHaveLength(CLIENTS - 1);
    for (const loser of losers) {
      const error = staleVersionErrorSchema.parse(loser.body).error;
      expect(error.currentVersion).toBe(entry.version + 1);
      expect(error.current.version).toBe(entry.version + 1);
    }
    const winner = winners[0]!;
    const stored = (await queryRows<{ version: number; notes: string | null; status: string }>(t.databaseUrl, 'select version, notes, status from complex where id = $1', [entry.id]))[0]!;
    expect(stored.version).toBe(entry.version + 1);
    const revisions = await queryRows<{ number: number; message: string }>(t.databaseUrl, 'select number, message from complex_revision where complex_id = $1 order by number', [entry.id]);
    expect(revisions.map((r) => r.number)).toEqual([1, 2]);
    if (label === 'PATCH the entry') {
      expect(stored.notes).toBe(`written by client ${winner.i}`);
      // The history line: what changed, in words, then the person's own message.
      expect(revisions[1]!.message).toBe(`Edited the notes — client ${winner.i}`);
    }
    if (label === 'add a measurement') {
      const kinds = await queryRows<{ value: string }>(t.databaseUrl, "select value::text from measurement where complex_id = $1 and kind = 'ligand-field-splitting'", [entry.id]);
      expect(kinds.map((k) => Number(k.value))).toEqual([17400 + winner.i]);
    }
    if (label === 'PATCH a measurement') {
      const value = await queryRows<{ value: string }>(t.databaseUrl, 'select value::text from measurement where id = $1', [entry.measurements[0]!.id]);
      expect(Number(value[0]!.value)).toBeCloseTo(2.4e-6 + (winner.i + 1) * 1e-8, 12);
    }
    if (label === 'submit') expect(stored.status).toBe('in-review');
    if (label === 'retire') expect(stored.status).toBe('retired');
  });
});

it('mixed changes from the same version: still exactly one winner and no lost update', async () => {
  const entry = await freshEntry('concurrent mixed');
  const results = await Promise.all(clients.map((client, i) => (changes[i % changes.length]![1])(client, i, entry)));
  expect(results.filter((r) => r.status < 300)).toHaveLength(1);
  expect(results.filter((r) => r.status === 409)).toHaveLength(CLIENTS - 1);
  const stored = await queryRows<{ version: number }>(t.databaseUrl, 'select version from complex where id = $1', [entry.id]);
  expect(stored[0]!.version).toBe(entry.version + 1);
});

it('a chain of 40 edits by 8 clients that retry on 409 keeps every acknowledged change in the history', async () => {
  const entry = await freshEntry('concurrent chain');
  const acknowledged: number[] = [];
  await Promise.all(
    clients.slice(0, 8).map(async (client, i) => {
      let version = entry.version;
      for (let done = 0, attempts = 0; done < 5 && attempts < 200; attempts += 1) {
        const result = await client.patch(`/api/complexes/${entry.id}`, { version, notes: `c${i}-${done}`, message: `c${i}-${done}` });
        if (result.status === 200) {
          version = (result.body as { version: number }).version;
          acknowledged.push(version);
          done += 1;
        } else {
          expect(result.status).toBe(409);
          version = (result.body as { error: { currentVersion: number } }).error.currentVersion;
        }
      }
    }),
  );
  expect(acknowledged).toHaveLength(40);
  expect(new Set(acknowledged).size).toBe(40);
  const revisions = await queryRows<{ number: number }>(t.databaseUrl, 'select number from complex_revision where complex_id = $1 order by number', [entry.id]);
  expect(revisions.map((r) => r.number)).toEqual(Array.from({ length: 41 }, (_, i) => i + 1));
}, 60_000);
