import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { createApp } from '@/server/app';
import { openOrm } from '@/server/db/orm';
import { readEnv } from '@/server/env';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { createTestApp, type TestApp } from '../setup/test-app';

let testApp: TestApp;
let webDir: string;

beforeAll(async () => {
  webDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-web-'));
  fs.writeFileSync(path.join(webDir, 'index.html'), '<!doctype html><title>Sphereline test shell</title>');
  fs.writeFileSync(path.join(webDir, 'app.js'), 'console.log("static")');
  testApp = await createTestApp({ webDir });
});

afterAll(async () => {
  await testApp.close();
  fs.rmSync(webDir, { recursive: true, force: true });
});

describe('GET /api/health', () => {
  it('reports the server and the database', async () => {
    const response = await request(testApp.app).get('/api/health');
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: 'ok', db: 'ok' });
  });

  it('answers 503 with db "down" when the database is unreachable', async () => {
    // Port 1 on loopback: nothing listens there, the connection is refused at once.
    const orm = await openOrm('postgresql://postgres:x@127.0.0.1:1/none');
    try {
      const app = createApp({ orm });
      const response = await request(app).get('/api/health');
      expect(response.status).toBe(503);
      expect(response.body).toEqual({ status: 'degraded', db: 'down' });
      // Liveness does not depend on the database: the process itself is fine.
      const live = await request(app).get('/api/health/live');
      expect(live.status).toBe(200);
      expect(live.body).toEqual({ status: 'ok' });
    } finally {
      await orm.close(true);
    }
  });
});

describe('bad requests get the one error shape, never a 500', () => {
  it('malformed JSON → 400 VALIDATION_FAILED', async () => {
    const response = await request(testApp.app)
      .post('/api/health')
      .set('Content-Type', 'application/json')
      .send('{"formula": "[Co(NH3)6]3+",');
    expect(response.status).toBe(400);
    expect(apiErrorBodySchema.parse(response.body).error.code).toBe('VALIDATION_FAILED');
  });

  it('unknown API route → 404 NOT_FOUND with the error shape (not the app HTML)', async () => {
    const response = await request(testApp.app).get('/api/no-such-thing');
    expect(response.status).toBe(404);
    expect(response.type).toBe('application/json');
    expect(apiErrorBodySchema.parse(response.body).error.code).toBe('NOT_FOUND');
  });

  it('a body over the limit → 413 PAYLOAD_TOO_LARGE', async () => {
    const huge = JSON.stringify({ formula: 'x'.repeat(1_200_000) });
    const response = await request(testApp.app)
      .post('/api/health')
      .set('Content-Type', 'application/json')
      .send(huge);
    expect(response.status).toBe(413);
    expect(apiErrorBodySchema.parse(response.body).error.code).toBe('PAYLOAD_TOO_LARGE');
  });
});

describe('the web app is served from the same port', () => {
  it('serves static files', async () => {
    const response = await request(testApp.app).get('/app.js');
    expect(response.status).toBe(200);
    expect(response.text).toContain('static');
  });

  it('falls back to the app HTML for client routes', async () => {
    const response = await request(testApp.app).get('/check?formula=%5BCo(NH3)6%5D3%2B');
    expect(response.status).toBe(200);
    expect(response.text).toContain('Sphereline test shell');
  });

  it('sends security headers with a content security policy', async () => {
    const response = await request(testApp.app).get('/library');
    expect(response.headers['content-security-policy']).toContain("default-src 'self'");
    expect(response.headers['x-content-type-options']).toBe('nosniff');
  });
});

describe('environment', () => {
  it('uses the documented defaults', () => {
    const env = readEnv({});
    expect(env.PORT).toBe(8080);
    expect(env.HOST).toBe('127.0.0.1');
    expect(env.DATA_DIR).toBe('.data');
    expect(env.DATABASE_URL).toBeUndefined();
  });

  it('rejects a bad value with a message naming the variable', () => {
    expect(() => readEnv({ PORT: 'eighty' })).toThrow(/PORT/);
    expect(() => readEnv({ DATABASE_URL: 'mysql://x' })).toThrow(/DATABASE_URL/);
  });
});
