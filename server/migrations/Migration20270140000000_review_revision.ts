import { Migration } from '@mikro-orm/migrations';

/**
 * A review decision belongs to the revision it recorded: `complex_review.revision_id` references
 * that revision (the one of the same entry whose number is the review's `revision_number`), so the
 * ORM maps the review n:1 revision as well as n:1 entry. Existing reviews are linked by that pair;
 * a review whose revision cannot be found keeps null. Deferred, as the other library keys of rows
 * written together in one transaction.
 */
export class Migration20270140000000_review_revision extends Migration {
  override async up(): Promise<void> {
    this.addSql(`alter table "complex_review" add column "revision_id" uuid null
      references "complex_revision" ("id") on delete cascade deferrable initially deferred;`);
    this.addSql(`create index "complex_review_revision_id_index" on "complex_review" ("revision_id");`);
    this.addSql(`update "complex_review" r set "revision_id" = v."id"
      from "complex_revision" v where v."complex_id" = r."complex_id" and v."number" = r."revision_number";`);
    // Check the linked rows now: a deferred check pending at the end of this migration would keep
    // later migrations in the same transaction from altering the table.
    this.addSql(`set constraints "complex_review_revision_id_fkey" immediate;`);
  }

  override async down(): Promise<void> {
    this.addSql(`alter table "complex_review" drop column "revision_id";`);
  }
}
