import { defineEntity, p } from '@mikro-orm/core';

/** A person's e-mail choices for review events; no row means the defaults (both on). */
export const UserMailPreference = defineEntity({
  name: 'UserMailPreference',
  tableName: 'user_mail_preference',
  properties: {
    userId: p.uuid().primary(),
    reviewSubmissions: p.boolean(),
    reviewDecisions: p.boolean(),
    updatedAt: p.datetime().onCreate(() => new Date()),
  },
});
