import request from 'supertest';
import { classificationSchema } from '@/lib/schemas/chem';
import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { createTestApp, type TestApp } from '../setup/test-app';
import { laurenczy1991, measurementInput, xuKrouseSwaddle1985 } from '../factories/library';
import { buildLibraryWorld, entryInState, type LibraryWorld } from '../factories/library-world';

/**
 * Measured decides through POST /api/classify with a groupId: the signed-in member's accepted
 * measurement of the same species (metal, oxidation state, ligand set) decides; drafts, retired
 * entries, other groups and measurements that are not first-order rates do not.
 */

let t: TestApp;
let w: LibraryWorld;
const ids: Record<string, string> = {};

// [Rh(H2O)6]3+ k_ex = 2.2e-9 s⁻¹ at 298 K (Laurenczy et al., Magn. Reson. Chem. 1991, 29, S45).
const RH_K = 2.2e-9;
// [Cr(H2O)6]3+ k_ex = 2.4e-6 s⁻¹ at 298 K (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
const CR_K = 2.4e-6;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'decides');
  ids.rh = (await entryInState(w, 'accepted', { formula: '[Rh(H2O)6]3+', name: 'hexaaquarhodium(III)', measurements: [measurementInput({ value: RH_K, citation: laurenczy1991 })] })).id;
  ids.crDraft = (await entryInState(w, 'draft', { formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)', measurements: [measurementInput({ value: CR_K, citation: xuKrouseSwaddle1985 })] })).id;
  // Ni(II) with only a second-order constant: nothing that can decide a first-order lability verdict.
  ids.niSecondOrder = (
    await entryInState(w, 'accepted', {
      formula: '[Ni(NH3)6]2+',
      name: 'hexaamminenickel(II)',
      measurements: [measurementInput({ kind: 'substitution', value: 3.0e3, unit: 'M-1 s-1', citation: xuKrouseSwaddle1985 })],
    })
  ).id;
  ids.coRetired = (await entryInState(w, 'retired', { formula: '[Co(NH3)5(OH2)]3+', name: 'pentaammineaquacobalt(III)', measurements: [measurementInput({ value: 5.7e-6, citation: xuKrouseSwaddle1985 })] })).id;
});
afterAll(async () => {
  await t.close();
});

describe('POST /api/classify with groupId', () => {
  it('an accepted measurement of the same species decides, named with its entry and citation', async () => {
    // Written differently (OH2, a perchlorate salt): same metal centre, oxidation state and ligand set.
    const response = await w.viewer.post('/api/classify', { formula: '[Rh(OH2)6](ClO4)3', groupId: w.groupId });
    expect(response.status).toBe(200);
    const body = classificationSchema.parse(response.body);
    expect(body.decidedBy).toBe('library');
    expect(body.libraryMeasurement).toMatchObject({ entryId: ids.rh, kind: 'water-exchange', kPerSecond: RH_K, temperatureK: 298.15 });
    expect(body.libraryMeasurement?.citation).toMatchObject({ doi: '10.1002/mrc.1260291311', journal: 'Magn. Reson. Chem.', year: 1991 });
    expect(body.verdict).toBe('inert'); // t½ = ln 2 / 2.2e-9 s ≈ 10 years (Taube's one-minute line)
    expect(body.halfLifeSeconds).toBeCloseTo(Math.LN2 / RH_K, -6);
    expect(body.reasons[0]).toMatch(/hexaaquarhodium\(III\).*Magn\. Reson\. Chem\. 1991/);
    expect(body.modelReasons?.length).toBeGreaterThan(0);
  });

  it('without groupId the engine answers alone (reference or model), even for a member', async () => {
    const body = classificationSchema.parse((await w.viewer.post('/api/classify', { formula: '[Rh(H2O)6]3+' })).body);
    expect(body.decidedBy).not.toBe('library');
    expect(body.libraryMeasurement).toBeUndefined();
    const model = classificationSchema.parse((await w.viewer.post('/api/classify', { formula: '[Co(NH3)5Cl]2+' })).body);
    expect(['reference', 'model']).toContain(model.decidedBy);
  });

  it('drafts, retired entries and second-order constants do not decide', async () => {
    for (const formula of ['[Cr(H2O)6]3+', '[Co(NH3)5(OH2)]3+', '[Ni(NH3)6]2+']) {
      const body = classificationSchema.parse((await w.curator.post('/api/classify', { formula, groupId: w.groupId })).body);
      expect([formula, body.decidedBy]).not.toEqual([formula, 'library']);
    }
  });

  it('a batch is decided per formula, errors stay in place', async () => {
    const response = await w.viewer.post('/api/classify', { formulas: ['[Rh(H2O)6]3+', '[Rh(H2O)5Cl]2+', '[Rh(H2O)6'], groupId: w.groupId });
    expect(response.status).toBe(200);
    const [decided, other, broken] = response.body as [unknown, unknown, { error: string; position: number }];
    expect(classificationSchema.parse(decided).decidedBy).toBe('library');
    expect(classificationSchema.parse(other).decidedBy).not.toBe('library');
    expect(broken.error).toBeTruthy();
  });

  it('signed out: 401; not a member: 404 (the same as an unknown group); not a uuid: 400 naming groupId', async () => {
    const signedOut = await request(t.app).post('/api/classify').send({ formula: '[Rh(H2O)6]3+', groupId: w.groupId });
    expect(signedOut.status).toBe(401);
    expect(apiErrorBodySchema.parse(signedOut.body).error.code).toBe('UNAUTHENTICATED');
    const outsider = await w.outsider.post('/api/classify', { formula: '[Rh(H2O)6]3+', groupId: w.groupId });
    expect(outsider.status).toBe(404);
    const unknown = await w.viewer.post('/api/classify', { formula: '[Rh(H2O)6]3+', groupId: '00000000-0000-4000-8000-000000000000' });
    expect(unknown.status).toBe(404);
    const bad = await w.viewer.post('/api/classify', { formula: '[Rh(H2O)6]3+', groupId: 'lab-1' });
    expect(bad.status).toBe(400);
    expect(apiErrorBodySchema.parse(bad.body).error.fields?.groupId).toMatch(/group/);
  });

  it('the other group’s measurements never decide for this one', async () => {
    const body = classificationSchema.parse((await w.outsider.post('/api/classify', { formula: '[Rh(H2O)6]3+', groupId: w.otherGroupId })).body);
    expect(body.decidedBy).not.toBe('library');
  });
});
