import { mailPreferencesSchema } from '@/lib/schemas/exchange';
import { createApp } from '@/server/app';
import type { ReviewMail } from '@/server/modules/notifications/review-mail';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, createEntry, type LibraryWorld } from '../factories/library-world';
import { Browser, outboxFor } from './auth-helpers';

let t: TestApp;
let w: LibraryWorld;
let reviewMail: ReviewMail;
const email = (who: string) => `${who}.mail@larkspur.example.org`;

beforeAll(async () => {
  const base = await createTestApp();
  const app = createApp({ orm: base.orm, onReviewMail: (m) => (reviewMail = m) });
  t = { ...base, app };
  w = await buildLibraryWorld(t, 'mail');
}, 30_000);
afterAll(async () => {
  await t.close();
});

const subjects = async (who: string) => (await outboxFor(t.app, email(who))).map((m) => m.subject);

describe('review e-mails', () => {
  it('a submission reaches the curators and admins (not the submitter, not viewers); the decision reaches the submitter', async () => {
    const entry = await createEntry(w.author, w.groupId, { formula: '[Ni(H2O)6]2+', name: 'hexaaquanickel(II)' });
    expect((await w.author.post(`/api/complexes/${entry.id}/submit`)).status).toBe(200);
    await reviewMail.settle();
    const expected = 'Sphereline: hexaaquanickel(II) ([Ni(H2O)6]2+) waits for review';
    expect(await subjects('curator')).toContain(expected);
    expect(await subjects('admin')).toContain(expected);
    expect(await subjects('author')).not.toContain(expected);
    expect(await subjects('viewer')).toEqual([]);
    expect(await subjects('outsider')).toEqual([]);
    const [toCurator] = await outboxFor(t.app, email('curator'));
    expect(toCurator?.text).toContain('author mail submitted hexaaquanickel(II)');
    expect(toCurator?.links.some((l) => l.endsWith('/review'))).toBe(true);

    expect((await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'return', comment: 'Give the ionic strength.' })).status).toBe(201);
    await reviewMail.settle();
    const [decision] = await outboxFor(t.app, email('author'));
    expect(decision?.subject).toBe('Sphereline: hexaaquanickel(II) ([Ni(H2O)6]2+) was returned for revision');
    expect(decision?.text).toContain('Comment: Give the ionic strength.');
    expect(decision?.links.some((l) => l.endsWith(`/library/${entry.id}`))).toBe(true);
  });

  it('a person who turned a mail off does not get it; the others still do', async () => {
    const off = await w.author.patch('/api/auth/me/preferences', { reviewDecisions: false });
    expect(mailPreferencesSchema.parse(off.body)).toEqual({ reviewSubmissions: true, reviewDecisions: false });
    expect((await w.curator.patch('/api/auth/me/preferences', { reviewSubmissions: false })).status).toBe(200);
    const authorBefore = (await outboxFor(t.app, email('author'))).length;
    const curatorBefore = (await outboxFor(t.app, email('curator'))).length;
    const adminBefore = (await outboxFor(t.app, email('admin'))).length;

    const entry = await createEntry(w.author, w.groupId, { formula: '[Co(NH3)6]3+', name: 'hexaamminecobalt(III)' });
    await w.author.post(`/api/complexes/${entry.id}/submit`);
    await w.curator.post(`/api/complexes/${entry.id}/reviews`, { decision: 'accept' });
    await reviewMail.settle();
    expect((await outboxFor(t.app, email('author'))).length).toBe(authorBefore);
    expect((await outboxFor(t.app, email('curator'))).length).toBe(curatorBefore);
    expect((await outboxFor(t.app, email('admin'))).length).toBe(adminBefore + 1);
    expect((await w.author.get('/api/auth/me/preferences')).body).toEqual({ reviewSubmissions: true, reviewDecisions: false, libraryColumns: null });
  });

  it('preferences: signed out → 401, unknown or wrong fields → 400', async () => {
    const stranger = new Browser(t.app);
    expect((await stranger.get('/api/auth/me/preferences')).status).toBe(401);
    expect((await stranger.patch('/api/auth/me/preferences', { reviewDecisions: true })).status).toBe(401);
    expect((await w.viewer.patch('/api/auth/me/preferences', { reviewDecisions: 'no' })).status).toBe(400);
    expect((await w.viewer.patch('/api/auth/me/preferences', { marketing: true })).status).toBe(400);
    expect((await w.viewer.get('/api/auth/me/preferences')).body).toEqual({ reviewSubmissions: true, reviewDecisions: true, libraryColumns: null });
  });
});
