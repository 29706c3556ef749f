import request from 'supertest';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { meResponseSchema, sessionsResponseSchema } from '@/lib/schemas/auth';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, latestLinkToken, outboxFor, TEST_HOST } from './auth-helpers';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

const email = 'new.student@larkspur.example.org';
const firstPassword = 'octahedral-cobalt-ammine';
const secondPassword = 'square-planar-platinum-d8';

describe('sign-up → verify → sign-in → reset → sign-in, through the mail sink', () => {
  it('runs the whole story by following the e-mailed links', async () => {
    const browser = new Browser(t.app);

    const signUp = await browser.post('/api/auth/sign-up', { email, password: firstPassword, displayName: 'Ada Quillfeather' });
    expect(signUp.status).toBe(202);

    // Unverified accounts cannot sign in (and get a fresh link).
    const early = await browser.post('/api/auth/sign-in', { email, password: firstPassword });
    expect(early.status).toBe(403);
    expect(early.body.error.reason).toBe('EMAIL_NOT_VERIFIED');

    const mails = await outboxFor(t.app, email);
    expect(mails.length).toBe(2);
    const verifyMail = mails[1]!;
    expect(verifyMail.subject).toBe('Sphereline: confirm your e-mail address');
    expect(verifyMail.text).toContain('Ada Quillfeather');
    expect(verifyMail.html).toContain('<a href="http://127.0.0.1:8080/verify?token=');

    const verifyToken = await latestLinkToken(t.app, email, '/verify');
    expect((await browser.post('/api/auth/verify', { token: verifyToken })).status).toBe(200);
    // Single use.
    const again = await browser.post('/api/auth/verify', { token: verifyToken });
    expect(again.status).toBe(400);
    expect(apiErrorBodySchema.parse(again.body).error.fields).toEqual({ token: 'invalid, used or expired' });

    const signIn = await browser.post('/api/auth/sign-in', { email: '  New.Student@Larkspur.example.org ', password: firstPassword });
    expect(signIn.status).toBe(200);
    expect(meResponseSchema.parse(signIn.body)).toEqual({
      user: { id: expect.any(String), email, displayName: 'Ada Quillfeather' },
      memberships: [],
    });
    const me = await browser.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);

    // A second device.
    const laptop = new Browser(t.app);
    await laptop.signIn(email, firstPassword);
    const sessions = sessionsResponseSchema.parse((await browser.get('/api/auth/sessions')).body).sessions;
    expect(sessions).toHaveLength(2);
    expect(sessions.filter((s) => s.current)).toHaveLength(1);

    // Reset by e-mail signs out everywhere.
    expect((await request(t.app).post('/api/auth/password-reset/request').send({ email })).status).toBe(202);
    const resetToken = await latestLinkToken(t.app, email, '/reset-password');
    const weak = await request(t.app).post('/api/auth/password-reset/confirm').send({ token: resetToken, password: 'password1234' });
    expect(weak.status).toBe(400);
    expect(weak.body.error.fields.password).toMatch(/commonly used/);
    const reset = await request(t.app).post('/api/auth/password-reset/confirm').send({ token: resetToken, password: secondPassword });
    expect(reset.status).toBe(200);
    const reused = await request(t.app).post('/api/auth/password-reset/confirm').send({ token: resetToken, password: secondPassword });
    expect(reused.status).toBe(400);

    expect((await browser.get('/api/auth/me')).status).toBe(401);
    expect((await laptop.get('/api/auth/me')).status).toBe(401);
    const old = await request(t.app).post('/api/auth/sign-in').set('Host', TEST_HOST).send({ email, password: firstPassword });
    expect(old.status).toBe(401);
    await browser.signIn(email, secondPassword);
    expect((await browser.get('/api/auth/me')).status).toBe(200);
    const afterReset = (await outboxFor(t.app, email))[0]!; // newest first
    expect(afterReset.subject).toBe('Sphereline: your password was changed');
    expect(afterReset.text).toMatch(/reset with a link/);
  });
});

describe('changing the password while signed in', () => {
  const owner = 'changer@larkspur.example.org';
  const original = 'tetrahedral-nickel-chloride';
  const replacement = 'low-spin-iron-cyanide-d6';

  it('asks for the current password, keeps this session, ends the others and tells the owner by e-mail', async () => {
    const desk = new Browser(t.app);
    expect((await desk.post('/api/auth/sign-up', { email: owner, password: original, displayName: 'Bea Thornbury' })).status).toBe(202);
    expect((await desk.post('/api/auth/verify', { token: await latestLinkToken(t.app, owner, '/verify') })).status).toBe(200);
    await desk.signIn(owner, original);
    const phone = new Browser(t.app);
    await phone.signIn(owner, original);

    // Signed out: 401, whatever the body.
    expect((await new Browser(t.app).post('/api/auth/password', { currentPassword: original, newPassword: replacement })).status).toBe(401);

    const wrong = await desk.post('/api/auth/password', { currentPassword: 'not-the-password-at-all', newPassword: replacement });
    expect(wrong.status).toBe(400);
    expect(apiErrorBodySchema.parse(wrong.body).error.fields).toEqual({ currentPassword: 'That is not your current password.' });
    const same = await desk.post('/api/auth/password', { currentPassword: original, newPassword: original });
    expect(same.status).toBe(400);
    expect(apiErrorBodySchema.parse(same.body).error.fields?.newPassword).toMatch(/different/);
    const weak = await desk.post('/api/auth/password', { currentPassword: original, newPassword: 'password1234' });
    expect(weak.status).toBe(400);
    expect(apiErrorBodySchema.parse(weak.body).error.fields?.newPassword).toMatch(/commonly used/);
    const short = await desk.post('/api/auth/password', { currentPassword: original, newPassword: 'short' });
    expect(short.status).toBe(400);
    expect(apiErrorBodySchema.parse(short.body).error.fields?.newPassword).toMatch(/at least 12/);
    // None of the refusals changed anything: both devices are still signed in.
    expect((await phone.get('/api/auth/me')).status).toBe(200);

    const changed = await desk.post('/api/auth/password', { currentPassword: original, newPassword: replacement });
    expect(changed.status).toBe(200);
    expect((await desk.get('/api/auth/me')).status).toBe(200);
    expect((await phone.get('/api/auth/me')).status).toBe(401);
    expect(sessionsResponseSchema.parse((await desk.get('/api/auth/sessions')).body).sessions).toHaveLength(1);
    expect((await request(t.app).post('/api/auth/sign-in').set('Host', TEST_HOST).send({ email: owner, password: original })).status).toBe(401);
    await new Browser(t.app).signIn(owner, replacement);

    const mail = (await outboxFor(t.app, owner))[0]!; // newest first
    expect(mail.subject).toBe('Sphereline: your password was changed');
    expect(mail.text).toMatch(/changed from the account page/);
    expect(mail.html).toContain('/forgot-password');
  });

  it('throttles guesses of the current password', async () => {
    const desk = new Browser(t.app);
    await desk.signIn(owner, replacement);
    const statuses: number[] = [];
    for (let i = 0; i < 6; i += 1) {
      statuses.push((await desk.post('/api/auth/password', { currentPassword: `guess-number-${i}-wrong`, newPassword: 'another-long-password-x' })).status);
    }
    expect(statuses.slice(0, 5)).toEqual([400, 400, 400, 400, 400]);
    expect(statuses[5]).toBe(429);
    // Even the right password waits now.
    expect((await desk.post('/api/auth/password', { currentPassword: replacement, newPassword: 'another-long-password-x' })).status).toBe(429);
  });
});
