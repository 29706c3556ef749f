import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';

/** Debian's Chromium, headless, with nothing that reaches for the network (see DEVELOPERS.md traps). */
export async function launchBrowser(): Promise<Browser> {
  // playwright gives every launch a fresh, empty profile of its own.
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export const baseUrl = () => {
  const url = process.env.E2E_BASE_URL;
  if (!url) throw new Error('E2E_BASE_URL is not set: run the browser tests with `npm run test:e2e`.');
  return url;
};

export const viewports = {
  phone: { width: 390, height: 844 },
  wide: { width: 1440, height: 900 },
} as const;

export type ViewportName = keyof typeof viewports;

const screenshotDir = path.resolve(__dirname, '../../test-results/screenshots');

export async function screenshot(page: Page, name: string) {
  fs.mkdirSync(screenshotDir, { recursive: true });
  await page.screenshot({ path: path.join(screenshotDir, `${name}.png`), fullPage: false });
}

/** Page errors make a test fail: collect them while the page is open. */
export function collectPageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on('pageerror', (error) => errors.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error') errors.push(message.text());
  });
  return errors;
}

export async function horizontalOverflowPx(page: Page): Promise<number> {
  return page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
}
