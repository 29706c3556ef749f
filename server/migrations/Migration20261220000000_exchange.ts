import { Migration } from '@mikro-orm/migrations';

/**
 * Library exchange: CSV import jobs (progress shared through PostgreSQL, so any server
 * process can answer the poll), attachments (metadata here, bytes in the object store) and
 * per-person e-mail preferences for review events.
 */
export class Migration20261220000000_exchange extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "import_job" (
      "id" uuid not null primary key,
      "group_id" uuid not null references "research_group" ("id") on delete cascade,
      "created_by_id" uuid null references "app_user" ("id") on delete set null,
      "file_name" varchar(200) null,
      "dry_run" boolean not null,
      "state" varchar(20) not null check ("state" in ('queued', 'validating', 'importing', 'succeeded', 'failed')),
      "processed" int not null default 0,
      "total" int not null default 0,
      "columns" jsonb not null default '[]',
      "error_count" int not null default 0,
      "errors" jsonb not null default '[]',
      "entry_count" int not null default 0,
      "measurement_count" int not null default 0,
      "complex_ids" jsonb not null default '[]',
      "message" text null,
      "heartbeat_at" timestamptz not null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      "finished_at" timestamptz null
    );`);
    this.addSql('create index "import_job_running_index" on "import_job" ("state", "heartbeat_at");');

    this.addSql(`create table "attachment" (
      "id" uuid not null primary key,
      "complex_id" uuid not null references "complex" ("id") on delete cascade,
      "group_id" uuid not null references "research_group" ("id") on delete cascade,
      "object_key" varchar(200) not null,
      "file_name" varchar(255) not null,
      "kind" varchar(20) not null,
      "content_type" varchar(100) not null,
      "size_bytes" bigint not null,
      "sha256" char(64) not null,
      "description" varchar(500) null,
      "uploaded_by_id" uuid null references "app_user" ("id") on delete set null,
      "created_at" timestamptz not null,
      constraint "attachment_object_key_unique" unique ("object_key")
    );`);
    this.addSql('create index "attachment_complex_id_index" on "attachment" ("complex_id", "created_at");');

    this.addSql(`create table "user_mail_preference" (
      "user_id" uuid not null primary key references "app_user" ("id") on delete cascade,
      "review_submissions" boolean not null default true,
      "review_decisions" boolean not null default true,
      "updated_at" timestamptz not null
    );`);
  }

  override async down(): Promise<void> {
    for (const table of ['user_mail_preference', 'attachment', 'import_job']) this.addSql(`drop table if exists "${table}" cascade;`);
  }
}
