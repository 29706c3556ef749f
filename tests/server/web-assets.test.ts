import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { precompressWebApp } from '@/server/web/compress';
import { createTestApp, type TestApp } from '../setup/test-app';

/**
 * The exported web app as the server sends it: pre-compressed copies chosen by Accept-Encoding,
 * with Vary, and cache lifetimes by kind (hashed chunks for a year, immutable; HTML revalidated).
 * Expected headers follow RFC 9110 (Content-Encoding, Vary) and RFC 8246 (immutable).
 */
const HASH = '0123456789abcdef0123456789abcdef';
const chunkPath = `/_expo/static/js/web/entry-${HASH}.js`;
// Repetitive enough to compress well, large enough to be worth compressing.
const chunkSource = Array.from({ length: 400 }, (_, i) => `export const ligand${i} = "ammine-${i % 7}";`).join('\n');
const html = `<!doctype html><html><head><title>Sphereline</title></head><body><div id="root"></div>${' '.repeat(2000)}<script src="${chunkPath}" defer></script></body></html>`;

let t: TestApp;
let webDir: string;

beforeAll(async () => {
  webDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-web-'));
  fs.mkdirSync(path.join(webDir, '_expo/static/js/web'), { recursive: true });
  fs.writeFileSync(path.join(webDir, chunkPath), chunkSource);
  fs.writeFileSync(path.join(webDir, 'index.html'), html);
  fs.writeFileSync(path.join(webDir, 'favicon.ico'), Buffer.alloc(64, 1));
  precompressWebApp(webDir);
  t = await createTestApp({ webDir });
});
afterAll(async () => {
  await t.close();
  fs.rmSync(webDir, { recursive: true, force: true });
});

/** The body as bytes (supertest decodes Content-Encoding before this parser sees it). */
function rawGet(urlPath: string, acceptEncoding: string) {
  return request(t.app)
    .get(urlPath)
    .set('Host', '127.0.0.1')
    .set('Accept-Encoding', acceptEncoding)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = [];
      res.on('data', (chunk: Buffer) => chunks.push(chunk));
      res.on('end', () => done(null, Buffer.concat(chunks)));
    });
}

describe('pre-compressed static files', () => {
  it('writes brotli and gzip copies beside the chunk at build time, smaller than the original', () => {
    const raw = fs.statSync(path.join(webDir, chunkPath)).size;
    expect(fs.statSync(path.join(webDir, `${chunkPath}.br`)).size).toBeLessThan(raw / 4);
    expect(fs.statSync(path.join(webDir, `${chunkPath}.gz`)).size).toBeLessThan(raw / 4);
    // Too small to gain anything: left alone.
    expect(fs.existsSync(path.join(webDir, 'favicon.ico.br'))).toBe(false);
  });

  it('sends brotli to a browser that accepts it, with Vary and a year-long immutable lifetime', async () => {
    const response = await rawGet(chunkPath, 'gzip, deflate, br');
    expect(response.status).toBe(200);
    expect(response.headers['content-encoding']).toBe('br');
    expect(response.headers.vary).toMatch(/Accept-Encoding/i);
    expect(response.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    expect(response.headers['content-type']).toMatch(/javascript/);
    // The bytes on the wire are the brotli copy (supertest decodes them on the way in).
    expect(Number(response.headers['content-length'])).toBe(fs.statSync(path.join(webDir, `${chunkPath}.br`)).size);
    expect((response.body as Buffer).toString()).toBe(chunkSource);
  });

  it('sends gzip when brotli is not accepted, and the plain file when nothing is', async () => {
    const gzipped = await rawGet(chunkPath, 'gzip, deflate');
    expect(gzipped.headers['content-encoding']).toBe('gzip');
    expect(Number(gzipped.headers['content-length'])).toBe(fs.statSync(path.join(webDir, `${chunkPath}.gz`)).size);
    expect((gzipped.body as Buffer).toString()).toBe(chunkSource);
    const plain = await rawGet(chunkPath, 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(Number(plain.headers['content-length'])).toBe(Buffer.byteLength(chunkSource));
    expect((plain.body as Buffer).toString()).toBe(chunkSource);
  });

  it('makes the browser revalidate the HTML, for the file and for client routes', async () => {
    for (const urlPath of ['/index.html', '/check', '/library/abc']) {
      const response = await rawGet(urlPath, 'gzip, br');
      expect(response.status).toBe(200);
      expect(response.headers['cache-control']).toBe('no-cache');
    }
  });

  it('gives unhashed files a short lifetime', async () => {
    const response = await rawGet('/favicon.ico', 'br');
    expect(response.status).toBe(200);
    expect(response.headers['cache-control']).toBe('public, max-age=3600');
  });
});
