import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

/**
 * Who did what to what, and when. Generic on purpose: membership and role changes write it now;
 * review decisions and status changes of library entries write it too.
 */
export const AuditEvent = defineEntity({
  name: 'AuditEvent',
  tableName: 'audit_event',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    actorId: p.uuid().nullable(),
    groupId: p.uuid().nullable(),
    action: p.string().length(80),
    subjectType: p.string().length(40),
    subjectId: p.string().length(80).nullable(),
    details: p.json<Record<string, unknown>>(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
