import { Migration } from '@mikro-orm/migrations';

/** The foundation: trigram search support for the library, and installation facts. */
export class Migration20261202000000_foundation extends Migration {
  override async up(): Promise<void> {
    this.addSql('create extension if not exists pg_trgm;');
    this.addSql(
      'create table "app_setting" ("key" varchar(255) not null, "value" jsonb not null, ' +
        '"updated_at" timestamptz not null, constraint "app_setting_pkey" primary key ("key"));',
    );
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "app_setting" cascade;');
  }
}
