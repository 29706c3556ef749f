import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

/**
 * A message the development mail sink received (raw RFC 5322 text). Kept in PostgreSQL so that
 * several server processes over one database share one outbox, and each test database its own.
 */
export const DevOutboxMessage = defineEntity({
  name: 'DevOutboxMessage',
  tableName: 'dev_outbox_message',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    receivedAt: p.datetime().onCreate(() => new Date()),
    mailFrom: p.string().length(320).nullable(),
    recipients: p.json<string[]>(),
    raw: p.text(),
  },
});
