import request from 'supertest';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { classificationSchema, formationResultSchema, sequenceResultSchema } from '@/lib/schemas/chem';
import { createTestApp, type TestApp } from '../setup/test-app';

let testApp: TestApp;
beforeAll(async () => {
  testApp = await createTestApp();
});
afterAll(async () => {
  await testApp.close();
});

const post = (path: string, body: unknown) => request(testApp.app).post(path).send(body as object);

describe('POST /api/classify carries the mechanism', () => {
  it('[Ni(H2O)6]2+: Id from the measured ΔV‡ = +7.1 cm³ mol⁻¹ (Ducommun, Earl & Merbach, Inorg. Chem. 1979, recalled)', async () => {
    const response = await post('/api/classify', { formula: '[Ni(H2O)6]2+' });
    expect(response.status).toBe(200);
    const body = classificationSchema.parse(response.body) as { mechanism?: { class: string; evidence: string; activationVolume?: number; reasons: string[] } };
    expect(body.mechanism).toMatchObject({ class: 'Id', evidence: 'measured', activationVolume: 7.1 });
    expect(body.mechanism?.reasons.length).toBeGreaterThan(0);
  });
});

describe('POST /api/formation', () => {
  it('[Ni(H2O)6]2+ + NH3: k_f within ×10 of the published 5e3 M⁻¹ s⁻¹ (Wilkins 1991, recalled), with K_os, k_ex and the comparison', async () => {
    const response = await post('/api/formation', { complex: '[Ni(H2O)6]2+', ligand: 'NH3', I: 0.1 });
    expect(response.status).toBe(200);
    const body = formationResultSchema.parse(response.body);
    expect(body.kf / 5e3).toBeLessThan(10);
    expect(body.kf / 5e3).toBeGreaterThan(0.1);
    // Ni(II) water exchange 3.2e4 s⁻¹ (Ducommun, Earl & Merbach 1979); K_os for 2+/neutral at 4 Å ≈ 0.16 M⁻¹ (common practice).
    expect(body.kex).toBeCloseTo(3.2e4, -3);
    expect(body.Kos).toBeCloseTo(0.16, 2);
    expect(body.published?.kf).toBe(5e3);
  });

  it('the ionic strength changes K_os for charged partners (Ni²⁺ + F⁻)', async () => {
    const low = formationResultSchema.parse((await post('/api/formation', { complex: '[Ni(H2O)6]2+', ligand: 'F', I: 0.01 })).body);
    const high = formationResultSchema.parse((await post('/api/formation', { complex: '[Ni(H2O)6]2+', ligand: 'F', I: 1 })).body);
    expect(low.Kos).toBeGreaterThan(high.Kos);
  });

  it.each([
    [{ complex: '[Ni(H2O6]2+', ligand: 'NH3' }, 'complex'],
    [{ complex: '[Ni(H2O)6]2+', ligand: 'XYZ' }, 'ligand'],
    [{ complex: '[Ni(H2O)6]2+' }, 'ligand'],
    [{ complex: '[Ni(H2O)6]2+', ligand: 'NH3', I: -1 }, 'I'],
    [{ complex: '[Ni(H2O)6]2+', ligand: 'NH3', T: 'hot' }, 'T'],
    [{ complex: '[Ni(H2O)6]2+', ligand: 'NH3', extra: 1 }, null],
  ])('%j → 400 naming %s', async (body, field) => {
    const response = await post('/api/formation', body);
    expect(response.status).toBe(400);
    const error = apiErrorBodySchema.parse(response.body).error;
    expect(error.code).toBe('VALIDATION_FAILED');
    if (field) expect(Object.keys(error.fields ?? {})).toContain(field);
  });
});

describe('POST /api/sequence', () => {
  it('[PtCl4]2- + NH3, NH3 → cis-[PtCl2(NH3)2] (Peyrone 1844, as in Basolo & Pearson 1967); [Pt(NH3)4]2+ + Cl, Cl → trans (Reiset 1844)', async () => {
    const cis = sequenceResultSchema.parse((await post('/api/sequence', { start: '[PtCl4]2-', ligands: ['NH3', 'NH3'] })).body);
    expect(cis.isomer).toBe('cis');
    expect(cis.steps).toHaveLength(2);
    expect(cis.steps[1]).toMatchObject({ entering: 'NH3', leaving: 'Cl', isomer: 'cis' });
    const trans = sequenceResultSchema.parse((await post('/api/sequence', { start: '[Pt(NH3)4]2+', ligands: ['Cl', 'Cl'] })).body);
    expect(trans.isomer).toBe('trans');
  });

  it.each([
    [{ start: '[PtCl2(NH3)2]', ligands: ['py'] }, 'start'],
    [{ start: '[Co(NH3)6]3+', ligands: ['Cl'] }, 'start'],
    [{ start: '[PtCl4]2-', ligands: ['NH3', 'XYZ'] }, 'ligands[1]'],
    [{ start: '[PtCl4]2-', ligands: [] }, 'ligands'],
    [{ start: '[PtCl4]2-', ligands: 'NH3' }, 'ligands'],
    [{ ligands: ['NH3'] }, 'start'],
  ])('%j → 400 naming %s', async (body, field) => {
    const response = await post('/api/sequence', body);
    expect(response.status).toBe(400);
    const error = apiErrorBodySchema.parse(response.body).error;
    expect(error.code).toBe('VALIDATION_FAILED');
    expect(Object.keys(error.fields ?? {}).join(' ')).toContain(field);
  });
});
