import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';
import type { AttachmentKind, AttachmentState } from '@/lib/schemas/exchange';
import { Complex } from '@/server/modules/library/complex.entity';

/**
 * A file attached to a library entry. The bytes live in the object store under `objectKey`, a key
 * the server makes up ("attachments/<group>/<complex>/<uuid>"); the person's file name is only shown.
 */
export const Attachment = defineEntity({
  name: 'Attachment',
  tableName: 'attachment',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    complex: () => p.manyToOne(Complex),
    groupId: p.uuid(),
    objectKey: p.string().length(200).unique(),
    fileName: p.string().length(255),
    kind: p.string().length(20).$type<AttachmentKind>(),
    contentType: p.string().length(100),
    sizeBytes: p.bigint('number'),
    sha256: p.string().length(64),
    description: p.string().length(500).nullable(),
    uploadedById: p.uuid().nullable(),
    /** Review state (migration 20270137): pending until a decision on the revision that added it. */
    state: p.string().length(10).$type<AttachmentState>().default('pending'),
    addedInVersion: p.integer().nullable(),
    acceptedInVersion: p.integer().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
