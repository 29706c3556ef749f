import fs from 'node:fs';
import path from 'node:path';
import { LANDING_ROUTE, LAYOUT_ROUTE, routeChunks } from './route-chunks';

/** The Check route's chunk: the page most often opened cold from a shared link. */
const CHECK_ROUTE = /^\.\/(\([^/]+\)\/)?check\.tsx?$/;
const FONT_URL = /"(\/assets\/[^"]+\.(?:ttf|otf|woff2?))"/g;

/**
 * Adds `<link rel="preload">` tags to the exported index.html for what every cold load asks for only
 * after the entry script has run: the shipped fonts (the routes stay hidden until they are in), the
 * layout chunks, and the landing and Check route chunks. The browser then fetches them beside the
 * entry script instead of one round after another. Returns the preloaded paths.
 */
export function addPreloads(webDir: string): string[] {
  const indexFile = path.join(webDir, 'index.html');
  const html = fs.readFileSync(indexFile, 'utf8');
  if (html.includes('data-sphereline-preload')) return [];
  const scripts = [...html.matchAll(/<script[^>]+src="([^"]+\.js)"/g)].map((match) => match[1] ?? '');
  const sources = scripts.map((src) => fs.readFileSync(path.join(webDir, src.replace(/^\//, '')), 'utf8'));
  const entryIndex = scripts.findIndex((src) => /\/entry-[^/]*\.js$/.test(src));
  const routes = entryIndex >= 0 ? routeChunks(sources[entryIndex] ?? '') : new Map<string, string>();
  const chunks = [...routes]
    .filter(([route]) => LAYOUT_ROUTE.test(route) || LANDING_ROUTE.test(route) || CHECK_ROUTE.test(route))
    .map(([, chunk]) => chunk);
  const fonts = [...new Set(sources.flatMap((source) => [...source.matchAll(FONT_URL)].map((match) => match[1] ?? '')))];
  const tags = [
    ...fonts.map((href) => `<link rel="preload" href="${href}" as="font" type="font/ttf" crossorigin data-sphereline-preload />`),
    ...chunks.map((href) => `<link rel="preload" href="${href}" as="script" data-sphereline-preload />`),
  ];
  if (tags.length === 0) return [];
  fs.writeFileSync(indexFile, html.replace('</head>', `${tags.join('')}</head>`));
  return [...fonts, ...chunks];
}
