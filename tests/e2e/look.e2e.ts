import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, collectPageErrors, launchBrowser, screenshot, viewports, type ViewportName } from './browser';
import { signedInPage } from './session';

/**
 * Feedback and orientation: a title per page, no console errors for a visitor, the Review tab only for
 * curators and admins, toasts in live regions, and a confirmation before a role change.
 */
let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

/** Pages a visitor opens, the element that says the page is in, and the title it must carry. */
const VISITOR_PAGES: { path: string; ready: string; title: string }[] = [
  { path: '/', ready: 'landing', title: 'Labile or inert, bridged or not — Sphereline' },
  { path: '/check?formula=%5BCo(NH3)6%5D3%2B', ready: 'verdict-card', title: '[Co(NH3)6]3+ — Check — Sphereline' },
  { path: '/route', ready: 'oxidant-input', title: 'Route — Sphereline' },
  { path: '/library', ready: 'library-signed-out', title: 'Library — Sphereline' },
  { path: '/account', ready: 'account-signed-out', title: 'Account — Sphereline' },
  { path: '/sign-in', ready: 'sign-in-email', title: 'Sign in — Sphereline' },
];

async function settle(page: Page) {
  // Deferred cards and the session question answer after the first paint.
  await page.waitForLoadState('networkidle');
}

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`feedback and titles at ${size} size`, () => {
    it('every page a visitor opens has its own title and logs no console error (no 401 from the session question)', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      const errors = collectPageErrors(page);
      const failed: string[] = [];
      page.on('response', (response) => {
        if (response.status() >= 400) failed.push(`${response.status()} ${response.url()}`);
      });
      for (const { path, ready, title } of VISITOR_PAGES) {
        await page.goto(`${baseUrl()}${path}`);
        await page.getByTestId(ready).first().waitFor();
        await settle(page);
        assert.equal(await page.title(), title, `title of ${path}`);
      }
      assert.deepEqual(errors, [], 'no console errors');
      assert.deepEqual(failed, [], 'no failed requests');
      await page.close();
    });

    it('the title follows the formula typed on Check', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      await page.goto(`${baseUrl()}/check`);
      await page.getByTestId('formula-input').fill('[Cr(H2O)6]3+');
      await page.getByTestId('verdict-card').waitFor();
      await page.waitForFunction(() => document.title === '[Cr(H2O)6]3+ — Check — Sphereline');
      await page.close();
    });
  });
}

describe('the Review tab', () => {
  for (const [role, email, offered] of [
    ['viewer', 'viewer@larkspur.example.org', false],
    ['contributor', 'contributor@larkspur.example.org', false],
    ['curator', 'curator@larkspur.example.org', true],
    ['admin', 'admin@larkspur.example.org', true],
  ] as const) {
    it(`is ${offered ? '' : 'not '}offered to a ${role}`, async () => {
      const { context, page } = await signedInPage(browser, email, 'wide');
      await page.getByTestId('nav-account').waitFor();
      if (offered) await page.getByTestId('nav-review').waitFor();
      else {
        await settle(page);
        assert.equal(await page.getByTestId('nav-review').count(), 0);
      }
      await context.close();
    });
  }

  it('disappears when the curator signs out', async () => {
    const { context, page } = await signedInPage(browser, 'curator@larkspur.example.org', 'phone');
    await page.getByTestId('nav-review').waitFor();
    await page.getByTestId('account-sign-out').click();
    await page.getByTestId('account-signed-out').waitFor();
    await page.getByTestId('nav-review').waitFor({ state: 'detached' });
    await context.close();
  });
});

describe('toasts and confirmations', () => {
  it('saving the display name says "Saved" in a status region', async () => {
    const { context, page } = await signedInPage(browser, 'contributor2@larkspur.example.org', 'phone');
    const field = page.getByTestId('profile-display-name');
    const name = await field.inputValue();
    await field.fill(`${name} `);
    await field.fill(name.replace(/\s+$/, '') + '.');
    await page.getByTestId('profile-save').click();
    const toast = page.getByRole('status').getByTestId('toast-done');
    await toast.waitFor();
    assert.match(await toast.innerText(), /Saved/);
    await screenshot(page, 'toast-saved-phone');
    // Put the name back for the other specs.
    await field.fill(name);
    await page.getByTestId('profile-save').click();
    await page.getByTestId('profile-saved').waitFor();
    await context.close();
  });

  it('a role change asks first, then confirms in a toast; the row stays where it was', async () => {
    const { context, page } = await signedInPage(browser, 'admin@larkspur.example.org', 'wide');
    const errors = collectPageErrors(page);
    await page.getByTestId('groups-list').waitFor();
    await page.getByTestId('groups-list').getByRole('link').filter({ hasText: 'Larkspur' }).first().click();
    await page.getByTestId('members-list').waitFor();
    const row = page.getByTestId('members-list').locator('[data-testid^="member-row-"]').filter({ hasText: 'Mateo Brackenridge' });
    const rowId = (await row.getAttribute('data-testid')) ?? '';
    const userId = rowId.replace('member-row-', '');
    const before = await page.getByTestId('members-list').locator('[data-testid^="member-row-"]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-testid')));

    await page.getByTestId(`member-role-${userId}-viewer`).click();
    const confirm = page.getByTestId(`member-role-confirm-${userId}`);
    await confirm.waitFor();
    assert.match(await confirm.innerText(), /Make Mateo Brackenridge a viewer instead of a contributor\?/);
    await screenshot(page, 'role-change-confirm-wide');
    await page.getByTestId(`member-role-yes-${userId}`).click();
    const toast = page.getByRole('status').getByTestId('toast-done');
    await toast.waitFor();
    assert.match(await toast.innerText(), /Mateo Brackenridge is now a viewer\./);
    const afterChange = await page.getByTestId('members-list').locator('[data-testid^="member-row-"]').evaluateAll((rows) => rows.map((r) => r.getAttribute('data-testid')));
    assert.deepEqual(afterChange, before, 'rows keep their order');

    // And back, so the demo lab is as the other specs expect it.
    await page.getByTestId(`member-role-${userId}-contributor`).click();
    await page.getByTestId(`member-role-yes-${userId}`).click();
    await page.getByRole('status').getByText('Mateo Brackenridge is now a contributor.').waitFor();
    assert.deepEqual(errors, []);
    await context.close();
  });
});
