import { randomUUID } from 'node:crypto';
import { defineEntity, p } from '@mikro-orm/core';

/** A curator's addition to the group's ligand catalogue (the reference ligands live in data/ligands.json). */
export const LibraryLigand = defineEntity({
  name: 'LibraryLigand',
  tableName: 'library_ligand',
  properties: {
    id: p.uuid().primary().onCreate(() => randomUUID()),
    groupId: p.uuid(),
    abbreviation: p.string().length(40),
    name: p.string().length(120),
    charge: p.integer(),
    denticity: p.integer(),
    donorAtoms: p.json<string[]>(),
    source: p.string().length(500),
    createdById: p.uuid().nullable(),
    createdAt: p.datetime().onCreate(() => new Date()),
  },
});
