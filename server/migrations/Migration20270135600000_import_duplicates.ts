import { Migration } from '@mikro-orm/migrations';

/** Import jobs list the rows whose species is already in the library or earlier in the file. */
export class Migration20270135600000_import_duplicates extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "import_job" add column "duplicates" jsonb not null default '[]';`);
  }

  override async down(): Promise<void> {
    this.addSql('alter table "import_job" drop column if exists "duplicates";');
  }
}
