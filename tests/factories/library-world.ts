import type { Role } from '@/lib/schemas/groups';
import { complexDetailSchema, type ComplexDetail, type CreateComplexInput } from '@/lib/schemas/library';
import type { TestApp } from '../setup/test-app';
import { Browser, FIXTURE_PASSWORD, makeGroup, makeUser } from '../server/auth-helpers';
import { complexInput } from './library';

/**
 * A small world for library tests: one lab with a person of every role (and a second curator), a
 * second group whose admin must never see the first group's entries, all signed in.
 */
export interface LibraryWorld {
  groupId: string;
  otherGroupId: string;
  admin: Browser;
  curator: Browser;
  author: Browser;
  contributor2: Browser;
  viewer: Browser;
  outsider: Browser;
  ids: Record<'admin' | 'curator' | 'author' | 'contributor2' | 'viewer' | 'outsider', string>;
}

export async function buildLibraryWorld(t: TestApp, tag: string): Promise<LibraryWorld> {
  const people = ['admin', 'curator', 'author', 'contributor2', 'viewer', 'outsider'] as const;
  const users = {} as Record<(typeof people)[number], { id: string; email: string }>;
  for (const who of people) {
    const email = `${who}.${tag}@larkspur.example.org`;
    const user = await makeUser(t.orm, email, { displayName: `${who} ${tag}` });
    users[who] = { id: user.id, email };
  }
  const roles: [keyof typeof users, Role][] = [
    ['admin', 'admin'],
    ['curator', 'curator'],
    ['author', 'contributor'],
    ['contributor2', 'contributor'],
    ['viewer', 'viewer'],
  ];
  const group = await makeGroup(t.orm, `Larkspur Coordination Lab ${tag}`, roles.map(([who, role]) => ({ userId: users[who].id, role })));
  const other = await makeGroup(t.orm, `Fenwick Photoredox Group ${tag}`, [{ userId: users.outsider.id, role: 'admin' }]);
  const browsers = {} as Record<(typeof people)[number], Browser>;
  for (const who of people) {
    browsers[who] = new Browser(t.app);
    await browsers[who].signIn(users[who].email, FIXTURE_PASSWORD);
  }
  return {
    groupId: group.id,
    otherGroupId: other.id,
    ...browsers,
    ids: Object.fromEntries(people.map((who) => [who, users[who].id])) as LibraryWorld['ids'],
  };
}

export async function createEntry(browser: Browser, groupId: string, overrides: Partial<Record<keyof CreateComplexInput, unknown>> = {}): Promise<ComplexDetail> {
  const response = await browser.post('/api/complexes', { ...complexInput(overrides), groupId });
  if (response.status !== 201) throw new Error(`create failed: ${response.status} ${JSON.stringify(response.body)}`);
  return complexDetailSchema.parse(response.body);
}

export type EntryState = 'draft' | 'in-review' | 'accepted' | 'returned' | 'declined' | 'retired' | 'pending-edit';

/** An entry of `author` brought into a state through the API (the curator reviews). */
export async function entryInState(world: LibraryWorld, state: EntryState, overrides: Partial<Record<keyof CreateComplexInput, unknown>> = {}): Promise<ComplexDetail> {
  const entry = await createEntry(world.author, world.groupId, overrides);
  const expectOk = async (promise: Promise<{ status: number; body: unknown }>) => {
    const response = await promise;
    if (response.status >= 300) throw new Error(`setup step failed: ${response.status} ${JSON.stringify(response.body)}`);
    return response;
  };
  if (state === 'draft') return entry;
  await expectOk(world.author.post(`/api/complexes/${entry.id}/submit`));
  const review = (decision: string, comment = 'checked against the cited paper') =>
    expectOk(world.curator.post(`/api/complexes/${entry.id}/reviews`, { decision, comment }));
  if (state === 'accepted' || state === 'pending-edit' || state === 'retired') await review('accept');
  if (state === 'returned') await review('return', 'give the ionic strength');
  if (state === 'declined') await review('decline', 'duplicate entry');
  if (state === 'retired') await expectOk(world.curator.post(`/api/complexes/${entry.id}/retire`));
  if (state === 'pending-edit') {
    const current = complexDetailSchema.parse((await world.curator.get(`/api/complexes/${entry.id}`)).body);
    await expectOk(world.author.patch(`/api/complexes/${entry.id}`, { version: current.version, notes: 'a pending edit' }));
  }
  return complexDetailSchema.parse((await world.curator.get(`/api/complexes/${entry.id}`)).body);
}
