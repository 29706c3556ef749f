import { defineEntity, p } from '@mikro-orm/core';

/**
 * A lucia session. The primary key is the SHA-256 (hex) of the secret session id carried in the
 * cookie, so a copy of this table cannot be replayed as cookies; the hash doubles as the public
 * handle in the session list.
 */
export const UserSession = defineEntity({
  name: 'UserSession',
  tableName: 'user_session',
  properties: {
    id: p.string().length(64).primary(),
    userId: p.uuid().index(),
    expiresAt: p.datetime(),
    createdAt: p.datetime(),
    userAgent: p.string().length(300).nullable(),
    ip: p.string().length(64).nullable(),
  },
});
