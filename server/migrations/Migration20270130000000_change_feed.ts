import { Migration } from '@mikro-orm/migrations';

/**
 * Change notifications for the server's in-memory caches (server/db/change-feed.ts): after any write
 * to a table that a cache reads, `pg_notify('sphereline_change', <topic>)`, delivered on commit to
 * every server process. Session lookups read the `session` tables; everything else the caches hold
 * is the library (`library`). Tables whose writes change nothing cached get no trigger.
 *
 * The triggers are attached to every table present when this runs; a later migration that adds a
 * table a cache reads must call `sphereline_watch_table(<table>, <topic>)` for it.
 */
const SESSION_TABLES = ['user_session', 'app_user', 'group_membership', 'research_group'];
const UNRELATED_TABLES = [
  'auth_throttle',
  'email_token',
  'dev_outbox_message',
  'audit_event',
  'import_job',
  'user_mail_preference',
  'group_invitation',
  'app_setting',
  'mikro_orm_migrations',
];
const list = (names: string[]) => names.map((name) => `'${name}'`).join(', ');

export class Migration20270130000000_change_feed extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create or replace function sphereline_notify_change() returns trigger language plpgsql as $$
      begin
        perform pg_notify('sphereline_change', tg_argv[0]);
        return null;
      end $$;`);
    this.addSql(`create or replace function sphereline_watch_table(target text, topic text) returns void language plpgsql as $$
      begin
        execute format('drop trigger if exists sphereline_change on %I', target);
        execute format(
          'create trigger sphereline_change after insert or update or delete or truncate on %I '
          'for each statement execute function sphereline_notify_change(%L)', target, topic);
      end $$;`);
    this.addSql(`do $$
      declare t record;
      begin
        for t in select tablename from pg_tables where schemaname = current_schema()
                   and tablename not in (${list(UNRELATED_TABLES)}) loop
          perform sphereline_watch_table(t.tablename,
            case when t.tablename in (${list(SESSION_TABLES)}) then 'session' else 'library' end);
        end loop;
      end $$;`);
  }

  override async down(): Promise<void> {
    this.addSql(`do $$
      declare t record;
      begin
        for t in select event_object_table as tablename from information_schema.triggers
                   where trigger_name = 'sphereline_change' group by event_object_table loop
          execute format('drop trigger if exists sphereline_change on %I', t.tablename);
        end loop;
      end $$;`);
    this.addSql('drop function if exists sphereline_watch_table(text, text);');
    this.addSql('drop function if exists sphereline_notify_change();');
  }
}
