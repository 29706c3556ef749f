import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { groupDetailSchema, groupsResponseSchema, invitationsResponseSchema } from '@/lib/schemas/groups';
import { seedDemo } from '@/server/db/seed';
import { DEMO_GROUPS, DEMO_PASSWORD } from '@/server/modules/auth/demo-accounts';
import { generateLinkToken, hashSecret } from '@/server/modules/auth/tokens';
import { User } from '@/server/modules/auth/user.entity';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupInvitation } from '@/server/modules/groups/invitation.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, makeUser } from './auth-helpers';

/**
 * The authorisation matrix: every group route × every role, a member of another group, and a
 * signed-out visitor, with the exact status. Policy: 401 signed out; 404 for a group you are not
 * in (the same as a group that does not exist); 403 for a member whose role is too low.
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

let t: TestApp;
const browsers = {} as Record<Actor, Browser>;
let larkspurId: string;
let fenwickId: string;
let contributor2Id: string;
let caseNumber = 0;

beforeAll(async () => {
  t = await createTestApp();
  await seedDemo(t.orm);
  for (const actor of actors) {
    browsers[actor] = new Browser(t.app);
    if (actor !== 'signedOut') await browsers[actor].signIn(emails[actor], DEMO_PASSWORD);
  }
  const em = t.orm.em.fork();
  larkspurId = (await em.findOneOrFail(ResearchGroup, { name: DEMO_GROUPS.larkspur })).id;
  fenwickId = (await em.findOneOrFail(ResearchGroup, { name: DEMO_GROUPS.fenwick })).id;
  contributor2Id = (await em.findOneOrFail(User, { email: 'contributor2@larkspur.example.org' })).id;
});
afterAll(async () => {
  await t.close();
});

/** A fresh person in the Larkspur lab, for routes that remove someone. */
async function spareMember() {
  caseNumber += 1;
  const user = await makeUser(t.orm, `spare${caseNumber}@larkspur.example.org`);
  const em = t.orm.em.fork();
  em.create(GroupMembership, { groupId: larkspurId, userId: user.id, role: 'viewer' });
  await em.flush();
  return user.id;
}

async function pendingInvitation() {
  caseNumber += 1;
  const em = t.orm.em.fork();
  const invitation = em.create(GroupInvitation, {
    groupId: larkspurId,
    email: `invitee${caseNumber}@example.org`,
    role: 'viewer',
    tokenHash: hashSecret(generateLinkToken()),
    invitedById: null,
    expiresAt: new Date(Date.now() + 86_400_000),
  });
  await em.flush();
  return invitation.id;
}

interface RouteCase {
  name: string;
  call: (b: Browser) => Promise<{ status: number; body: unknown }>;
  expected: Record<Actor, number>;
}

const adminOnly = (ok: number): Record<Actor, number> => ({
  admin: ok, curator: 403, contributor: 403, viewer: 403, outsider: 404, signedOut: 401,
});

const routeCases: RouteCase[] = [
  {
    name: 'GET /api/groups/:groupId',
    call: (b) => b.get(`/api/groups/${larkspurId}`),
    expected: { admin: 200, curator: 200, contributor: 200, viewer: 200, outsider: 404, signedOut: 401 },
  },
  { name: 'GET /api/groups/:groupId/invitations', call: (b) => b.get(`/api/groups/${larkspurId}/invitations`), expected: adminOnly(200) },
  {
    name: 'POST /api/groups/:groupId/invitations',
    call: (b) => b.post(`/api/groups/${larkspurId}/invitations`, { email: `new${(caseNumber += 1)}@example.org`, role: 'viewer' }),
    expected: adminOnly(201),
  },
  {
    name: 'DELETE /api/groups/:groupId/invitations/:id',
    call: async (b) => b.delete(`/api/groups/${larkspurId}/invitations/${await pendingInvitation()}`),
    expected: adminOnly(204),
  },
  {
    name: 'PATCH /api/groups/:groupId/members/:userId',
    call: (b) => b.patch(`/api/groups/${larkspurId}/members/${contributor2Id}`, { role: 'contributor' }),
    expected: adminOnly(200),
  },
  {
    name: 'DELETE /api/groups/:groupId/members/:userId (someone else)',
    call: async (b) => b.delete(`/api/groups/${larkspurId}/members/${await spareMember()}`),
    expected: adminOnly(204),
  },
];

describe.each(routeCases)('$name', ({ call, expected }) => {
  it.each(actors)('as %s', async (actor) => {
    const response = await call(browsers[actor]);
    expect(response.status).toBe(expected[actor]);
    if (response.status >= 400) apiErrorBodySchema.parse(response.body);
  });
});

describe('routes outside a group', () => {
  const signedIn: Actor[] = ['admin', 'viewer', 'outsider'];
  it.each([
    ['GET /api/auth/me', (b: Browser) => b.get('/api/auth/me'), 200],
    ['GET /api/auth/sessions', (b: Browser) => b.get('/api/auth/sessions'), 200],
    ['GET /api/groups', (b: Browser) => b.get('/api/groups'), 200],
    ['POST /api/groups', (b: Browser) => b.post('/api/groups', { name: 'Matrix test group' }), 201],
    ['POST /api/invitations/accept (unknown token)', (b: Browser) => b.post('/api/invitations/accept', { token: 'x'.repeat(32) }), 400],
    ['PATCH /api/auth/me', (b: Browser) => b.patch('/api/auth/me', { displayName: 'Same Person' }), 200],
  ] as const)('%s: signed in → the expected status, signed out → 401', async (_name, call, okStatus) => {
    for (const actor of signedIn) expect((await call(browsers[actor])).status).toBe(okStatus);
    expect((await call(browsers.signedOut)).status).toBe(401);
  });
});

describe('isolation between groups', () => {
  it('each sees only their own groups in GET /api/groups', async () => {
    const larkspur = groupsResponseSchema.parse((await browsers.viewer.get('/api/groups')).body).groups;
    // (The viewer also made a group of their own above.)
    expect(larkspur.map((g) => g.name)).toContain(DEMO_GROUPS.larkspur);
    expect(larkspur.map((g) => g.name)).not.toContain(DEMO_GROUPS.fenwick);
    expect(larkspur.find((g) => g.name === DEMO_GROUPS.larkspur)?.role).toBe('viewer');
    const fenwick = groupsResponseSchema.parse((await browsers.outsider.get('/api/groups')).body).groups;
    expect(fenwick.map((g) => g.name)).toContain(DEMO_GROUPS.fenwick);
    expect(fenwick.map((g) => g.name)).not.toContain(DEMO_GROUPS.larkspur);
  });

  it('the Larkspur admin gets 404 on every Fenwick route, the same as for a group that does not exist', async () => {
    const admin = browsers.admin;
    const missing = '00000000-0000-4000-8000-000000000000';
    for (const groupId of [fenwickId, missing, 'not-a-uuid']) {
      const responses = await Promise.all([
        admin.get(`/api/groups/${groupId}`),
        admin.get(`/api/groups/${groupId}/invitations`),
        admin.post(`/api/groups/${groupId}/invitations`, { email: 'x@example.org', role: 'admin' }),
        admin.patch(`/api/groups/${groupId}/members/${contributor2Id}`, { role: 'admin' }),
        admin.delete(`/api/groups/${groupId}/members/${contributor2Id}`),
      ]);
      expect(responses.map((r) => r.status)).toEqual([404, 404, 404, 404, 404]);
      expect(responses[0]?.body).toEqual({ error: { code: 'NOT_FOUND', message: 'That group was not found.' } });
    }
  });

  it('an admin cannot change a person of another group through their own group', async () => {
    const em = t.orm.em.fork();
    const fenwickAdmin = await em.findOneOrFail(User, { email: emails.outsider });
    const response = await browsers.admin.patch(`/api/groups/${larkspurId}/members/${fenwickAdmin.id}`, { role: 'viewer' });
    expect(response.status).toBe(404);
    expect(await em.fork().findOneOrFail(GroupMembership, { groupId: fenwickId, userId: fenwickAdmin.id })).toMatchObject({ role: 'admin' });
  });
});

describe('what members see', () => {
  it('the group detail lists the five demo members with their roles', async () => {
    const detail = groupDetailSchema.parse((await browsers.contributor.get(`/api/groups/${larkspurId}`)).body);
    expect(detail.myRole).toBe('contributor');
    const byEmail = Object.fromEntries(detail.members.map((m) => [m.email, m.role]));
    expect(byEmail).toMatchObject({
      'admin@larkspur.example.org': 'admin',
      'curator@larkspur.example.org': 'curator',
      'contributor@larkspur.example.org': 'contributor',
      'contributor2@larkspur.example.org': 'contributor',
      'viewer@larkspur.example.org': 'viewer',
    });
    expect(JSON.stringify(detail)).not.toMatch(/argon|password/i);
  });

  it('invitation lists parse with the shared schema', async () => {
    const list = invitationsResponseSchema.parse((await browsers.admin.get(`/api/groups/${larkspurId}/invitations`)).body);
    expect(list.invitations.every((i) => i.status === 'pending')).toBe(true);
  });

  it('bad bodies get 400 with the error shape, after authorisation', async () => {
    const badRole = await browsers.admin.patch(`/api/groups/${larkspurId}/members/${contributor2Id}`, { role: 'owner' });
    expect(badRole.status).toBe(400);
    expect(apiErrorBodySchema.parse(badRole.body).error.fields?.role).toMatch(/viewer, contributor, curator, admin/);
    const badEmail = await browsers.admin.post(`/api/groups/${larkspurId}/invitations`, { email: 'not an address', role: 'viewer' });
    expect(badEmail.status).toBe(400);
    const noName = await browsers.admin.post('/api/groups', {});
    expect(noName.status).toBe(400);
  });
});
