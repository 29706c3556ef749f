import assert from 'node:assert/strict';
import path from 'node:path';
import { after, before, describe, it } from 'node:test';
import type { Browser } from 'playwright-core';
import { baseUrl, collectPageErrors, launchBrowser, screenshot } from './browser';
import { signedInPage } from './session';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const fixture = (name: string) => path.resolve(__dirname, '../fixtures', name);

describe('library exchange in the browser (wide)', () => {
  it('a curator checks a spreadsheet, sees the row-by-row report, and imports a clean one', async () => {
    const { context, page } = await signedInPage(browser, 'curator@larkspur.example.org', 'wide');
    const errors = collectPageErrors(page);
    await page.goto(`${baseUrl()}/library/import`);
    await page.getByTestId('import-pick').waitFor();

    await page.locator('input[type=file]').setInputFiles(fixture('import-mistakes.csv'));
    await page.getByTestId('import-file-name').waitFor();
    await page.getByTestId('import-dry-run').click();
    await page.getByTestId('import-report').waitFor();
    assert.ok((await page.getByTestId('import-report-row-0').count()) > 0, 'the report lists the mistakes');
    await screenshot(page, 'import-report-mistakes-wide');

    await page.locator('input[type=file]').setInputFiles(fixture('import-valid.csv'));
    await page.getByTestId('import-dry-run').click();
    await page.getByTestId('import-report-clean').waitFor();
    await page.getByTestId('import-run').click();
    await page.getByTestId('import-done').waitFor();
    assert.match(await page.getByTestId('import-done').innerText(), /submitted for review/);
    await screenshot(page, 'import-done-wide');
    assert.deepEqual(errors.filter((e) => !/40[0-9]/.test(e)), []);
    await context.close();
  });

  it('offers the filtered library as CSV, BibTeX and RIS downloads', async () => {
    const { context, page } = await signedInPage(browser, 'viewer@larkspur.example.org', 'wide');
    await page.goto(`${baseUrl()}/library`);
    await page.getByTestId('library-export').click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('library-export-bib').click()]);
    assert.match(download.suggestedFilename(), /\.bib$/);
    const file = await download.path();
    assert.ok(file, 'downloaded');
    const text = (await import('node:fs')).readFileSync(file, 'utf8');
    assert.match(text, /@article\{/i);
    await context.close();
  });
});
