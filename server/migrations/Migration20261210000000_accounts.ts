import { Migration } from '@mikro-orm/migrations';

/**
 * Accounts, sessions, groups and roles: users with Argon2id hashes, lucia sessions
 * (stored by the SHA-256 of their id), single-use e-mail tokens (stored hashed), sign-in
 * throttling counters shared by every server process, groups with memberships and invitations,
 * a generic audit trail, and the development mail sink's outbox.
 * Foreign keys are checked at commit (deferred): the entities hold plain id columns, so MikroORM
 * cannot order the inserts of one flush by their references.
 */
export class Migration20261210000000_accounts extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create table "app_user" (
      "id" uuid not null primary key,
      "email" varchar(254) not null,
      "display_name" varchar(80) not null,
      "password_hash" text not null,
      "email_verified_at" timestamptz null,
      "created_at" timestamptz not null,
      "updated_at" timestamptz not null,
      constraint "app_user_email_unique" unique ("email"),
      constraint "app_user_email_lower" check ("email" = lower("email"))
    );`);

    this.addSql(`create table "user_session" (
      "id" varchar(64) not null primary key,
      "user_id" uuid not null references "app_user" ("id") on delete cascade deferrable initially deferred,
      "expires_at" timestamptz not null,
      "created_at" timestamptz not null,
      "user_agent" varchar(300) null,
      "ip" varchar(64) null
    );`);
    this.addSql('create index "user_session_user_id_index" on "user_session" ("user_id");');

    this.addSql(`create table "email_token" (
      "id" uuid not null primary key,
      "user_id" uuid not null references "app_user" ("id") on delete cascade deferrable initially deferred,
      "purpose" varchar(20) not null check ("purpose" in ('verify-email', 'reset-password')),
      "token_hash" varchar(64) not null,
      "expires_at" timestamptz not null,
      "used_at" timestamptz null,
      "created_at" timestamptz not null,
      constraint "email_token_token_hash_unique" unique ("token_hash")
    );`);
    this.addSql('create index "email_token_user_id_index" on "email_token" ("user_id");');

    this.addSql(`create table "auth_throttle" (
      "key" varchar(300) not null primary key,
      "attempts" int not null,
      "window_started_at" timestamptz not null
    );`);

    this.addSql(`create table "research_group" (
      "id" uuid not null primary key,
      "name" varchar(120) not null,
      "created_at" timestamptz not null
    );`);

    this.addSql(`create table "group_membership" (
      "id" uuid not null primary key,
      "group_id" uuid not null references "research_group" ("id") on delete cascade deferrable initially deferred,
      "user_id" uuid not null references "app_user" ("id") on delete cascade deferrable initially deferred,
      "role" varchar(20) not null check ("role" in ('viewer', 'contributor', 'curator', 'admin')),
      "created_at" timestamptz not null,
      constraint "group_membership_group_user_unique" unique ("group_id", "user_id")
    );`);
    this.addSql('create index "group_membership_user_id_index" on "group_membership" ("user_id");');

    this.addSql(`create table "group_invitation" (
      "id" uuid not null primary key,
      "group_id" uuid not null references "research_group" ("id") on delete cascade deferrable initially deferred,
      "email" varchar(254) not null,
      "role" varchar(20) not null check ("role" in ('viewer', 'contributor', 'curator', 'admin')),
      "token_hash" varchar(64) not null,
      "invited_by_id" uuid null references "app_user" ("id") on delete set null deferrable initially deferred,
      "expires_at" timestamptz not null,
      "accepted_at" timestamptz null,
      "accepted_by_id" uuid null references "app_user" ("id") on delete set null deferrable initially deferred,
      "created_at" timestamptz not null,
      constraint "group_invitation_token_hash_unique" unique ("token_hash")
    );`);
    this.addSql('create index "group_invitation_group_id_index" on "group_invitation" ("group_id");');

    this.addSql(`create table "audit_event" (
      "id" uuid not null primary key,
      "actor_id" uuid null references "app_user" ("id") on delete set null deferrable initially deferred,
      "group_id" uuid null references "research_group" ("id") on delete set null deferrable initially deferred,
      "action" varchar(80) not null,
      "subject_type" varchar(40) not null,
      "subject_id" varchar(80) null,
      "details" jsonb not null default '{}',
      "created_at" timestamptz not null
    );`);
    this.addSql('create index "audit_event_group_id_created_at_index" on "audit_event" ("group_id", "created_at");');

    this.addSql(`create table "dev_outbox_message" (
      "id" uuid not null primary key,
      "received_at" timestamptz not null,
      "mail_from" varchar(320) null,
      "recipients" jsonb not null,
      "raw" text not null
    );`);
  }

  override async down(): Promise<void> {
    for (const table of [
      'dev_outbox_message', 'audit_event', 'group_invitation', 'group_membership', 'research_group',
      'auth_throttle', 'email_token', 'user_session', 'app_user',
    ]) {
      this.addSql(`drop table if exists "${table}" cascade;`);
    }
  }
}
