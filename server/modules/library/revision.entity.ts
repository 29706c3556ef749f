import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { ComplexSnapshot, ComplexStatus } from '@/lib/schemas/library';
import { Complex } from './complex.entity';

export type RevisionKind = 'create' | 'edit' | 'submit' | 'review' | 'retire' | 'restore';

/** A full snapshot of an entry right after a change; `number` is the entry's version then. */
export const ComplexRevision = defineEntity({
  name: 'ComplexRevision',
  tableName: 'complex_revision',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    complex: () => p.manyToOne(Complex),
    number: p.integer(),
    kind: p.string().length(12).$type<RevisionKind>(),
    status: p.string().length(20).$type<ComplexStatus>(),
    message: p.string().length(500),
    snapshot: p.json<ComplexSnapshot>(),
    authorId: p.uuid().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
  uniques: [{ properties: ['complex', 'number'] }],
});
