import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { Browser } from 'playwright-core';
import { baseUrl, collectPageErrors, horizontalOverflowPx, launchBrowser, screenshot, viewports, type ViewportName } from './browser';
import { signedInPage } from './session';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

/** One distinct complex per size, so the two runs do not meet in the library. */
const ENTRIES: Record<ViewportName, { formula: string; name: string }> = {
  phone: { formula: '[Co(NH3)5(NCS)]Cl2', name: 'Thiocyanato-κN pentaammine, phone run' },
  wide: { formula: '[Cr(NH3)5(NCS)]Cl2', name: 'Thiocyanato-κN chromium, wide run' },
};

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`the review story at ${size} size`, () => {
    let entryPath = '';

    it('a contributor creates an entry and submits it for review', async () => {
      const { context, page } = await signedInPage(browser, 'contributor@larkspur.example.org', size);
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl()}/library/new`);
      await page.getByTestId('complex-form-formula').fill(ENTRIES[size].formula);
      await page.getByTestId('complex-form-name').fill(ENTRIES[size].name);
      await screenshot(page, `library-new-${size}`);
      await page.getByTestId('complex-form-save').click();
      await page.waitForURL(/\/library\/[0-9a-f-]{36}$/);
      entryPath = new URL(page.url()).pathname;
      await page.getByTestId('complex-detail').waitFor();
      await page.getByTestId('complex-submit').click();
      await page.getByTestId('complex-action-done').waitFor();
      assert.match(await page.getByTestId('complex-detail').innerText(), /submitted/i);
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `library-submitted-${size}`);
      assert.deepEqual(errors.filter((e) => !/40[19]/.test(e)), []);
      await context.close();
    });

    it('a curator finds it in the queue and accepts it', async () => {
      assert.ok(entryPath, 'the entry was created');
      const { context, page } = await signedInPage(browser, 'curator@larkspur.example.org', size);
      await page.goto(`${baseUrl()}/review`);
      await page.getByTestId('review-queue').waitFor();
      assert.match(await page.getByTestId('review-queue').innerText(), new RegExp(ENTRIES[size].name.split(',')[0] ?? ''));
      await screenshot(page, `review-queue-${size}`);
      await page.goto(`${baseUrl()}${entryPath}`);
      await page.getByTestId('review-panel').waitFor();
      await page.getByTestId('review-accept').click();
      await page.getByTestId('review-comment').fill('Checked against the lab notebook.');
      await page.getByTestId('review-decision-submit').click();
      // Once accepted the entry leaves review: the panel goes and the status reads accepted.
      await page.getByTestId('review-panel').waitFor({ state: 'detached' });
      await page.waitForFunction(
        () => /accepted/i.test(document.querySelector('[data-testid="complex-detail"]')?.textContent ?? ''),
      );
      await screenshot(page, `review-accepted-${size}`);
      await context.close();
    });

    it('a viewer sees the accepted entry in the library', async () => {
      const { context, page } = await signedInPage(browser, 'viewer@larkspur.example.org', size);
      await page.goto(`${baseUrl()}/library`);
      await page.getByTestId('library-search').fill(ENTRIES[size].formula.slice(0, 8));
      await page.getByTestId('library-list').waitFor();
      await page.goto(`${baseUrl()}${entryPath}`);
      await page.getByTestId('complex-formula').waitFor();
      const detail = await page.getByTestId('complex-detail').innerText();
      assert.match(detail, /accepted/i);
      assert.ok(!(await page.getByTestId('complex-edit').count()), 'viewers cannot edit');
      await screenshot(page, `library-viewer-${size}`);
      await context.close();
    });
  });
}
