import { createApp } from '@/server/app';
import { ChangeFeed, topicsWrittenBy } from '@/server/db/change-feed';
import { openOrm, type Orm } from '@/server/db/orm';
import { hashSecret } from '@/server/modules/auth/tokens';
import { generateSyntheticEntries } from '@/server/modules/library/generate';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser } from './auth-helpers';

/**
 * The in-memory caches (session lookups, library searches) and what empties them: a write in this
 * process at once, a write by another process through PostgreSQL's notification on commit, and no
 * caching at all while notifications cannot be received.
 */
let t: TestApp;
/** A second connection pool that the app does not watch: writes through it stand for another server process. */
let otherProcess: Orm;
let viewer: Browser;
let groupId: string;
const statements: string[] = [];

beforeAll(async () => {
  t = await createTestApp();
  otherProcess = await openOrm(t.databaseUrl);
  const person = await makeUser(t.orm, 'opal@larkspur.example.org', { displayName: 'Opal Hendry' });
  groupId = (await makeGroup(t.orm, 'Larkspur Coordination Lab', [{ userId: person.id, role: 'viewer' }])).id;
  await generateSyntheticEntries(t.orm.em.fork(), { groupId, count: 12, createdById: person.id });
  viewer = new Browser(t.app);
  await viewer.signIn('opal@larkspur.example.org', FIXTURE_PASSWORD);
  t.orm.em
    .getConnection()
    .getKnex()
    .on('query', (query: { sql: string }) => statements.push(query.sql));
});
afterAll(async () => {
  await otherProcess.close(true);
  await t.close();
});

async function statementsOf(run: () => Promise<unknown>): Promise<number> {
  statements.length = 0;
  await run();
  return statements.length;
}

/** Polls until `check` holds (a notification crosses a connection: milliseconds, bounded at 5 s). */
async function eventually(check: () => Promise<boolean>): Promise<boolean> {
  const until = Date.now() + 5000;
  while (Date.now() < until) {
    if (await check()) return true;
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
  return false;
}

const searchPath = () => `/api/complexes?groupId=${groupId}&pageSize=5`;

describe('which writes empty which cache', () => {
  it('reads nothing from a SELECT and names the topic of a write by its table', () => {
    expect(topicsWrittenBy('select * from "user_session" where id = $1')).toEqual([]);
    expect(topicsWrittenBy('delete from "user_session" where "id" = $1')).toEqual(['session']);
    expect(topicsWrittenBy('update "group_membership" set "role" = $1')).toEqual(['session']);
    expect(topicsWrittenBy('insert into "complex" ("id") values ($1)')).toEqual(['library']);
    expect(topicsWrittenBy('truncate table "measurement" cascade')).toEqual(['library']);
    expect(topicsWrittenBy('insert into "audit_event" ("id") values ($1)')).toEqual([]);
  });
});

describe('session lookups', () => {
  it('are read once, then answered from the in-process cache', async () => {
    expect((await viewer.get('/api/auth/me')).status).toBe(200);
    expect(await statementsOf(() => viewer.get('/api/auth/me'))).toBe(0);
  });

  it('a session ended by another process is refused as soon as its notification arrives', async () => {
    const second = new Browser(t.app);
    await second.signIn('opal@larkspur.example.org', FIXTURE_PASSWORD);
    expect((await second.get('/api/auth/me')).status).toBe(200);
    await otherProcess.em.fork().getConnection().execute('delete from user_session where id = ?', [hashSecret(second.cookie ?? '')]);
    expect(await eventually(async () => (await second.get('/api/auth/me')).status === 401)).toBe(true);
  });

  it('a role changed by another process shows on the next request after the notification', async () => {
    await otherProcess.em.fork().getConnection().execute(`update group_membership set role = 'contributor' where group_id = ?`, [groupId]);
    const promoted = async () => {
      const me = await viewer.get('/api/auth/me');
      return me.body.memberships?.[0]?.role === 'contributor';
    };
    expect(await eventually(promoted)).toBe(true);
    await otherProcess.em.fork().getConnection().execute(`update group_membership set role = 'viewer' where group_id = ?`, [groupId]);
    expect(await eventually(async () => (await viewer.get('/api/auth/me')).body.memberships?.[0]?.role === 'viewer')).toBe(true);
  });
});

describe('library searches', () => {
  it('repeat from the in-process cache, and a write in this process shows on the very next search', async () => {
    const first = await viewer.get(searchPath());
    expect(first.status).toBe(200);
    expect(first.body.total).toBe(12);
    expect(await statementsOf(() => viewer.get(searchPath()))).toBe(0);

    const [oldest] = (await t.orm.em.fork().getConnection().execute('select id from complex where group_id = ? order by id limit 1', [groupId])) as { id: string }[];
    await t.orm.em.fork().getConnection().execute('delete from complex where id = ?', [oldest?.id]);
    expect((await viewer.get(searchPath())).body.total).toBe(11);
  });

  it('a write by another process shows once its notification arrives', async () => {
    expect((await viewer.get(searchPath())).body.total).toBe(11);
    const [one] = (await t.orm.em.fork().getConnection().execute('select id from complex where group_id = ? order by id limit 1', [groupId])) as { id: string }[];
    await otherProcess.em.fork().getConnection().execute('delete from complex where id = ?', [one?.id]);
    expect(await eventually(async () => (await viewer.get(searchPath())).body.total === 10)).toBe(true);
  });
});

describe('without notifications nothing is cached', () => {
  it('a feed that is not listening leaves every request to the database', async () => {
    const deaf = new ChangeFeed(t.databaseUrl);
    const app = createApp({ orm: t.orm, changeFeed: deaf });
    const browser = new Browser(app);
    browser.cookie = viewer.cookie;
    expect(deaf.healthy).toBe(false);
    expect(await statementsOf(() => browser.get('/api/auth/me'))).toBe(1);
    expect(await statementsOf(() => browser.get('/api/auth/me'))).toBe(1);
    expect(await statementsOf(() => browser.get(searchPath()))).toBeGreaterThan(1);
    expect(await statementsOf(() => browser.get(searchPath()))).toBeGreaterThan(1);
  });

  it('stops caching when the listening connection is lost, and caches again once it is back', async () => {
    const feed = new ChangeFeed(t.databaseUrl);
    await feed.start();
    const app = createApp({ orm: t.orm, changeFeed: feed });
    const browser = new Browser(app);
    browser.cookie = viewer.cookie;
    await browser.get('/api/auth/me');
    expect(await statementsOf(() => browser.get('/api/auth/me'))).toBe(0);
    // The server ends the listening connection (as a database restart would).
    await otherProcess.em
      .fork()
      .getConnection()
      .execute(`select pg_terminate_backend(pid) from pg_stat_activity where query ilike 'LISTEN sphereline_change%' and pid <> pg_backend_pid()`);
    expect(await eventually(async () => !feed.healthy)).toBe(true);
    expect(await statementsOf(() => browser.get('/api/auth/me'))).toBe(1);
    // It reconnects by itself (about a second later) and caches again.
    expect(await eventually(async () => feed.healthy)).toBe(true);
    await browser.get('/api/auth/me');
    expect(await statementsOf(() => browser.get('/api/auth/me'))).toBe(0);
    await feed.stop();
  });
});
