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
  });
});
