import { createHash } from 'node:crypto';
import request from 'supertest';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { createApp } from '@/server/app';
import { openOrm } from '@/server/db/orm';
import { User } from '@/server/modules/auth/user.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import {
  Browser,
  FIXTURE_PASSWORD,
  SESSION_COOKIE,
  TEST_HOST,
  TEST_ORIGIN,
  latestLinkToken,
  makeUser,
  outboxFor,
  sessionCookieFrom,
  setCookieLine,
} from './auth-helpers';

let t: TestApp;
const known = 'curator.security@larkspur.example.org';
const sha256Hex = (value: string) => createHash('sha256').update(value).digest('hex');

beforeAll(async () => {
  t = await createTestApp();
  await makeUser(t.orm, known, { displayName: 'Tobias Wrenfield' });
});
afterAll(async () => {
  await t.close();
});

/** A sign-in from a given client IP (the loopback test client is a trusted proxy, so X-Forwarded-For counts). */
const signInFrom = (app: typeof t.app, ip: string, email: string, password: string) =>
  request(app).post('/api/auth/sign-in').set('Host', TEST_HOST).set('X-Forwarded-For', ip).send({ email, password });

describe('no account enumeration', () => {
  it('sign-in failures answer the same for a known and an unknown address', async () => {
    const knownWrong = await signInFrom(t.app, '198.51.100.1', known, 'not-the-password-at-all');
    const unknown = await signInFrom(t.app, '198.51.100.1', 'nobody@larkspur.example.org', 'not-the-password-at-all');
    expect(knownWrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(unknown.body).toEqual(knownWrong.body);
    expect(knownWrong.body.error.code).toBe('UNAUTHENTICATED');
  });

  it('password-reset requests answer the same for a known and an unknown address', async () => {
    const a = await request(t.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', '198.51.100.2').send({ email: known });
    const b = await request(t.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', '198.51.100.2').send({ email: 'ghost@larkspur.example.org' });
    expect([a.status, b.status]).toEqual([202, 202]);
    expect(b.body).toEqual(a.body);
  });

  it('sign-up with an address that already has an account answers like a new one and changes nothing', async () => {
    const response = await request(t.app)
      .post('/api/auth/sign-up')
      .set('X-Forwarded-For', '198.51.100.3')
      .send({ email: known, password: 'a-brand-new-password-here', displayName: 'Impostor' });
    expect(response.status).toBe(202);
    expect(response.body.message).toMatch(/Check your e-mail/);
    const mails = await outboxFor(t.app, known);
    expect(mails[0]?.subject).toBe('Sphereline: you already have an account');
    // The old password still works; the name is unchanged.
    const ok = await signInFrom(t.app, '198.51.100.3', known, FIXTURE_PASSWORD);
    expect(ok.status).toBe(200);
    expect(ok.body.user.displayName).toBe('Tobias Wrenfield');
  });
});

describe('throttling (counters in PostgreSQL)', () => {
  it('per address and IP: after 5 failures from one IP the 6th from there is 429 with Retry-After, even with the right password', async () => {
    const email = 'throttled@larkspur.example.org';
    await makeUser(t.orm, email);
    for (let i = 0; i < 5; i += 1) {
      expect((await signInFrom(t.app, '192.0.2.10', email, 'wrong-password-guess')).status).toBe(401);
    }
    const blocked = await signInFrom(t.app, '192.0.2.10', email, FIXTURE_PASSWORD);
    expect(blocked.status).toBe(429);
    expect(apiErrorBodySchema.parse(blocked.body).error.code).toBe('RATE_LIMITED');
    const retryAfter = Number(blocked.headers['retry-after']);
    expect(Number.isInteger(retryAfter)).toBe(true);
    expect(retryAfter).toBeGreaterThan(0);
    expect(retryAfter).toBeLessThanOrEqual(15 * 60);
  });

  it('a stranger cannot lock the owner out: failures from other IPs leave the owner’s own sign-in working (OWASP Authentication Cheat Sheet, account lockout)', async () => {
    const email = 'owner@larkspur.example.org';
    await makeUser(t.orm, email);
    for (let i = 0; i < 10; i += 1) {
      const status = (await signInFrom(t.app, '192.0.2.50', email, 'wrong-password-guess')).status;
      expect([401, 429]).toContain(status);
    }
    expect((await signInFrom(t.app, '198.51.100.60', email, FIXTURE_PASSWORD)).status).toBe(200);
  });

  it('guessing spread over many IPs meets the per-address cap', async () => {
    const email = 'spread@larkspur.example.org';
    await makeUser(t.orm, email);
    const app = createApp({ orm: t.orm, auth: { signInFailuresPerAddress: 6 } });
    for (let i = 0; i < 6; i += 1) expect((await signInFrom(app, `192.0.2.${100 + i}`, email, 'wrong-password-guess')).status).toBe(401);
    expect((await signInFrom(app, '192.0.2.120', email, 'wrong-password-guess')).status).toBe(429);
  });

  it('the owner’s password-reset link lifts every counter of the address', async () => {
    const email = 'reset-lifts@larkspur.example.org';
    await makeUser(t.orm, email);
    const app = createApp({ orm: t.orm, auth: { signInFailuresPerAddress: 3 } });
    for (let i = 0; i < 3; i += 1) await signInFrom(app, `192.0.2.${130 + i}`, email, 'wrong-password-guess');
    expect((await signInFrom(app, '192.0.2.140', email, FIXTURE_PASSWORD)).status).toBe(429);
    await request(app).post('/api/auth/password-reset/request').set('X-Forwarded-For', '192.0.2.141').send({ email });
    const token = await latestLinkToken(app, email, '/reset-password');
    const confirmed = await request(app).post('/api/auth/password-reset/confirm').set('Host', TEST_HOST).set('Origin', TEST_ORIGIN).send({ token, password: 'basalt-ligand-trans-effect-5' });
    expect(confirmed.status).toBe(200);
    expect((await signInFrom(app, '192.0.2.140', email, 'basalt-ligand-trans-effect-5')).status).toBe(200);
  });

  it('per IP, shared by two app instances over the same database', async () => {
    const secondOrm = await openOrm(t.databaseUrl);
    try {
      const limits = { signInFailuresPerIp: 4, signInFailuresPerAddress: 100 };
      const appA = createApp({ orm: t.orm, auth: limits });
      const appB = createApp({ orm: secondOrm, auth: limits });
      const ip = '203.0.113.77';
      // Four failures for four different addresses, alternating between the instances.
      for (let i = 0; i < 4; i += 1) {
        const app = i % 2 === 0 ? appA : appB;
        expect((await signInFrom(app, ip, `guess${i}@example.org`, 'wrong-password-guess')).status).toBe(401);
      }
      const fromB = await signInFrom(appB, ip, 'guess9@example.org', 'wrong-password-guess');
      expect(fromB.status).toBe(429);
      expect(Number(fromB.headers['retry-after'])).toBeGreaterThan(0);
      expect((await signInFrom(appA, ip, known, FIXTURE_PASSWORD)).status).toBe(429);
      // Another IP is not affected.
      expect((await signInFrom(appA, '203.0.113.78', known, FIXTURE_PASSWORD)).status).toBe(200);
    } finally {
      await secondOrm.close(true);
    }
  });
});

describe('sessions and cookies', () => {
  it('sets HttpOnly, SameSite=Lax, Path=/ and no Secure over plain HTTP', async () => {
    const response = await signInFrom(t.app, '198.51.100.20', known, FIXTURE_PASSWORD);
    const line = setCookieLine(response) ?? '';
    expect(line).toMatch(/; HttpOnly/);
    expect(line).toMatch(/; SameSite=Lax/);
    expect(line).toMatch(/; Path=\//);
    expect(line).toMatch(/; Max-Age=\d+/);
    expect(line).not.toMatch(/; Secure/);
  });

  it('adds Secure when a loopback proxy says the request came over HTTPS', async () => {
    const response = await signInFrom(t.app, '198.51.100.21', known, FIXTURE_PASSWORD).set('X-Forwarded-Proto', 'https');
    expect(setCookieLine(response)).toMatch(/; Secure/);
  });

  it('over HTTPS names the cookie with the __Host- prefix (RFC 6265bis), and reads only that name there', async () => {
    const response = await signInFrom(t.app, '198.51.100.23', known, FIXTURE_PASSWORD).set('X-Forwarded-Proto', 'https');
    const line = setCookieLine(response) ?? '';
    expect(line).toMatch(/^__Host-sphereline_session=/);
    expect(line).toMatch(/; Secure/);
    expect(line).toMatch(/; Path=\//);
    expect(line).not.toMatch(/; Domain=/i);
    const value = (line.split(';')[0] ?? '').split('=')[1] ?? '';
    const over = (cookie: string) =>
      request(t.app).get('/api/auth/me').set('Host', TEST_HOST).set('X-Forwarded-Proto', 'https').set('Cookie', cookie);
    expect((await over(`__Host-sphereline_session=${value}`)).status).toBe(200);
    // A cookie without the prefix (which a sibling subdomain could have set) is not read over HTTPS.
    expect((await over(`sphereline_session=${value}`)).status).toBe(401);
  });

  it('stores only the SHA-256 of the session id, and Argon2id password hashes', async () => {
    const response = await signInFrom(t.app, '198.51.100.22', known, FIXTURE_PASSWORD);
    const cookie = sessionCookieFrom(response) ?? '';
    const rows = (await t.orm.em.getConnection().execute('select "id" from "user_session"')) as { id: string }[];
    const ids = rows.map((r) => r.id);
    expect(ids).not.toContain(cookie);
    expect(ids).toContain(sha256Hex(cookie));
    const user = await t.orm.em.fork().findOneOrFail(User, { email: known });
    expect(user.passwordHash.startsWith('$argon2id$')).toBe(true);
  });

  it('no session fixation: a planted cookie is not reused, and a previous session is ended', async () => {
    const browser = new Browser(t.app);
    browser.cookie = 'planted-by-someone-else-0123456789';
    await browser.signIn(known, FIXTURE_PASSWORD);
    const first = browser.cookie;
    expect(first).not.toBe('planted-by-someone-else-0123456789');
    await browser.signIn(known, FIXTURE_PASSWORD);
    expect(browser.cookie).not.toBe(first);
    const stale = await request(t.app).get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=${first}`);
    expect(stale.status).toBe(401);
    expect((await browser.get('/api/auth/me')).status).toBe(200);
  });

  it('sign-out ends the session on the server; sign-out-everywhere ends them all', async () => {
    const phone = new Browser(t.app);
    await phone.signIn(known, FIXTURE_PASSWORD);
    const phoneCookie = phone.cookie;
    const out = await phone.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(sessionCookieFrom(out)).toBe('');
    expect((await request(t.app).get('/api/auth/me').set('Cookie', `${SESSION_COOKIE}=${phoneCookie}`)).status).toBe(401);

    const a = new Browser(t.app);
    const b = new Browser(t.app);
    await a.signIn(known, FIXTURE_PASSWORD);
    await b.signIn(known, FIXTURE_PASSWORD);
    expect((await a.post('/api/auth/sign-out-everywhere')).status).toBe(204);
    expect((await b.get('/api/auth/me')).status).toBe(401);
    expect((await a.get('/api/auth/me')).status).toBe(401);
  });

  it('one session can end another of the same person, but not someone else\'s', async () => {
    const a = new Browser(t.app);
    const b = new Browser(t.app);
    await a.signIn(known, FIXTURE_PASSWORD);
    await b.signIn(known, FIXTURE_PASSWORD);
    const handleOfB = sha256Hex(b.cookie ?? '');
    const stranger = new Browser(t.app);
    await makeUser(t.orm, 'stranger@fenwick.example.org');
    await stranger.signIn('stranger@fenwick.example.org', FIXTURE_PASSWORD);
    expect((await stranger.delete(`/api/auth/sessions/${handleOfB}`)).status).toBe(404);
    expect((await a.delete(`/api/auth/sessions/${handleOfB}`)).status).toBe(204);
    expect((await b.get('/api/auth/me')).status).toBe(401);
    expect((await a.get('/api/auth/me')).status).toBe(200);
    expect((await a.delete('/api/auth/sessions/not-a-handle')).status).toBe(404);
  });

  it('sliding expiry: a session past half its life is extended and the cookie re-sent', async () => {
    const browser = new Browser(t.app);
    await browser.signIn(known, FIXTURE_PASSWORD);
    const handle = sha256Hex(browser.cookie ?? '');
    await t.orm.em.getConnection().execute(
      `update "user_session" set "expires_at" = now() + interval '2 days' where "id" = ?`, [handle], 'run');
    const response = await browser.get('/api/auth/me');
    expect(response.status).toBe(200);
    expect(setCookieLine(response)).toMatch(/Max-Age=1209600/); // 14 days in seconds
    const [row] = (await t.orm.em.getConnection().execute(
      `select extract(epoch from ("expires_at" - now())) / 86400 as days from "user_session" where "id" = ?`, [handle])) as { days: string }[];
    expect(Number(row?.days)).toBeGreaterThan(13.9);
  });

  it('a session older than 30 days is refused even if it was in use (absolute lifetime)', async () => {
    const browser = new Browser(t.app);
    await browser.signIn(known, FIXTURE_PASSWORD);
    await t.orm.em.getConnection().execute(
      `update "user_session" set "created_at" = now() - interval '31 days' where "id" = ?`, [sha256Hex(browser.cookie ?? '')], 'run');
    expect((await browser.get('/api/auth/me')).status).toBe(401);
  });

  it('an expired session is refused and its cookie cleared', async () => {
    const browser = new Browser(t.app);
    await browser.signIn(known, FIXTURE_PASSWORD);
    await t.orm.em.getConnection().execute(
      `update "user_session" set "expires_at" = now() - interval '1 minute' where "id" = ?`, [sha256Hex(browser.cookie ?? '')], 'run');
    const response = await browser.get('/api/auth/me');
    expect(response.status).toBe(401);
    expect(sessionCookieFrom(response)).toBe('');
  });
});

describe('CSRF: origin check on state-changing requests', () => {
  let browser: Browser;
  beforeAll(async () => {
    browser = new Browser(t.app);
    await browser.signIn(known, FIXTURE_PASSWORD);
  });
  const withCookie = (req: request.Test) => req.set('Host', TEST_HOST).set('Cookie', `${SESSION_COOKIE}=${browser.cookie}`);

  it('a cross-origin POST with the session cookie → 403 FORBIDDEN', async () => {
    const response = await withCookie(request(t.app).post('/api/groups')).set('Origin', 'http://evil.example').send({ name: 'Sneaky' });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('FORBIDDEN');
  });

  it('a cookie-carrying PATCH without Origin or Referer → 403; with a same-origin Referer → allowed', async () => {
    const bare = await withCookie(request(t.app).patch('/api/auth/me')).send({ displayName: 'No Origin' });
    expect(bare.status).toBe(403);
    const referred = await withCookie(request(t.app).patch('/api/auth/me')).set('Referer', `${TEST_ORIGIN}/account`).send({ displayName: 'Tobias Wrenfield' });
    expect(referred.status).toBe(200);
  });

  it('a cross-origin POST without cookies (e.g. to sign-in) → 403', async () => {
    const response = await request(t.app).post('/api/auth/sign-in').set('Host', TEST_HOST).set('Origin', 'https://evil.example')
      .send({ email: known, password: FIXTURE_PASSWORD });
    expect(response.status).toBe(403);
  });

  it('no cookie and no Origin (a command-line client of the public engine) → allowed', async () => {
    const response = await request(t.app).post('/api/classify').send({ formulas: ['[Co(NH3)6]3+'] });
    expect(response.status).not.toBe(403);
  });
});

describe('verification and reset tokens', () => {
  it('are stored hashed, single-use, and refused once expired', async () => {
    const email = 'expiring@larkspur.example.org';
    expect((await request(t.app).post('/api/auth/sign-up').set('X-Forwarded-For', '198.51.100.30')
      .send({ email, password: 'tetrahedral-zinc-chloride', displayName: 'Wyn Ellery' })).status).toBe(202);
    const verifyToken = await latestLinkToken(t.app, email, '/verify');
    const stored = ((await t.orm.em.getConnection().execute('select "token_hash" from "email_token"')) as { token_hash: string }[])
      .map((r) => r.token_hash);
    expect(stored).toContain(sha256Hex(verifyToken));
    expect(stored).not.toContain(verifyToken);

    await t.orm.em.getConnection().execute(`update "email_token" set "expires_at" = now() - interval '1 second'`, [], 'run');
    const late = await request(t.app).post('/api/auth/verify').send({ token: verifyToken });
    expect(late.status).toBe(400);
    expect(late.body.error.fields).toEqual({ token: 'invalid, used or expired' });

    // A reset link proves the address too; expire one, then use a fresh one.
    await request(t.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', '198.51.100.31').send({ email });
    const resetToken = await latestLinkToken(t.app, email, '/reset-password');
    await t.orm.em.getConnection().execute(`update "email_token" set "expires_at" = now() - interval '1 second'`, [], 'run');
    expect((await request(t.app).post('/api/auth/password-reset/confirm').send({ token: resetToken, password: 'trigonal-bipyramid-five' })).status).toBe(400);
  });

  it('a newer link replaces an older one', async () => {
    const email = 'twice@larkspur.example.org';
    await makeUser(t.orm, email);
    await request(t.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', '198.51.100.32').send({ email });
    const first = await latestLinkToken(t.app, email, '/reset-password');
    await request(t.app).post('/api/auth/password-reset/request').set('X-Forwarded-For', '198.51.100.32').send({ email });
    const second = await latestLinkToken(t.app, email, '/reset-password');
    expect(second).not.toBe(first);
    expect((await request(t.app).post('/api/auth/password-reset/confirm').send({ token: first, password: 'jahn-teller-distortion' })).status).toBe(400);
    expect((await request(t.app).post('/api/auth/password-reset/confirm').send({ token: second, password: 'jahn-teller-distortion' })).status).toBe(200);
  });
});

describe('bad input is always 400 with the error shape', () => {
  it.each([
    ['/api/auth/sign-up', {}, 'email'],
    ['/api/auth/sign-up', { email: 'a@b.example.org', password: 'short', displayName: 'X' }, 'password'],
    ['/api/auth/sign-up', { email: 'not-an-address', password: 'long-enough-password', displayName: 'X' }, 'email'],
    ['/api/auth/sign-up', { email: 'a@b.example.org', password: 'qwertyuiop', displayName: 'X' }, 'password'],
    ['/api/auth/sign-in', { email: 'a@b.example.org' }, 'password'],
    ['/api/auth/sign-in', { email: 42, password: 'x' }, 'email'],
    ['/api/auth/verify', { token: 12345 }, 'token'],
    ['/api/auth/password-reset/request', { email: '' }, 'email'],
    ['/api/auth/password-reset/confirm', { token: 'short', password: 'long-enough-password' }, 'token'],
  ])('POST %s %j → 400 naming %s', async (path, body, field) => {
    const response = await request(t.app).post(path).set('X-Forwarded-For', '198.51.100.40').send(body);
    expect(response.status).toBe(400);
    const error = apiErrorBodySchema.parse(response.body).error;
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(error.fields ?? {})).toContain(field);
  });

  it('malformed JSON on sign-in → 400, not 500', async () => {
    const response = await request(t.app).post('/api/auth/sign-in').set('Content-Type', 'application/json').send('{"email":');
    expect(response.status).toBe(400);
  });
});

describe('TRUST_PROXY', () => {
  // Express "trust proxy": forwarded headers count only from proxies the operator names.
  it('off (the default outside tests): X-Forwarded-For and X-Forwarded-Proto are ignored', async () => {
    const app = createApp({ orm: t.orm, env: { TRUST_PROXY: undefined }, auth: { signInFailuresPerIp: 2, signInFailuresPerAddress: 100, signInFailuresPerAddressAndIp: 100 } });
    // Each attempt claims another client IP; all come from the same socket, so the per-IP limit trips.
    for (let i = 0; i < 2; i += 1) expect((await signInFrom(app, `192.0.2.${200 + i}`, `nobody${i}@example.org`, 'wrong-password-guess')).status).toBe(401);
    expect((await signInFrom(app, '192.0.2.210', 'nobody9@example.org', 'wrong-password-guess')).status).toBe(429);
    const https = await signInFrom(createApp({ orm: t.orm, env: { TRUST_PROXY: undefined } }), '192.0.2.211', known, FIXTURE_PASSWORD).set('X-Forwarded-Proto', 'https');
    expect(setCookieLine(https)).not.toMatch(/; Secure/);
  });

  it('on ("loopback"): each forwarded client IP is counted apart, and HTTPS behind the proxy gives a Secure cookie', async () => {
    const app = createApp({ orm: t.orm, env: { TRUST_PROXY: 'loopback' }, auth: { signInFailuresPerIp: 2, signInFailuresPerAddress: 100, signInFailuresPerAddressAndIp: 100 } });
    for (let i = 0; i < 3; i += 1) expect((await signInFrom(app, `192.0.2.${220 + i}`, `someone${i}@example.org`, 'wrong-password-guess')).status).toBe(401);
    const https = await signInFrom(app, '192.0.2.230', known, FIXTURE_PASSWORD).set('X-Forwarded-Proto', 'https');
    expect(setCookieLine(https)).toMatch(/; Secure/);
  });
});
