import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import fc from 'fast-check';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { createTestApp, type TestApp } from '../setup/test-app';

/** ≥ 5 000 generated formulas through POST /api/classify: never a 5xx, every error positioned. */
let testApp: TestApp;
let server: Server;
let baseUrl: string;

beforeAll(async () => {
  testApp = await createTestApp();
  server = testApp.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  baseUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await testApp.close();
});

const pieces = ['[', ']', '(', ')', 'Co', 'Cr', 'Fe', 'NH3', 'H2O', 'OH2', 'Cl', 'en', 'bpy', 'CN', '3+', '2-', '^', '·', '6', '2', 'K', 'SO4', 'ox', 'x', ' ', '³⁺', '\u202E', '{', '"'];
const formulaArbitrary = fc.array(fc.constantFrom(...pieces), { maxLength: 14 }).map((parts) => parts.join(''));

async function pool<T>(items: T[], concurrency: number, worker: (item: T) => Promise<void>) {
  let next = 0;
  await Promise.all(
    Array.from({ length: concurrency }, async () => {
      while (next < items.length) {
        const item = items[next++] as T;
        await worker(item);
      }
    }),
  );
}

it('answers 5 000 random formulas with 200 or a positioned 400, never a 5xx', async () => {
  const formulas = fc.sample(formulaArbitrary, { numRuns: 5_000, seed: 20261202 });
  const statuses = new Map<number, number>();
  await pool(formulas, 16, async (formula) => {
    const response = await fetch(`${baseUrl}/api/classify`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ formula }),
    });
    statuses.set(response.status, (statuses.get(response.status) ?? 0) + 1);
    const body: unknown = await response.json();
    if (response.status === 200) return;
    expect(response.status).toBe(400);
    const error = apiErrorBodySchema.parse(body).error;
    expect(error.code).toBe('VALIDATION_FAILED');
    const position = (body as { error: { position?: unknown } }).error.position;
    // Schema-level refusals (empty, too long) name the field; engine refusals carry a position.
    if (position !== undefined) expect(typeof position).toBe('number');
    else expect(error.fields).toHaveProperty('formula');
  });
  expect([...statuses.keys()].every((status) => status === 200 || status === 400)).toBe(true);
  expect((statuses.get(200) ?? 0) + (statuses.get(400) ?? 0)).toBe(5_000);
}, 120_000);
