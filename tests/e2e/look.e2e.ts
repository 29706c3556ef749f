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

describe('Check: the verdict as the hero', () => {
  it('phone: the verdict, its half-life and reason lead; the controls sit with the input; Why opens on a tap; the jump bar reaches Safety', async () => {
    const page = await browser.newPage({ viewport: viewports.phone });
    await page.goto(`${baseUrl()}/check?formula=${encodeURIComponent('[Co(NH3)5Cl]Cl2')}`);
    await page.getByTestId('verdict-card').waitFor();
    const conditions = page.getByTestId('check-conditions');
    const hero = page.getByTestId('verdict-card');
    const conditionsBox = await conditions.boundingBox();
    const heroBox = await hero.boundingBox();
    assert.ok(conditionsBox && heroBox && conditionsBox.y < heroBox.y, 'the conditions come before the verdict');
    assert.ok(heroBox.y + 200 < viewports.phone.height, 'the verdict starts in the first screen');
    // [Co(NH3)5Cl]2+: low-spin d6 Co(III), inert (common practice; Taube 1952).
    const word = page.getByTestId('verdict-badge').getByText('inert', { exact: true });
    const fontSize = await word.evaluate((el) => parseFloat(getComputedStyle(el).fontSize));
    assert.ok(fontSize >= 36, `the verdict word is large (${fontSize} px)`);
    assert.match(await page.getByTestId('verdict-rate').innerText(), /t½ ≈/);
    assert.equal(await page.getByTestId('verdict-reasons').count(), 0, 'Why starts closed on a phone');
    await screenshot(page, 'check-hero-phone');
    await page.getByTestId('verdict-why-toggle').click();
    await page.getByTestId('verdict-reasons').waitFor();
    await conditions.click();
    await page.getByTestId('check-options').waitFor();
    await page.getByTestId('jump-safety').click();
    await page.waitForFunction(() => {
      const safety = document.getElementById('safety');
      return !!safety && safety.getBoundingClientRect().top < window.innerHeight && document.activeElement === safety;
    });
    await page.close();
  });

  it('wide: the input column stays in view while the answer scrolls, and Why is open', async () => {
    const page = await browser.newPage({ viewport: viewports.wide });
    await page.goto(`${baseUrl()}/check?formula=${encodeURIComponent('K3[Fe(CN)6]')}`);
    await page.getByTestId('verdict-reasons').waitFor();
    await screenshot(page, 'check-hero-wide');
    await page.getByTestId('jump-ligand-field').click();
    await page.waitForFunction(() => (document.getElementById('ligand-field')?.getBoundingClientRect().top ?? 999) < 150);
    const input = await page.getByTestId('formula-input').boundingBox();
    assert.ok(input && input.y >= 0 && input.y < viewports.wide.height, 'the formula field is still on screen');
    await screenshot(page, 'check-ligand-field-wide');
    await page.close();
  });

  it('Route has a jump bar to Route, Bridges and Marcus', async () => {
    const page = await browser.newPage({ viewport: viewports.phone });
    await page.goto(`${baseUrl()}/route?oxidant=${encodeURIComponent('[Co(NH3)5Cl]2+')}&reductant=${encodeURIComponent('[Cr(H2O)6]2+')}`);
    await page.getByTestId('route-jump-bar').waitFor();
    await page.getByTestId('jump-marcus').click();
    // The Marcus panel ends the page: it comes into view (as far up as the page can scroll) and takes the focus.
    await page.waitForFunction(() => {
      const marcus = document.getElementById('marcus');
      return !!marcus && marcus.getBoundingClientRect().top < window.innerHeight / 2 && document.activeElement === marcus;
    });
    await screenshot(page, 'route-jump-marcus-phone');
    await page.close();
  });
});
