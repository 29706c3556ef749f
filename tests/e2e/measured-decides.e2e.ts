import assert from 'node:assert/strict';
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

/**
 * Measured decides, end to end: a contributor adds a measurement, a curator accepts it, and Check
 * shows it as the headline with the model's prediction as the footnote.
 *
 * [Co(NH3)5(OH2)]3+ water exchange: k = 5.7e-6 s⁻¹ at 25 °C (Hunt & Taube, J. Am. Chem. Soc. 1958,
 * 80, 2642 — from memory). The demo library holds no entry of this species.
 */
const ENTRY = { formula: '[Co(NH3)5(H2O)]3+', name: 'Pentaammineaquacobalt(III), exchange run' };

describe('a group measurement decides on Check', () => {
  let entryPath = '';

  it('a contributor adds an entry with a measured water-exchange rate and submits it', async () => {
    const { context, page } = await signedInPage(browser, 'contributor@larkspur.example.org', 'wide');
    const errors = collectPageErrors(page);
    await page.goto(`${baseUrl()}/library/new`);
    await page.getByTestId('complex-form-formula').fill(ENTRY.formula);
    await page.getByTestId('complex-form-name').fill(ENTRY.name);
    await page.getByTestId('complex-form-add-measurement').click();
    await page.getByTestId('complex-form-m-0-kind-water-exchange').click();
    await page.getByTestId('complex-form-m-0-value').fill('5.7e-6');
    await page.getByTestId('complex-form-m-0-temperature').fill('298.15');
    await page.getByTestId('complex-form-m-0-authors').fill('H. R. Hunt, H. Taube');
    await page.getByTestId('complex-form-m-0-journal').fill('J. Am. Chem. Soc.');
    await page.getByTestId('complex-form-m-0-year').fill('1958');
    await page.getByTestId('complex-form-m-0-volume').fill('80');
    await page.getByTestId('complex-form-m-0-pages').fill('2642');
    await page.getByTestId('complex-form-save').click();
    await page.waitForURL(/\/library\/[0-9a-f-]{36}$/);
    entryPath = new URL(page.url()).pathname;
    await page.getByTestId('complex-detail').waitFor();
    // Not accepted yet: the model still speaks on the entry page.
    assert.equal(await page.getByTestId('verdict-headline').count(), 0);
    await page.getByTestId('complex-submit').click();
    await page.getByTestId('complex-action-done').waitFor();
    assert.deepEqual(errors.filter((e) => !/40[19]/.test(e)), []);
    await context.close();
  });

  it('a curator accepts it; the entry page now shows the measurement as the headline', async () => {
    assert.ok(entryPath, 'the entry was created');
    const { context, page } = await signedInPage(browser, 'curator@larkspur.example.org', 'wide');
    await page.goto(`${baseUrl()}${entryPath}`);
    await page.getByTestId('review-panel').waitFor();
    await page.getByTestId('review-accept').click();
    await page.getByTestId('review-comment').fill('Checked against the cited paper.');
    await page.getByTestId('review-decision-submit').click();
    await page.getByTestId('review-panel').waitFor({ state: 'detached' });
    await page.getByTestId('verdict-headline').waitFor();
    assert.match(await page.getByTestId('verdict-headline').innerText(), /Pentaammineaquacobalt\(III\)[\s\S]*J\. Am\. Chem\. Soc\. 1958/);
    await screenshot(page, 'measured-decides-entry-wide');
    await context.close();
  });

  it('Check shows the accepted measurement as the headline, written another way, with the model as the footnote', async () => {
    const { context, page } = await signedInPage(browser, 'viewer@larkspur.example.org', 'wide');
    await page.goto(`${baseUrl()}/check?formula=${encodeURIComponent('[Co(NH3)5(OH2)](ClO4)3')}`);
    await page.getByTestId('verdict-headline').waitFor();
    const card = await page.getByTestId('verdict-card').innerText();
    assert.match(card, /decided by your group’s measurement/);
    assert.match(await page.getByTestId('verdict-headline').innerText(), /Pentaammineaquacobalt\(III\)[\s\S]*H\. R\. Hunt, H\. Taube, J\. Am\. Chem\. Soc\. 1958, 80, 2642/);
    // k = 5.7e-6 s⁻¹ → t½ = ln 2 / k ≈ 1.2e5 s ≈ 1.4 days: inert by the one-minute line (Taube 1952).
    assert.match(card, /inert/i);
    assert.match(await page.getByTestId('verdict-rate').innerText(), /t½ ≈ 1.4 d\b/);
    assert.match(await page.getByTestId('verdict-model-footnote').innerText(), /Model’s prediction/);
    await screenshot(page, 'measured-decides-check-wide');
    await context.close();
  });
});
