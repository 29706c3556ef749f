import { Migration } from '@mikro-orm/migrations';

/**
 * Safe retries: a write sent with an Idempotency-Key is recorded in the same transaction as the
 * write itself, so a retry after a lost reply (or a 503 whose write had in fact committed) finds
 * it and gets the first result instead of writing again. Records are kept for a day.
 */
export class Migration20270135500000_idempotency extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "idempotency_record" (
      "user_id" uuid not null references "app_user" ("id") on delete cascade,
      "key" varchar(200) not null,
      "request_hash" varchar(64) not null,
      "status" int not null,
      "resource_id" uuid null,
      "body" jsonb null,
      "created_at" timestamptz not null default now(),
      constraint "idempotency_record_pkey" primary key ("user_id", "key")
    );`);
    this.addSql('create index "idempotency_record_created_at_index" on "idempotency_record" ("created_at");');
  }

  override async down(): Promise<void> {
    this.addSql('drop table if exists "idempotency_record";');
  }
}
