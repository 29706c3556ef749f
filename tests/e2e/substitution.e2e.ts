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

const checkLink = (formula: string) => `${baseUrl()}/check?formula=${encodeURIComponent(formula)}`;

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`substitution on Check and the planner at ${size} size`, () => {
    it('shows the mechanism card with the measured class and the pathway picture', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      const errors = collectPageErrors(page);
      // [Ni(H2O)6]2+: ΔV‡ = +7.1 cm³ mol⁻¹, Id (Ducommun, Earl & Merbach, Inorg. Chem. 1979; recalled).
      await page.goto(checkLink('[Ni(H2O)6]2+'));
      await page.getByTestId('mechanism-card').waitFor();
      assert.equal((await page.getByTestId('mechanism-class').innerText()).trim(), 'Id');
      assert.match(await page.getByTestId('mechanism-evidence').innerText(), /measured/);
      assert.ok((await page.getByTestId('mechanism-picture').locator('svg').count()) > 0, 'pathway drawn');
      await page.getByTestId('mechanism-card').scrollIntoViewIfNeeded();
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `mechanism-card-${size}`);
      assert.deepEqual(errors.filter((e) => !/401/.test(e)), []);
      await page.close();
    });

    it('gives the formation rate for a picked entering ligand, with the published value beside it', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      await page.goto(checkLink('[Ni(H2O)6]2+'));
      await page.getByTestId('incoming-ligand-card').waitFor();
      await page.getByTestId('incoming-ligand-bpy').click();
      await page.getByTestId('incoming-ligand-result').waitFor();
      // Published k_f = 1.6e3 M⁻¹ s⁻¹ (Holyer, Hubbard, Kettle & Wilkins 1965; recalled); the estimate is within ×10.
      const kfText = await page.getByTestId('incoming-ligand-kf').innerText();
      const kf = Number(/k_f ≈ ([\d.]+) M⁻¹ s⁻¹/.exec(kfText)?.[1]);
      assert.ok(kf / 1.6e3 < 10 && kf / 1.6e3 > 0.1, `k_f ${kfText} within ×10 of 1.6e3`);
      assert.match(await page.getByTestId('incoming-ligand-published').innerText(), /k_f = 1600 M⁻¹ s⁻¹/);
      assert.match(await page.getByTestId('incoming-ligand-card').innerText(), /first bond/);
      await page.getByTestId('incoming-ligand-input').fill('XYZ');
      await page.getByText(/"XYZ" is not in the ligand table/).waitFor();
      await page.getByTestId('incoming-ligand-NH3').click();
      await page.getByTestId('incoming-ligand-result').scrollIntoViewIfNeeded();
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `incoming-ligand-${size}`);
      await page.close();
    });

    it('opens the planner from a square-planar complex and draws each step to the cis isomer', async () => {
      const page = await browser.newPage({ viewport: viewports[size] });
      const errors = collectPageErrors(page);
      await page.goto(checkLink('[PtCl4]2-'));
      await page.getByTestId('planner-link').click();
      await page.waitForURL(/\/planner\?start=/);
      assert.equal(await page.getByTestId('planner-start').inputValue(), '[PtCl4]2-');
      await page.getByTestId('planner-add-NH3').click();
      await page.getByTestId('planner-add-NH3').click();
      await page.getByTestId('planner-result').waitFor();
      // [PtCl4]2- + 2 NH3 → cis-[PtCl2(NH3)2] (Peyrone 1844; Basolo & Pearson 1967).
      await page.getByTestId('planner-isomer').getByText('cis isomer').waitFor();
      assert.equal(await page.getByTestId('planner-chain').locator('svg').count(), 3, 'start and two intermediates drawn');
      assert.match(await page.getByTestId('planner-arrow-2').innerText(), /\+ NH₃[\s\S]*− Cl/);
      assert.match(await page.getByTestId('planner-square-2').innerHTML(), /trans director/);
      assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
      await screenshot(page, `planner-cis-${size}`);

      // The other order of a mixed pair: nitrite first, then ammonia, gives the trans isomer (Basolo & Pearson 1967).
      await page.getByTestId('planner-clear').click();
      await page.getByTestId('planner-ligands').fill('NO2 NH3');
      await page.getByTestId('planner-isomer').getByText('trans isomer').waitFor();
      await screenshot(page, `planner-trans-${size}`);
      assert.deepEqual(errors.filter((e) => !/401/.test(e)), []);
      await page.close();
    });
  });
}
