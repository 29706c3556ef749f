/**
 * Section 5: web. (a) Size of the JavaScript the first screen loads, raw and gzip (zlib, default
 * level, as a server would send it), plus the largest modules in it. "First screen" is everything the
 * browser must download before the landing page (/) renders: the <script> tags of the exported
 * index.html AND the route chunks expo-router fetches before it can draw (every layout, then the
 * landing route): with async routes those arrive in a second round of requests, and counting only the
 * script tags left them out. (b) Time from navigation to the first rendered Check result in headless
 * Chromium at 390×844, against a blank page from the same server, medians of N cold loads (a fresh
 * browser context each: no cache), alternating so noise falls on both alike; the first, unmeasured
 * load also lists the scripts requested before the result appeared (in the JSON report), and what
 * everything received before it weighed on the wire (compressed as the server sent it).
 */
import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { chromium, type Browser } from 'playwright-core';
import { LANDING_ROUTE, LAYOUT_ROUTE, routeChunks } from '@/server/web/route-chunks';
import { median } from './stats';

export interface BundleFile {
  file: string;
  rawBytes: number;
  gzipBytes: number;
}

export interface BundleResult {
  /** index.html's scripts, then the route chunks the landing page needs (layouts, then the route). */
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
  const tags = [...indexHtml.matchAll(/<script[^>]+src="([^"]+\.js)"/g)].map((match) => match[1] ?? '');
  // With async routes the entry holds no screen: expo-router fetches every layout's chunk, then the
  // landing route's, before the first frame (seen in Chromium's requests). Those count too.
  const entry = tags.find((src) => /\/entry-[^/]*\.js$/.test(src));
  const routes = entry ? routeChunks(fs.readFileSync(path.join(webDir, entry.replace(/^\//, '')), 'utf8')) : new Map<string, string>();
  const layouts = [...routes].filter(([route]) => LAYOUT_ROUTE.test(route)).map(([, chunk]) => chunk);
  const landing = [...routes].filter(([route]) => LANDING_ROUTE.test(route)).map(([, chunk]) => chunk);
  if (routes.size > 0 && landing.length === 0) throw new Error('bench/web.ts: no landing route chunk found; update LANDING_ROUTE');
  const scripts = [...new Set([...tags, ...layouts, ...landing])];
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
  // Modules of every first-screen file (entry, common chunk, layouts and the landing route).
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
  /** Scripts the first (unmeasured) Check load requested before its result appeared, and their gzip total. */
  scriptsBeforeResult: string[];
  scriptsBeforeResultGzipBytes: number;
  /**
   * Everything the browser received before the first result showed (the HTML, scripts, fonts…), as
   * sent: compressed bytes plus headers (Resource Timing transferSize).
   */
  firstScreenWireBytes: number;
  firstScreenFiles: { path: string; wireBytes: number; encoding: string }[];
}

export async function measureFirstResult(baseUrl: string, loads = 5, formula = '[Co(NH3)5Cl]Cl2'): Promise<FirstResultTiming> {
  const browser = await launchBenchBrowser();
  const checkMs: number[] = [];
  const blankMs: number[] = [];
  const checkUrl = `${baseUrl}/check?formula=${encodeURIComponent(formula)}`;
  const blankUrl = `${baseUrl}/bench/blank`;
  let scriptsBeforeResult: string[] = [];
  let firstScreenFiles: FirstResultTiming['firstScreenFiles'] = [];
  const timeLoad = async (url: string, listScripts = false) => {
    const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
    const page = await context.newPage();
    const encodings = new Map<string, string>();
    if (listScripts) {
      page.on('response', (response) => {
        const pathname = new URL(response.url()).pathname;
        encodings.set(pathname, response.headers()['content-encoding'] ?? 'none');
      });
      // Page-clock time of the first frame in which the result is displayed (not merely in the DOM: the
      // app may render it hidden while its fonts load), to compare with the requests' start times.
      await page.addInitScript(() => {
        // Polled on a short timer: a requestAnimationFrame loop started this early stops before the app
        // renders in headless Chromium, which left the mark unset and counted every later request.
        const marks = window as unknown as { resultShownAt?: number };
        const timer = setInterval(() => {
          const result = document.querySelector<HTMLElement>('[data-testid="check-result"]');
          if (result && result.offsetParent !== null) {
            marks.resultShownAt = performance.now();
            clearInterval(timer);
          }
        }, 5);
      });
    }
    const started = performance.now();
    await page.goto(url, { waitUntil: 'commit' });
    await page.getByTestId('check-result').waitFor({ state: 'visible', timeout: 30_000 });
    const elapsed = performance.now() - started;
    if (listScripts) {
      scriptsBeforeResult = await page.evaluate(() => {
        const shownAt = (window as unknown as { resultShownAt?: number }).resultShownAt ?? Number.POSITIVE_INFINITY;
        return performance
          .getEntriesByType('resource')
          .filter((entry) => entry.startTime < shownAt && new URL(entry.name).pathname.endsWith('.js'))
          .map((entry) => new URL(entry.name).pathname);
      });
      const received = await page.evaluate(() => {
        const shownAt = (window as unknown as { resultShownAt?: number }).resultShownAt ?? Number.POSITIVE_INFINITY;
        const entries = [
          ...performance.getEntriesByType('navigation'),
          ...performance.getEntriesByType('resource').filter((entry) => entry.startTime < shownAt),
        ] as PerformanceResourceTiming[];
        return entries.map((entry) => ({ path: new URL(entry.name).pathname, wireBytes: entry.transferSize }));
      });
      firstScreenFiles = received.map((file) => ({ ...file, encoding: encodings.get(file.path) ?? 'none' }));
    }
    await context.close();
    return elapsed;
  };
  try {
    // One unmeasured load of each (the server's static files into the OS cache, the browser started).
    await timeLoad(checkUrl, true);
    await timeLoad(blankUrl);
    for (let load = 0; load < loads; load++) {
      checkMs.push(await timeLoad(checkUrl));
      blankMs.push(await timeLoad(blankUrl));
    }
  } finally {
    await browser.close();
  }
  const ratios = checkMs.map((ms, i) => ms / (blankMs[i] ?? Number.NaN));
  let scriptsBeforeResultGzipBytes = 0;
  for (const src of scriptsBeforeResult) {
    const response = await fetch(`${baseUrl}${src}`);
    scriptsBeforeResultGzipBytes += gzipSize(Buffer.from(await response.arrayBuffer()));
  }
  return {
    checkMs,
    blankMs,
    checkMedianMs: median(checkMs),
    blankMedianMs: median(blankMs),
    ratio: median(ratios),
    formula,
    scriptsBeforeResult,
    scriptsBeforeResultGzipBytes,
    firstScreenWireBytes: firstScreenFiles.reduce((sum, file) => sum + file.wireBytes, 0),
    firstScreenFiles,
  };
}
