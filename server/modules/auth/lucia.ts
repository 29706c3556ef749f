import { Lucia, TimeSpan, type Adapter, type DatabaseSession, type DatabaseUser } from 'lucia';
import type { Orm } from '@/server/db/orm';
import { hashSecret } from './tokens';
import { User } from './user.entity';
import { UserSession } from './user-session.entity';

export const SESSION_COOKIE_NAME = 'sphereline_session';

interface SessionAttributes {
  createdAt: Date;
  userAgent: string | null;
  ip: string | null;
}

interface UserAttributes {
  email: string;
  displayName: string;
}

/**
 * lucia v3 adapter over MikroORM (PLATFORM trap 11). Session ids are stored as their SHA-256:
 * lucia hands the adapter the secret id, the adapter hashes it on the way in. Only the two
 * public user fields are returned to lucia, never the password hash.
 */
export class MikroOrmSessionAdapter implements Adapter {
  constructor(private readonly orm: Orm) {}

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const em = this.orm.em.fork();
    const row = await em.findOne(UserSession, { id: hashSecret(sessionId) });
    if (!row) return [null, null];
    const user = await em.findOne(User, { id: row.userId });
    const session: DatabaseSession = {
      id: sessionId,
      userId: row.userId,
      expiresAt: row.expiresAt,
      attributes: { createdAt: row.createdAt, userAgent: row.userAgent ?? null, ip: row.ip ?? null },
    };
    return [session, user ? { id: user.id, attributes: { email: user.email, displayName: user.displayName } } : null];
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

export function createLucia(orm: Orm) {
  return new Lucia(new MikroOrmSessionAdapter(orm), {
    sessionExpiresIn: SESSION_LIFETIME,
    sessionCookie: {
      name: SESSION_COOKIE_NAME,
      expires: true,
      // Secure is decided per request (HTTPS or a trusted proxy saying so): see session-cookie.ts.
      attributes: { sameSite: 'lax', path: '/', secure: false },
    },
    getSessionAttributes: (attributes) => attributes,
    getUserAttributes: (attributes) => ({ email: attributes.email, displayName: attributes.displayName }),
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
