import { meResponseSchema } from '@/lib/schemas/auth';
import { hashSecret } from '@/server/modules/auth/tokens';
import { UserSession } from '@/server/modules/auth/user-session.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser } from './auth-helpers';

/**
 * What a signed-in request costs the database, cold (caches emptied first; see change-feed.test.ts
 * for the cached path). The session, its person and the person's groups are read in one statement;
 * validation writes only when the sliding expiry is moved (lucia: once the session has used half of
 * its lifetime), never on every request.
 */
let t: TestApp;
let curator: Browser;
let outsider: Browser;
let groupId: string;
const statements: string[] = [];

beforeAll(async () => {
  t = await createTestApp();
  const person = await makeUser(t.orm, 'marguerite@larkspur.example.org', { displayName: 'Marguerite Vance' });
  await makeUser(t.orm, 'outsider@larkspur.example.org');
  groupId = (await makeGroup(t.orm, 'Larkspur Coordination Lab', [{ userId: person.id, role: 'curator' }])).id;
  await makeGroup(t.orm, 'Hollowbrook Kinetics Group', [{ userId: person.id, role: 'viewer' }]);
  curator = new Browser(t.app);
  await curator.signIn('marguerite@larkspur.example.org', FIXTURE_PASSWORD);
  outsider = new Browser(t.app);
  await outsider.signIn('outsider@larkspur.example.org', FIXTURE_PASSWORD);
  t.orm.em
    .getConnection()
    .getKnex()
    .on('query', (query: { sql: string }) => statements.push(query.sql));
});
afterAll(async () => {
  await t.close();
});

/** Statements of `run`, with the session and search caches emptied first (the cost of a cold request). */
async function statementsOf(run: () => Promise<unknown>): Promise<string[]> {
  t.changeFeed.changed('session');
  t.changeFeed.changed('library');
  statements.length = 0;
  await run();
  return [...statements];
}

const writes = (sql: string[]) => sql.filter((s) => /^\s*(update|insert|delete)\b/i.test(s));

describe('the signed-in path', () => {
  it('GET /api/auth/me is one statement: the session lookup that also brings the groups', async () => {
    let response: Awaited<ReturnType<Browser['get']>> | undefined;
    const sql = await statementsOf(async () => {
      response = await curator.get('/api/auth/me');
    });
    expect(response?.status).toBe(200);
    expect(sql).toHaveLength(1);
    const me = meResponseSchema.parse(response?.body);
    // Sorted by group name, with the role in each group: the same answer as before the change.
    expect(me.memberships.map((m) => [m.groupName, m.role])).toEqual([
      ['Hollowbrook Kinetics Group', 'viewer'],
      ['Larkspur Coordination Lab', 'curator'],
    ]);
  });

  it('validation does not write on repeated requests, cold or from the cache', async () => {
    const cold: string[] = [];
    for (let i = 0; i < 5; i += 1) {
      cold.push(...(await statementsOf(async () => expect((await curator.get('/api/auth/me')).status).toBe(200))));
    }
    expect(cold).toHaveLength(5);
    expect(writes(cold)).toEqual([]);
    statements.length = 0;
    for (let i = 0; i < 5; i += 1) expect((await curator.get('/api/auth/me')).status).toBe(200);
    // The first may look the session up again; the rest are answered from the in-process cache.
    expect(statements.length).toBeLessThanOrEqual(1);
    expect(writes(statements)).toEqual([]);
  });

  it('a group route checks membership without a query of its own', async () => {
    let status = 0;
    const sql = await statementsOf(async () => {
      status = (await curator.get(`/api/groups/${groupId}`)).status;
    });
    expect(status).toBe(200);
    // The handler lists the group's members; nothing asks for this person's own membership again.
    expect(sql.filter((s) => /from "group_membership"/.test(s) && /"user_id" = /.test(s))).toEqual([]);
    expect(sql.filter((s) => /from "research_group"/.test(s) && !/json_agg/.test(s)).length).toBeLessThanOrEqual(1);
    // A person who is not a member gets 404 after the one lookup, and no other statement.
    const denied = await statementsOf(async () => {
      status = (await outsider.get(`/api/groups/${groupId}`)).status;
    });
    expect(status).toBe(404);
    expect(denied).toHaveLength(1);
  });

  it('a library search reads the groups from the session, not again', async () => {
    let status = 0;
    const sql = await statementsOf(async () => {
      status = (await curator.get(`/api/complexes?groupId=${groupId}&q=ammine`)).status;
    });
    expect(status).toBe(200);
    expect(sql.filter((s) => /from "group_membership"/.test(s) && !/json_agg/.test(s))).toEqual([]);
    expect(sql.filter((s) => /from "research_group"/.test(s) && !/json_agg/.test(s))).toEqual([]);
  });

  it('the sliding expiry is written once when half the lifetime has passed, then not again', async () => {
    const em = t.orm.em.fork();
    const handle = hashSecret(curator.cookie ?? '');
    // Three days left of fourteen: past the half-way mark, so lucia extends it.
    await em.nativeUpdate(UserSession, { id: handle }, { expiresAt: new Date(Date.now() + 3 * 86_400_000) });
    const first = await statementsOf(async () => {
      expect((await curator.get('/api/auth/me')).status).toBe(200);
    });
    expect(writes(first)).toHaveLength(1);
    const row = await t.orm.em.fork().findOneOrFail(UserSession, { id: handle });
    expect(row.expiresAt.getTime()).toBeGreaterThan(Date.now() + 13 * 86_400_000);
    const later: string[] = [];
    for (let i = 0; i < 3; i += 1) {
      later.push(...(await statementsOf(async () => expect((await curator.get('/api/auth/me')).status).toBe(200))));
    }
    expect(writes(later)).toEqual([]);
  });
});
