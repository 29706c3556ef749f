import http from 'node:http';
import { GetObjectCommand, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import request from 'supertest';
import { createApp } from '@/server/app';
import { startFakeMetadataService, type FakeMetadataService } from '@/server/dev/fake-metadata-service';
import { startFakeS3 } from '@/server/dev/fake-s3';
import { checkS3Signature } from '@/server/dev/s3-signature';
import { developmentTools, registerDevelopmentTools } from '@/server/development-tools';
import type { S3Settings } from '@/server/modules/attachments/object-storage';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeUser } from './auth-helpers';

/**
 * The development stand-ins (server/dev): the fake S3 answers only loopback Hosts and requests
 * signed (AWS Signature Version 4) with its own key pair; the fake DOI service answers only
 * loopback Hosts; in production none of them is used, even when registered.
 */

const credentials = { accessKeyId: 'LARKSPURDEVKEY01', secretAccessKey: 'larkspur-dev-secret-not-for-production' };
let s3: { settings: S3Settings; close: () => Promise<void> };

const clientWith = (settings: S3Settings, accessKeyId: string, secretAccessKey: string) =>
  new S3Client({
    endpoint: settings.endpoint,
    region: 'us-east-1',
    credentials: { accessKeyId, secretAccessKey },
    forcePathStyle: true,
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  });

/** A raw HTTP request, so the test chooses every header (Host included). */
function raw(url: string, options: { method?: string; path?: string; headers?: Record<string, string> } = {}): Promise<{ status: number; body: string }> {
  const target = new URL(url);
  return new Promise((resolve, reject) => {
    const req = http.request(
      { host: '127.0.0.1', port: target.port, method: options.method ?? 'GET', path: options.path ?? `${target.pathname}${target.search}`, headers: options.headers },
      (res) => {
        let body = '';
        res.on('data', (chunk: Buffer) => (body += chunk.toString()));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body }));
      },
    );
    req.on('error', reject);
    req.end();
  });
}

/** The exact request the AWS SDK sends (method, path, headers), caught by a plain server that answers 404. */
async function captureSignedGet(key: string, bucket: string): Promise<{ method: string; path: string; headers: Record<string, string> }> {
  let caught: { method: string; path: string; headers: Record<string, string> } | null = null;
  const catcher = http.createServer((req, res) => {
    caught = { method: req.method ?? '', path: req.url ?? '', headers: Object.fromEntries(Object.entries(req.headers).map(([k, v]) => [k, String(v)])) };
    res.writeHead(404, { 'Content-Type': 'application/xml' }).end('<Error><Code>NoSuchKey</Code></Error>');
  });
  await new Promise<void>((resolve) => catcher.listen(0, '127.0.0.1', () => resolve()));
  const address = catcher.address();
  const port = typeof address === 'object' && address ? address.port : 0;
  const client = clientWith({ ...s3.settings, endpoint: `http://127.0.0.1:${port}` }, credentials.accessKeyId, credentials.secretAccessKey);
  await client.send(new GetObjectCommand({ Bucket: bucket, Key: key })).catch(() => undefined);
  client.destroy();
  await new Promise<void>((resolve) => catcher.close(() => resolve()));
  if (!caught) throw new Error('the SDK sent nothing');
  return caught;
}

beforeAll(async () => {
  s3 = await startFakeS3({ credentials });
  const client = clientWith(s3.settings, credentials.accessKeyId, credentials.secretAccessKey);
  await client.send(new PutObjectCommand({ Bucket: s3.settings.bucket, Key: 'groups/alpha/notes.txt', Body: 'Larkspur kinetics notes', ContentType: 'text/plain' }));
  client.destroy();
});
afterAll(async () => {
  await s3.close();
});

describe('the fake S3 needs its credentials', () => {
  it('serves a request signed with the configured key pair', async () => {
    expect(s3.settings).toMatchObject(credentials);
    const client = clientWith(s3.settings, credentials.accessKeyId, credentials.secretAccessKey);
    const object = await client.send(new GetObjectCommand({ Bucket: s3.settings.bucket, Key: 'groups/alpha/notes.txt' }));
    expect(await object.Body?.transformToString()).toBe('Larkspur kinetics notes');
    client.destroy();
  });

  it('refuses an unsigned request (403 AccessDenied), for objects and for listings', async () => {
    for (const path of [`/${s3.settings.bucket}/groups/alpha/notes.txt`, `/${s3.settings.bucket}`, '/']) {
      const response = await raw(`${s3.settings.endpoint}${path}`);
      expect(response.status).toBe(403);
      expect(response.body).toContain('<Code>AccessDenied</Code>');
      expect(response.body).not.toContain('Larkspur kinetics notes');
    }
  });

  it('refuses a wrong secret and an unknown key (403)', async () => {
    const wrongSecret = clientWith(s3.settings, credentials.accessKeyId, 'a-guessed-secret');
    await expect(wrongSecret.send(new GetObjectCommand({ Bucket: s3.settings.bucket, Key: 'groups/alpha/notes.txt' }))).rejects.toMatchObject({
      name: 'SignatureDoesNotMatch',
      $metadata: { httpStatusCode: 403 },
    });
    wrongSecret.destroy();
    // s3rver's own built-in key pair opens nothing here.
    const builtIn = clientWith(s3.settings, 'S3RVER', 'S3RVER');
    await expect(builtIn.send(new GetObjectCommand({ Bucket: s3.settings.bucket, Key: 'groups/alpha/notes.txt' }))).rejects.toMatchObject({
      name: 'InvalidAccessKeyId',
      $metadata: { httpStatusCode: 403 },
    });
    builtIn.destroy();
  });

  it('refuses a signed request changed after signing (other path), and one replayed after 15 minutes', async () => {
    const signed = await captureSignedGet('groups/alpha/notes.txt', s3.settings.bucket);
    // Replayed unchanged (its signed Host is loopback, only the port differs): served.
    const replay = await raw(s3.settings.endpoint, { path: signed.path, headers: signed.headers });
    expect(replay.status).toBe(200);
    expect(replay.body).toBe('Larkspur kinetics notes');
    const tampered = await raw(s3.settings.endpoint, { path: signed.path.replace('alpha', 'beta'), headers: signed.headers });
    expect(tampered.status).toBe(403);
    expect(tampered.body).toContain('<Code>SignatureDoesNotMatch</Code>');

    const asSent = { method: signed.method, url: signed.path, headers: signed.headers };
    expect(checkS3Signature(asSent, credentials)).toEqual({ ok: true });
    expect(checkS3Signature(asSent, credentials, Date.now() + 16 * 60 * 1000)).toMatchObject({ ok: false, code: 'RequestTimeTooSkewed' });
    expect(checkS3Signature({ ...asSent, method: 'DELETE' }, credentials)).toMatchObject({ ok: false, code: 'SignatureDoesNotMatch' });
  });

  it('answers only a loopback Host, even to a correctly signed request', async () => {
    const signed = await captureSignedGet('groups/alpha/notes.txt', s3.settings.bucket);
    const rebound = await raw(s3.settings.endpoint, { path: signed.path, headers: { ...signed.headers, host: 'rebind.attacker.example' } });
    expect(rebound.status).toBe(403);
    expect(rebound.body).toContain('loopback host name');
    expect(rebound.body).not.toContain('Larkspur kinetics notes');
  });

  it('makes a random key pair of its own when none is configured', async () => {
    const other = await startFakeS3();
    try {
      expect(other.settings.accessKeyId).not.toBe('S3RVER');
      expect(other.settings.secretAccessKey.length).toBeGreaterThanOrEqual(32);
      expect((await raw(`${other.settings.endpoint}/${other.settings.bucket}`)).status).toBe(403);
    } finally {
      await other.close();
    }
  });
});

describe('the fake DOI service', () => {
  let fake: FakeMetadataService;
  beforeAll(async () => {
    fake = await startFakeMetadataService();
  });
  afterAll(async () => {
    await fake.close();
  });

  it('answers a loopback Host and refuses any other (403)', async () => {
    // Laurenczy, Rapaport, Zbinden & Merbach, Magn. Reson. Chem. 1991, 29, S45-S51: one of its records.
    const doiPath = '/works/10.1002%2Fmrc.1260291311';
    expect((await raw(fake.url, { path: doiPath, headers: { host: new URL(fake.url).host } })).status).toBe(200);
    expect((await raw(fake.url, { path: doiPath, headers: { host: 'localhost' } })).status).toBe(200);
    const rebound = await raw(fake.url, { path: doiPath, headers: { host: 'rebind.attacker.example' } });
    expect(rebound.status).toBe(403);
    expect(rebound.body).not.toContain('Laurenczy');
  });
});

describe('production does not use the stand-ins', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
    await makeUser(t.orm, 'prod.check@northfen.example.org');
  });
  afterAll(async () => {
    await t.close();
  });

  it('are registered for these tests, but production gets none of them', () => {
    expect(developmentTools('test')).not.toBeNull();
    expect(developmentTools('development')).not.toBeNull();
    expect(developmentTools('production')).toBeNull();
  });

  it('without S3_*, METADATA_URL or SMTP_URL a production app answers 503 and the outbox 404', async () => {
    const production = createApp({ orm: t.orm, env: { NODE_ENV: 'production' } });
    expect((await request(production).get('/api/dev/outbox').set('Host', '127.0.0.1')).status).toBe(404);
    const member = new Browser(production);
    await member.signIn('prod.check@northfen.example.org', FIXTURE_PASSWORD);
    const lookup = await member.get('/api/citations/lookup?doi=10.1002/mrc.1260291311');
    expect(lookup.status).toBe(503);
    expect(lookup.body.error.code).toBe('UNAVAILABLE');
    // No mail sink behind it: sending is refused, not quietly kept in an outbox.
    const reset = await member.post('/api/auth/password-reset/request', { email: 'prod.check@northfen.example.org' });
    expect(reset.status).toBe(503);
  });

  it('outside production without registered tools: no outbox either', async () => {
    const registered = developmentTools('test');
    registerDevelopmentTools(null);
    try {
      const bare = createApp({ orm: t.orm, env: { NODE_ENV: 'development' } });
      expect((await request(bare).get('/api/dev/outbox').set('Host', '127.0.0.1')).status).toBe(404);
    } finally {
      registerDevelopmentTools(registered);
    }
  });
});
