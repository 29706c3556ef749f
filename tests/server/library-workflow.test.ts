import { apiErrorBodySchema } from '@/lib/schemas/errors';
import {
  complexDetailSchema,
  reviewQueueResponseSchema,
  reviewResponseSchema,
  revisionDiffSchema,
  revisionsResponseSchema,
  staleVersionErrorSchema,
} from '@/lib/schemas/library';
import { AuditEvent } from '@/server/modules/audit/audit-event.entity';
import { createTestApp, type TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser } from './auth-helpers';
import { measurementInput } from '../factories/library';
import { buildLibraryWorld, createEntry, entryInState, type EntryState, type LibraryWorld } from '../factories/library-world';

let t: TestApp;
let w: LibraryWorld;

beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'wf');
});
afterAll(async () => {
  await t.close();
});

type Who = 'admin' | 'curator' | 'author' | 'contributor2' | 'viewer' | 'outsider';
type Act = 'edit' | 'submit' | 'accept' | 'return' | 'decline' | 'retire';

async function act(who: Who, action: Act, id: string, version: number) {
  const browser = w[who];
  switch (action) {
    case 'edit':
      return browser.patch(`/api/complexes/${id}`, { version, notes: `edited by ${who}` });
    case 'submit':
      return browser.post(`/api/complexes/${id}/submit`);
    case 'retire':
      return browser.post(`/api/complexes/${id}/retire`);
    default:
      return browser.post(`/api/complexes/${id}/reviews`, { decision: action, comment: 'reviewed' });
  }
}

// [state, who, action, expected HTTP status, expected status afterwards (when allowed)]
const transitions: [EntryState, Who, Act, number, string?][] = [
  ['draft', 'author', 'edit', 200, 'draft'],
  ['draft', 'author', 'submit', 200, 'in-review'],
  ['draft', 'curator', 'edit', 200, 'draft'],
  ['draft', 'curator', 'submit', 200, 'in-review'],
  ['draft', 'contributor2', 'edit', 404], // another contributor's draft is invisible
  ['draft', 'viewer', 'submit', 404],
  ['draft', 'outsider', 'edit', 404],
  ['draft', 'curator', 'accept', 409],
  ['draft', 'curator', 'retire', 200, 'retired'],
  ['in-review', 'author', 'accept', 403],
  ['in-review', 'author', 'edit', 409],
  ['in-review', 'author', 'submit', 409],
  ['in-review', 'curator', 'accept', 201, 'accepted'],
  ['in-review', 'admin', 'accept', 201, 'accepted'],
  ['in-review', 'curator', 'return', 201, 'returned'],
  ['in-review', 'curator', 'decline', 201, 'declined'],
  ['in-review', 'outsider', 'accept', 404],
  ['returned', 'author', 'edit', 200, 'returned'],
  ['returned', 'author', 'submit', 200, 'in-review'],
  ['returned', 'curator', 'accept', 409],
  ['accepted', 'author', 'submit', 409],
  ['accepted', 'curator', 'accept', 409],
  ['accepted', 'viewer', 'edit', 403],
  ['accepted', 'contributor2', 'edit', 403],
  ['accepted', 'author', 'edit', 200, 'draft'],
  ['accepted', 'author', 'retire', 403],
  ['accepted', 'admin', 'retire', 200, 'retired'],
  ['declined', 'author', 'edit', 409],
  ['declined', 'author', 'submit', 409],
  ['declined', 'curator', 'accept', 409],
  ['retired', 'author', 'edit', 409],
  ['retired', 'curator', 'retire', 409],
  ['retired', 'curator', 'accept', 409],
  ['pending-edit', 'author', 'submit', 200, 'in-review'],
];

describe('workflow transitions by role and status (table-driven)', () => {
  // Objects, not arrays: jest would take a missing 5th array element for a `done` callback.
  const rows = transitions.map(([state, who, action, expected, after]) => ({ state, who, action, expected, after: after ?? null }));
  it.each(rows)('$state: $who $action → $expected', async ({ state, who, action, expected, after }) => {
    const entry = await entryInState(w, state);
    const response = await act(who, action, entry.id, entry.version);
    expect(response.status).toBe(expected);
    if (expected >= 400) {
      const body = apiErrorBodySchema.parse(response.body);
      expect(body.error.message.length).toBeGreaterThan(10);
      const unchanged = complexDetailSchema.parse((await w.curator.get(`/api/complexes/${entry.id}`)).body);
      expect(unchanged.status).toBe(entry.status);
      expect(unchanged.version).toBe(entry.version);
    } else {
      const detail = action === 'accept' || action === 'decline' || action === 'return'
        ? reviewResponseSchema.parse(response.body).complex
        : complexDetailSchema.parse(response.body);
      expect(detail.status).toBe(after);
      expect(detail.version).toBe(entry.version + 1);
    }
  });

  it('writes an audit event for every status change', async () => {
    const entry = await entryInState(w, 'accepted');
    const events = await t.orm.em.fork().find(AuditEvent, { subjectId: entry.id }, { orderBy: { createdAt: 'asc' } });
    expect(events.map((e) => e.action)).toEqual(['library.entry.created', 'library.entry.submitted', 'library.entry.accepted']);
    expect(events.map((e) => e.details.to)).toEqual(['draft', 'in-review', 'accepted']);
    expect(events.every((e) => e.groupId === w.groupId)).toBe(true);
  });

  it('viewers cannot create entries; contributors can', async () => {
    const refused = await w.viewer.post('/api/complexes', { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)' });
    expect(refused.status).toBe(403);
    const created = await w.contributor2.post('/api/complexes', { groupId: w.groupId, formula: '[Cr(H2O)6]3+', name: 'hexaaquachromium(III)' });
    expect(created.status).toBe(201);
    expect(complexDetailSchema.parse(created.body)).toMatchObject({ status: 'draft', version: 1, metal: 'Cr', oxidationState: 3 });
  });

  it('a decline comment is required; acceptance needs none', async () => {
    const entry = await entryInState(w, 'in-review');
    const response = await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'decline' });
    expect(response.status).toBe(400);
    expect(apiErrorBodySchema.parse(response.body).error.fields?.comment).toMatch(/comment is required/);
  });

  it('submit and retire refuse a body that is not JSON (415) instead of acting as if none was sent', async () => {
    const entry = await entryInState(w, 'draft');
    for (const [who, action] of [['author', 'submit'], ['curator', 'retire']] as const) {
      const response = await w[who]
        .raw('post', `/api/complexes/${entry.id}/${action}`)
        .set('Content-Type', 'text/plain')
        .send('{"note":"sent as text"}');
      expect(response.status).toBe(415);
      expect(apiErrorBodySchema.parse(response.body).error.message).toMatch(/as JSON/);
    }
    const after = await w.author.get(`/api/complexes/${entry.id}`);
    expect(after.body.status).toBe('draft');
    // Without a body at all they still work: the note is optional.
    expect((await w.author.send('post', `/api/complexes/${entry.id}/submit`)).status).toBe(200);
  });
});

describe('four eyes: curators cannot accept what they submitted or wrote', () => {
  it('refuses when another curator (or admin) exists', async () => {
    const entry = await createEntry(w.curator, w.groupId);
    expect((await w.curator.post(`/api/complexes/${entry.id}/submit`)).status).toBe(200);
    const own = await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' });
    expect(own.status).toBe(409);
    expect(apiErrorBodySchema.parse(own.body).error.message).toMatch(/submitted or helped write/);
    const other = await w.admin.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' });
    expect(other.status).toBe(201);
    expect(reviewResponseSchema.parse(other.body).review.selfAccepted).toBe(false);
  });

  it('refuses a curator who edited a contributor’s draft, though the contributor submitted it', async () => {
    const entry = await createEntry(w.author, w.groupId);
    expect((await w.curator.patch(`/api/complexes/${entry.id}`, { version: entry.version, notes: 'ionic strength added by the curator' })).status).toBe(200);
    expect((await w.author.post(`/api/complexes/${entry.id}/submit`)).status).toBe(200);
    const asSeen = complexDetailSchema.parse((await w.curator.get(`/api/complexes/${entry.id}`)).body);
    expect(asSeen.permissions.canReview).toBe(false);
    const own = await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' });
    expect(own.status).toBe(409);
    // Returning it for revision stays open to them; another curator may accept.
    expect(complexDetailSchema.parse((await w.admin.get(`/api/complexes/${entry.id}`)).body).permissions.canReview).toBe(true);
    expect((await w.admin.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' })).status).toBe(201);
  });

  it('allows it for the group’s only curator and records it in the audit event', async () => {
    const solo = await makeUser(t.orm, 'solo.curator@larkspur.example.org');
    const student = await makeUser(t.orm, 'solo.student@larkspur.example.org');
    const group = await makeGroup(t.orm, 'One-curator lab', [
      { userId: solo.id, role: 'curator' },
      { userId: student.id, role: 'contributor' },
    ]);
    const browser = new Browser(t.app);
    await browser.signIn('solo.curator@larkspur.example.org', FIXTURE_PASSWORD);
    const entry = await createEntry(browser, group.id);
    await browser.post(`/api/complexes/${entry.id}/submit`);
    const response = await browser.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' });
    expect(response.status).toBe(201);
    const body = reviewResponseSchema.parse(response.body);
    expect(body.review.selfAccepted).toBe(true);
    expect(body.complex.status).toBe('accepted');
    const event = await t.orm.em.fork().findOneOrFail(AuditEvent, { subjectId: entry.id, action: 'library.entry.accepted' });
    expect(event.details.selfAccepted).toBe(true);
  });
});

describe('optimistic locking', () => {
  it('20 simultaneous PATCHes with the same version: exactly one wins, the rest get 409 with the current version', async () => {
    const entry = await createEntry(w.author, w.groupId);
    const responses = await Promise.all(
      Array.from({ length: 20 }, (_, i) => w.author.patch(`/api/complexes/${entry.id}`, { version: entry.version, notes: `attempt ${i}` })),
    );
    const statuses = responses.map((r) => r.status);
    expect(statuses.filter((s) => s === 200)).toHaveLength(1);
    expect(statuses.filter((s) => s === 409)).toHaveLength(19);
    const winner = complexDetailSchema.parse(responses.find((r) => r.status === 200)!.body);
    expect(winner.version).toBe(entry.version + 1);
    for (const loser of responses.filter((r) => r.status === 409)) {
      const body = staleVersionErrorSchema.parse(loser.body);
      expect(body.error.currentVersion).toBe(entry.version + 1);
      expect(body.error.current.version).toBe(entry.version + 1);
      expect(body.error.current.notes).toBe(winner.notes);
    }
    const revisions = revisionsResponseSchema.parse((await w.author.get(`/api/complexes/${entry.id}/revisions`)).body).revisions;
    expect(revisions.map((r) => r.number)).toEqual([2, 1]);
  });

  it('a PATCH with an old version after a change → 409, never a silent overwrite', async () => {
    const entry = await createEntry(w.author, w.groupId);
    expect((await w.curator.patch(`/api/complexes/${entry.id}`, { version: 1, name: 'curator edit' })).status).toBe(200);
    const stale = await w.author.patch(`/api/complexes/${entry.id}`, { version: 1, name: 'author edit' });
    expect(stale.status).toBe(409);
    expect(staleVersionErrorSchema.parse(stale.body).error.current.name).toBe('curator edit');
  });

  it('PATCH without a version is refused with a clear 400', async () => {
    const entry = await createEntry(w.author, w.groupId);
    const response = await w.author.patch(`/api/complexes/${entry.id}`, { name: 'no version' });
    expect(response.status).toBe(400);
    expect(apiErrorBodySchema.parse(response.body).error.fields?.version).toMatch(/version/);
  });
});

describe('a pending revision keeps the accepted version visible', () => {
  it('viewers see the accepted snapshot until the edit is accepted', async () => {
    const entry = await entryInState(w, 'accepted', { name: 'hexaaquachromium(III) — accepted name' });
    const edit = await w.author.patch(`/api/complexes/${entry.id}`, { version: entry.version, name: 'hexaaquachromium(III) — revised name' });
    expect(edit.status).toBe(200);
    const working = complexDetailSchema.parse(edit.body);
    expect(working).toMatchObject({ status: 'draft', view: 'working', hasPendingRevision: true, name: 'hexaaquachromium(III) — revised name' });
    expect(working.accepted?.name).toBe('hexaaquachromium(III) — accepted name');

    const seen = complexDetailSchema.parse((await w.viewer.get(`/api/complexes/${entry.id}`)).body);
    expect(seen).toMatchObject({ view: 'published', status: 'accepted', name: 'hexaaquachromium(III) — accepted name' });
    const otherStudent = complexDetailSchema.parse((await w.contributor2.get(`/api/complexes/${entry.id}`)).body);
    expect(otherStudent.name).toBe('hexaaquachromium(III) — accepted name');
    const listed = (await w.viewer.get(`/api/complexes?groupId=${w.groupId}&q=revised`)).body as { items: { id: string; name: string }[] };
    expect(listed.items.find((i) => i.id === entry.id)?.name ?? 'accepted name').not.toMatch(/revised/);

    // Viewers see the history up to the accepted version only.
    const viewerRevisions = revisionsResponseSchema.parse((await w.viewer.get(`/api/complexes/${entry.id}/revisions`)).body).revisions;
    expect(Math.max(...viewerRevisions.map((r) => r.number))).toBe(entry.version);

    await w.author.post(`/api/complexes/${entry.id}/submit`);
    expect(complexDetailSchema.parse((await w.viewer.get(`/api/complexes/${entry.id}`)).body).name).toBe('hexaaquachromium(III) — accepted name');
    expect((await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' })).status).toBe(201);
    expect(complexDetailSchema.parse((await w.viewer.get(`/api/complexes/${entry.id}`)).body).name).toBe('hexaaquachromium(III) — revised name');
  });

  it('declining an edit of an accepted entry restores the accepted version', async () => {
    const entry = await entryInState(w, 'accepted', { measurements: [measurementInput()] });
    const added = await w.author.post(`/api/complexes/${entry.id}/measurements`, measurementInput({ kind: 'activation-enthalpy', value: 108.6, unit: 'kJ/mol' }));
    expect(added.status).toBe(201);
    await w.author.post(`/api/complexes/${entry.id}/submit`);
    const declined = reviewResponseSchema.parse((await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'decline', comment: 'value not in the cited paper' })).body);
    expect(declined.complex.status).toBe('accepted');
    expect(declined.complex.measurements.map((m) => m.kind)).toEqual(['water-exchange']);
    expect(declined.complex.hasPendingRevision).toBe(false);
  });

  it('the review queue lists submitted entries, oldest first, for curators only', async () => {
    const first = await entryInState(w, 'in-review');
    const second = await entryInState(w, 'in-review');
    const queue = reviewQueueResponseSchema.parse((await w.curator.get('/api/review-queue')).body);
    const ids = queue.items.map((i) => i.id);
    expect(ids.indexOf(first.id)).toBeLessThan(ids.indexOf(second.id));
    expect(queue.items.every((i) => i.status === 'in-review')).toBe(true);
    expect((await w.author.get('/api/review-queue')).status).toBe(403);
    const outsiderQueue = await w.outsider.get('/api/review-queue');
    expect(reviewQueueResponseSchema.parse(outsiderQueue.body).items.some((i) => i.id === first.id)).toBe(false);
  });
});

describe('revisions and diffs', () => {
  it('diffs any two revisions field by field, with measurements added, removed and changed', async () => {
    const entry = await createEntry(w.author, w.groupId, { measurements: [measurementInput()] });
    const measurementId = entry.measurements[0]!.id;
    let version = entry.version;
    const step = async (promise: Promise<{ status: number; body: unknown }>) => {
      const response = await promise;
      expect(response.status).toBeLessThan(300);
      version = complexDetailSchema.parse(response.body).version;
    };
    await step(w.author.patch(`/api/complexes/${entry.id}`, { version, name: 'hexaaquachromium(III) perchlorate', message: 'Named the salt' }));
    // ΔH‡ = 108.6 kJ/mol for [Cr(H2O)6]3+ (Xu, Krouse & Swaddle 1985, water_exchange.json).
    await step(w.author.post(`/api/complexes/${entry.id}/measurements`, measurementInput({ kind: 'activation-enthalpy', value: 108.6, unit: 'kJ/mol', version })));
    await step(w.author.patch(`/api/complexes/${entry.id}/measurements/${measurementId}`, { value: 2.5e-6, version }));

    const revisions = revisionsResponseSchema.parse((await w.author.get(`/api/complexes/${entry.id}/revisions`)).body).revisions;
    expect(revisions.map((r) => r.number)).toEqual([4, 3, 2, 1]);
    expect(revisions[2]!.message).toBe('Renamed — Named the salt');

    const diff = revisionDiffSchema.parse((await w.author.get(`/api/complexes/${entry.id}/revisions/diff?from=1&to=4`)).body);
    expect(diff.fields).toEqual([{ field: 'name', before: 'hexaaquachromium(III)', after: 'hexaaquachromium(III) perchlorate' }]);
    expect(diff.measurements.added.map((m) => [m.kind, m.value, m.unit])).toEqual([['activation-enthalpy', 108.6, 'kJ/mol']]);
    expect(diff.measurements.removed).toEqual([]);
    expect(diff.measurements.changed).toEqual([{ id: measurementId, kind: 'water-exchange', fields: [{ field: 'value', before: 2.4e-6, after: 2.5e-6 }] }]);
    // In the app's words and notation (units as printed, numbers as a × 10ⁿ: common practice).
    expect(diff.summary).toEqual([
      'Name: “hexaaquachromium(III)” → “hexaaquachromium(III) perchlorate”',
      'Changed water exchange: value 2.4 × 10⁻⁶ s⁻¹ → 2.5 × 10⁻⁶ s⁻¹',
      'Added Activation enthalpy 108.6 kJ mol⁻¹ at 25 °C (298.15 K)',
    ]);

    await step(w.author.delete(`/api/complexes/${entry.id}/measurements/${measurementId}?version=${version}`));
    const removal = revisionDiffSchema.parse((await w.author.get(`/api/complexes/${entry.id}/revisions/diff?from=4&to=5`)).body);
    expect(removal.measurements.removed.map((m) => m.id)).toEqual([measurementId]);
    expect(removal.fields).toEqual([]);

    expect((await w.author.get(`/api/complexes/${entry.id}/revisions/diff?from=1&to=99`)).status).toBe(404);
    expect((await w.author.get(`/api/complexes/${entry.id}/revisions/diff?from=x&to=2`)).status).toBe(400);
  });
});
