import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

export type EmailTokenPurpose = 'verify-email' | 'reset-password';

/** A single-use, expiring token sent by e-mail; only its SHA-256 is stored. */
export const EmailToken = defineEntity({
  name: 'EmailToken',
  tableName: 'email_token',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    userId: p.uuid().index(),
    purpose: p.string().length(20).$type<EmailTokenPurpose>(),
    tokenHash: p.string().length(64).unique(),
    expiresAt: p.datetime(),
    usedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
