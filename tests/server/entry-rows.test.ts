import { Complex } from '@/server/modules/library/complex.entity';
import { Measurement } from '@/server/modules/library/measurement.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, type LibraryWorld } from '../factories/library-world';
import { upload } from './exchange-helpers';

/**
 * The form and the CSV import store the same entry the same way: one set of row builders
 * (server/modules/library/entry-rows.ts). Only what must differ differs: ids, times, and the
 * import's submission for review.
 */
let t: TestApp;
let w: LibraryWorld;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'rows');
});
afterAll(async () => {
  await t.close();
});

// [Cr(H2O)6]3+ water exchange 2.4e-6 s-1 at 298.15 K (Xu, Krouse & Swaddle, Inorg. Chem. 1985, 24, 267).
const ENTRY = {
  formula: '[Cr(H2O)6]3+',
  notes: 'stored alike',
  measurement: { kind: 'water-exchange', value: 2.4e-6, unit: 's-1', temperatureK: 298.15, ionicStrengthM: 1, medium: 'aqueous HClO4', method: '17O NMR' },
};

const ENTRY_FIELDS = ['formula', 'notes', 'metal', 'oxidationState', 'dElectrons', 'spinState', 'verdict', 'ligandIds', 'ligandSetKey', 'measurementKinds', 'hasCitation', 'version', 'createdById'] as const;
const MEASUREMENT_FIELDS = ['kind', 'value', 'unit', 'temperatureK', 'ionicStrengthM', 'medium', 'method', 'partnerFormula', 'notes'] as const;

async function stored(name: string) {
  const em = t.orm.em.fork();
  const entry = await em.findOneOrFail(Complex, { groupId: w.groupId, name });
  const [measurement] = await em.find(Measurement, { complex: entry.id });
  return {
    entry: Object.fromEntries(ENTRY_FIELDS.map((f) => [f, entry[f]])),
    measurement: { ...Object.fromEntries(MEASUREMENT_FIELDS.map((f) => [f, measurement?.[f] ?? null])), citationId: measurement?.citation?.id ?? null },
    status: entry.status,
  };
}

it('the form and the import produce identical rows for the same entry', async () => {
  const created = await w.author.post('/api/complexes', { groupId: w.groupId, formula: ENTRY.formula, name: 'from the form', notes: ENTRY.notes, measurements: [ENTRY.measurement] });
  expect(created.status).toBe(201);
  const m = ENTRY.measurement;
  const csv = Buffer.from(
    'entry,formula,name,notes,kind,value,unit,temperature_K,ionic_strength_M,medium,method\n' +
      `1,${ENTRY.formula},from the import,${ENTRY.notes},${m.kind},${m.value},${m.unit},${m.temperatureK},${m.ionicStrengthM},${m.medium},${m.method}\n`,
  );
  const job = await upload(t.app, w.author, `/api/imports?groupId=${w.groupId}&wait=true&duplicates=import`, csv);
  expect(job.body.state).toBe('succeeded');

  const fromForm = await stored('from the form');
  const fromImport = await stored('from the import');
  expect(fromImport.entry).toEqual(fromForm.entry);
  expect(fromImport.measurement).toEqual(fromForm.measurement);
  expect(fromForm.measurement).toMatchObject({ kind: 'water-exchange', value: 2.4e-6, temperatureK: 298.15 });
  expect([fromForm.status, fromImport.status]).toEqual(['draft', 'in-review']);
});
