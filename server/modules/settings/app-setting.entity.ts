import { defineEntity, p } from '@mikro-orm/core';

/** Small key/value facts about this installation (e.g. when the demo data was seeded). */
export const AppSetting = defineEntity({
  name: 'AppSetting',
  tableName: 'app_setting',
  properties: {
    key: p.string().primary(),
    value: p.json<Record<string, unknown>>(),
    updatedAt: p.datetime().onCreate(() => new Date()).onUpdate(() => new Date()),
  },
});
