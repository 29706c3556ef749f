import request from 'supertest';
import { sessionStateResponseSchema } from '@/lib/schemas/auth';
import { createTestApp, type TestApp } from '../setup/test-app';
import { SESSION_COOKIE_NAME } from '@/server/modules/auth/lucia';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser, TEST_HOST } from './auth-helpers';

/**
 * GET /api/auth/session: the app's "who is here" question. A visitor gets 200 with `me: null` (so the
 * browser logs no failed request); a signed-in person gets the same answer as GET /api/auth/me, which
 * keeps its 401 for scripts.
 */
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('GET /api/auth/session', () => {
  it('answers a visitor with 200 and me: null, never cached, while /auth/me still says 401', async () => {
    const visitor = await request(t.app).get('/api/auth/session').set('Host', TEST_HOST);
    expect(visitor.status).toBe(200);
    expect(visitor.body).toEqual({ me: null });
    expect(visitor.headers['cache-control']).toBe('no-store');
    expect((await request(t.app).get('/api/auth/me').set('Host', TEST_HOST)).status).toBe(401);
  });

  it('answers a signed-in person with who they are and their roles, as /auth/me does', async () => {
    const person = await makeUser(t.orm, 'odile@larkspur.example.org', { displayName: 'Odile Ferrant' });
    await makeGroup(t.orm, 'Larkspur Coordination Lab', [{ userId: person.id, role: 'curator' }]);
    const browser = new Browser(t.app);
    await browser.signIn('odile@larkspur.example.org', FIXTURE_PASSWORD);
    const session = await browser.get('/api/auth/session');
    expect(session.status).toBe(200);
    const parsed = sessionStateResponseSchema.parse(session.body);
    expect(parsed.me?.user).toEqual({ id: person.id, email: 'odile@larkspur.example.org', displayName: 'Odile Ferrant' });
    expect(parsed.me?.memberships).toEqual([{ groupId: expect.any(String), groupName: 'Larkspur Coordination Lab', role: 'curator' }]);
    expect(session.body.me).toEqual((await browser.get('/api/auth/me')).body);
  });

  it('treats a forged or ended session cookie as a visitor, not an error', async () => {
    const forged = await request(t.app)
      .get('/api/auth/session')
      .set('Host', TEST_HOST)
      .set('Cookie', `${SESSION_COOKIE_NAME}=not-a-real-session`);
    expect(forged.status).toBe(200);
    expect(forged.body).toEqual({ me: null });
  });
});
