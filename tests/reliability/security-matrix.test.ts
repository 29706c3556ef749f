import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { createApp } from '@/server/app';
import { openOrm, type Orm } from '@/server/db/orm';
import { seedDemo } from '@/server/db/seed';
import { startFakeS3 } from '@/server/dev/fake-s3';
import { createS3Storage, type ObjectStorage } from '@/server/modules/attachments/object-storage';
import { DEMO_GROUPS, DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { createTestDatabase } from '../setup/test-database';
import { Browser, setCookieLine, TEST_HOST, TEST_ORIGIN } from '../server/auth-helpers';

/**
 * The authorisation matrix of the accounts tests extended to every library and exchange
 * route (each route × admin, curator, contributor, viewer, a member of another group, signed out,
 * with the exact status), then session cookie flags, the CSRF origin check, no account
 * enumeration, security headers (CSP that the exported web app satisfies), uploads that cannot
 * escape their storage, and SQL injection attempts in every search and filter parameter.
 * Policy (DEVELOPERS.md): 401 signed out; 404 for what another group holds or a reader may not
 * see (indistinguishable from "does not exist"); 403 for a member whose role is too low.
 */
type Actor = 'admin' | 'curator' | 'contributor' | 'viewer' | 'outsider' | 'signedOut';
const actors: Actor[] = ['admin', 'curator', 'contributor', 'viewer', 'outsider', 'signedOut'];
const emails: Record<Exclude<Actor, 'signedOut'>, string> = {
  admin: 'admin@larkspur.example.org',
  curator: 'curator@larkspur.example.org',
  contributor: 'contributor@larkspur.example.org',
  viewer: 'viewer@larkspur.example.org',
  outsider: 'fenwick-admin@fenwick.example.org',
};

let orm: Orm;
let drop: () => Promise<void>;
let storage: ObjectStorage;
let closeS3: () => Promise<void>;
let storageDir: string;
let app: ReturnType<typeof createApp>;
const b = {} as Record<Actor, Browser>;
let larkspur: string;
let fenwick: string;
let counter = 0;
const unique = () => (counter += 1);

beforeAll(async () => {
  const database = await createTestDatabase();
  drop = database.drop;
  orm = await openOrm(database.url);
  await seedDemo(orm);
  storageDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-s3-'));
  const s3 = await startFakeS3({ directory: storageDir });
  storage = createS3Storage(s3.settings);
  closeS3 = s3.close;
  app = createApp({ orm, storage });
  for (const actor of actors) {
    b[actor] = new Browser(app);
    if (actor !== 'signedOut') await b[actor].signIn(emails[actor], DEMO_PASSWORD);
  }
  const em = orm.em.fork();
  larkspur = (await em.findOneOrFail(ResearchGroup, { name: DEMO_GROUPS.larkspur })).id;
  fenwick = (await em.findOneOrFail(ResearchGroup, { name: DEMO_GROUPS.fenwick })).id;
}, 60_000);

afterAll(async () => {
  await storage?.close?.();
  await closeS3?.();
  await orm?.close(true);
  await drop?.();
  fs.rmSync(storageDir, { recursive: true, force: true });
});

interface Entry {
  id: string;
  version: number;
  measurementId: string;
}

async function draft(by: Actor = 'contributor'): Promise<Entry> {
  const created = await b[by].post('/api/complexes', {
    groupId: larkspur,
    formula: '[Co(NH3)5Cl]2+',
    name: `matrix fixture ${unique()}`,
    measurements: [{ kind: 'substitution', value: 1.7e-6, unit: 's-1', temperatureK: 298.15 }],
  });
  if (created.status !== 201) throw new Error(`fixture: ${created.status} ${JSON.stringify(created.body)}`);
  return { id: created.body.id, version: created.body.version, measurementId: created.body.measurements[0].id };
}

async function submitted(): Promise<Entry> {
  const entry = await draft();
  const response = await b.contributor.post(`/api/complexes/${entry.id}/submit`, { version: entry.version });
  return { ...entry, version: response.body.version };
}

async function accepted(): Promise<Entry> {
  const entry = await submitted();
  const response = await b.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept', version: entry.version });
  if (response.status !== 201) throw new Error(`accept: ${response.status} ${JSON.stringify(response.body)}`);
  return { ...entry, version: response.body.complex.version };
}

async function withAttachment(): Promise<Entry & { attachmentId: string }> {
  const entry = await accepted();
  // The author attaches (a revision re-opening the entry), submits, and a curator accepts: an accepted file.
  const response = await upload('contributor', entry.id, 'notes.txt', Buffer.from('UV-vis: 475 nm band\n'));
  if (response.status !== 201) throw new Error(`attach: ${response.status} ${JSON.stringify(response.body)}`);
  const submittedAgain = await b.contributor.post(`/api/complexes/${entry.id}/submit`);
  if (submittedAgain.status !== 200) throw new Error(`submit: ${submittedAgain.status} ${JSON.stringify(submittedAgain.body)}`);
  const acceptedAgain = await b.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept', version: submittedAgain.body.version });
  if (acceptedAgain.status !== 201) throw new Error(`accept: ${acceptedAgain.status} ${JSON.stringify(acceptedAgain.body)}`);
  return { ...entry, version: acceptedAgain.body.complex.version, attachmentId: response.body.id };
}

function upload(actor: Actor, complexId: string, fileName: string, bytes: Buffer, contentType = 'application/octet-stream') {
  let req = request(app).post(`/api/complexes/${complexId}/attachments?fileName=${encodeURIComponent(fileName)}`).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN).set('Content-Type', contentType);
  if (b[actor].cookie) req = req.set('Cookie', `sphereline_session=${b[actor].cookie}`);
  return req.send(bytes);
}

function importCsv(actor: Actor, query: string) {
  let req = request(app).post(`/api/imports?${query}`).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN).set('Content-Type', 'text/csv');
  if (b[actor].cookie) req = req.set('Cookie', `sphereline_session=${b[actor].cookie}`);
  return req.send('formula,name,kind,value,unit\n[Cr(H2O)6]3+,hexaaquachromium(III),water-exchange,2.4e-6,s-1\n');
}

const ok = (status: number, over: Partial<Record<Actor, number>> = {}): Record<Actor, number> => ({
  admin: status, curator: status, contributor: status, viewer: status, outsider: 404, signedOut: 401, ...over,
});

interface RouteCase {
  name: string;
  call: (actor: Actor) => Promise<{ status: number; body: unknown }>;
  expected: Record<Actor, number>;
}

const cases: RouteCase[] = [
  { name: 'GET /api/complexes?groupId', call: (a) => b[a].get(`/api/complexes?groupId=${larkspur}`), expected: ok(200) },
  { name: 'POST /api/complexes', call: (a) => b[a].post('/api/complexes', { groupId: larkspur, formula: '[Cr(H2O)6]3+', name: `matrix ${unique()}` }), expected: ok(201, { viewer: 403 }) },
  { name: 'GET /api/complexes/:id (accepted)', call: async (a) => b[a].get(`/api/complexes/${(await accepted()).id}`), expected: ok(200) },
  { name: 'GET /api/complexes/:id (a draft by the admin)', call: async (a) => b[a].get(`/api/complexes/${(await draft('admin')).id}`), expected: ok(200, { contributor: 404, viewer: 404 }) },
  { name: 'PATCH /api/complexes/:id (own draft)', call: async (a) => { const e = await draft(); return b[a].patch(`/api/complexes/${e.id}`, { version: e.version, notes: 'x' }); }, expected: ok(200, { viewer: 404 }) },
  { name: 'PATCH /api/complexes/:id (accepted, by someone else)', call: async (a) => { const e = await accepted(); return b[a].patch(`/api/complexes/${e.id}`, { version: e.version, notes: 'x' }); }, expected: ok(200, { viewer: 403 }) },
  { name: 'POST /api/complexes/:id/submit', call: async (a) => { const e = await draft(); return b[a].post(`/api/complexes/${e.id}/submit`, { version: e.version }); }, expected: ok(200, { viewer: 404 }) },
  { name: 'POST /api/complexes/:id/reviews', call: async (a) => { const e = await submitted(); return b[a].post(`/api/complexes/${e.id}/reviews`, { decision: 'return', comment: 'cite the rate', version: e.version }); }, expected: ok(201, { contributor: 403, viewer: 404 }) },
  { name: 'POST /api/complexes/:id/retire', call: async (a) => { const e = await accepted(); return b[a].post(`/api/complexes/${e.id}/retire`, { version: e.version }); }, expected: ok(200, { contributor: 403, viewer: 403 }) },
  { name: 'GET /api/complexes/:id/revisions', call: async (a) => b[a].get(`/api/complexes/${(await accepted()).id}/revisions`), expected: ok(200) },
  // Viewers see only the accepted states of an entry's history (revision 3 here), never its drafts.
  { name: 'GET /api/complexes/:id/revisions/diff', call: async (a) => b[a].get(`/api/complexes/${(await accepted()).id}/revisions/diff?from=1&to=3`), expected: ok(200, { viewer: 404 }) },
  { name: 'GET /api/complexes/:id/revisions/:number', call: async (a) => b[a].get(`/api/complexes/${(await accepted()).id}/revisions/3`), expected: ok(200) },
  { name: 'GET /api/complexes/:id/revisions/:number (a draft state)', call: async (a) => b[a].get(`/api/complexes/${(await accepted()).id}/revisions/1`), expected: ok(200, { viewer: 404 }) },
  { name: 'POST /api/complexes/:id/measurements', call: async (a) => { const e = await draft(); return b[a].post(`/api/complexes/${e.id}/measurements`, { version: e.version, kind: 'ligand-field-splitting', value: 22900, unit: 'cm-1' }); }, expected: ok(201, { viewer: 404 }) },
  { name: 'PATCH /api/complexes/:id/measurements/:mid', call: async (a) => { const e = await draft(); return b[a].patch(`/api/complexes/${e.id}/measurements/${e.measurementId}`, { version: e.version, value: 1.8e-6 }); }, expected: ok(200, { viewer: 404 }) },
  { name: 'DELETE /api/complexes/:id/measurements/:mid', call: async (a) => { const e = await draft(); return b[a].delete(`/api/complexes/${e.id}/measurements/${e.measurementId}?version=${e.version}`); }, expected: ok(200, { viewer: 404 }) },
  { name: 'GET /api/review-queue', call: (a) => b[a].get('/api/review-queue'), expected: ok(200, { contributor: 403, viewer: 403, outsider: 200 }) },
  { name: 'GET /api/citations?groupId', call: (a) => b[a].get(`/api/citations?groupId=${larkspur}`), expected: ok(200) },
  { name: 'POST /api/citations', call: (a) => b[a].post('/api/citations', { groupId: larkspur, doi: `10.5555/matrix.${unique()}`, authors: 'A. Author', journal: 'J. Test', year: 2001 }), expected: ok(201, { viewer: 403 }) },
  { name: 'GET /api/ligands?groupId', call: (a) => b[a].get(`/api/ligands?groupId=${larkspur}`), expected: ok(200) },
  { name: 'POST /api/groups/:groupId/ligands', call: (a) => b[a].post(`/api/groups/${larkspur}/ligands`, { abbreviation: `mx${unique()}`, name: 'a matrix ligand', charge: 0, denticity: 1, donorAtoms: ['N'], source: 'matrix test' }), expected: ok(201, { contributor: 403, viewer: 403 }) },
  { name: 'GET /api/groups/:groupId/measured', call: (a) => b[a].get(`/api/groups/${larkspur}/measured?formula=${encodeURIComponent('[Cr(H2O)6]3+')}`), expected: ok(200) },
  { name: 'POST /api/imports (dry run)', call: (a) => importCsv(a, `groupId=${larkspur}&dryRun=true`), expected: ok(202, { viewer: 403 }) },
  { name: 'GET /api/imports/:id (contributor’s job)', call: async (a) => { const job = await importCsv('contributor', `groupId=${larkspur}&dryRun=true`); return b[a].get(`/api/imports/${job.body.id}`); }, expected: ok(200, { viewer: 404 }) },
  { name: 'GET /api/exports/library.csv', call: (a) => b[a].get(`/api/exports/library.csv?groupId=${larkspur}`), expected: ok(200) },
  { name: 'GET /api/complexes/facets', call: (a) => b[a].get(`/api/complexes/facets?groupId=${larkspur}`), expected: ok(200) },
  { name: 'GET /api/exports/citations.bib', call: (a) => b[a].get(`/api/exports/citations.bib?groupId=${larkspur}`), expected: ok(200) },
  { name: 'GET /api/exports/citations.ris', call: (a) => b[a].get(`/api/exports/citations.ris?groupId=${larkspur}`), expected: ok(200) },
  { name: 'GET /api/complexes/:id/attachments', call: async (a) => b[a].get(`/api/complexes/${(await accepted()).id}/attachments`), expected: ok(200) },
  { name: 'POST /api/complexes/:id/attachments (own draft)', call: async (a) => upload(a, (await draft()).id, 'spectrum.txt', Buffer.from('a spectrum\n')), expected: ok(201, { viewer: 404 }) },
  { name: 'POST /api/complexes/:id/attachments (accepted, by someone else)', call: async (a) => upload(a, (await accepted()).id, 'spectrum.txt', Buffer.from('a spectrum\n')), expected: ok(201, { viewer: 403 }) },
  { name: 'GET /api/complexes/:id/attachments/:attachmentId', call: async (a) => { const e = await withAttachment(); return b[a].get(`/api/complexes/${e.id}/attachments/${e.attachmentId}`); }, expected: ok(200) },
  { name: 'DELETE /api/complexes/:id/attachments/:attachmentId', call: async (a) => { const e = await withAttachment(); return b[a].delete(`/api/complexes/${e.id}/attachments/${e.attachmentId}`); }, expected: ok(204, { contributor: 403, viewer: 403 }) },
];

describe.each(cases)('$name', ({ call, expected }) => {
  it.each(actors)('as %s', async (actor) => {
    const response = await call(actor);
    expect({ actor, status: response.status }).toEqual({ actor, status: expected[actor] });
    if (response.status >= 400) apiErrorBodySchema.parse(response.body);
  });
});

it('the other group’s entries are 404 to Larkspur members on every entry route, exactly like a random id', async () => {
  const fenwickEntry = await b.outsider.post('/api/complexes', { groupId: fenwick, formula: '[Ru(bpy)3]2+', name: 'tris(bipyridine)ruthenium(II)' });
  expect(fenwickEntry.status).toBe(201);
  const id = fenwickEntry.body.id as string;
  for (const actor of ['admin', 'curator', 'contributor', 'viewer'] as const) {
    for (const probe of [
      b[actor].get(`/api/complexes/${id}`),
      b[actor].patch(`/api/complexes/${id}`, { version: 1, notes: 'x' }),
      b[actor].post(`/api/complexes/${id}/submit`, { version: 1 }),
      b[actor].post(`/api/complexes/${id}/retire`, { version: 1 }),
      b[actor].get(`/api/complexes/${id}/revisions`),
      b[actor].get(`/api/complexes/${id}/attachments`),
      b[actor].get(`/api/exports/library.csv?groupId=${fenwick}`),
    ]) {
      const response = await probe;
      expect(response.status).toBe(404);
      expect(response.body.error.code).toBe('NOT_FOUND');
    }
  }
});

describe('sessions, CSRF and enumeration', () => {
  it('the session cookie is HttpOnly, SameSite=Lax, Path=/, and Secure behind an HTTPS proxy', async () => {
    const plain = await request(app).post('/api/auth/sign-in').set('Host', TEST_HOST).send({ email: emails.viewer, password: DEMO_PASSWORD });
    const line = setCookieLine(plain) ?? '';
    expect(line).toMatch(/; HttpOnly/i);
    expect(line).toMatch(/; SameSite=Lax/i);
    expect(line).toMatch(/; Path=\//i);
    expect(line).not.toMatch(/; Secure/i);
    const proxied = await request(app).post('/api/auth/sign-in').set('Host', TEST_HOST).set('X-Forwarded-Proto', 'https').send({ email: emails.viewer, password: DEMO_PASSWORD });
    expect(setCookieLine(proxied) ?? '').toMatch(/; Secure/i);
  });

  it('session ids carry at least 128 bits (base32: ≥ 26 characters), never appear in a URL, and signed-in answers are not cached', async () => {
    const cookie = b.viewer.cookie ?? '';
    expect(cookie).toMatch(/^[a-z2-7]{26,}$/);
    const me = await b.viewer.get('/api/auth/me');
    expect(me.headers['cache-control']).toBe('no-store');
    expect(JSON.stringify(me.body)).not.toContain(cookie);
    const sessions = await b.viewer.get('/api/auth/sessions');
    expect(sessions.headers['cache-control']).toBe('no-store');
    expect(JSON.stringify(sessions.body)).not.toContain(cookie);
  });

  it('refuses state-changing requests from another origin, or with a cookie but no Origin/Referer', async () => {
    const cookie = `sphereline_session=${b.contributor.cookie}`;
    const body = { groupId: larkspur, formula: '[Cr(H2O)6]3+', name: 'csrf attempt' };
    const evil = await request(app).post('/api/complexes').set('Host', TEST_HOST).set('Origin', 'https://evil.example').set('Cookie', cookie).send(body);
    expect(evil.status).toBe(403);
    const lookalike = await request(app).post('/api/complexes').set('Host', TEST_HOST).set('Origin', `http://${TEST_HOST}.evil.example`).set('Cookie', cookie).send(body);
    expect(lookalike.status).toBe(403);
    const nullOrigin = await request(app).post('/api/complexes').set('Host', TEST_HOST).set('Origin', 'null').set('Cookie', cookie).send(body);
    expect(nullOrigin.status).toBe(403);
    const bare = await request(app).post('/api/complexes').set('Host', TEST_HOST).set('Cookie', cookie).send(body);
    expect(bare.status).toBe(403);
    const viaReferer = await request(app).post('/api/complexes').set('Host', TEST_HOST).set('Referer', `${TEST_ORIGIN}/library`).set('Cookie', cookie).send({ ...body, name: 'same-site form' });
    expect(viaReferer.status).toBe(201);
    const count = await orm.em.fork().getConnection().execute<{ n: string }[]>("select count(*) as n from complex where name = 'csrf attempt'");
    expect(Number(count[0]?.n)).toBe(0);
  });

  it('does not tell whether an account exists (sign-in, reset, sign-up answer alike)', async () => {
    const signIn = (email: string) => request(app).post('/api/auth/sign-in').set('Host', TEST_HOST).set('X-Forwarded-For', '203.0.113.77').send({ email, password: 'not-the-password-1' });
    const known = await signIn(emails.curator);
    const unknown = await signIn('nobody-here@larkspur.example.org');
    expect([known.status, unknown.status]).toEqual([401, 401]);
    expect(known.body).toEqual(unknown.body);
    const reset = (email: string) => request(app).post('/api/auth/password-reset/request').set('Host', TEST_HOST).set('X-Forwarded-For', '203.0.113.78').send({ email });
    const resetKnown = await reset(emails.curator);
    const resetUnknown = await reset('nobody-here@larkspur.example.org');
    expect(resetKnown.status).toBe(resetUnknown.status);
    expect(resetKnown.body).toEqual(resetUnknown.body);
    const signUp = (email: string) => request(app).post('/api/auth/sign-up').set('Host', TEST_HOST).set('X-Forwarded-For', '203.0.113.79').send({ email, password: 'a-long-enough-passphrase-7', displayName: 'Someone' });
    const taken = await signUp(emails.viewer);
    const fresh = await signUp('brand-new-person@example.org');
    expect(taken.status).toBe(fresh.status);
    expect(taken.body).toEqual(fresh.body);
  });
});

describe('security headers', () => {
  const distDir = path.resolve(__dirname, '../../dist');

  it('every response carries the CSP and the helmet headers; no X-Powered-By', async () => {
    for (const url of ['/api/health', '/api/nope']) {
      const response = await request(app).get(url);
      const csp = String(response.headers['content-security-policy'] ?? '');
      expect(csp).toContain("default-src 'self'");
      expect(csp).toContain("script-src 'self'");
      expect(csp).not.toMatch(/script-src[^;]*'unsafe-(inline|eval)'/);
      expect(csp).toContain("object-src 'none'");
      expect(csp).toContain("frame-ancestors 'self'");
      expect(csp).toContain("base-uri 'self'");
      expect(csp).toContain("form-action 'self'");
      expect(response.headers['x-content-type-options']).toBe('nosniff');
      expect(response.headers['x-frame-options']).toBe('SAMEORIGIN');
      expect(response.headers['referrer-policy']).toBe('no-referrer');
      expect(response.headers['strict-transport-security']).toMatch(/max-age=\d+/);
      expect(response.headers['cross-origin-opener-policy']).toBe('same-origin');
      expect(response.headers['x-powered-by']).toBeUndefined();
    }
  });

  (fs.existsSync(path.join(distDir, 'index.html')) ? it : it.skip)('the exported web app fits its CSP: scripts and styles from our origin only, no inline script', async () => {
    const webApp = createApp({ orm, storage, webDir: distDir });
    const page = await request(webApp).get('/library');
    expect(page.status).toBe(200);
    const html = page.text;
    const scripts = [...html.matchAll(/<script\b([^>]*)>([\s\S]*?)<\/script>/g)];
    expect(scripts.length).toBeGreaterThan(0);
    for (const [, attributes, content] of scripts) {
      // An inline script would need 'unsafe-inline' or a hash; JSON data blocks do not run.
      if (/type="application\/(ld\+)?json"/.test(attributes ?? '')) continue;
      expect((content ?? '').trim()).toBe('');
      const src = /src="([^"]+)"/.exec(attributes ?? '')?.[1] ?? '';
      expect(src.startsWith('/')).toBe(true);
      expect(src.startsWith('//')).toBe(false);
      expect((await request(webApp).get(src)).status).toBe(200);
    }
    expect(html).not.toMatch(/\son[a-z]+="/i); // no inline event handlers
  });
});

describe('uploads cannot escape their storage', () => {
  it('path tricks in file names never name a storage path, and are served back only as downloads', async () => {
    const entry = await draft();
    const tricks = ['../../../../etc/passwd.txt', '..\\..\\windows\\win.ini.txt', '/etc/shadow.txt', 'a/../../b.txt', '%2e%2e%2fescape.txt', '....//....//x.txt', 'CON.txt', ' .txt'];
    for (const name of tricks) {
      const response = await upload('contributor', entry.id, name, Buffer.from(`content of ${name}\n`));
      expect([201, 400, 415]).toContain(response.status);
      if (response.status !== 201) continue;
      const download = await b.contributor.get(`/api/complexes/${entry.id}/attachments/${response.body.id}`);
      expect(download.status).toBe(200);
      expect(String(download.headers['content-disposition'])).toMatch(/^attachment;/);
      expect(download.headers['content-security-policy']).toBe("default-src 'none'; sandbox");
      expect(download.headers['x-content-type-options']).toBe('nosniff');
    }
    // Nothing was written outside the storage folder, and no stored path carries a name from the request.
    const stored: string[] = [];
    const walk = (dir: string) => {
      for (const item of fs.readdirSync(dir, { withFileTypes: true })) {
        const full = path.join(dir, item.name);
        if (item.isDirectory()) walk(full);
        else stored.push(path.relative(storageDir, full));
      }
    };
    walk(storageDir);
    expect(stored.length).toBeGreaterThan(0);
    for (const file of stored) {
      expect(file.startsWith('..')).toBe(false);
      expect(file).not.toMatch(/passwd|shadow|win\.ini|escape/);
    }
    expect(fs.existsSync(path.join(storageDir, '..', 'etc'))).toBe(false);
  });

  it('content-type lies are refused or neutralised: HTML sent as a picture, a PNG named .pdf, a script as text', async () => {
    const entry = await draft();
    const png = Buffer.from('89504e470d0a1a0a0000000d4948445200000001000000010806000000', 'hex');
    const pngAsPdf = await upload('contributor', entry.id, 'spectrum.pdf', png, 'application/pdf');
    expect(pngAsPdf.status).toBe(415);
    const htmlAsPng = await upload('contributor', entry.id, 'figure.png', Buffer.from('<html><script>alert(1)</script></html>'), 'image/png');
    expect([400, 415]).toContain(htmlAsPng.status);
    const htmlAsText = await upload('contributor', entry.id, 'readme.txt', Buffer.from('<html><script>alert(1)</script></html>'), 'text/html');
    if (htmlAsText.status === 201) {
      const download = await b.contributor.get(`/api/complexes/${entry.id}/attachments/${htmlAsText.body.id}`);
      expect(String(download.headers['content-type'])).not.toMatch(/html/);
      expect(download.headers['content-security-policy']).toBe("default-src 'none'; sandbox");
    } else {
      expect([400, 415]).toContain(htmlAsText.status);
    }
  });
});

describe('SQL injection in every search and filter parameter', () => {
  const injections = ["' or '1'='1", "Co' union select id, email, password_hash from app_user --", "1; drop table complex; --", "%' or '%'='", '\\', '%', '_', "'::text", '$1', '1 or 1=1', ')) or ((1=1', "' || pg_sleep(5) || '"];
  const params = ['q', 'metal', 'verdict', 'status', 'ligand', 'measurementKind', 'oxidationState', 'dCount', 'hasCitation', 'groupId', 'page', 'pageSize', 'sort'];

  it('answers 200 or 400 (never 5xx, never slow), and never leaks another group’s rows or hidden drafts', async () => {
    const hidden = await draft('admin'); // a draft the viewer may not see
    const fenwickEntry = await b.outsider.post('/api/complexes', { groupId: fenwick, formula: '[Ru(bpy)3]2+', name: "fenwick secret ' or '1'='1" });
    const forbiddenIds = new Set([hidden.id, fenwickEntry.body.id as string]);
    const failures: string[] = [];
    for (const route of ['/api/complexes', '/api/exports/library.csv']) {
      for (const param of params) {
        if (route !== '/api/complexes' && (param === 'page' || param === 'pageSize')) continue;
        for (const value of injections) {
          const started = Date.now();
          const response = await b.viewer.get(`${route}?${param}=${encodeURIComponent(value)}`);
          const where = `${route}?${param}=${value}`;
          if (![200, 400].includes(response.status)) failures.push(`${where}: ${response.status}`);
          if (Date.now() - started > 3000) failures.push(`${where}: slow (${Date.now() - started} ms)`);
          if (response.status !== 200) continue;
          const text = route.endsWith('.csv') ? response.text : JSON.stringify(response.body);
          for (const id of forbiddenIds) if (text.includes(id)) failures.push(`${where}: leaked ${id}`);
          if (text.includes('fenwick secret') || text.includes('password_hash') || text.includes('$argon2')) failures.push(`${where}: leaked another group's or account data`);
          if (route === '/api/complexes') {
            for (const item of response.body.items as { status: string; groupId: string }[]) {
              if (item.groupId !== larkspur) failures.push(`${where}: row of group ${item.groupId}`);
              if (item.status !== 'accepted') failures.push(`${where}: a ${item.status} entry shown to a viewer`);
            }
          }
        }
      }
    }
    expect(failures).toEqual([]);
    // The tables are all still there.
    expect((await b.viewer.get('/api/complexes')).status).toBe(200);
  }, 120_000);
});
