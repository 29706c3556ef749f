import { apiErrorBodySchema } from '@/lib/schemas/errors';
import { Browser, FIXTURE_PASSWORD } from './auth-helpers';
import { createTestApp, type TestApp } from '../setup/test-app';
import { buildLibraryWorld, type LibraryWorld } from '../factories/library-world';

/** The library table's columns are kept per person on the server (GET/PATCH /api/auth/me/preferences). */
let t: TestApp;
let w: LibraryWorld;
beforeAll(async () => {
  t = await createTestApp();
  w = await buildLibraryWorld(t, 'columns');
});
afterAll(async () => {
  await t.close();
});

describe('libraryColumns', () => {
  it('is null (every column) until chosen, then the choice in table order, for that person only', async () => {
    expect((await w.viewer.get('/api/auth/me/preferences')).body.libraryColumns).toBeNull();
    const saved = await w.viewer.patch('/api/auth/me/preferences', { libraryColumns: ['verdict', 'formula', 'name'] });
    expect(saved.status).toBe(200);
    // Table order: formula, name, …, verdict.
    expect(saved.body.libraryColumns).toEqual(['formula', 'name', 'verdict']);
    expect((await w.viewer.get('/api/auth/me/preferences')).body.libraryColumns).toEqual(['formula', 'name', 'verdict']);
    // Another person keeps every column; the e-mail choices are untouched.
    expect((await w.curator.get('/api/auth/me/preferences')).body.libraryColumns).toBeNull();
    expect((await w.viewer.get('/api/auth/me/preferences')).body).toMatchObject({ reviewSubmissions: true, reviewDecisions: true });
  });

  it('follows the person to a new session (another browser)', async () => {
    await w.author.patch('/api/auth/me/preferences', { libraryColumns: ['formula', 'rate', 'updated'] });
    const elsewhere = new Browser(t.app);
    await elsewhere.signIn('author.columns@larkspur.example.org', FIXTURE_PASSWORD);
    expect((await elsewhere.get('/api/auth/me/preferences')).body.libraryColumns).toEqual(['formula', 'rate', 'updated']);
  });

  it('always keeps the formula, and null brings every column back', async () => {
    expect((await w.admin.patch('/api/auth/me/preferences', { libraryColumns: ['status'] })).body.libraryColumns).toEqual(['formula', 'status']);
    expect((await w.admin.patch('/api/auth/me/preferences', { libraryColumns: null })).body.libraryColumns).toBeNull();
    // A mail change leaves the columns alone, and a column change the mail choices.
    await w.contributor2.patch('/api/auth/me/preferences', { libraryColumns: ['formula', 'name'] });
    const mail = await w.contributor2.patch('/api/auth/me/preferences', { reviewDecisions: false });
    expect(mail.body).toEqual({ reviewSubmissions: true, reviewDecisions: false, libraryColumns: ['formula', 'name'] });
  });

  it('refuses unknown columns, repeats and wrong types with a 400 naming libraryColumns', async () => {
    for (const libraryColumns of [['colour'], ['name', 'name'], 'name', [1]]) {
      const response = await w.viewer.patch('/api/auth/me/preferences', { libraryColumns });
      expect(response.status).toBe(400);
      expect(Object.keys(apiErrorBodySchema.parse(response.body).error.fields ?? {}).join(' ')).toMatch(/libraryColumns/);
    }
    expect((await w.viewer.get('/api/auth/me/preferences')).body.libraryColumns).toEqual(['formula', 'name', 'verdict']);
  });
});
