import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { ReviewDecision } from '@/lib/schemas/library';
import { Complex } from './complex.entity';
import { ComplexRevision } from './revision.entity';

/**
 * A curator's decision on a submitted revision: the revision it recorded (`revision`, whose number
 * is `revisionNumber`), written in the same transaction.
 */
export const ComplexReview = defineEntity({
  name: 'ComplexReview',
  tableName: 'complex_review',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    complex: () => p.manyToOne(Complex),
    revisionNumber: p.integer(),
    /** Null only for a review whose revision could not be found when the column was added. */
    revision: () => p.manyToOne(ComplexRevision).nullable(),
    decision: p.string().length(20).$type<ReviewDecision>(),
    comment: p.text(),
    reviewerId: p.uuid().nullable(),
    selfAccepted: p.boolean(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
