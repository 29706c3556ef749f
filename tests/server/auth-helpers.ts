import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import request from 'supertest';
import { outboxResponseSchema, type OutboxMessage } from '@/lib/schemas/auth';
import type { Role } from '@/lib/schemas/groups';
import type { Orm } from '@/server/db/orm';
import { createUser } from '@/server/modules/auth/auth.service';
import { hashPassword } from '@/server/modules/auth/password';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';

/** Every test request is addressed to this host; state-changing ones carry its origin (CSRF check). */
export const TEST_HOST = 'sphereline.test';
export const TEST_ORIGIN = `http://${TEST_HOST}`;
export const SESSION_COOKIE = 'sphereline_session';

type Method = 'get' | 'post' | 'patch' | 'put' | 'delete';

/** The session cookie's value from a response, '' when it was cleared, undefined when not set. */
export function sessionCookieFrom(response: request.Response): string | undefined {
  const raw = response.headers['set-cookie'] as unknown as string[] | undefined;
  const line = raw?.find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  return line === undefined ? undefined : (line.split(';')[0] ?? '').slice(SESSION_COOKIE.length + 1);
}

/** The Set-Cookie line of the session cookie, plain or `__Host-` prefixed (over HTTPS). */
export function setCookieLine(response: request.Response): string | undefined {
  const raw = response.headers['set-cookie'] as unknown as string[] | undefined;
  return raw?.find((c) => c.startsWith(`${SESSION_COOKIE}=`) || c.startsWith(`__Host-${SESSION_COOKIE}=`));
}

/** A browser-like client: same-origin requests, remembers the session cookie. */
export class Browser {
  cookie: string | null = null;
  constructor(readonly app: Express) {}

  /** The request with this browser's host, origin and cookie, for bodies `send` does not cover. */
  raw(method: Method, path: string) {
    let req = request(this.app)[method](path).set('Host', TEST_HOST);
    if (method !== 'get') req = req.set('Origin', TEST_ORIGIN);
    if (this.cookie) req = req.set('Cookie', `${SESSION_COOKIE}=${this.cookie}`);
    return req;
  }

  send(method: Method, path: string, body?: unknown) {
    let req = this.raw(method, path);
    if (body !== undefined) req = req.send(body as object);
    return req.then((response) => {
      const value = sessionCookieFrom(response);
      if (value !== undefined) this.cookie = value || null;
      return response;
    });
  }

  get = (path: string) => this.send('get', path);
  post = (path: string, body?: unknown) => this.send('post', path, body ?? {});
  patch = (path: string, body?: unknown) => this.send('patch', path, body ?? {});
  put = (path: string, body?: unknown) => this.send('put', path, body ?? {});
  delete = (path: string) => this.send('delete', path);

  async signIn(email: string, password: string) {
    const response = await this.post('/api/auth/sign-in', { email, password });
    if (response.status !== 200) throw new Error(`sign-in of ${email} failed: ${response.status} ${JSON.stringify(response.body)}`);
    return response;
  }
}

export async function outboxFor(app: Express, to: string): Promise<OutboxMessage[]> {
  const response = await request(app).get(`/api/dev/outbox?to=${encodeURIComponent(to)}`);
  if (response.status !== 200) throw new Error(`outbox: ${response.status}`);
  return outboxResponseSchema.parse(response.body).messages;
}

/** The token of the newest link to `route` (e.g. "/verify") in mail to `to`. */
export async function latestLinkToken(app: Express, to: string, route: string): Promise<string> {
  for (const message of await outboxFor(app, to)) {
    for (const link of message.links) {
      const url = new URL(link);
      const token = url.searchParams.get('token');
      if (url.pathname === route && token) return token;
    }
  }
  throw new Error(`no ${route} link in mail to ${to}`);
}

let sharedHash: { password: string; hash: Promise<string> } | null = null;
export const FIXTURE_PASSWORD = 'violet-ligand-field-42';

/** A user straight into the database (one Argon2 hash per test file, shared). */
export async function makeUser(orm: Orm, email: string, options: { displayName?: string; verified?: boolean } = {}) {
  sharedHash ??= { password: FIXTURE_PASSWORD, hash: hashPassword(FIXTURE_PASSWORD) };
  return createUser(orm.em.fork(), {
    email,
    displayName: options.displayName ?? email.split('@')[0] ?? email,
    passwordHash: await sharedHash.hash,
    verified: options.verified ?? true,
  });
}

export async function makeGroup(orm: Orm, name: string, members: { userId: string; role: Role }[]) {
  const em = orm.em.fork();
  const group = em.create(ResearchGroup, { id: randomUUID(), name });
  for (const member of members) em.create(GroupMembership, { groupId: group.id, userId: member.userId, role: member.role });
  await em.flush();
  return group;
}
