import { randomUUID } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { IMPORT_MAX_BYTES } from '@/lib/schemas/exchange';
import { seedDemo } from '@/server/db/seed';
import { DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { createTestApp, type TestApp } from '../setup/test-app';
import { databaseFingerprint } from './helpers/database-state';
import { HttpClient, type HttpResult } from './helpers/http-client';
import { isWriteRoute, KNOWN_WRITE_ROUTES, listApiRoutes, routeKey, type ApiRoute } from './helpers/route-inventory';

/**
 * Hostile input on EVERY write route (POST/PATCH/PUT/DELETE under /api, read from the
 * Express router itself, so a new route is covered without editing this file): malformed JSON,
 * wrong types, huge strings, deep nesting, oversize bodies, hostile path ids and query strings.
 * Each must get a 4xx in the one error shape, quickly, and nothing may be written (the whole
 * database is fingerprinted before and after: row counts, version sums, newest updated_at).
 * A second table sends odd-but-possibly-valid text (NUL, bidi overrides, lone surrogates …):
 * 2xx or 4xx are both fine there, a 5xx never.
 */

let t: TestApp;
let server: Server;
let admin: HttpClient;
let routes: ApiRoute[];
const ids = { groupId: '', complexId: '', measurementId: '', invitationId: '', memberId: '', sessionHandle: '' };

beforeAll(async () => {
  t = await createTestApp();
  await seedDemo(t.orm);
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((resolve) => server.once('listening', resolve));
  admin = new HttpClient(`http://127.0.0.1:${(server.address() as AddressInfo).port}`);
  await admin.signIn('admin@larkspur.example.org', DEMO_PASSWORD);
  const groups = (await admin.get('/api/groups')).body as { groups: { id: string; name: string }[] };
  ids.groupId = groups.groups[0]?.id ?? '';
  const created = await admin.post('/api/complexes', {
    formula: '[Co(NH3)6]3+',
    name: 'hexaamminecobalt(III) (hostile-input fixture)',
    measurements: [{ kind: 'ligand-field-splitting', value: 22900, unit: 'cm-1' }],
  });
  expect(created.status).toBe(201);
  const entry = created.body as { id: string; measurements: { id: string }[] };
  ids.complexId = entry.id;
  ids.measurementId = entry.measurements[0]?.id ?? '';
  const invitation = await admin.post(`/api/groups/${ids.groupId}/invitations`, { email: 'hostile-invitee@example.org', role: 'viewer' });
  ids.invitationId = (invitation.body as { id: string }).id;
  const detail = (await admin.get(`/api/groups/${ids.groupId}`)).body as { members: { userId: string; role: string }[] };
  ids.memberId = detail.members.find((m) => m.role === 'viewer')?.userId ?? '';
  const sessions = (await admin.get('/api/auth/sessions')).body as { sessions: { id: string }[] };
  ids.sessionHandle = sessions.sessions[0]?.id ?? '';
  routes = listApiRoutes(t.app);
}, 60_000);

afterAll(async () => {
  await new Promise((resolve) => server.close(resolve));
  await t.close();
});

/** A valid-looking body per route, mutated one field at a time (null: the route reads no JSON body). */
const sampleBodies: Record<string, Record<string, unknown> | null | 'raw'> = {
  'POST /api/classify': { formula: '[Co(NH3)6]3+', temperatureC: 25 },
  'POST /api/route': { oxidant: '[Co(NH3)5Cl]2+', reductant: '[Cr(H2O)6]2+' },
  'POST /api/marcus': { k11: 4.2, k22: 1e-5, dE: 0.4 },
  'POST /api/auth/sign-up': { email: 'new-person@example.org', password: 'a-long-enough-passphrase-7', displayName: 'New Person' },
  'POST /api/auth/verify': { token: 'a'.repeat(40) },
  'POST /api/auth/sign-in': { email: 'admin@larkspur.example.org', password: DEMO_PASSWORD },
  'POST /api/auth/sign-out': null,
  'POST /api/auth/sign-out-everywhere': null,
  'PATCH /api/auth/me': { displayName: 'Dr. Imogen Larkspur' },
  'POST /api/auth/password-reset/request': { email: 'admin@larkspur.example.org' },
  'POST /api/auth/password-reset/confirm': { token: 'a'.repeat(40), password: 'a-long-enough-passphrase-7' },
  'DELETE /api/auth/sessions/:id': null,
  'POST /api/groups': { name: 'Hostile input group' },
  'POST /api/groups/:groupId/invitations': { email: 'someone@example.org', role: 'viewer' },
  'DELETE /api/groups/:groupId/invitations/:id': null,
  'PATCH /api/groups/:groupId/members/:userId': { role: 'contributor' },
  'DELETE /api/groups/:groupId/members/:userId': null,
  'POST /api/invitations/accept': { token: 'b'.repeat(40) },
  'PATCH /api/auth/me/preferences': { reviewSubmissions: true, reviewDecisions: false },
  'POST /api/imports': 'raw',
  'POST /api/complexes/:id/attachments': 'raw',
  'DELETE /api/complexes/:id/attachments/:attachmentId': null,
  'POST /api/complexes': { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)', notes: 'n', measurements: [{ kind: 'water-exchange', value: 2.4e-6, unit: 's-1' }] },
  'PATCH /api/complexes/:id': { version: 1, formula: '[Co(NH3)6]3+', name: 'renamed', notes: 'x', message: 'm' },
  'POST /api/complexes/:id/submit': { version: 1, message: 'please review' },
  'POST /api/complexes/:id/reviews': { decision: 'accept', comment: 'fine', version: 1 },
  'POST /api/complexes/:id/retire': { version: 1, message: 'retire it' },
  'POST /api/complexes/:id/measurements': { kind: 'water-exchange', value: 5, unit: 's-1', temperatureK: 298.15, version: 1 },
  'PATCH /api/complexes/:id/measurements/:mid': { value: 23000, unit: 'cm-1', medium: 'water', version: 1 },
  'DELETE /api/complexes/:id/measurements/:mid': null,
  'POST /api/citations': { doi: '10.1021/cr030726o', authors: 'L. Helm, A. E. Merbach', journal: 'Chem. Rev.', year: 2005 },
  'POST /api/groups/:groupId/ligands': { abbreviation: 'hostile', name: 'a ligand', charge: 0, denticity: 1, donorAtoms: ['N'], source: 'test' },
};

/** Routes whose every body field is optional: `{}` is a valid request there, not hostile input. */
const EMPTY_BODY_IS_VALID = new Set([
  'PATCH /api/auth/me/preferences',
  'POST /api/complexes/:id/submit',
  'POST /api/complexes/:id/retire',
  'PATCH /api/complexes/:id/measurements/:mid',
]);

function concretePath(path: string, overrides: Record<string, string> = {}): string {
  const values: Record<string, string> = {
    groupId: ids.groupId,
    id: path.startsWith('/api/auth/sessions') ? ids.sessionHandle : path.includes('/invitations/') ? ids.invitationId : ids.complexId,
    mid: ids.measurementId,
    userId: ids.memberId,
    attachmentId: randomUUID(),
    ...overrides,
  };
  return path.replace(/:([A-Za-z]+)/g, (_m, name: string) => encodeURIComponent(values[name] ?? randomUUID()));
}

/** Per field: a value of the wrong type for what the sample holds. */
function wrongTypesFor(value: unknown): unknown[] {
  if (typeof value === 'string') return [12345, { $ne: '' }, ['a'], true];
  if (typeof value === 'number') return ['12', { $gt: 0 }, [1], Number.MAX_VALUE * 0 === 0 ? 'NaN' : null];
  if (typeof value === 'boolean') return ['true', 1, {}];
  if (Array.isArray(value)) return ['not a list', { 0: value[0] }, 7];
  return ['x', 3, []];
}

const HUGE_TEXT = 'Ω'.repeat(300_000); // ≈ 600 kB of UTF-8: under the 1 MB JSON limit, over every field limit
const nested = (depth: number) => `${'['.repeat(depth)}${']'.repeat(depth)}`;

interface HostileCase {
  label: string;
  path?: string;
  raw?: string | Buffer;
  body?: unknown;
  contentType?: string;
  query?: string;
  /** Allowed statuses (all 4xx); default any 4xx. */
  expect?: number[];
}

function hostileCasesFor(route: ApiRoute): HostileCase[] {
  const key = routeKey(route);
  const sample = sampleBodies[key];
  const cases: HostileCase[] = [];
  const json = 'application/json';
  // Whole-body attacks refused by the JSON parser before any route runs (so also on routes that read no body).
  cases.push({ label: 'malformed JSON', raw: '{"formula": "[Co(NH3)6]3+", ', contentType: json, expect: [400, 415] });
  cases.push({ label: 'JSON with a trailing comment', raw: '{"a": 1} // hi', contentType: json, expect: [400, 415] });
  cases.push({ label: 'a bare JSON string (strict parser)', raw: '"just text"', contentType: json, expect: [400, 415] });
  cases.push({ label: 'body over 1 MB', raw: JSON.stringify({ pad: 'x'.repeat(1_100_000) }), contentType: json, expect: [413, 415] });
  cases.push({ label: 'JSON declared in an unsupported charset', raw: '{}', contentType: 'application/json; charset=ibm-1047', expect: [415] });
  cases.push({ label: 'a NUL character in a JSON key', raw: '{"a\\u0000": 1}', contentType: json, expect: [400, 415] });
  if (sample && sample !== 'raw') {
    cases.push({ label: 'deep nesting 100 000 levels', raw: nested(100_000), contentType: json, expect: [400, 413] });
    cases.push({ label: 'a JSON array instead of an object', body: [sample], expect: [400] });
    if (!EMPTY_BODY_IS_VALID.has(key)) cases.push({ label: 'an empty object', body: {}, expect: [400] });
    cases.push({ label: 'deep nesting 2 000 levels inside a field', raw: `{"${Object.keys(sample)[0]}": ${nested(2000)}}`, contentType: json, expect: [400] });
    for (const [field, value] of Object.entries(sample)) {
      for (const wrong of wrongTypesFor(value)) cases.push({ label: `${field} = ${JSON.stringify(wrong)}`, body: { ...sample, [field]: wrong }, expect: [400] });
      if (typeof value === 'string') cases.push({ label: `${field} = 600 kB of text`, body: { ...sample, [field]: HUGE_TEXT }, expect: [400] });
    }
    cases.push({ label: 'prototype pollution keys', raw: JSON.stringify(Object.keys(sample).length ? { ...Object.fromEntries(Object.keys(sample).map((k) => [k, { __proto__: { admin: true } }])) } : {}).replace(/{}/g, '{"__proto__":{"admin":true},"constructor":{"prototype":{"admin":true}}}'), contentType: json, expect: [400] });
  }
  if (sample === 'raw') {
    cases.push({ label: 'JSON where a file belongs', body: { file: 'x' }, expect: [400, 415] });
    cases.push({ label: 'bad query: unknown key', raw: 'formula\n[Co(NH3)6]3+\n', contentType: 'text/csv', query: "groupId=' or 1=1 --&evil=1", expect: [400] });
    if (route.path === '/api/imports') {
      cases.push({ label: 'file over 5 MB', raw: Buffer.alloc(IMPORT_MAX_BYTES + 1024, 0x41), contentType: 'text/csv', expect: [413] });
      cases.push({ label: 'empty file', raw: '', contentType: 'text/csv', expect: [400] });
      cases.push({ label: 'a PNG named CSV', raw: Buffer.from('89504e470d0a1a0a0000000d49484452', 'hex'), contentType: 'text/csv', expect: [400, 415] });
      cases.push({ label: 'mapping that is not JSON', raw: 'formula\nx\n', contentType: 'text/csv', query: 'mapping=%7B%22formula%22%3A', expect: [400] });
      cases.push({ label: 'mapping with an unknown column', raw: 'formula\nx\n', contentType: 'text/csv', query: `mapping=${encodeURIComponent('{"__proto__":"x","drop table":"y"}')}`, expect: [400] });
      cases.push({ label: 'dryRun that is not a boolean', raw: 'formula\nx\n', contentType: 'text/csv', query: 'dryRun=maybe', expect: [400] });
    } else {
      cases.push({ label: 'no file name', raw: 'hello', contentType: 'text/plain', query: '', expect: [400] });
      cases.push({ label: 'file name of 10 000 characters', raw: 'hello', contentType: 'text/plain', query: `fileName=${'a'.repeat(10_000)}`, expect: [400, 414, 431] });
    }
  }
  // Hostile path ids (every :param in turn): 404 (or 400), never a 5xx.
  const params = [...route.path.matchAll(/:([A-Za-z]+)/g)].map((m) => m[1] as string);
  const hostileIds = ["' or '1'='1", '1; drop table complex; --', '../../../etc/passwd', '%00', 'a'.repeat(4000), '١٢٣', '00000000-0000-0000-0000-000000000000', 'ＦＦ'];
  for (const param of params) {
    for (const bad of hostileIds) {
      cases.push({ label: `:${param} = ${JSON.stringify(bad.slice(0, 30))}`, path: concretePath(route.path, { [param]: bad }), body: sample && sample !== 'raw' ? sample : undefined, expect: [400, 404, 414] });
    }
  }
  if (key === 'DELETE /api/complexes/:id/measurements/:mid') {
    for (const q of ['version=abc', 'version=-1', 'version=1e400', "version=1'--", 'version[]=1', 'other=1']) cases.push({ label: `query ${q}`, query: q, expect: [400] });
  }
  return cases;
}

async function send(route: ApiRoute, c: HostileCase): Promise<HttpResult> {
  const path = `${c.path ?? concretePath(route.path)}${c.query !== undefined ? `?${c.query}` : ''}`;
  const headers: Record<string, string> = {};
  if (c.contentType) headers['Content-Type'] = c.contentType;
  if (c.raw !== undefined) return admin.request(route.method, path, undefined, { raw: c.raw, headers });
  return admin.request(route.method, path, c.body, { headers });
}

it('finds every known write route by reading the router (introspection still works)', () => {
  const found = new Set(routes.filter(isWriteRoute).map(routeKey));
  for (const known of KNOWN_WRITE_ROUTES) expect(found).toContain(known);
  expect(found.size).toBeGreaterThanOrEqual(KNOWN_WRITE_ROUTES.length);
});

it('refuses hostile input on every write route with a 4xx in the error shape, quickly, and writes nothing', async () => {
  const writeRoutes = routes.filter(isWriteRoute);
  const failures: string[] = [];
  const slowest: [number, string][] = [];
  let requests = 0;
  for (const route of writeRoutes) {
    const before = await databaseFingerprint(t.databaseUrl);
    for (const c of hostileCasesFor(route)) {
      const result = await send(route, c);
      requests += 1;
      const where = `${routeKey(route)} [${c.label}]`;
      const allowed = c.expect ?? [400, 401, 403, 404, 409, 413, 414, 415, 431];
      if (!allowed.includes(result.status)) failures.push(`${where}: ${result.status} ${JSON.stringify(result.body).slice(0, 200)}`);
      else if (result.status !== 414 && result.status !== 431 && !apiErrorBodySchema.safeParse(result.body).success) failures.push(`${where}: not the error shape: ${JSON.stringify(result.body).slice(0, 200)}`);
      if (result.ms > 3000) failures.push(`${where}: took ${Math.round(result.ms)} ms`);
      slowest.push([Math.round(result.ms), where]);
    }
    const after = await databaseFingerprint(t.databaseUrl);
    if (JSON.stringify(after) !== JSON.stringify(before)) {
      const changed = Object.keys(after).filter((table) => after[table] !== before[table]);
      failures.push(`${routeKey(route)}: the database changed (${changed.join(', ')})`);
    }
  }
  slowest.sort((a, b) => b[0] - a[0]);
  console.log(`hostile input: ${requests} requests on ${writeRoutes.length} write routes; slowest: ${slowest.slice(0, 5).map(([ms, w]) => `${w} ${ms} ms`).join('; ')}`);
  expect(failures).toEqual([]);
  expect(requests).toBeGreaterThan(500);
  // The session survived everything (nothing above signed the admin out).
  expect((await admin.get('/api/auth/me')).status).toBe(200);
}, 180_000);

it('never answers odd-but-possibly-valid text with a 5xx (NUL, bidi overrides, lone surrogates, emoji, full-width)', async () => {
  const oddTexts = ['\u0000', 'a\u0000b', '\u202E[Co(NH3)6]3+', '\uD800', '\uDFFF\uD800', '🧪🧪', 'Ｃｏ', 'e\u0301', '\uFEFF', '\u200B\u200D', "Robert'); drop table complex;--", '%s%n%x', '${7*7}', '<script>alert(1)</script>'];
  const failures: string[] = [];
  for (const route of routes.filter(isWriteRoute)) {
    const sample = sampleBodies[routeKey(route)];
    if (!sample || sample === 'raw') continue;
    // Sign-in with valid credentials but odd extra text would sign in again: only text fields are varied.
    for (const [field, value] of Object.entries(sample)) {
      if (typeof value !== 'string') continue;
      for (const odd of oddTexts) {
        const result = await admin.request(route.method, concretePath(route.path), { ...sample, [field]: odd });
        if (result.status >= 500) failures.push(`${routeKey(route)} ${field}=${JSON.stringify(odd)}: ${result.status} ${JSON.stringify(result.body).slice(0, 200)}`);
        if (result.status === 401 && route.path.startsWith('/api/auth/')) await admin.signIn('admin@larkspur.example.org', DEMO_PASSWORD);
      }
    }
  }
  expect(failures).toEqual([]);
}, 180_000);
