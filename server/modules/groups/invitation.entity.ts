import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { Role } from '@/lib/schemas/groups';

/** An e-mailed invitation to join a group with a role: single-use, expiring, token stored hashed. */
export const GroupInvitation = defineEntity({
  name: 'GroupInvitation',
  tableName: 'group_invitation',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    groupId: p.uuid().index(),
    email: p.string().length(254),
    role: p.string().length(20).$type<Role>(),
    tokenHash: p.string().length(64).unique(),
    invitedById: p.uuid().nullable(),
    expiresAt: p.datetime(),
    acceptedAt: p.datetime().nullable(),
    acceptedById: p.uuid().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
