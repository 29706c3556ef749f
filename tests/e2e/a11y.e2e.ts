import assert from 'node:assert/strict';
import { after, before, describe, it } from 'node:test';
import { AxeBuilder } from '@axe-core/playwright';
import type { Browser, Page } from 'playwright-core';
import { baseUrl, collectPageErrors, horizontalOverflowPx, launchBrowser, screenshot, viewports, type ViewportName } from './browser';
import { signedInPage } from './session';

/**
 * Accessibility and phone ergonomics on the screens of the shell, Check, Route and Account, at both
 * sizes: axe-core (WCAG 2.0–2.2 A and AA rules) with no serious or critical violation, tap targets of
 * at least 44 × 44 px (WCAG 2.2 SC 2.5.5 at AAA, our own bar), buttons whose label stays on one line,
 * and a visible keyboard focus.
 */
let browser: Browser;
before(async () => {
  browser = await launchBrowser();
});
after(async () => {
  await browser?.close();
});

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

async function seriousViolations(page: Page): Promise<string[]> {
  const results = await new AxeBuilder({ page }).withTags(WCAG_TAGS).analyze();
  return results.violations
    .filter((violation) => violation.impact === 'serious' || violation.impact === 'critical')
    .map((violation) => `${violation.id} (${violation.impact}): ${violation.nodes.slice(0, 4).map((node) => `${node.target.join(' ')} ${node.html.slice(0, 160)}`).join(' | ')}`);
}

/** Every visible control smaller than 44 × 44 px, described by its role and name. */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const selector = 'a[href], button, input, textarea, select, [role="button"], [role="link"], [role="tab"], [role="switch"], [role="checkbox"], [role="radio"]';
    const found: string[] = [];
    for (const element of Array.from(document.querySelectorAll<HTMLElement>(selector))) {
      const rect = element.getBoundingClientRect();
      if (rect.width === 0 || rect.height === 0) continue; // not shown
      const style = getComputedStyle(element);
      if (style.visibility === 'hidden' || style.display === 'none') continue;
      // A control nested in a larger control (a chip's inner text) is reached through the outer one.
      if (element.parentElement?.closest(selector)) continue;
      if (rect.width < 43.5 || rect.height < 43.5) {
        const name = element.getAttribute('aria-label') ?? element.textContent?.trim().slice(0, 40) ?? '';
        found.push(`${element.getAttribute('role') ?? element.tagName.toLowerCase()} "${name}" ${Math.round(rect.width)}×${Math.round(rect.height)}`);
      }
    }
    return found;
  });
}

/** Buttons whose label runs onto a second line: a text run of the button laid out on more than one line. */
async function wrappedButtons(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const found: string[] = [];
    for (const element of Array.from(document.querySelectorAll<HTMLElement>('button, [role="button"]'))) {
      if (element.getBoundingClientRect().height === 0) continue;
      const walker = document.createTreeWalker(element, NodeFilter.SHOW_TEXT);
      for (let node = walker.nextNode(); node; node = walker.nextNode()) {
        if (!node.textContent?.trim()) continue;
        const range = document.createRange();
        range.selectNodeContents(node);
        const lines = new Set(Array.from(range.getClientRects()).filter((r) => r.width > 0).map((r) => Math.round(r.top)));
        if (lines.size > 1) {
          found.push(`"${element.textContent?.trim().slice(0, 40)}" on ${lines.size} lines`);
          break;
        }
      }
    }
    return found;
  });
}

/** Tabs through the page; every focused control must show an outline or a ring. */
async function focusWithoutRing(page: Page, presses = 12): Promise<string[]> {
  const missing: string[] = [];
  await page.locator('body').click({ position: { x: 1, y: 1 } });
  for (let i = 0; i < presses; i++) {
    await page.keyboard.press('Tab');
    const seen = await page.evaluate(() => {
      const element = document.activeElement as HTMLElement | null;
      if (!element || element === document.body) return null;
      const style = getComputedStyle(element);
      const ring = (style.outlineStyle !== 'none' && parseFloat(style.outlineWidth) >= 2) || (style.boxShadow !== 'none' && style.boxShadow !== '');
      return ring ? '' : `${element.getAttribute('role') ?? element.tagName.toLowerCase()} "${(element.getAttribute('aria-label') ?? element.textContent ?? '').trim().slice(0, 40)}"`;
    });
    if (seen) missing.push(seen);
  }
  return missing;
}

interface Screen {
  name: string;
  path: string;
  ready: string;
  /** Demo person to sign in as, if the screen needs one. */
  as?: string;
}

const SCREENS: Screen[] = [
  { name: 'landing', path: '/', ready: 'landing' },
  { name: 'check', path: `/check?formula=${encodeURIComponent('[Co(NH3)5Cl]Cl2')}`, ready: 'verdict-card' },
  { name: 'check-empty', path: '/check', ready: 'check-empty' },
  { name: 'route', path: `/route?oxidant=${encodeURIComponent('[Co(NH3)5Cl]2+')}&reductant=${encodeURIComponent('[Cr(H2O)6]2+')}`, ready: 'route-result' },
  { name: 'library-visitor', path: '/library', ready: 'library-signed-out' },
  { name: 'account-visitor', path: '/account', ready: 'account-signed-out' },
  { name: 'sign-in', path: '/sign-in', ready: 'sign-in-email' },
  { name: 'sign-up', path: '/sign-up', ready: 'sign-up-screen' },
  { name: 'account-admin', path: '/account', ready: 'groups-list', as: 'admin@larkspur.example.org' },
  { name: 'check-signed-in', path: `/check?formula=${encodeURIComponent('[Cr(H2O)6]3+')}`, ready: 'verdict-card', as: 'viewer@larkspur.example.org' },
];

for (const size of Object.keys(viewports) as ViewportName[]) {
  describe(`accessibility at ${size} size`, () => {
    for (const screen of SCREENS) {
      it(`${screen.name}: no serious or critical axe violation, 44 px targets, one-line buttons, no console error`, async () => {
        const { page, close } = screen.as
          ? await signedInPage(browser, screen.as, size).then(({ context, page: signed }) => ({ page: signed, close: () => context.close() }))
          : await browser.newContext({ viewport: viewports[size] }).then(async (context) => ({ page: await context.newPage(), close: () => context.close() }));
        const errors = collectPageErrors(page);
        await page.goto(`${baseUrl()}${screen.path}`);
        await page.getByTestId(screen.ready).first().waitFor();
        await page.waitForLoadState('networkidle');
        await screenshot(page, `a11y-${screen.name}-${size}`);
        assert.deepEqual(await seriousViolations(page), [], 'axe: serious or critical violations');
        if (size === 'phone') {
          assert.deepEqual(await smallTargets(page), [], 'tap targets under 44 × 44 px');
          assert.ok((await horizontalOverflowPx(page)) <= 0, 'no horizontal scrolling');
        }
        assert.deepEqual(await wrappedButtons(page), [], 'buttons whose label wraps');
        assert.deepEqual(errors, [], 'console errors');
        await close();
      });
    }

    it('keyboard: every control reached by Tab on Check shows a visible focus ring', async () => {
      const context = await browser.newContext({ viewport: viewports[size] });
      const page = await context.newPage();
      await page.goto(`${baseUrl()}/check?formula=${encodeURIComponent('[Ni(NH3)6]2+')}`);
      await page.getByTestId('verdict-card').waitFor();
      assert.deepEqual(await focusWithoutRing(page, 16), [], 'focused controls without a visible ring');
      await context.close();
    });
  });
}
