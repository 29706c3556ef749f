import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import http from 'node:http';
import os from 'node:os';
import path from 'node:path';
import S3rver from 's3rver';
import { isLoopbackHostHeader } from '@/server/http/host-allow-list';
import type { S3Settings } from '@/server/modules/attachments/object-storage';
import { checkS3Signature } from './s3-signature';

const xmlEscape = (text: string) => text.replace(/[&<>"']/g, (ch) => `&#${ch.charCodeAt(0)};`);

function refuse(res: http.ServerResponse, status: number, code: string, message: string) {
  res.writeHead(status, { 'Content-Type': 'application/xml', 'Cache-Control': 'no-store' });
  res.end(`<?xml version="1.0" encoding="UTF-8"?>\n<Error><Code>${code}</Code><Message>${xmlEscape(message)}</Message></Error>`);
}

/**
 * The local fake S3 (development and tests): s3rver over its own folder, one bucket, on a free
 * port of 127.0.0.1. In front of it, two checks s3rver does not make: the Host must be a loopback
 * name (a DNS-rebinding page cannot reach it), and every request must carry a valid Signature
 * Version 4 made with this store's key pair — the configured S3_ACCESS_KEY / S3_SECRET_KEY, or a
 * random pair made at start and handed only to the app.
 */
export async function startFakeS3(
  options: { directory?: string; bucket?: string; credentials?: { accessKeyId: string; secretAccessKey: string } } = {},
): Promise<{ settings: S3Settings; close: () => Promise<void> }> {
  const bucket = options.bucket ?? 'sphereline-attachments';
  const credentials = options.credentials ?? {
    accessKeyId: `DEV${randomBytes(8).toString('hex').toUpperCase()}`,
    secretAccessKey: randomBytes(24).toString('base64url'),
  };
  const throwaway = !options.directory;
  const directory = options.directory ?? fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-s3-'));
  fs.mkdirSync(directory, { recursive: true });
  const store = new S3rver({ silent: true, directory, configureBuckets: [{ name: bucket }] });
  await store.configureBuckets();
  const handle = store.callback();

  const server = http.createServer((req, res) => {
    if (!isLoopbackHostHeader(req.headers.host)) {
      refuse(res, 403, 'AccessDenied', 'This development store answers only on a loopback host name.');
      return;
    }
    const check = checkS3Signature({ method: req.method ?? 'GET', url: req.url ?? '/', headers: req.headers }, credentials);
    if (!check.ok) {
      refuse(res, 403, check.code, check.reason);
      return;
    }
    // The signature is checked: s3rver then serves the request as it serves unsigned ones.
    delete req.headers.authorization;
    handle(req, res);
  });
  const port: number = await new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      resolve(typeof address === 'object' && address ? address.port : 0);
    });
  });
  return {
    settings: { endpoint: `http://127.0.0.1:${port}`, bucket, ...credentials },
    close: async () => {
      server.closeAllConnections();
      await new Promise<void>((resolve) => server.close(() => resolve()));
      if (throwaway) fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
