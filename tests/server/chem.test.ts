import request from 'supertest';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { classificationSchema, marcusResultSchema, routeResultSchema } from '@/lib/schemas/chem';
import { createTestApp, type TestApp } from '../setup/test-app';

let testApp: TestApp;
beforeAll(async () => {
  testApp = await createTestApp();
});
afterAll(async () => {
  await testApp.close();
});

const post = (path: string, body: unknown) => request(testApp.app).post(path).send(body as object);

describe('POST /api/classify', () => {
  it('classifies one formula (hexaammine cobalt(III): d6 low spin, inert — Taube 1952; common practice)', async () => {
    const response = await post('/api/classify', { formula: '[Co(NH3)6]Cl3' });
    expect(response.status).toBe(200);
    const body = classificationSchema.parse(response.body);
    expect(body).toMatchObject({ metal: 'Co', oxidationState: 3, dElectrons: 6, spinState: 'low', verdict: 'inert' });
  });

  it('classifies a batch in order, with an error object for the unreadable one', async () => {
    const response = await post('/api/classify', { formulas: ['[Cu(H2O)6]2+', '[Co(NH3)6', '[Cr(H2O)6]3+'] });
    expect(response.status).toBe(200);
    expect(response.body).toHaveLength(3);
    expect(response.body[0]).toMatchObject({ metal: 'Cu', verdict: 'labile' }); // Helm & Merbach 2005: k_ex ~ 4e9 s⁻¹
    expect(response.body[1]).toMatchObject({ formula: '[Co(NH3)6', position: 0 });
    expect(response.body[1].error).toMatch(/Unclosed/);
    expect(response.body[2]).toMatchObject({ metal: 'Cr', verdict: 'inert' }); // Helm & Merbach 2005: k_ex ~ 2.4e-6 s⁻¹
  });

  it('answers 400 with the character position for an unreadable formula', async () => {
    const response = await post('/api/classify', { formula: '[Co(NH3)6]3+)' });
    expect(response.status).toBe(400);
    const body = apiErrorBodySchema.parse(response.body);
    expect(body.error.code).toBe('VALIDATION_FAILED');
    expect(body.error.fields?.formula).toMatch(/character \d+/);
    expect(typeof response.body.error.position).toBe('number');
  });

  // Green CrCl3·6H2O is trans-[CrCl2(H2O)4]Cl·2H2O (Dance & Freeman, Inorg. Chem. 1965, 4, 1555 — recalled).
  it('answers for salts, names and bridged species as written, saying what it read', async () => {
    const response = await post('/api/classify', { formulas: ['CrCl3·6H2O', 'cisplatin', '[(NH3)5Co(μ-OH)Co(NH3)5]5+', '[Fe(H2O)6]'] });
    expect(response.status).toBe(200);
    const [salt, name, bridged, uncharged] = response.body as Record<string, unknown>[];
    expect(salt).toMatchObject({ metal: 'Cr', oxidationState: 3, coordinationNumber: 6, readings: [expect.objectContaining({ kind: 'solid', species: 'trans-[CrCl2(H2O)4]Cl·2H2O' })] });
    expect(name).toMatchObject({ metal: 'Pt', oxidationState: 2, readings: [expect.objectContaining({ kind: 'name' })] });
    expect((bridged as { centres: unknown[] }).centres).toHaveLength(2);
    expect((uncharged as { warnings: string[] }).warnings[0]).toMatch(/taken as neutral/);
  });

  it('points at the missing bracket, not at the charge', async () => {
    const response = await post('/api/classify', { formula: '[Co(NH3)5Cl2+' });
    expect(response.status).toBe(400);
    expect(response.body.error.position).toBe(11);
    expect(response.body.error.fields.formula).toMatch(/Missing '\]' at character 12/);
  });

  it.each([
    [{}, 'formula'],
    [{ formula: 42 }, 'formula'],
    [{ formula: '' }, 'formula'],
    [{ formula: '[Co(NH3)6]3+', formulas: ['[Co(NH3)6]3+'] }, 'formula'],
    [{ formulas: [] }, 'formulas'],
    [{ formulas: new Array(1001).fill('[Co(NH3)6]3+') }, 'formulas'],
    [{ formula: '[Co(NH3)6]3+', temperatureC: 'hot' }, 'temperatureC'],
    [{ formula: '[Co(NH3)6]3+', geometry: 'cubic' }, 'geometry'],
    [{ formula: '[Co(NH3)6]3+', extra: true }, 'body'],
  ])('rejects %j with a 400 naming %s', async (body, field) => {
    const response = await post('/api/classify', body);
    expect(response.status).toBe(400);
    const parsed = apiErrorBodySchema.parse(response.body);
    expect(Object.keys(parsed.error.fields ?? {}).join(' ')).toContain(field);
  });

  it('refuses a geometry that cannot hold the ligands, naming the field (common practice: six donors are octahedral)', async () => {
    const response = await request(testApp.app).post('/api/classify').send({ formula: '[Co(NH3)6]3+', geometry: 'square-planar' });
    expect(response.status).toBe(400);
    const body = apiErrorBodySchema.parse(response.body);
    expect(body.error.code).toBe('VALIDATION_FAILED');
    expect(body.error.fields?.geometry).toMatch(/needs coordination number 4, but this complex has 6/);
  });

  it('rejects a JSON array or a string body with 400, not 500', async () => {
    expect((await post('/api/classify', ['[Co(NH3)6]3+'])).status).toBe(400);
    const asText = await request(testApp.app).post('/api/classify').set('Content-Type', 'application/json').send('"x"');
    expect(asText.status).toBe(400);
  });
});

describe('POST /api/route', () => {
  it('bridged Co(III)–Cr(II) with chloride goes inner-sphere (Candlin, Halpern & Trimm 1964; Taube)', async () => {
    const response = await post('/api/route', { oxidant: '[Co(NH3)5Cl]2+', reductant: '[Cr(H2O)6]2+' });
    expect(response.status).toBe(200);
    const body = routeResultSchema.parse(response.body);
    expect(body.route).toBe('inner-sphere');
    expect(body.bridgingCandidates.some((c) => c.ligand === 'Cl')).toBe(true);
  });

  it('hexaammine cobalt(III) with Cr(II) has no bridge: outer-sphere (common practice)', async () => {
    const response = await post('/api/route', { oxidant: '[Co(NH3)6]3+', reductant: '[Cr(H2O)6]2+' });
    expect(response.status).toBe(200);
    expect(response.body.route).toBe('outer-sphere');
  });

  it('answers 400 naming the unreadable partner', async () => {
    const response = await post('/api/route', { oxidant: '[Co(NH3)5Cl]2+', reductant: '[Cr(H2O)6' });
    expect(response.status).toBe(400);
    expect(apiErrorBodySchema.parse(response.body).error.fields).toHaveProperty('reductant');
  });

  it('answers 400 when a partner is missing', async () => {
    const response = await post('/api/route', { oxidant: '[Co(NH3)5Cl]2+' });
    expect(response.status).toBe(400);
    expect(apiErrorBodySchema.parse(response.body).error.fields).toHaveProperty('reductant');
  });
});

describe('POST /api/marcus', () => {
  it('identity: k11 = k22 and K12 = 1 gives k12 = k11 (Marcus cross relation)', async () => {
    const response = await post('/api/marcus', { k11: 4.2e3, k22: 4.2e3, K12: 1 });
    expect(response.status).toBe(200);
    const body = marcusResultSchema.parse(response.body);
    expect(body.k12).toBeCloseTo(4.2e3, 6);
    expect(body.f12).toBe(1);
  });

  it.each([
    [{ k11: -1, k22: 10, dE: 0.1 }, 'k11'],
    [{ k11: 10, k22: 10 }, 'dE'],
    [{ k11: 10, k22: 10, dE: 0.1, K12: 3 }, 'dE'],
    [{ k22: 10, dE: 0.1 }, 'k11'],
    [{ k11: 10, k22: 'fast', dE: 0.1 }, 'k22'],
  ])('rejects %j with a 400 naming %s', async (body, field) => {
    const response = await post('/api/marcus', body);
    expect(response.status).toBe(400);
    expect(apiErrorBodySchema.parse(response.body).error.fields).toHaveProperty(field);
  });
});
