import type { Browser, BrowserContext, Page } from 'playwright-core';
import { baseUrl, viewports, type ViewportName } from './browser';

export const DEMO_PASSWORD = 'sphereline-demo';

/** A signed-in browser context for one demo person (own cookies), at a viewport size. */
export async function signedInPage(
  browser: Browser,
  email: string,
  size: ViewportName,
): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport: viewports[size] });
  const page = await context.newPage();
  await page.goto(`${baseUrl()}/sign-in?next=${encodeURIComponent('/account')}`);
  await page.getByTestId('sign-in-email').fill(email);
  await page.getByTestId('sign-in-password').fill(DEMO_PASSWORD);
  await page.getByTestId('sign-in-submit').click();
  await page.getByTestId('account-signed-in').waitFor();
  return { context, page };
}
