import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, collectPageErrors, launchBrowser, screenshot, viewports, type ViewportName } from './browser';
import { signedInPage } from './session';

/**
 * An accepted entry goes through a second review round: the contributor edits the name and adds a
 * measurement and submits, the curator returns it with a comment, the contributor fixes it, the
 * curator accepts it; a viewer sees the accepted content only, before and after.
 */
let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const ENTRIES: Record<ViewportName, { formula: string; name: string; renamed: string }> = {
  phone: { formula: '[Co(NH3)5(H2O)]3+', name: 'aquapentaamminecobalt(III), phone round', renamed: 'pentaammineaquacobalt(III), phone round' },
  wide: { formula: '[Rh(NH3)5(H2O)]3+', name: 'aquapentaamminerhodium(III), wide round', renamed: 'pentaammineaquarhodium(III), wide round' },
};

async function api(page: Page, method: 'post', path: string, data: unknown) {
  const response = await page.request[method](`${baseUrl()}${path}`, { data, headers: { Origin: baseUrl() } });
  assert.ok(response.ok(), `${method} ${path}: ${response.status()} ${await response.text()}`);
  return (await response.json()) as { id: string };
}

async function viewerSees(size: ViewportName, path: string): Promise<{ name: string; detail: string }> {
  const { context, page } = await signedInPage(browser, 'viewer@larkspur.example.org', size);
  await page.goto(`${baseUrl()}${path}`);
  await page.getByTestId('complex-name').waitFor();
  const seen = { name: await page.getByTestId('complex-name').innerText(), detail: await page.getByTestId('complex-detail').innerText() };
  await screenshot(page, `library-revision-viewer-${size}`);
  await context.close();
  return seen;
}

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`a second review round at ${size} size`, () => {
    let path = '';

    it('starts from an accepted entry', async () => {
      const contributor = await signedInPage(browser, 'contributor@larkspur.example.org', size);
      const entry = await api(contributor.page, 'post', '/api/complexes', { formula: ENTRIES[size].formula, name: ENTRIES[size].name });
      await api(contributor.page, 'post', `/api/complexes/${entry.id}/submit`, {});
      await contributor.context.close();
      const curator = await signedInPage(browser, 'curator@larkspur.example.org', size);
      await api(curator.page, 'post', `/api/complexes/${entry.id}/reviews`, { decision: 'accept', comment: '' });
      await curator.context.close();
      path = `/library/${entry.id}`;
    });

    it('the contributor renames it, adds a measurement, saves once and submits', async () => {
      const { context, page } = await signedInPage(browser, 'contributor@larkspur.example.org', size);
      const errors = collectPageErrors(page);
      const writes: string[] = [];
      page.on('request', (request) => {
        if (request.method() !== 'GET' && request.url().includes('/api/complexes/')) writes.push(`${request.method()} ${new URL(request.url()).pathname}`);
      });
      await page.goto(`${baseUrl()}${path}/edit`);
      await page.getByTestId('complex-form-name').fill(ENTRIES[size].renamed);
      await page.getByTestId('complex-form-add-measurement').click();
      await page.getByTestId('complex-form-m-0-value').fill('6.6e-6');
      await page.getByTestId('complex-form-save').click();
      await page.waitForURL(new RegExp(`${path}$`));
      await page.getByTestId('complex-name').waitFor();
      // One save, one request.
      assert.deepEqual(writes, [`PUT ${path.replace('/library', '/api/complexes')}`]);
      await page.getByTestId('complex-submit').click();
      await page.getByTestId('complex-action-done').waitFor();
      await screenshot(page, `library-revision-submitted-${size}`);
      assert.deepEqual(errors.filter((e) => !/40[19]/.test(e)), []);
      await context.close();
    });

    it('a viewer still sees the accepted content while the edit is in review', async () => {
      const seen = await viewerSees(size, path);
      assert.equal(seen.name, ENTRIES[size].name);
      assert.doesNotMatch(seen.detail, /6\.6/);
    });

    it('the curator returns it for revision with a comment', async () => {
      const { context, page } = await signedInPage(browser, 'curator@larkspur.example.org', size);
      await page.goto(`${baseUrl()}${path}`);
      await page.getByTestId('review-panel').waitFor();
      await page.getByTestId('review-return').click();
      await page.getByTestId('review-comment').fill('Give the temperature of the new rate constant.');
      await page.getByTestId('review-decision-submit').click();
      await page.getByTestId('review-panel').waitFor({ state: 'detached' });
      await page.waitForFunction(() => /returned/i.test(document.querySelector('[data-testid="complex-detail"]')?.textContent ?? ''));
      await screenshot(page, `library-revision-returned-${size}`);
      await context.close();
    });

    it('the contributor reads the comment, fixes the measurement and submits again', async () => {
      const { context, page } = await signedInPage(browser, 'contributor@larkspur.example.org', size);
      await page.goto(`${baseUrl()}${path}`);
      await page.getByTestId('complex-name').waitFor();
      // The curator's comment is on the entry for its author.
      await page.waitForFunction(() =>
        /Give the temperature of the new rate constant/.test(document.querySelector('[data-testid="complex-detail"]')?.textContent ?? ''),
      );
      await page.goto(`${baseUrl()}${path}/edit`);
      await page.getByTestId('complex-form-m-0-temperature').fill('308.15');
      await page.getByTestId('complex-form-save').click();
      await page.waitForURL(new RegExp(`${path}$`));
      await page.getByTestId('complex-submit').click();
      await page.getByTestId('complex-action-done').waitFor();
      await context.close();
    });

    it('the curator accepts it, and the viewer sees exactly the accepted content', async () => {
      const { context, page } = await signedInPage(browser, 'curator@larkspur.example.org', size);
      await page.goto(`${baseUrl()}${path}`);
      await page.getByTestId('review-panel').waitFor();
      await page.getByTestId('review-accept').click();
      await page.getByTestId('review-decision-submit').click();
      await page.getByTestId('review-panel').waitFor({ state: 'detached' });
      await context.close();
      const seen = await viewerSees(size, path);
      assert.equal(seen.name, ENTRIES[size].renamed);
      assert.match(seen.detail, /308(\.15)? K|35 °C/);
    });
  });
}
