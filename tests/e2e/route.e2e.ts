import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import type { Browser } from 'playwright-core';
import { baseUrl, collectPageErrors, horizontalOverflowPx, launchBrowser, screenshot, viewports, type ViewportName } from './browser';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const deepLink = (oxidant: string, reductant: string) =>
  `${baseUrl()}/route?oxidant=${encodeURIComponent(oxidant)}&reductant=${encodeURIComponent(reductant)}`;

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`the Route screen at ${size} size`, () => {
    it('shows a bridged pair as inner-sphere with the bridge drawn and the Marcus panel', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      const errors = collectPageErrors(page);
      // [Co(NH3)5Cl]2+ + Cr(II): the classic chloride-bridged reduction (Candlin, Halpern & Trimm 1964).
      await page.goto(deepLink('[Co(NH3)5Cl]2+', '[Cr(H2O)6]2+'));
      await page.getByTestId('route-result').waitFor();
      assert.ok(await page.getByTestId('route-inner-sphere').isVisible());
      assert.equal(await page.getByTestId('bridge').count(), 1, 'bridging ligand drawn between the spheres');
      assert.ok(await page.getByTestId('bridging-candidates').isVisible());
      assert.match(await page.getByTestId('expected-products').innerText(), /Cr/);
      assert.ok(await page.getByTestId('marcus-panel').isVisible());
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `route-inner-sphere-${size}`);
      assert.deepEqual(errors, []);
      await page.close();
    });

    it('says outer-sphere when the inert partner has no bridge, and computes Marcus from prefilled couples', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      await page.goto(deepLink('[Ru(NH3)6]3+', '[V(H2O)6]2+'));
      await page.getByTestId('route-result').waitFor();
      assert.ok(await page.getByTestId('route-outer-sphere').isVisible());
      await page.getByTestId('marcus-result').waitFor();
      await page.getByTestId('marcus-observed').fill('1.5e3');
      await page.getByTestId('marcus-comparison').waitFor();
      assert.match(await page.getByTestId('marcus-comparison').innerText(), /outer-sphere|predict/i);
      await screenshot(page, `route-outer-sphere-${size}`);
      await page.close();
    });
  });
}
