import { createApp } from '@/server/app';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser, outboxFor } from './auth-helpers';

/**
 * Limits that keep the app from being used to send mail in bulk: invitations per inviter, per group
 * and per recipient, and verification links resent on sign-in at most once per window.
 */
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

async function adminOf(groupName: string, email: string, app = t.app) {
  const user = await makeUser(t.orm, email);
  const group = await makeGroup(t.orm, groupName, [{ userId: user.id, role: 'admin' }]);
  const browser = new Browser(app);
  await browser.signIn(email, FIXTURE_PASSWORD);
  return { browser, groupId: group.id };
}

describe('invitation limits', () => {
  it('per recipient: the third invitation to one address in a day is 429 with Retry-After', async () => {
    const app = createApp({ orm: t.orm, auth: { invitationsPerRecipientPerDay: 2 } });
    const { browser, groupId } = await adminOf('Larkspur Coordination Lab', 'pi-recipient@larkspur.example.org', app);
    for (let i = 0; i < 2; i += 1) expect((await browser.post(`/api/groups/${groupId}/invitations`, { email: 'target@example.org', role: 'viewer' })).status).toBe(201);
    const third = await browser.post(`/api/groups/${groupId}/invitations`, { email: 'target@example.org', role: 'viewer' });
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe('RATE_LIMITED');
    expect(Number(third.headers['retry-after'])).toBeGreaterThan(0);
  });

  it('per inviter: after the hour’s allowance further invitations are refused, whoever they are for', async () => {
    const app = createApp({ orm: t.orm, auth: { invitationsPerInviterPerHour: 3 } });
    const { browser, groupId } = await adminOf('Fenwick Photoredox Group', 'pi-inviter@fenwick.example.org', app);
    for (let i = 0; i < 3; i += 1) expect((await browser.post(`/api/groups/${groupId}/invitations`, { email: `person${i}@example.org`, role: 'viewer' })).status).toBe(201);
    expect((await browser.post(`/api/groups/${groupId}/invitations`, { email: 'person9@example.org', role: 'viewer' })).status).toBe(429);
  });

  it('keeps the free-text group name out of the mail subject', async () => {
    const { browser, groupId } = await adminOf('URGENT: reset your bank password', 'pi-subject@larkspur.example.org');
    expect((await browser.post(`/api/groups/${groupId}/invitations`, { email: 'reader@example.org', role: 'viewer' })).status).toBe(201);
    const [mail] = await outboxFor(t.app, 'reader@example.org');
    expect(mail?.subject).toBe('Sphereline: an invitation to a research group');
    expect(mail?.text).toContain('"URGENT: reset your bank password"');
  });
});

describe('verification mail on sign-in', () => {
  it('an unverified account signing in again and again gets one new link per window, not one per attempt', async () => {
    const email = 'unverified@larkspur.example.org';
    await makeUser(t.orm, email, { verified: false });
    const browser = new Browser(t.app);
    for (let i = 0; i < 4; i += 1) {
      const response = await browser.post('/api/auth/sign-in', { email, password: FIXTURE_PASSWORD });
      expect(response.status).toBe(403);
      expect(response.body.error.reason).toBe('EMAIL_NOT_VERIFIED');
    }
    expect(await outboxFor(t.app, email)).toHaveLength(1);
  });
});

describe('common passwords', () => {
  // Mozilla's common-password list (npm fxa-common-password-list): digit runs and keyboard walks of 12 characters.
  it.each(['123456789012', 'qwertyuiop12', '1q2w3e4r5t6y'])('refuses %s at sign-up', async (password) => {
    const response = await new Browser(t.app).post('/api/auth/sign-up', { email: `new-${password}@example.org`, displayName: 'New Person', password });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.password).toMatch(/commonly used/);
  });
});
