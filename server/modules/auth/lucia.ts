import { Lucia, TimeSpan, type Adapter, type DatabaseSession, type DatabaseUser } from 'lucia';
import type { Role } from '@/lib/schemas/groups';
import { FeedCache, type ChangeFeed } from '@/server/db/change-feed';
import type { Orm } from '@/server/db/orm';
import { hashSecret } from './tokens';
import { UserSession } from './user-session.entity';

export const SESSION_COOKIE_NAME = 'sphereline_session';

interface SessionAttributes {
  createdAt: Date;
  userAgent: string | null;
  ip: string | null;
}

/** A group the signed-in person belongs to, read with the session so group routes need no query. */
export interface SessionMembership {
  groupId: string;
  groupName: string;
  role: Role;
}

interface UserAttributes {
  email: string;
  displayName: string;
  memberships: SessionMembership[];
}

interface SessionLookupRow {
  user_id: string;
  expires_at: Date;
  created_at: Date;
  user_agent: string | null;
  ip: string | null;
  email: string;
  display_name: string;
  memberships: SessionMembership[];
}

/**
 * The session, its person and the person's groups in one statement: every signed-in request
 * starts here, so it costs one round trip, not four.
 */
const SESSION_LOOKUP_SQL = `
  select s.user_id, s.expires_at, s.created_at, s.user_agent, s.ip, u.email, u.display_name,
    coalesce((
      select json_agg(json_build_object('groupId', m.group_id, 'groupName', g.name, 'role', m.role)
                      order by g.name, m.group_id)
      from group_membership m join research_group g on g.id = m.group_id
      where m.user_id = s.user_id
    ), '[]'::json) as memberships
  from user_session s join app_user u on u.id = s.user_id
  where s.id = ?`;

/**
 * lucia v3 adapter over MikroORM (PLATFORM trap 11). Session ids are stored as their SHA-256:
 * lucia hands the adapter the secret id, the adapter hashes it on the way in. Only the two
 * public user fields are returned to lucia, never the password hash.
 * Each call forks its own manager: lucia also runs outside requests (sign-out everywhere, expiry
 * clean-up), and a session row must not linger in a request's unit of work.
 */
export class MikroOrmSessionAdapter implements Adapter {
  /** Session lookups by hashed id, dropped whenever a session, person, group or membership changes. */
  private readonly lookups: FeedCache<SessionLookupRow> | null;

  constructor(
    private readonly orm: Orm,
    feed?: ChangeFeed,
  ) {
    this.lookups = feed ? new FeedCache(feed, ['session'], { maxEntries: 10_000, ttlMs: 10_000 }) : null;
  }

  private async lookUp(handle: string): Promise<SessionLookupRow | undefined> {
    const query = async () => {
      const rows: SessionLookupRow[] = await this.orm.em.getConnection().execute(SESSION_LOOKUP_SQL, [handle]);
      return rows[0];
    };
    // Unknown ids are not cached (through() stores only what was found): a new session is found at once.
    return this.lookups ? this.lookups.through(handle, query) : query();
  }

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const row = await this.lookUp(hashSecret(sessionId));
    if (!row) return [null, null];
    const session: DatabaseSession = {
      id: sessionId,
      userId: row.user_id,
      expiresAt: new Date(row.expires_at),
      attributes: { createdAt: new Date(row.created_at), userAgent: row.user_agent, ip: row.ip },
    };
    const attributes: UserAttributes = { email: row.email, displayName: row.display_name, memberships: row.memberships };
    return [session, { id: row.user_id, attributes }];
  }

  /** Returns the hashed ids (the public handles); lucia's own getUserSessions is not used. */
  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const rows = await this.orm.em.fork().find(UserSession, { userId }, { orderBy: { createdAt: 'desc' } });
    return rows.map((row) => ({
      id: row.id,
      userId: row.userId,
      expiresAt: row.expiresAt,
      attributes: { createdAt: row.createdAt, userAgent: row.userAgent ?? null, ip: row.ip ?? null },
    }));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    const em = this.orm.em.fork();
    em.create(UserSession, {
      id: hashSecret(session.id),
      userId: session.userId,
      expiresAt: session.expiresAt,
      createdAt: session.attributes.createdAt,
      userAgent: session.attributes.userAgent,
      ip: session.attributes.ip,
    });
    await em.flush();
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    await this.orm.em.fork().nativeUpdate(UserSession, { id: hashSecret(sessionId) }, { expiresAt });
  }

  async deleteSession(sessionId: string): Promise<void> {
    await this.orm.em.fork().nativeDelete(UserSession, { id: hashSecret(sessionId) });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    await this.orm.em.fork().nativeDelete(UserSession, { userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    await this.orm.em.fork().nativeDelete(UserSession, { expiresAt: { $lte: new Date() } });
  }
}

/** Idle sessions end after 14 days; lucia slides the expiry forward once half of it has passed. */
export const SESSION_LIFETIME = new TimeSpan(14, 'd');

export function createLucia(orm: Orm, feed?: ChangeFeed) {
  return new Lucia(new MikroOrmSessionAdapter(orm, feed), {
    sessionExpiresIn: SESSION_LIFETIME,
    sessionCookie: {
      name: SESSION_COOKIE_NAME,
      expires: true,
      // Secure is decided per request (HTTPS or a trusted proxy saying so): see session-cookie.ts.
      attributes: { sameSite: 'lax', path: '/', secure: false },
    },
    getSessionAttributes: (attributes) => attributes,
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      displayName: attributes.displayName,
      memberships: attributes.memberships,
    }),
  });
}

export type SphereLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: SphereLucia;
    DatabaseSessionAttributes: SessionAttributes;
    DatabaseUserAttributes: UserAttributes;
  }
}
