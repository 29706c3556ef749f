import { Migration } from '@mikro-orm/migrations';

/**
 * A finished import names the entries it created (id, file row, formula, name, status), so the
 * import screen can list them with links. Jobs from before this keep an empty list.
 */
export class Migration20270142000000_import_created extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "import_job" add column "created" jsonb not null default '[]';`);
  }

  override async down(): Promise<void> {
    this.addSql('alter table "import_job" drop column if exists "created";');
  }
}
