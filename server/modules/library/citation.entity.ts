import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

/** A published source. Belongs to a group; unique per group by lower(DOI) (partial unique index). */
export const Citation = defineEntity({
  name: 'Citation',
  tableName: 'citation',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    groupId: p.uuid(),
    doi: p.string().length(200).nullable(),
    authors: p.string().length(1000),
    title: p.string().length(500).nullable(),
    journal: p.string().length(200),
    year: p.integer().nullable(),
    volume: p.string().length(40).nullable(),
    pages: p.string().length(40).nullable(),
    /** article | book | chapter | web-page (migration 20270125). */
    kind: p.string().length(16).default('article'),
    publisher: p.string().length(200).nullable(),
    place: p.string().length(120).nullable(),
    url: p.string().length(500).nullable(),
    createdById: p.uuid().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
