import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { Browser } from 'playwright-core';
import {
  baseUrl,
  collectPageErrors,
  horizontalOverflowPx,
  launchBrowser,
  screenshot,
  viewports,
  type ViewportName,
} from './browser';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`the app shell at ${size} size`, () => {
    it('shows the landing view, the four tabs a visitor may use and our shipped font, without horizontal scrolling', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl()}/`);
      await page.getByTestId('landing').waitFor();
      assert.ok(await page.getByRole('heading', { name: 'Sphereline' }).isVisible());
      for (const tab of ['check', 'route', 'library', 'account']) {
        assert.ok(await page.getByTestId(`nav-${tab}`).isVisible(), `tab ${tab} visible`);
      }
      // Review is the curators' queue: a visitor is not offered a dead end.
      assert.equal(await page.getByTestId('nav-review').count(), 0, 'no Review tab for a visitor');
      assert.equal(await page.title(), 'Labile or inert, bridged or not — Sphereline');
      const navId = size === 'wide' ? 'nav-rail' : 'nav-bar';
      assert.ok(await page.getByTestId(navId).isVisible(), `${navId} is the navigation at ${size} size`);
      await page.evaluate(() => document.fonts.ready);
      assert.equal(await page.evaluate(() => document.fonts.check('16px AtkinsonNext')), true, 'AtkinsonNext loaded');
      const fontOfHeading = await page
        .getByRole('heading', { name: 'Sphereline' })
        .evaluate((el) => getComputedStyle(el).fontFamily);
      assert.match(fontOfHeading, /AtkinsonNext/);
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `shell-landing-${size}`);
      assert.deepEqual(errors, []);
      await page.close();
    });

    it('navigates between tabs from the navigation', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      await page.goto(`${baseUrl()}/`);
      await page.getByTestId('nav-check').click();
      await page.getByTestId('check-empty').waitFor();
      assert.match(page.url(), /\/check$/);
      await page.getByTestId('nav-library').click();
      await page.getByTestId('library-signed-out').waitFor();
      assert.match(page.url(), /\/library$/);
      await screenshot(page, `shell-library-signed-out-${size}`);
      await page.close();
    });
  });
}
