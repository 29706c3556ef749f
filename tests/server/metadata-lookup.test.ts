import type { Express } from 'express';
import { doiLookupResponseSchema } from '@/lib/schemas/exchange';
import { createApp } from '@/server/app';
import { startFakeMetadataService, type FakeMetadataService } from '@/server/dev/fake-metadata-service';
import { createMetadataClient } from '@/server/modules/metadata/metadata-client';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeUser } from './auth-helpers';

let t: TestApp;
let fake: FakeMetadataService;
let app: Express;
let member: Browser;
const TIMEOUT_MS = 400;

beforeAll(async () => {
  t = await createTestApp();
  fake = await startFakeMetadataService();
  app = createApp({ orm: t.orm, metadata: createMetadataClient(fake.url, TIMEOUT_MS) });
  await makeUser(t.orm, 'reader.meta@larkspur.example.org');
  member = new Browser(app);
  await member.signIn('reader.meta@larkspur.example.org', FIXTURE_PASSWORD);
});
afterAll(async () => {
  await fake.close();
  await t.close();
});

describe('GET /api/citations/lookup', () => {
  it('fills a citation from a DOI the service knows', async () => {
    const response = await member.get('/api/citations/lookup?doi=10.1002/mrc.1260291311');
    expect(response.status).toBe(200);
    // Laurenczy, Rapaport, Zbinden & Merbach, Magn. Reson. Chem. 1991, 29, S45-S51 (water_exchange.json).
    expect(doiLookupResponseSchema.parse(response.body)).toEqual({
      doi: '10.1002/mrc.1260291311',
      authors: 'G. Laurenczy, I. Rapaport, D. Zbinden, A. E. Merbach',
      title: 'Variable-pressure oxygen-17 NMR study of water exchange on hexaaquarhodium(III)',
      journal: 'Magn. Reson. Chem.',
      year: 1991,
      volume: '29',
      pages: 'S45-S51',
    });
  });

  it('accepts a DOI pasted as a link, in any letter case', async () => {
    const response = await member.get(`/api/citations/lookup?doi=${encodeURIComponent('https://doi.org/10.1021/JA954071N')}`);
    expect(response.status).toBe(200);
    // Cusanelli, Frey, Richens & Merbach, J. Am. Chem. Soc. 1996, 118, 5265 (water_exchange.json).
    expect(response.body).toMatchObject({ journal: 'J. Am. Chem. Soc.', year: 1996, volume: '118', pages: '5265-5271' });
  });

  it('an unknown DOI → 404 NOT_FOUND saying so', async () => {
    const response = await member.get('/api/citations/lookup?doi=10.9999/not.a.real.work');
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('NOT_FOUND');
    expect(response.body.error.message).toContain('No record was found for DOI 10.9999/not.a.real.work');
  });

  it('a slow service → 503 UNAVAILABLE after the deadline, with a message the form can show', async () => {
    fake.setDelay(TIMEOUT_MS * 3);
    const started = Date.now();
    try {
      const response = await member.get('/api/citations/lookup?doi=10.1002/mrc.1260291311');
      expect(response.status).toBe(503);
      expect(response.body.error.code).toBe('UNAVAILABLE');
      expect(response.body.error.message).toMatch(/did not answer within 0\.4 s.*by hand/);
      expect(Date.now() - started).toBeLessThan(TIMEOUT_MS * 3);
    } finally {
      fake.setDelay(0);
    }
  });

  it('a service that is down → 503 UNAVAILABLE', async () => {
    const down = createApp({ orm: t.orm, metadata: createMetadataClient('http://127.0.0.1:9', TIMEOUT_MS) });
    const browser = new Browser(down);
    browser.cookie = member.cookie;
    const response = await browser.get('/api/citations/lookup?doi=10.1002/mrc.1260291311');
    expect(response.status).toBe(503);
    expect(response.body.error.message).toContain('cannot be reached');
  });

  it('a malformed DOI → 400 with the field', async () => {
    const response = await member.get('/api/citations/lookup?doi=hexaaqua');
    expect(response.status).toBe(400);
    expect(response.body.error.fields.doi).toContain('starts with "10."');
  });

  it('signed out → 401', async () => {
    const response = await new Browser(app).get('/api/citations/lookup?doi=10.1002/mrc.1260291311');
    expect(response.status).toBe(401);
  });
});
