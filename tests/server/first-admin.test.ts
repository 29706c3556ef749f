import { seedDemo } from '@/server/db/seed';
import { AppError } from '@/server/http/errors';
import { DEMO_PASSWORD, demoAccounts } from '@/server/modules/auth/demo-accounts';
import { createFirstAdmin, demoAccountsWithDemoPassword } from '@/server/modules/auth/first-admin';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser } from './auth-helpers';

/**
 * Production without demo accounts: the guard that refuses to start while a demo account opens with
 * the published password, and the first administrator made by `npm run admin`, whose one-time link
 * sets a password exactly once.
 */
let t: TestApp;

beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('first administrator', () => {
  it('gets a group they administer and a link that sets their password once', async () => {
    const { link, groupId } = await createFirstAdmin(
      t.orm.em.fork(),
      { email: 'Wren.Oakes@northfen.example.org', name: 'Dr. Wren Oakes', group: 'Oakes Coordination Group' },
      'https://sphereline.northfen.example.org',
    );
    const url = new URL(link);
    expect(url.origin).toBe('https://sphereline.northfen.example.org');
    expect(url.pathname).toBe('/reset-password');
    const token = url.searchParams.get('token') ?? '';
    expect(token.length).toBeGreaterThan(20);

    const browser = new Browser(t.app);
    // Before the link is used, no password opens the account (it has none anyone knows).
    expect((await browser.post('/api/auth/sign-in', { email: 'wren.oakes@northfen.example.org', password: DEMO_PASSWORD })).status).toBe(401);
    const password = 'quartz-ligand-octahedron-7';
    expect((await browser.post('/api/auth/password-reset/confirm', { token, password })).status).toBe(200);
    const again = await browser.post('/api/auth/password-reset/confirm', { token, password: 'another-long-passphrase-9' });
    expect(again.status).toBeGreaterThanOrEqual(400);
    expect(again.status).toBeLessThan(500);

    expect((await browser.signIn('wren.oakes@northfen.example.org', password)).status).toBe(200);
    const me = await browser.get('/api/auth/me');
    expect(me.body.memberships).toEqual([{ groupId, groupName: 'Oakes Coordination Group', role: 'admin' }]);
  });

  it('refuses an address that already has an account', async () => {
    await expect(
      createFirstAdmin(t.orm.em.fork(), { email: 'wren.oakes@northfen.example.org', name: 'Someone else', group: 'Another group' }, 'http://127.0.0.1:8080'),
    ).rejects.toMatchObject({ code: 'CONFLICT' } satisfies Partial<AppError>);
  });
});

describe('demo accounts in production', () => {
  it('finds none on a database without the demo, and every one after the demo was seeded', async () => {
    expect(await demoAccountsWithDemoPassword(t.orm.em.fork())).toEqual([]);
    await seedDemo(t.orm);
    const open = await demoAccountsWithDemoPassword(t.orm.em.fork());
    expect(open.sort()).toEqual(demoAccounts.map((account) => account.email).sort());
  });
});
