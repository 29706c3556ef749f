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

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`the Check screen at ${size} size`, () => {
    it('opens a deep link with the verdict, reasons, diagram and scale shown', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      const errors = collectPageErrors(page);
      await page.goto(`${baseUrl()}/check?formula=${encodeURIComponent('[Co(NH3)5Cl]Cl2')}`);
      await page.getByTestId('check-result').waitFor();
      // Pentaamminechloridocobalt(III): d6 low spin, inert (common practice; Taube 1952).
      assert.match(await page.getByTestId('verdict-card').innerText(), /inert/i);
      assert.match(await page.getByTestId('identity-card').innerText(), /Co\(III\)[\s\S]*d6/);
      assert.ok(await page.getByTestId('cautions').isVisible(), 'cobalt caution shown');
      assert.ok((await page.getByTestId('ligand-field-card').locator('svg').count()) > 0, 'orbital diagram drawn');
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `check-deep-link-${size}`);
      // Signed out, the app asks who is signed in once and gets 401: that is not an error.
      assert.deepEqual(errors.filter((e) => !/401/.test(e)), []);
      await page.close();
    });

    it('classifies as you type and shows where a formula is wrong', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      await page.goto(`${baseUrl()}/check`);
      await page.getByTestId('check-empty').waitFor();
      const input = page.getByTestId('formula-input');
      await input.fill('[Cu(H2O)6]2+');
      await page.getByTestId('check-result').waitFor();
      // Hexaaquacopper(II): water exchange ~1e9 s⁻¹, labile (Helm & Merbach 2005).
      assert.match(await page.getByTestId('verdict-card').innerText(), /labile/i);
      await page.waitForURL(/formula=/);

      await input.fill('[Cu(H2O)6]2+)');
      await page.getByTestId('formula-input-problem').waitFor();
      assert.match(await page.getByTestId('formula-input-problem').innerText(), /character \d+/);
      await screenshot(page, `check-error-${size}`);
      await page.close();
    });
  });
}

describe('measured meets predicted', () => {
  it('shows the group library’s accepted measurements beside the prediction when signed in', async () => {
    const { context, page } = await signedInPage(browser, 'viewer@larkspur.example.org', 'wide');
    // [Cr(H2O)6]3+: the demo library holds accepted, cited water-exchange data (Helm & Merbach 2005 and others).
    await page.goto(`${baseUrl()}/check?formula=${encodeURIComponent('[Cr(H2O)6]3+')}`);
    await page.getByTestId('library-measured').waitFor();
    assert.match(await page.getByTestId('library-measured').innerText(), /larkspur[\s\S]*water exchange/i);
    await screenshot(page, 'check-library-measured-wide');
    await context.close();
  });
});

describe('formulas as written', () => {
  it('keeps a raw + in a typed deep link and reads a hydrate as the species it gives', async () => {
    const page = await browser.newPage({ viewport: viewports.wide });
    // Typed into the address bar as is: the '+' must stay a charge, not become a space.
    await page.goto(`${baseUrl()}/check?formula=[Co(NH3)6]3+`);
    await page.getByTestId('check-result').waitFor();
    // Hexaamminecobalt(III): d6 low spin, inert (common practice; Taube 1952).
    assert.match(await page.getByTestId('identity-card').innerText(), /Co\(III\)[\s\S]*d6/);

    // Commercial green CrCl3·6H2O is trans-[CrCl2(H2O)4]Cl·2H2O (Dance & Freeman, Inorg. Chem. 1965, 4, 1555 — recalled).
    await page.getByTestId('formula-input').fill('CrCl3·6H2O');
    await page.getByTestId('read-as').waitFor();
    assert.match(await page.getByTestId('read-as').innerText(), /solid[\s\S]*CrCl₂\(H₂O\)₄/i);
    assert.match(await page.getByTestId('verdict-why').innerText(), /read as the complex in the solid/i);
    await screenshot(page, 'check-hydrate-read-as-wide');
    await page.close();
  });
});
