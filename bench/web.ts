/**
 * Section 5: web. (a) Size of the JavaScript the first screen loads (the <script> tags of the
 * exported index.html), raw and gzip (zlib, default level, as a server would send it), plus the
 * largest modules in them; (b) time from navigation to the first rendered Check result
 * in headless Chromium at 390×844, against a blank page from the same server, medians of N cold
 * loads (a fresh browser context each: no cache), alternating so noise falls on both alike.
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { chromium, type Browser } from 'playwright-core';
import { median } from './stats';

export interface BundleFile {
  file: string;
  rawBytes: number;
  gzipBytes: number;
}

export interface BundleResult {
  firstScreen: BundleFile[];
  firstScreenRawBytes: number;
  firstScreenGzipBytes: number;
  allJsRawBytes: number;
  allJsGzipBytes: number;
  moduleCount: number;
  largestModules: { rawBytes: number; hint: string }[];
}

const gzipSize = (data: Buffer) => zlib.gzipSync(data).length;

/**
 * The production bundle keeps no module paths, so each module (a `__d(function…` factory) is named
 * by a hint: the first package-like or distinctive string literal in it.
 */
function largestModules(source: string, top: number): { count: number; modules: { rawBytes: number; hint: string }[] } {
  const starts: number[] = [];
  const marker = '__d(function';
  for (let index = source.indexOf(marker); index >= 0; index = source.indexOf(marker, index + marker.length)) starts.push(index);
  const modules = starts.map((start, i) => {
    const text = source.slice(start, starts[i + 1] ?? source.length);
    const hint =
      /["'`](@?[a-z0-9-]+\/[a-zA-Z0-9/_.-]+)["'`]/.exec(text)?.[1] ??
      /displayName\s*=\s*["'`]([^"'`]{3,60})["'`]/.exec(text)?.[1] ??
      /["'`]([A-Za-z][^"'`\n]{12,60})["'`]/.exec(text)?.[1] ??
      text.slice(12, 72);
    return { rawBytes: text.length, hint };
  });
  modules.sort((a, b) => b.rawBytes - a.rawBytes);
  return { count: starts.length, modules: modules.slice(0, top) };
}

export function measureBundle(webDir: string): BundleResult {
  const indexHtml = fs.readFileSync(path.join(webDir, 'index.html'), 'utf8');
  const scripts = [...indexHtml.matchAll(/<script[^>]+src="([^"]+\.js)"/g)].map((match) => match[1] ?? '');
  const firstScreen = scripts.map((src) => {
    const data = fs.readFileSync(path.join(webDir, src.replace(/^\//, '')));
    return { file: src, rawBytes: data.length, gzipBytes: gzipSize(data) };
  });
  const jsDir = path.join(webDir, '_expo/static/js/web');
  const allJs = fs.existsSync(jsDir) ? fs.readdirSync(jsDir).filter((name) => name.endsWith('.js')) : [];
  let allJsRawBytes = 0;
  let allJsGzipBytes = 0;
  for (const name of allJs) {
    const data = fs.readFileSync(path.join(jsDir, name));
    allJsRawBytes += data.length;
    allJsGzipBytes += gzipSize(data);
  }
  // Modules of every first-screen file (the entry and any common chunk the export splits off).
  const firstScreenSource = firstScreen.map((file) => fs.readFileSync(path.join(webDir, file.file.replace(/^\//, '')), 'utf8')).join('\n');
  const { count, modules } = largestModules(firstScreenSource, 15);
  return {
    firstScreen,
    firstScreenRawBytes: firstScreen.reduce((sum, file) => sum + file.rawBytes, 0),
    firstScreenGzipBytes: firstScreen.reduce((sum, file) => sum + file.gzipBytes, 0),
    allJsRawBytes,
    allJsGzipBytes,
    moduleCount: count,
    largestModules: modules,
  };
}

export async function launchBenchBrowser(): Promise<Browser> {
  // Same flags as the browser tests (tests/e2e/browser.ts; PLATFORM.md trap 15).
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
}

export interface FirstResultTiming {
  checkMs: number[];
  blankMs: number[];
  checkMedianMs: number;
  blankMedianMs: number;
  /** check / blank: how many blank-page loads one Check result costs. */
  ratio: number;
  formula: string;
}

export async function measureFirstResult(baseUrl: string, loads = 5, formula = '[Co(NH3)5Cl]Cl2'): Promise<FirstResultTiming> {
  const browser = await launchBenchBrowser();
  const checkMs: number[] = [];
  const blankMs: number[] = [];
  const checkUrl = `${baseUrl}/check?formula=${encodeURIComponent(formula)}`;
  const blankUrl = `${baseUrl}/bench/blank`;
  const timeLoad = async (url: string) => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const started = performance.now();
    await page.goto(url, { waitUntil: 'commit' });
    await page.getByTestId('check-result').waitFor({ state: 'visible', timeout: 30_000 });
    const elapsed = performance.now() - started;
    await context.close();
    return elapsed;
  };
  try {
    // One unmeasured load of each (the server's static files into the OS cache, the browser started).
    await timeLoad(checkUrl);
    await timeLoad(blankUrl);
    for (let load = 0; load < loads; load++) {
      checkMs.push(await timeLoad(checkUrl));
      blankMs.push(await timeLoad(blankUrl));
    }
  } finally {
    await browser.close();
  }
  const ratios = checkMs.map((ms, i) => ms / (blankMs[i] ?? Number.NaN));
  return { checkMs, blankMs, checkMedianMs: median(checkMs), blankMedianMs: median(blankMs), ratio: median(ratios), formula };
}
