import assert from 'node:assert/strict';
import path from 'node:path';
import { after, before, describe, it } from 'node:test';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, collectPageErrors, launchBrowser, screenshot, viewports, type ViewportName } from './browser';
import { signedInPage } from './session';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const fixture = (name: string) => path.resolve(__dirname, '../fixtures', name);

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];
async function seriousViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  return results.violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => `${violation.id}: ${violation.nodes.slice(0, 3).map((node) => node.target.join(' ')).join(' | ')}`);
}

/**
 * A Larkspur Coordination Lab rate sheet with the lab's own headers (synonyms, one column the
 * importer does not use) and one entry without a name. Each size imports species of its own, so
 * the second run does not meet the first run's entries as repeats.
 */
const SHEETS: Record<ViewportName, { named: string; unnamed: string; suggested: string }> = {
  // IUPAC 2005 Recommendations, IR-9 (from memory): the suggested names.
  phone: { named: '[Rh(NH3)5Cl]2+', unnamed: '[PdCl4]2-', suggested: 'tetrachloridopalladate(II)' },
  wide: { named: '[Ir(NH3)5Cl]2+', unnamed: '[Pd(NH3)4]2+', suggested: 'tetraamminepalladium(II)' },
};
function sheet(size: ViewportName): Buffer {
  const { named, unnamed } = SHEETS[size];
  return Buffer.from(
    [
      'Species,Compound name,Measurement,k,Units,Temperature (K),Notebook page',
      `"${named}",chloro ${size} sample,substitution,1.0e-6,s-1,298.15,L-12`,
      `"${unnamed}",,,,,,L-13`,
    ].join('\n') + '\n',
  );
}

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`import and new entry at ${size} size`, () => {
    it('a contributor sees the column mapping before the dry run, imports, and gets the created entries with links (no review queue)', async () => {
      const { context, page } = await signedInPage(browser, 'contributor@larkspur.example.org', size);
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl()}/library/import`);
      await page.getByTestId('import-pick').waitFor();
      await page.locator('input[type=file]').setInputFiles({ name: `larkspur-${size}.csv`, mimeType: 'text/csv', buffer: sheet(size) });

      // The mapping, read from the header line in the browser, before any request is made.
      const mapping = page.getByTestId('import-mapping');
      await mapping.waitFor();
      assert.match(await page.getByTestId('import-mapping-0').innerText(), /Species[\s\S]*formula/);
      assert.match(await page.getByTestId('import-mapping-1').innerText(), /Compound name[\s\S]*name/);
      assert.match(await page.getByTestId('import-mapping-3').innerText(), /k[\s\S]*value/);
      assert.match(await page.getByTestId('import-mapping-6').innerText(), /Notebook page[\s\S]*not used/);
      assert.doesNotMatch(await mapping.innerText(), /not read/);
      assert.equal(await page.getByTestId('import-report').count(), 0, 'no dry run yet');
      await page.getByTestId('import-mapping-complete').waitFor();
      await screenshot(page, `import-mapping-${size}`);
      assert.deepEqual(await seriousViolations(page), [], 'axe on the mapping');

      await page.getByTestId('import-dry-run').click();
      await page.getByTestId('import-report-clean').waitFor();
      assert.match(await page.getByTestId('import-report-named').innerText(), new RegExp(`Row 3: ${SHEETS[size].suggested.replace(/[()]/g, '\\$&')}`));
      await page.getByTestId('import-run').click();
      await page.getByTestId('import-done').waitFor();
      const created = page.getByTestId('import-created');
      assert.match(await created.innerText(), /chloro .* sample/);
      assert.match(await created.innerText(), new RegExp(SHEETS[size].suggested.replace(/[()]/g, '\\$&')));
      assert.equal(await page.getByTestId('import-to-review').count(), 0, 'a contributor is not sent to the review queue');
      await page.getByTestId('import-to-library').waitFor();
      await screenshot(page, `import-done-${size}`);
      assert.deepEqual(await seriousViolations(page), [], 'axe on the success screen');

      const link = page.getByTestId('import-created-0-link');
      assert.match((await link.getAttribute('href')) ?? '', /^\/library\/[0-9a-f-]{36}$/);
      await link.click();
      // The entry page opens on the created entry.
      await page.getByTestId('complex-detail').getByText(`chloro ${size} sample`).first().waitFor();
      assert.deepEqual(errors, []);
      await context.close();
    });

    it('the new-entry form suggests the name from the formula, in keyboard order after the name field', async () => {
      const { context, page } = await signedInPage(browser, 'contributor@larkspur.example.org', size);
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl()}/library/new`);
      await page.getByTestId('complex-form-formula').fill('[Rh(en)3]3+');
      const suggestion = page.getByTestId('complex-form-name-suggestion');
      await suggestion.waitFor();
      // IUPAC 2005 Recommendations, IR-9 (from memory): tris(ethane-1,2-diamine) with the metal and its oxidation state.
      assert.match(await suggestion.innerText(), /tris\(ethane-1,2-diamine\)rhodium\(III\)/);
      assert.equal(await page.getByTestId('complex-form-name').inputValue(), '', 'the suggestion does not fill the field by itself');
      assert.equal(await page.getByTestId('complex-form-formula').getAttribute('placeholder'), null);

      // Keyboard order: formula → name → "Use this name" → notes.
      await page.getByTestId('complex-form-formula').focus();
      const order: (string | null)[] = [];
      for (let i = 0; i < 3; i++) {
        await page.keyboard.press('Tab');
        order.push(await page.evaluate(() => document.activeElement?.getAttribute('data-testid') ?? null));
      }
      assert.deepEqual(order, ['complex-form-name', 'complex-form-use-name', 'complex-form-notes']);
      await screenshot(page, `new-entry-suggestion-${size}`);
      assert.deepEqual(await seriousViolations(page), [], 'axe on the form');

      await page.getByTestId('complex-form-use-name').click();
      assert.equal(await page.getByTestId('complex-form-name').inputValue(), 'tris(ethane-1,2-diamine)rhodium(III)');
      assert.equal(await suggestion.count(), 0);

      // With a measurement row open, every field is still labelled.
      await page.getByTestId('complex-form-add-measurement').click();
      await page.getByTestId('complex-form-m-0-notes').waitFor();
      assert.deepEqual(await seriousViolations(page), [], 'axe on the form with a measurement');
      assert.deepEqual(errors, []);
      await context.close();
    });
  });
}

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
    assert.deepEqual(await seriousViolations(page), [], 'axe on the report of mistakes');

    await page.locator('input[type=file]').setInputFiles(fixture('import-valid.csv'));
    await page.getByTestId('import-dry-run').click();
    await page.getByTestId('import-report-clean').waitFor();
    await page.getByTestId('import-run').click();
    await page.getByTestId('import-done').waitFor();
    assert.match(await page.getByTestId('import-done').innerText(), /submitted for review/);
    // Curators review: the queue is offered to them.
    await page.getByTestId('import-to-review').waitFor();
    await screenshot(page, 'import-done-curator-wide');
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
