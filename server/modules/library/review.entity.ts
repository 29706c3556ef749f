import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { ReviewDecision } from '@/lib/schemas/library';
import { Complex } from './complex.entity';

/**
 * A curator's decision on a submitted revision. The revision is the entry's revision with
 * `revisionNumber` (unique per entry with the entry's id), written in the same transaction.
 */
export const ComplexReview = defineEntity({
  name: 'ComplexReview',
  tableName: 'complex_review',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    complex: () => p.manyToOne(Complex),
    revisionNumber: p.integer(),
    decision: p.string().length(20).$type<ReviewDecision>(),
    comment: p.text(),
    reviewerId: p.uuid().nullable(),
    selfAccepted: p.boolean(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
