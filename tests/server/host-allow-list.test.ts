import request from 'supertest';
import { createApp } from '@/server/app';
import { hostNameOf } from '@/server/http/host-allow-list';
import { createTestApp, type TestApp } from '../setup/test-app';

/**
 * Host header allow-list (OWASP Web Security Testing Guide, "Testing for Host Header Injection";
 * DNS rebinding): only APP_URL's host, loopback and ALLOWED_HOSTS are answered, and the development
 * outbox only on loopback.
 */
let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('Host allow-list', () => {
  it('answers loopback, APP_URL’s host and the configured extra hosts', async () => {
    const app = createApp({ orm: t.orm, env: { appUrl: 'https://sphereline.northfen.example.org' } });
    for (const host of ['127.0.0.1:8080', 'localhost', '[::1]:8080', 'sphereline.northfen.example.org', 'SPHERELINE.northfen.example.org:443', 'sphereline.test']) {
      expect((await request(app).get('/api/health/live').set('Host', host)).status).toBe(200);
    }
  });

  it('refuses a forged or rebound host with 403 before any route runs, API and pages alike', async () => {
    const app = createApp({ orm: t.orm, env: { appUrl: 'https://sphereline.northfen.example.org' } });
    for (const path of ['/api/health/live', '/api/auth/me', '/check']) {
      const response = await request(app).get(path).set('Host', 'attacker.example.com');
      expect(response.status).toBe(403);
      expect(response.body.error.code).toBe('FORBIDDEN');
      expect(response.body.error.message).toMatch(/attacker\.example\.com/);
    }
  });

  it('reads host names without their port, IPv6 in brackets kept whole', () => {
    expect(hostNameOf('Example.org:8443')).toBe('example.org');
    expect(hostNameOf('[::1]:8080')).toBe('[::1]');
    expect(hostNameOf(undefined)).toBe('');
  });
});

describe('development outbox', () => {
  it('answers on loopback and is not found under an allowed public name', async () => {
    expect((await request(t.app).get('/api/dev/outbox').set('Host', '127.0.0.1:8080')).status).toBe(200);
    expect((await request(t.app).get('/api/dev/outbox').set('Host', 'sphereline.test')).status).toBe(404);
  });
});
