import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

/** A lab (or any team) that keeps a library together. */
export const ResearchGroup = defineEntity({
  name: 'ResearchGroup',
  tableName: 'research_group',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    name: p.string().length(120),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
