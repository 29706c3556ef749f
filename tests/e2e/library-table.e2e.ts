import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, collectPageErrors, horizontalOverflowPx, launchBrowser, screenshot, type ViewportName } from './browser';
import { signedInPage } from './session';

/**
 * The library on both sizes with the demo library (the Larkspur Coordination Lab, 72 entries):
 * the dense table at 1440 × 900 (at least 15 whole rows on screen, table semantics, sorting,
 * selection for export, columns kept per person), cards on a phone, axe on both, the list's state
 * in the address (Back and a shared link restore it) and "Load more" asking for exactly one page.
 */
let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const CURATOR = 'curator@larkspur.example.org';
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function seriousViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  return results.violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => `${violation.id} (${violation.impact}): ${violation.nodes.slice(0, 4).map((node) => `${node.target.join(' ')} ${node.html.slice(0, 160)}`).join(' | ')}`);
}

/** Rows wholly inside the window. */
async function wholeRowsOnScreen(page: Page, prefix: string): Promise<number> {
  return page.evaluate((testIdPrefix) => {
    return Array.from(document.querySelectorAll<HTMLElement>(`[data-testid^="${testIdPrefix}"]`)).filter((row) => {
      if (!/^[a-z-]+-\d+$/.test(row.dataset.testid ?? '')) return false;
      const rect = row.getBoundingClientRect();
      return rect.height > 0 && rect.top >= 0 && rect.bottom <= window.innerHeight;
    }).length;
  }, prefix);
}

/** The `page` of every list request (GET /api/complexes?…) the page makes from now on, and the failed ones. */
function listRequests(page: Page) {
  const pages: string[] = [];
  const failed: string[] = [];
  const isList = (url: string) => new URL(url).pathname === '/api/complexes';
  page.on('request', (request) => {
    if (isList(request.url())) pages.push(new URL(request.url()).searchParams.get('page') ?? '?');
  });
  page.on('requestfailed', (request) => {
    if (isList(request.url())) failed.push(`${request.url()} ${request.failure()?.errorText ?? ''}`);
  });
  return { pages, failed };
}

const params = (page: Page) => new URL(page.url()).searchParams;

describe('the library table at 1440 × 900', () => {
  it('shows at least 15 whole rows, as a table a screen reader can read, with no serious axe violation', async () => {
    const { context, page } = await signedInPage(browser, CURATOR, 'wide');
    const errors = collectPageErrors(page);
    await page.goto(`${baseUrl()}/library`);
    await page.getByTestId('library-row-0').waitFor();
    const rows = await wholeRowsOnScreen(page, 'library-row-');
    assert.ok(rows >= 15, `whole rows on screen: ${rows}`);
    assert.equal(await page.getByRole('table', { name: 'Library entries' }).count(), 1);
    const headers = (await page.getByRole('columnheader').allTextContents()).map((text) => text.toLowerCase());
    for (const header of ['Formula', 'Name', 'Metal', 'dⁿ', 'Verdict', 'k or t½', 'Meas.', 'Status', 'Updated']) {
      assert.ok(headers.some((text) => text.includes(header.toLowerCase())), `header ${header} in ${headers.join(' | ')}`);
    }
    // The default order is by name: that header says so.
    assert.equal(await page.getByTestId('library-column-name').getAttribute('aria-sort'), 'ascending');
    assert.ok((await page.getByRole('row').count()) >= 21, 'a header row and the first page of rows');
    assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
    assert.deepEqual(await seriousViolations(page), [], 'axe on the table');
    await screenshot(page, 'library-table-wide');
    assert.deepEqual(errors, []);
    await context.close();
  });

  it('sorts on the server from a header (aria-sort follows), and Enter on a focused row opens the entry', async () => {
    const { context, page } = await signedInPage(browser, CURATOR, 'wide');
    await page.goto(`${baseUrl()}/library`);
    await page.getByTestId('library-row-0').waitFor();
    await page.getByTestId('library-sort-dCount').click();
    await page.waitForURL((url) => url.searchParams.get('sort') === 'dCount' && url.searchParams.get('dir') === 'asc');
    await page.waitForFunction(() => document.querySelector('[data-testid="library-column-dCount"]')?.getAttribute('aria-sort') === 'ascending');
    const dCounts = async () => (await page.locator('[data-testid^="library-row-"] [role="cell"]:nth-child(5)').allInnerTexts()).map((t) => Number(t.replace(/\D/g, '')));
    await page.waitForFunction(() => /d0|d1|d2|d3/.test(document.querySelector('[data-testid="library-row-0"]')?.textContent ?? ''));
    const ascending = await dCounts();
    assert.deepEqual(ascending, [...ascending].sort((a, b) => a - b), `d counts ascending: ${ascending.join(',')}`);
    await page.getByTestId('library-sort-dCount').click();
    await page.waitForURL((url) => url.searchParams.get('dir') === 'desc');
    await page.waitForFunction(() => /d10|d9|d8/.test(document.querySelector('[data-testid="library-row-0"]')?.textContent ?? ''));
    const descending = await dCounts();
    assert.deepEqual(descending, [...descending].sort((a, b) => b - a), `d counts descending: ${descending.join(',')}`);
    await screenshot(page, 'library-table-sorted-wide');
    // Keyboard: focus the first row and press Enter.
    await page.getByTestId('library-row-0').focus();
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/library\/[0-9a-f-]{36}$/);
    await page.getByTestId('complex-detail').waitFor();
    await context.close();
  });

  it('exports only the ticked rows', async () => {
    const { context, page } = await signedInPage(browser, CURATOR, 'wide');
    await page.goto(`${baseUrl()}/library?sort=formula&dir=asc`);
    await page.getByTestId('library-row-1').waitFor();
    const formulas = await page.locator('[data-testid="library-row-0"] [role="cell"]:nth-child(2), [data-testid="library-row-1"] [role="cell"]:nth-child(2)').allInnerTexts();
    await page.getByTestId('library-select-0').click();
    await page.getByTestId('library-select-1').click();
    assert.equal(await page.getByTestId('library-select-0').getAttribute('aria-checked'), 'true');
    await page.getByTestId('library-export').click();
    const href = await page.getByTestId('library-export-csv').getAttribute('href');
    assert.ok(href && /ids=/.test(href), `export link with ids: ${href}`);
    const csv = await (await page.request.get(`${baseUrl()}${href}`)).text();
    const lines = csv.trim().split('\n').slice(1);
    // One line per measurement (at least one per entry); every line belongs to one of the two entries.
    const entries = new Set(lines.map((line) => line.split(',')[0]));
    assert.ok(entries.size >= 1 && entries.size <= 2, `entries in the export: ${[...entries].join(' | ')}`);
    assert.equal(formulas.length, 2);
    await screenshot(page, 'library-table-selection-wide');
    await context.close();
  });

  it('keeps the column choice for the person (a new session shows the same columns)', async () => {
    const first = await signedInPage(browser, CURATOR, 'wide');
    await first.page.goto(`${baseUrl()}/library`);
    await first.page.getByTestId('library-row-0').waitFor();
    await first.page.getByTestId('library-columns').click();
    const saved = first.page.waitForResponse((r) => r.url().endsWith('/api/auth/me/preferences') && r.request().method() === 'PATCH');
    await first.page.getByTestId('library-columns-updated').click();
    assert.equal((await saved).status(), 200);
    assert.equal(await first.page.getByTestId('library-column-updated').count(), 0);
    await first.context.close();

    const second = await signedInPage(browser, CURATOR, 'wide');
    await second.page.goto(`${baseUrl()}/library`);
    await second.page.getByTestId('library-row-0').waitFor();
    await second.page.getByTestId('library-column-name').waitFor();
    await second.page.waitForResponse((r) => r.url().endsWith('/api/auth/me/preferences')).catch(() => undefined);
    assert.equal(await second.page.getByTestId('library-column-updated').count(), 0, 'the hidden column stays hidden in a new session');
    // Put it back for the other tests.
    await second.page.getByTestId('library-columns').click();
    await second.page.getByTestId('library-columns-updated').click();
    await second.page.getByTestId('library-column-updated').waitFor();
    await second.context.close();
  });
});

describe('cards on a phone', () => {
  it('keeps the cards at 390 × 844, with no serious axe violation', async () => {
    const { context, page } = await signedInPage(browser, CURATOR, 'phone');
    const errors = collectPageErrors(page);
    await page.goto(`${baseUrl()}/library`);
    await page.getByTestId('library-item-0').waitFor();
    assert.equal(await page.getByTestId('library-table').count(), 0, 'no table on a phone');
    assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
    assert.deepEqual(await seriousViolations(page), [], 'axe on the cards');
    await screenshot(page, 'library-cards-phone');
    assert.deepEqual(errors, []);
    await context.close();
  });
});

for (const size of ['phone', 'wide'] as ViewportName[]) {
  describe(`the list’s state in the address at ${size} size`, () => {
    const rowPrefix = size === 'wide' ? 'library-row-' : 'library-item-';

    it('search, filter, order and loaded pages go into the address (replaced, not pushed); Back and a shared link restore them', async () => {
      const { context, page } = await signedInPage(browser, CURATOR, size);
      await page.goto(`${baseUrl()}/library`);
      await page.getByTestId(`${rowPrefix}0`).waitFor();
      const historyBefore = await page.evaluate(() => history.length);
      await page.getByTestId('library-search').pressSequentially('hexa', { delay: 40 });
      await page.waitForURL((url) => url.searchParams.get('q') === 'hexa');
      assert.equal(await page.evaluate(() => history.length), historyBefore, 'typing replaces the address, it does not push');
      await page.getByTestId('library-filters-toggle').click();
      await page.getByTestId('library-filter-cited').click();
      await page.waitForURL((url) => url.searchParams.get('hasCitation') === 'true');
      if (size === 'wide') {
        await page.getByTestId('library-sort-formula').click();
        await page.waitForURL((url) => url.searchParams.get('sort') === 'formula');
      }
      await page.getByTestId('library-filters-toggle').click();
      // Load more: exactly the next page, nothing aborted.
      const requests = listRequests(page);
      const more = page.getByTestId('library-load-more');
      await more.waitFor();
      await more.click();
      await page.waitForURL((url) => url.searchParams.get('pages') === '2');
      await page.getByTestId(`${rowPrefix}20`).waitFor();
      await page.waitForTimeout(500);
      assert.deepEqual(requests.pages, ['2'], `list requests after one press: ${requests.pages.join(',')}`);
      assert.deepEqual(requests.failed, []);
      const shown = await page.getByTestId('library-count').innerText();
      const url = page.url();
      const expected = { q: 'hexa', hasCitation: 'true', pages: '2', ...(size === 'wide' ? { sort: 'formula', dir: 'asc' } : {}) };
      for (const [key, value] of Object.entries(expected)) assert.equal(params(page).get(key), value, `${key} in ${url}`);
      await screenshot(page, `library-url-state-${size}`);

      // Open an entry (one from the second page), come Back: the same list.
      await page.getByTestId(`${rowPrefix}20`).click();
      await page.waitForURL(/\/library\/[0-9a-f-]{36}$/);
      await page.getByTestId('complex-detail').waitFor();
      await page.goBack();
      await page.waitForURL((u) => u.pathname === '/library' && u.searchParams.get('q') === 'hexa');
      assert.equal(await page.getByTestId('library-search').inputValue(), 'hexa');
      await page.waitForFunction((text) => document.querySelector('[data-testid="library-count"]')?.textContent === text, shown);
      for (const [key, value] of Object.entries(expected)) assert.equal(params(page).get(key), value, `${key} after Back`);

      // A shared link: a new session opens the same list.
      const other = await signedInPage(browser, CURATOR, size);
      await other.page.goto(url);
      await other.page.getByTestId(`${rowPrefix}0`).waitFor();
      assert.equal(await other.page.getByTestId('library-search').inputValue(), 'hexa');
      await other.page.waitForFunction((text) => document.querySelector('[data-testid="library-count"]')?.textContent === text, shown);
      if (size === 'wide') assert.equal(await other.page.getByTestId('library-column-formula').getAttribute('aria-sort'), 'ascending');
      await other.context.close();
      await context.close();
    });
  });
}
