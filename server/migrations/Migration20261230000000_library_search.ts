import { Migration } from '@mikro-orm/migrations';

/**
 * Library search at 100 000 entries.
 *
 * `is_published` (generated, so every writer keeps it right without knowing of it): the entry has
 * an approved snapshot and is not retired, which is what a viewer may see.
 *
 * `complex_search_cover`: one b-tree that answers a whole search without touching the table —
 * keyed by group (every search is scoped to groups) and the equality filters (metal, verdict,
 * oxidation state, d count), carrying everything else the search filters, ranks, sorts and counts
 * on. With the visibility map set (autovacuum, or the VACUUM after a bulk load) the planner reads
 * it as an index-only scan: the count of 10 000+ matches no longer visits 10 000 heap rows.
 * Only the page's rows (≤ 100) are then read from the table.
 */
export class Migration20261230000000_library_search extends Migration {
  override async up(): Promise<void> {
    this.addSql(
      `alter table "complex" add column "is_published" boolean generated always as ("approved_snapshot" is not null and "status" <> 'retired') stored;`,
    );
    this.addSql(`create index "complex_search_cover" on "complex" ("group_id", "metal", "verdict", "oxidation_state", "d_electrons")
      include ("id", "is_published", "status", "created_by_id", "has_citation", "ligand_ids", "measurement_kinds", "name", "search_text");`);
    // Superseded by complex_search_cover (same leading columns).
    this.addSql('drop index if exists "complex_group_verdict_index";');
  }

  override async down(): Promise<void> {
    this.addSql('create index if not exists "complex_group_verdict_index" on "complex" ("group_id", "verdict");');
    this.addSql('drop index if exists "complex_search_cover";');
    this.addSql('alter table "complex" drop column if exists "is_published";');
  }
}
