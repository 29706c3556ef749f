import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { Role } from '@/lib/schemas/groups';

/** One person's role in one group (a person may belong to several groups). */
export const GroupMembership = defineEntity({
  name: 'GroupMembership',
  tableName: 'group_membership',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    groupId: p.uuid(),
    userId: p.uuid().index(),
    role: p.string().length(20).$type<Role>(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
  uniques: [{ properties: ['groupId', 'userId'] }],
});
