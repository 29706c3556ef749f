import { defineEntity, p } from '@mikro-orm/core';
import type { LibraryColumn } from '@/lib/schemas/library';

/** A person's library table columns; no row (or null) means every column. */
export const UserLibraryPreference = defineEntity({
  name: 'UserLibraryPreference',
  tableName: 'user_library_preference',
  properties: {
    userId: p.uuid().primary(),
    columns: p.array().$type<LibraryColumn[]>().nullable(),
    updatedAt: p.datetime().onCreate(() => new Date()),
  },
});
