import type { EntityManager } from '@mikro-orm/core';
import { AuditEvent } from './audit-event.entity';

export interface AuditInput {
  actorId: string | null;
  groupId?: string | null;
  /** Dotted verb, e.g. "member.role-changed", "group.created", "entry.accepted". */
  action: string;
  subjectType: string;
  subjectId?: string | null;
  details?: Record<string, unknown>;
}

/** Queues an audit event on the entity manager; it is written with the caller's flush (same transaction). */
export function recordAudit(em: EntityManager, input: AuditInput): void {
  em.create(AuditEvent, {
    actorId: input.actorId,
    groupId: input.groupId ?? null,
    action: input.action,
    subjectType: input.subjectType,
    subjectId: input.subjectId ?? null,
    details: input.details ?? {},
  });
}
