import type { EntityManager } from '@mikro-orm/postgresql';
import { libraryColumnKeys, type LibraryColumn, type LibraryPreferences } from '@/lib/schemas/library';
import { UserLibraryPreference } from './library-preference.entity';

/** The person's library preferences (null columns: every column). */
export async function getLibraryPreferences(em: EntityManager, userId: string): Promise<LibraryPreferences> {
  const row = await em.findOne(UserLibraryPreference, { userId }, { refresh: true });
  return { libraryColumns: row?.columns ? inTableOrder(row.columns) : null };
}

/** Stores the shown columns in the table's order (null: every column). */
export async function setLibraryColumns(em: EntityManager, userId: string, columns: readonly LibraryColumn[] | null): Promise<LibraryPreferences> {
  const stored = columns ? inTableOrder(columns) : null;
  await em.execute(
    `insert into user_library_preference (user_id, columns, updated_at) values (?, ?::text[], now())
     on conflict (user_id) do update set columns = excluded.columns, updated_at = now()`,
    [userId, stored === null ? null : `{${stored.join(',')}}`],
  );
  return { libraryColumns: stored };
}

/** Known columns only, in the table's order; the formula always shows. */
function inTableOrder(columns: readonly string[]): LibraryColumn[] {
  return libraryColumnKeys.filter((column) => column === 'formula' || columns.includes(column));
}
