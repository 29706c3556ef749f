import { randomUUID } from 'node:crypto';
import { Cascade, defineEntity, p } from '@mikro-orm/core';
import type { ComplexSnapshot, ComplexStatus } from '@/lib/schemas/library';
import { Measurement } from './measurement.entity';
import { ComplexRevision } from './revision.entity';

/**
 * A library entry: the working copy (what authors and curators edit) plus, once accepted, the
 * accepted snapshot that viewers keep seeing while a newer revision is drafted or reviewed.
 * The derived columns (metal … ligand_set_key) come from the engine and are stored for search.
 * `version` is MikroORM's optimistic lock: every change is based on a version and adds one (complex.service.ts).
 */
export const Complex = defineEntity({
  name: 'Complex',
  tableName: 'complex',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    groupId: p.uuid(),
    formula: p.string().length(300),
    name: p.string().length(200),
    status: p.string().length(20).$type<ComplexStatus>(),
    notes: p.text().nullable(),
    metal: p.string().length(3),
    oxidationState: p.integer(),
    dElectrons: p.integer(),
    spinState: p.string().length(4).$type<'high' | 'low'>().nullable(),
    verdict: p.string().length(12).$type<'labile' | 'intermediate' | 'inert'>(),
    ligandIds: p.array(),
    ligandSetKey: p.string().length(400),
    searchText: p.text(),
    measurementKinds: p.array(),
    hasCitation: p.boolean(),
    /** Optimistic lock (MikroORM's version property): every flush that changes the row adds one. */
    version: p.integer().version(),
    createdById: p.uuid().nullable(),
    submittedById: p.uuid().nullable(),
    submittedAt: p.datetime().nullable(),
    acceptedSnapshot: p.json<ComplexSnapshot>().nullable(),
    acceptedVersion: p.integer().nullable(),
    acceptedAt: p.datetime().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
    updatedAt: p.datetime().onCreate(() => new Date()),
    /** The entry's measurements: saved and removed with it (the aggregate's rows). */
    measurements: () => p.oneToMany(Measurement).mappedBy('complex').cascade(Cascade.PERSIST).orphanRemoval(),
    /** The history, append-only: written by every change, never through this collection. */
    revisions: () => p.oneToMany(ComplexRevision).mappedBy('complex'),
  },
});
