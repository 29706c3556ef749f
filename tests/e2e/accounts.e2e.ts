import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { Browser } from 'playwright-core';
import { baseUrl, collectPageErrors, horizontalOverflowPx, launchBrowser, screenshot } from './browser';
import { signedInPage } from './session';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const DEMO_ROLES = [
  ['admin', 'admin@larkspur.example.org'],
  ['curator', 'curator@larkspur.example.org'],
  ['contributor', 'contributor@larkspur.example.org'],
  ['viewer', 'viewer@larkspur.example.org'],
] as const;

describe('signing in as each demo role at phone size', () => {
  for (const [role, email] of DEMO_ROLES) {
    it(`${role}: lands on Account with the lab membership and role shown`, async () => {
      const { context, page } = await signedInPage(browser, email, 'phone');
      const errors = collectPageErrors(page);
      await page.getByTestId('groups-list').waitFor();
      const groups = await page.getByTestId('groups-list').innerText();
      assert.match(groups, /Larkspur/);
      assert.match(groups, new RegExp(role, 'i'));
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `account-${role}-phone`);
      assert.deepEqual(errors.filter((e) => !/401/.test(e)), []);
      await context.close();
    });
  }

  it('refuses a wrong password with one neutral sentence, and signs out cleanly', async () => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${baseUrl()}/sign-in`);
    await page.getByTestId('sign-in-email').fill('viewer@larkspur.example.org');
    await page.getByTestId('sign-in-password').fill('not-the-password');
    await page.getByTestId('sign-in-submit').click();
    await page.getByTestId('sign-in-form-error').waitFor();
    await screenshot(page, 'account-sign-in-refused-phone');
    await context.close();

    const { context: signedIn, page: account } = await signedInPage(browser, 'viewer@larkspur.example.org', 'wide');
    await screenshot(account, 'account-viewer-wide');
    await account.getByTestId('account-sign-out').click();
    await account.getByTestId('account-signed-out').waitFor();
    await signedIn.close();
  });
});
