import { Migration } from '@mikro-orm/migrations';

/**
 * Attachments go through review with the entry. Each file is added by a revision of its entry
 * (`added_in_version`) and has a review state: `pending` until a decision on that revision,
 * `accepted` (with `accepted_in_version`) once the entry is accepted, `declined` when the revision
 * is declined. Viewers, and contributors for entries they did not create, list and download only
 * accepted files. A trigger on complex_review settles the pending files of the entry whenever a
 * decision is recorded, whichever code records it; `return` leaves them pending.
 *
 * Existing files: those added before the entry's last acceptance are accepted, the rest pending.
 */
export class Migration20270137000000_attachment_review extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "attachment" add column "state" varchar(10) not null default 'pending',
      add column "added_in_version" int null, add column "accepted_in_version" int null;`);
    this.addSql(`alter table "attachment" add constraint "attachment_state_check" check ("state" in ('pending', 'accepted', 'declined'));`);
    this.addSql(`update "attachment" a set "state" = 'accepted', "accepted_in_version" = c."accepted_version"
      from "complex" c where c."id" = a."complex_id" and c."accepted_snapshot" is not null and c."accepted_at" is not null and a."created_at" <= c."accepted_at";`);
    this.addSql(`create or replace function sphereline_attachment_review() returns trigger language plpgsql as $$
      begin
        if new.decision = 'accept' then
          update attachment set state = 'accepted', accepted_in_version = new.revision_number where complex_id = new.complex_id and state = 'pending';
        elsif new.decision = 'decline' then
          update attachment set state = 'declined' where complex_id = new.complex_id and state = 'pending';
        end if;
        return null;
      end $$;`);
    this.addSql(`create trigger "complex_review_settles_attachments" after insert on "complex_review"
      for each row execute function sphereline_attachment_review();`);
  }

  override async down(): Promise<void> {
    this.addSql('drop trigger if exists "complex_review_settles_attachments" on "complex_review";');
    this.addSql('drop function if exists sphereline_attachment_review();');
    this.addSql('alter table "attachment" drop constraint if exists "attachment_state_check";');
    this.addSql('alter table "attachment" drop column if exists "state", drop column if exists "added_in_version", drop column if exists "accepted_in_version";');
  }
}
