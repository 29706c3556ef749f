import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { ReviewDecision } from '@/lib/schemas/library';

/** A curator's decision on a submitted revision. */
export const ComplexReview = defineEntity({
  name: 'ComplexReview',
  tableName: 'complex_review',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    complexId: p.uuid(),
    revisionNumber: p.integer(),
    decision: p.string().length(20).$type<ReviewDecision>(),
    comment: p.text(),
    reviewerId: p.uuid().nullable(),
    selfAccepted: p.boolean(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
