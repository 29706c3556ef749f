import assert from 'node:assert/strict';
import fs from 'node:fs';
import path from 'node:path';
import { after, before, describe, it } from 'node:test';
import type { Browser, Page } from 'playwright-core';
import { launchBrowser, viewports, type ViewportName } from './browser';
import { demoScreens, openScreen, type DemoScreen } from './screen-list';

/**
 * A picture of every screen at both sizes, as its demo person sees it, for people to look at:
 * test-results/screens/<screen>-<phone|wide>.png, the whole page (not only the first screenful).
 * Each screen must also carry its own page title and log no console error.
 *
 * `SCREENS_DIR` writes the pictures elsewhere; `SCREENS_LENIENT=1` takes a picture of whatever
 * shows even when the screen's content marker never appears and skips the title and console
 * checks (for pictures of an older build, whose screens carry other markers).
 */
const outDir = path.resolve(__dirname, '../..', process.env.SCREENS_DIR ?? 'test-results/screens');
const lenient = process.env.SCREENS_LENIENT === '1';

let browser: Browser;
before(async () => {
  browser = await launchBrowser();
  fs.mkdirSync(outDir, { recursive: true });
});
after(async () => {
  await browser?.close();
});

/**
 * The screens scroll inside the app's own scroll views, so a full-page screenshot of the window shows
 * one screenful: grow the window to the tallest scrolled content first, then take the picture.
 */
async function wholePage(page: Page, size: ViewportName, file: string) {
  const extra = await page.evaluate(() => {
    let most = 0;
    for (const element of Array.from(document.querySelectorAll<HTMLElement>('*'))) {
      const style = getComputedStyle(element);
      if (!/(auto|scroll)/.test(style.overflowY)) continue;
      most = Math.max(most, element.scrollHeight - element.clientHeight);
    }
    return most;
  });
  const { width, height } = viewports[size];
  if (extra > 0) {
    await page.setViewportSize({ width, height: Math.min(height + extra, 12_000) });
    await page.waitForTimeout(300);
  }
  await page.screenshot({ path: path.join(outDir, file), fullPage: true });
  await page.setViewportSize({ width, height });
}

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`screenshots of every screen at ${size} size`, () => {
    let screens: DemoScreen[] = [];
    before(async () => {
      screens = await demoScreens(browser, size);
    });

    it('every screen opens with its content, its own title and a clean console, pictured whole', async () => {
      const problems: string[] = [];
      for (const screen of screens) {
        const opened = await openScreen(browser, screen, size, { lenient }).catch((error: Error) => {
          problems.push(`${screen.name}: ${error.message.split('\n')[0]}`);
          return null;
        });
        if (!opened) continue;
        const { page, errors, close } = opened;
        try {
          const title = await page.title();
          if (!lenient) {
            if (!screen.title.test(title)) problems.push(`${screen.name}: title "${title}" does not match ${screen.title}`);
            if (errors.length > 0) problems.push(`${screen.name}: console errors ${errors.join(' | ')}`);
          }
          await wholePage(page, size, `${screen.name}-${size}.png`);
        } finally {
          await close();
        }
      }
      if (lenient) problems.forEach((problem) => console.log(`[screens] ${problem}`));
      else assert.deepEqual(problems, [], 'screens with problems');
      assert.equal(fs.readdirSync(outDir).filter((file) => file.endsWith(`-${size}.png`)).length >= screens.length, true, 'a picture per screen');
    });
  });
}
