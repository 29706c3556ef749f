import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

/** A person with an account. The password hash is hidden: it never reaches a serialised DTO. */
export const User = defineEntity({
  name: 'User',
  tableName: 'app_user',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    /** Stored lower-cased (a check constraint keeps it so): one account per address. */
    email: p.string().length(254).unique(),
    displayName: p.string().length(80),
    passwordHash: p.text().hidden(),
    emailVerifiedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
