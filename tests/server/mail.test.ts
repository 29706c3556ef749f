import request from 'supertest';
import { createApp } from '@/server/app';
import { extractLinks, parseMail } from '@/server/modules/mail/mime';
import { createTestApp, type TestApp } from '../setup/test-app';
import { outboxFor } from './auth-helpers';

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

describe('the mail sink and the dev outbox', () => {
  it('keeps a real SMTP delivery, with text and HTML parts and links to APP_URL routes', async () => {
    const app = createApp({ orm: t.orm, env: { appUrl: 'https://sphereline.example.org' } });
    const email = 'outbox.check@larkspur.example.org';
    const response = await request(app)
      .post('/api/auth/sign-up')
      .send({ email, password: 'hexaaquachromium-three', displayName: 'Zoë Ashgrove-Ñúñez' });
    expect(response.status).toBe(202);
    const [message] = await outboxFor(app, email);
    expect(message?.to).toEqual([email]);
    expect(message?.subject).toBe('Sphereline: confirm your e-mail address');
    // Non-ASCII survives the trip through SMTP and MIME.
    expect(message?.text).toContain('Hello Zoë Ashgrove-Ñúñez,');
    expect(message?.html).toContain('Zoë Ashgrove-Ñúñez');
    expect(message?.links).toHaveLength(1);
    expect(message?.links[0]).toMatch(/^https:\/\/sphereline\.example\.org\/verify\?token=[a-z2-7]{32}$/);
  });

  it('is not there in production (404)', async () => {
    const production = createApp({ orm: t.orm, env: { NODE_ENV: 'production' } });
    const response = await request(production).get('/api/dev/outbox');
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('NOT_FOUND');
  });
});

describe('reading MIME', () => {
  it('decodes encoded-word subjects, quoted-printable and base64 parts', () => {
    const raw = [
      'From: Sphereline <no-reply@sphereline.example.org>',
      'To: a@example.org',
      'Subject: =?UTF-8?Q?Sphereline_=E2=80=94_Larkspur?=',
      'Content-Type: multipart/alternative;',
      ' boundary="b1"',
      '',
      '--b1',
      'Content-Type: text/plain; charset=utf-8',
      'Content-Transfer-Encoding: quoted-printable',
      '',
      // "=" itself is written =3D; a trailing "=" is a soft line break (RFC 2045 §6.7).
      'Caf=C3=A9 link: http://127.0.0.1:8080/verify?token=3Dabc=',
      'def.',
      '--b1',
      'Content-Type: text/html; charset=utf-8',
      'Content-Transfer-Encoding: base64',
      '',
      Buffer.from('<p>Café</p>').toString('base64'),
      '--b1--',
      '',
    ].join('\r\n');
    const mail = parseMail(raw);
    expect(mail.subject).toBe('Sphereline — Larkspur');
    expect(mail.text).toBe('Café link: http://127.0.0.1:8080/verify?token=abcdef.');
    expect(mail.html).toBe('<p>Café</p>');
    expect(extractLinks(mail.text)).toEqual(['http://127.0.0.1:8080/verify?token=abcdef']);
  });
});

describe('the outbox page for people', () => {
  it('answers a browser with an HTML page, and scripts with JSON', async () => {
    const t = await createTestApp();
    try {
      const response = await request(t.app).get('/api/dev/outbox').set('Accept', 'text/html,application/xhtml+xml');
      expect(response.status).toBe(200);
      expect(response.type).toBe('text/html');
      expect(response.text).toContain('Local outbox');
      const json = await request(t.app).get('/api/dev/outbox');
      expect(json.type).toBe('application/json');
    } finally {
      await t.close();
    }
  });
});
