import fs from 'node:fs';
import path from 'node:path';
import type { ServerResponse } from 'node:http';
import type { Express } from 'express';
import expressStaticGzip from 'express-static-gzip';

/**
 * Files whose name carries a content hash never change under the same URL: the bundler's chunks
 * (`/_expo/static/…-<32 hex>.js`) and the exported assets (`name.<32 hex>.ttf`, `…@2x.png`).
 */
const HASHED = /[.-][0-9a-f]{32}(@\dx)?\.[a-z0-9]+$/i;

export const IMMUTABLE_CACHE = 'public, max-age=31536000, immutable';
/** The HTML names the current chunks: the browser must ask again (a 304 when unchanged). */
export const REVALIDATE_CACHE = 'no-cache';
/** Unhashed files (favicon, metadata): a short lifetime. */
export const SHORT_CACHE = 'public, max-age=3600';

export function cacheControlFor(filePath: string): string {
  if (filePath.endsWith('.html')) return REVALIDATE_CACHE;
  return HASHED.test(filePath) ? IMMUTABLE_CACHE : SHORT_CACHE;
}

/**
 * The exported web app: static files with their pre-compressed brotli or gzip copies (written at
 * build time, see compress.ts) chosen by Accept-Encoding, with `Vary: Accept-Encoding`; then, for any
 * other GET, index.html, which routes in the browser.
 */
export function serveWebApp(app: Express, webDir: string) {
  app.use(
    expressStaticGzip(webDir, {
      enableBrotli: true,
      orderPreference: ['br', 'gz'],
      index: false,
      serveStatic: {
        index: false,
        // serve-static would set its own max-age; the header below decides.
        cacheControl: false,
        setHeaders: (res: ServerResponse, filePath: string) => {
          res.setHeader('Cache-Control', cacheControlFor(filePath.replace(/\.(br|gz)$/, '')));
        },
      },
    }),
  );
  const indexFile = path.join(webDir, 'index.html');
  // Client routes (/check, /library/…): the app's HTML, which routes in the browser.
  app.use((req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    if (!fs.existsSync(indexFile)) {
      res
        .status(503)
        .type('text/plain')
        .send('The web app has not been built yet: run `npm run build:web` (npm start does it for you).');
      return;
    }
    res.setHeader('Cache-Control', REVALIDATE_CACHE);
    res.sendFile(indexFile);
  });
}
