import { Migration } from '@mikro-orm/migrations';

/**
 * Per-person library preferences: the columns the library table shows on a wide screen, kept on
 * the server so the choice follows the person to any browser. No row (or `columns` null) means
 * every column.
 */
export class Migration20270141000000_library_columns extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "user_library_preference" (
      "user_id" uuid not null primary key references "app_user" ("id") on delete cascade,
      "columns" text[] null,
      "updated_at" timestamptz not null default now()
    );`);
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "user_library_preference";');
  }
}
