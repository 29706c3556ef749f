import { Migration } from '@mikro-orm/migrations';

/**
 * The library table's "Updated" order (`sort=updated`, newest first being the usual reading) read
 * in index order within a group, for the working copy and for the published one that viewers see,
 * so a page of the newest changes does not sort the whole group. The other column orders sort the
 * matches (a top-N sort); see the search bench for their cost.
 */
export class Migration20270141100000_library_sort_updated extends Migration {
  override async up(): Promise<void> {
    this.addSql('create index if not exists "complex_sort_updated" on "complex" ("group_id", "updated_at", "id");');
    this.addSql('create index if not exists "complex_sort_updated_published" on "complex" ("group_id", "updated_at", "id") where "is_published";');
  }

  override async down(): Promise<void> {
    this.addSql('drop index if exists "complex_sort_updated_published";');
    this.addSql('drop index if exists "complex_sort_updated";');
  }
}
