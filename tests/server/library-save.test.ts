import { complexDetailSchema, revisionsResponseSchema, type ComplexDetail, type SaveComplexInput } from '@/lib/schemas/library';
import { AuditEvent } from '@/server/modules/audit/audit-event.entity';
import { ComplexReview } from '@/server/modules/library/review.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';

/**
 * One save is one change: PUT /api/complexes/:id takes the whole entry, and the server writes what
 * differs in one transaction with one revision (its summary in words) — or nothing at all.
 */
let t: TestApp;
let w: LibraryWorld;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'save');
});
afterAll(async () => {
  await t.close();
});

/** The entry as the form would send it back unchanged. */
function asSave(entry: ComplexDetail): SaveComplexInput {
  return {
    version: entry.version,
    formula: entry.formula,
    name: entry.name,
    notes: entry.notes,
    measurements: entry.measurements.map((m) => ({
      id: m.id,
      kind: m.kind,
      value: m.value,
      unit: m.unit,
      temperatureK: m.temperatureK,
      ionicStrengthM: m.ionicStrengthM,
      medium: m.medium,
      method: m.method,
      partnerFormula: m.partnerFormula,
      citationId: m.citation?.id ?? null,
      notes: m.notes,
    })),
  };
}

async function revisionsOf(id: string) {
  return revisionsResponseSchema.parse((await w.author.get(`/api/complexes/${id}/revisions`)).body).revisions;
}

/** Every SQL statement the app's connection sends while `run` runs. */
async function countStatements(run: () => Promise<unknown>): Promise<{ count: number; sql: string[] }> {
  const knex = t.orm.em.getConnection().getKnex();
  const sql: string[] = [];
  const listener = (query: { sql: string }) => sql.push(query.sql);
  knex.on('query', listener);
  try {
    await run();
  } finally {
    knex.off('query', listener);
  }
  return { count: sql.length, sql };
}

describe('PUT /api/complexes/:id', () => {
  it('renames and adds a measurement in one request, one transaction and one revision', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    const before = await revisionsOf(entry.id);
    const body = asSave(entry);
    body.name = 'hexaaquachromium(III) perchlorate';
    // [Cr(H2O)6]3+ activation volume −9.6 cm3/mol (Xu, Krouse & Swaddle 1985).
    body.measurements.push({ kind: 'activation-volume', value: -9.6, unit: 'cm3/mol', temperatureK: 298.15 });
    let response: Awaited<ReturnType<typeof w.author.put>> | undefined;
    const statements = await countStatements(async () => {
      response = await w.author.put(`/api/complexes/${entry.id}`, body);
    });
    expect(response!.status).toBe(200);
    const saved = complexDetailSchema.parse(response!.body);
    expect(saved.name).toBe('hexaaquachromium(III) perchlorate');
    expect(saved.measurements.map((m) => m.kind).sort()).toEqual(['activation-volume', 'water-exchange']);
    expect(saved.version).toBe(entry.version + 1);
    const after = await revisionsOf(entry.id);
    expect(after).toHaveLength(before.length + 1);
    expect(after[0]!.message).toBe('Renamed; added an activation volume measurement');
    // One transaction: a single begin … commit pair around the writes.
    expect(statements.sql.filter((s) => /^begin/i.test(s))).toHaveLength(1);
    expect(statements.sql.filter((s) => /^commit/i.test(s))).toHaveLength(1);
    // The figure the closing note reports (session read, entry read, the transaction, the reply).
    expect(statements.count).toBeLessThanOrEqual(30);
    console.info(`one save (rename + one measurement): ${statements.count} SQL statements`);
  });

  it('changes and removes measurements by id, and names both in the summary', async () => {
    const entry = await createEntry(w.author, w.groupId, {
      measurements: [measurementInput(), measurementInput({ kind: 'activation-volume', value: -9.6, unit: 'cm3/mol', citation: null })],
    });
    const body = asSave(entry);
    const exchange = body.measurements.find((m) => m.kind === 'water-exchange')!;
    exchange.temperatureK = 308.15;
    body.measurements = [exchange];
    const saved = complexDetailSchema.parse((await w.author.put(`/api/complexes/${entry.id}`, body)).body);
    expect(saved.measurements).toHaveLength(1);
    expect(saved.measurements[0]!.temperatureK).toBe(308.15);
    expect((await revisionsOf(entry.id))[0]!.message).toBe('Changed a water exchange measurement; removed an activation volume measurement');
  });

  it('a save that changes nothing writes no revision and keeps the version', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    const before = await revisionsOf(entry.id);
    const response = await w.author.put(`/api/complexes/${entry.id}`, asSave(entry));
    expect(response.status).toBe(200);
    expect(complexDetailSchema.parse(response.body).version).toBe(entry.version);
    expect(await revisionsOf(entry.id)).toHaveLength(before.length);
  });

  it('a failure half-way leaves nothing behind: no row, no revision, no version, no audit event', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    const before = await revisionsOf(entry.id);
    const auditBefore = await t.orm.em.fork().count(AuditEvent, { subjectId: entry.id });
    const body = asSave(entry);
    body.name = 'renamed before the failure';
    // The first new measurement is valid and written first; the second names a foreign id.
    body.measurements.push({ kind: 'activation-volume', value: -9.6, unit: 'cm3/mol' });
    body.measurements.push({ ...body.measurements[0]!, id: '00000000-0000-4000-8000-000000000000' });
    const response = await w.author.put(`/api/complexes/${entry.id}`, body);
    expect(response.status).toBe(400);
    expect(response.body.error.fields['measurements.2.id']).toMatch(/not a measurement of this entry/i);
    const now = complexDetailSchema.parse((await w.author.get(`/api/complexes/${entry.id}`)).body);
    expect(now.name).toBe(entry.name);
    expect(now.version).toBe(entry.version);
    expect(now.measurements.map((m) => m.id)).toEqual(entry.measurements.map((m) => m.id));
    expect(await revisionsOf(entry.id)).toHaveLength(before.length);
    expect(await t.orm.em.fork().count(AuditEvent, { subjectId: entry.id })).toBe(auditBefore);
  });

  it('a stale version is a 409 with the entry as it is now', async () => {
    const entry = await createEntry(w.author, w.groupId);
    const first = asSave(entry);
    first.notes = 'first';
    expect((await w.author.put(`/api/complexes/${entry.id}`, first)).status).toBe(200);
    const second = asSave(entry);
    second.notes = 'second';
    const response = await w.author.put(`/api/complexes/${entry.id}`, second);
    expect(response.status).toBe(409);
    expect(response.body.error.current.notes).toBe('first');
  });

  it('refuses a malformed body field by field (400, not 500)', async () => {
    const entry = await createEntry(w.author, w.groupId);
    const response = await w.author.put(`/api/complexes/${entry.id}`, { version: entry.version, formula: 42, measurements: 'none' });
    expect(response.status).toBe(400);
    expect(Object.keys(response.body.error.fields)).toEqual(expect.arrayContaining(['formula', 'name', 'measurements']));
  });

  it('of concurrent saves based on the same version exactly one is made; the others get 409', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    const before = await revisionsOf(entry.id);
    const saves = ['first', 'second', 'third', 'fourth'].map((notes) => ({ ...asSave(entry), notes }));
    const responses = await Promise.all(saves.map((body) => w.author.put(`/api/complexes/${entry.id}`, body)));
    expect(responses.map((r) => r.status).sort()).toEqual([200, 409, 409, 409]);
    const now = complexDetailSchema.parse((await w.author.get(`/api/complexes/${entry.id}`)).body);
    expect(now.version).toBe(entry.version + 1);
    expect(saves.map((b) => b.notes)).toContain(now.notes);
    expect(now.measurements.map((m) => m.id)).toEqual(entry.measurements.map((m) => m.id));
    expect(await revisionsOf(entry.id)).toHaveLength(before.length + 1);
  });

  it('removes a measurement and adds another in one save: the entry keeps exactly what was sent', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    const body = asSave(entry);
    // [Cr(H2O)6]3+ activation volume −9.6 cm3/mol (Xu, Krouse & Swaddle 1985).
    body.measurements = [{ kind: 'activation-volume', value: -9.6, unit: 'cm3/mol', temperatureK: 298.15 }];
    const saved = complexDetailSchema.parse((await w.author.put(`/api/complexes/${entry.id}`, body)).body);
    expect(saved.measurements.map((m) => [m.kind, m.value])).toEqual([['activation-volume', -9.6]]);
    expect(saved.measurements[0]!.id).not.toBe(entry.measurements[0]!.id);
    expect((await revisionsOf(entry.id))[0]!.message).toBe('Added an activation volume measurement; removed a water exchange measurement');
  });

  it('a review decision belongs to the revision it recorded (one flush writes both)', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    expect((await w.author.post(`/api/complexes/${entry.id}/submit`)).status).toBe(200);
    const reviewed = await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'return', comment: 'Name the medium.' });
    expect(reviewed.status).toBe(201);
    const review = await t.orm.em.fork().findOneOrFail(ComplexReview, { id: reviewed.body.review.id }, { populate: ['revision'] });
    expect(review.revision).not.toBeNull();
    expect(review.revision!.number).toBe(review.revisionNumber);
    expect(review.revision!.complex.id).toBe(entry.id);
    expect(review.revision!.kind).toBe('review');
    expect(review.revision!.message).toBe('Returned: Name the medium.');
  });

  it('viewers and other contributors cannot save', async () => {
    const entry = await createEntry(w.author, w.groupId);
    expect((await w.viewer.put(`/api/complexes/${entry.id}`, asSave(entry))).status).toBe(404);
    expect((await w.contributor2.put(`/api/complexes/${entry.id}`, asSave(entry))).status).toBe(404);
    expect((await w.outsider.put(`/api/complexes/${entry.id}`, asSave(entry))).status).toBe(404);
  });
});
