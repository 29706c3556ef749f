import { Migration } from '@mikro-orm/migrations';

/**
 * An import may leave a name cell empty when the formula gives a name: the job records which
 * entries took the suggested name, so the dry run can say so before anything is written.
 */
export class Migration20270142100000_import_suggested_names extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "import_job" add column "suggested_names" jsonb not null default '[]';`);
  }

  override async down(): Promise<void> {
    this.addSql('alter table "import_job" drop column if exists "suggested_names";');
  }
}
