import request from 'supertest';
import { acceptInvitationResponseSchema, invitationPreviewSchema, invitationSchema } from '@/lib/schemas/groups';
import { AuditEvent } from '@/server/modules/audit/audit-event.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, latestLinkToken, makeUser, outboxFor } from './auth-helpers';

let t: TestApp;
let pi: Browser;
let groupId: string;

beforeAll(async () => {
  t = await createTestApp();
  await makeUser(t.orm, 'pi@larkspur.example.org', { displayName: 'Dr. Imogen Larkspur' });
  pi = new Browser(t.app);
  await pi.signIn('pi@larkspur.example.org', FIXTURE_PASSWORD);
  const created = await pi.post('/api/groups', { name: 'Larkspur Coordination Lab' });
  expect(created.status).toBe(201);
  groupId = created.body.id;
});
afterAll(async () => {
  await t.close();
});

describe('a group always keeps an admin', () => {
  it('the only admin can neither step down nor leave (409); with a second admin both work', async () => {
    const me = (await pi.get('/api/auth/me')).body.user.id as string;
    const demote = await pi.patch(`/api/groups/${groupId}/members/${me}`, { role: 'curator' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('CONFLICT');
    expect((await pi.delete(`/api/groups/${groupId}/members/${me}`)).status).toBe(409);

    const deputy = await makeUser(t.orm, 'deputy@larkspur.example.org');
    const em = t.orm.em.fork();
    em.create(GroupMembership, { groupId, userId: deputy.id, role: 'viewer' });
    await em.flush();
    expect((await pi.patch(`/api/groups/${groupId}/members/${deputy.id}`, { role: 'admin' })).status).toBe(200);
    expect((await pi.patch(`/api/groups/${groupId}/members/${me}`, { role: 'curator' })).status).toBe(200);

    const deputyBrowser = new Browser(t.app);
    await deputyBrowser.signIn('deputy@larkspur.example.org', FIXTURE_PASSWORD);
    // Now the deputy is the only admin: the same rule protects them.
    expect((await deputyBrowser.delete(`/api/groups/${groupId}/members/${deputy.id}`)).status).toBe(409);
    expect((await deputyBrowser.patch(`/api/groups/${groupId}/members/${me}`, { role: 'admin' })).status).toBe(200);

    const events = await t.orm.em.fork().find(AuditEvent, { groupId, action: 'member.role-changed' }, { orderBy: { createdAt: 'asc' } });
    expect(events.map((e) => e.details)).toEqual([
      { from: 'viewer', to: 'admin' },
      { from: 'admin', to: 'curator' },
      { from: 'curator', to: 'admin' },
    ]);
    expect(events[0]?.actorId).toBe(me);
    expect(events[0]?.subjectId).toBe(deputy.id);
  });

  it('any member may leave; the leaving is audited', async () => {
    const leaver = await makeUser(t.orm, 'leaver@larkspur.example.org');
    const em = t.orm.em.fork();
    em.create(GroupMembership, { groupId, userId: leaver.id, role: 'contributor' });
    await em.flush();
    const browser = new Browser(t.app);
    await browser.signIn('leaver@larkspur.example.org', FIXTURE_PASSWORD);
    expect((await browser.delete(`/api/groups/${groupId}/members/${leaver.id}`)).status).toBe(204);
    expect((await browser.get(`/api/groups/${groupId}`)).status).toBe(404);
    expect(await t.orm.em.fork().count(AuditEvent, { groupId, action: 'member.left', subjectId: leaver.id })).toBe(1);
  });
});

describe('invitations', () => {
  it('e-mail → preview → accept as the invited address; single use; the wrong person is refused', async () => {
    const invitee = 'mateo@larkspur.example.org';
    const created = await pi.post(`/api/groups/${groupId}/invitations`, { email: 'Mateo@Larkspur.example.org', role: 'contributor' });
    expect(created.status).toBe(201);
    expect(invitationSchema.parse(created.body)).toMatchObject({ email: invitee, role: 'contributor', status: 'pending' });

    const [mail] = await outboxFor(t.app, invitee);
    expect(mail?.subject).toBe('Sphereline: an invitation to a research group');
    expect(mail?.text).toContain('Dr. Imogen Larkspur invites you to join "Larkspur Coordination Lab"');
    expect(mail?.html).toContain('/invitations/accept?token=');
    const token = await latestLinkToken(t.app, invitee, '/invitations/accept');

    const preview = await request(t.app).get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(Object.keys(invitationPreviewSchema.parse(preview.body)).sort()).toEqual(['email', 'expiresAt', 'groupName', 'role']);
    expect(preview.body).toMatchObject({ groupName: 'Larkspur Coordination Lab', role: 'contributor', email: invitee });

    // Signed out → 401; signed in as someone else → 403.
    expect((await new Browser(t.app).post('/api/invitations/accept', { token })).status).toBe(401);
    await makeUser(t.orm, 'someone.else@larkspur.example.org');
    const other = new Browser(t.app);
    await other.signIn('someone.else@larkspur.example.org', FIXTURE_PASSWORD);
    expect((await other.post('/api/invitations/accept', { token })).status).toBe(403);

    await makeUser(t.orm, invitee);
    const mateo = new Browser(t.app);
    await mateo.signIn(invitee, FIXTURE_PASSWORD);
    const accepted = await mateo.post('/api/invitations/accept', { token });
    expect(accepted.status).toBe(200);
    expect(acceptInvitationResponseSchema.parse(accepted.body)).toEqual({ groupId, groupName: 'Larkspur Coordination Lab', role: 'contributor' });
    expect((await mateo.get(`/api/groups/${groupId}`)).body.myRole).toBe('contributor');

    const again = await mateo.post('/api/invitations/accept', { token });
    expect(again.status).toBe(400);
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
    expect(await t.orm.em.fork().count(AuditEvent, { groupId, action: 'member.joined' })).toBe(1);

    // Inviting someone who is already a member → 409.
    expect((await pi.post(`/api/groups/${groupId}/invitations`, { email: invitee, role: 'viewer' })).status).toBe(409);
  });

  it('an expired invitation cannot be previewed or accepted, and is listed as expired', async () => {
    const invitee = 'late@larkspur.example.org';
    await pi.post(`/api/groups/${groupId}/invitations`, { email: invitee, role: 'viewer' });
    const token = await latestLinkToken(t.app, invitee, '/invitations/accept');
    await t.orm.em.getConnection().execute(
      `update "group_invitation" set "expires_at" = now() - interval '1 second' where "email" = ?`, [invitee], 'run');
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
    await makeUser(t.orm, invitee);
    const late = new Browser(t.app);
    await late.signIn(invitee, FIXTURE_PASSWORD);
    expect((await late.post('/api/invitations/accept', { token })).status).toBe(400);
    const list = (await pi.get(`/api/groups/${groupId}/invitations`)).body.invitations as { email: string; status: string }[];
    expect(list.find((i) => i.email === invitee)?.status).toBe('expired');
  });

  it('a withdrawn invitation stops working', async () => {
    const invitee = 'withdrawn@larkspur.example.org';
    const created = await pi.post(`/api/groups/${groupId}/invitations`, { email: invitee, role: 'viewer' });
    const token = await latestLinkToken(t.app, invitee, '/invitations/accept');
    expect((await pi.delete(`/api/groups/${groupId}/invitations/${created.body.id}`)).status).toBe(204);
    expect((await pi.delete(`/api/groups/${groupId}/invitations/${created.body.id}`)).status).toBe(404);
    expect((await request(t.app).get(`/api/invitations/${token}`)).status).toBe(404);
  });

  it('the invitation token is stored only as its hash', async () => {
    const invitee = 'hashed@larkspur.example.org';
    await pi.post(`/api/groups/${groupId}/invitations`, { email: invitee, role: 'viewer' });
    const token = await latestLinkToken(t.app, invitee, '/invitations/accept');
    const rows = (await t.orm.em.getConnection().execute(
      'select "token_hash" from "group_invitation" where "email" = ?', [invitee])) as { token_hash: string }[];
    expect(rows).toHaveLength(1);
    expect(rows[0]?.token_hash).not.toBe(token);
    expect(rows[0]?.token_hash).toHaveLength(64);
  });
});
