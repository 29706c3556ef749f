import { defineEntity, p } from '@mikro-orm/core';

/**
 * Attempt counters for throttling (sign-in failures per address and per IP, reset requests …).
 * They live in PostgreSQL so that every server process over the same database shares them;
 * they are updated with one atomic upsert (see throttle.ts), never read-modify-write.
 */
export const AuthThrottle = defineEntity({
  name: 'AuthThrottle',
  tableName: 'auth_throttle',
  properties: {
    key: p.string().length(300).primary(),
    attempts: p.integer(),
    windowStartedAt: p.datetime(),
  },
});
