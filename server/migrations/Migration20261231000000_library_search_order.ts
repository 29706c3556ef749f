import { Migration } from '@mikro-orm/migrations';

/**
 * Library search pages without visiting every match.
 *
 * The search counts only up to a cap and reads a page in an order an index delivers, so that a
 * page of a 10 000-match search reads ~ the page's share of the index, not all matches:
 *
 * - `complex_search_by_id`: (group, id) carrying every column the search filters on, including
 *   `search_text`. A text search walks one rank level at a time in id order (the tie-break),
 *   index-only, and stops when the page is full.
 * - `complex_search_by_name`: (group, lower(name), id) with the filter columns: the order of a
 *   search without text; one walk gives the page and the capped count. It supersedes `complex_group_name_index` (same key).
 * - `complex_search_words_gin`: the words of `search_text`, so "t is a whole word" (the top rank
 *   tier) is answered by index and estimated from statistics; an empty or rare top level then
 *   costs an index probe instead of a walk over the group.
 */
export class Migration20261231000000_library_search_order extends Migration {
  override async up(): Promise<void> {
    this.addSql(`create index "complex_search_by_id" on "complex" ("group_id", "id")
      include ("is_published", "status", "created_by_id", "metal", "verdict", "oxidation_state", "d_electrons", "has_citation",
               "ligand_ids", "measurement_kinds", "search_text");`);
    // `name` itself too: without it the planner will not read lower("name") from the index only.
    this.addSql(`create index "complex_search_by_name" on "complex" ("group_id", lower("name"), "id")
      include ("name", "is_published", "status", "created_by_id", "metal", "verdict", "oxidation_state", "d_electrons", "has_citation",
               "ligand_ids", "measurement_kinds");`);
    this.addSql(`create index "complex_search_words_gin" on "complex" using gin (string_to_array("search_text", ' '));`);
    this.addSql('drop index if exists "complex_group_name_index";');
  }

  override async down(): Promise<void> {
    this.addSql('create index if not exists "complex_group_name_index" on "complex" ("group_id", lower("name"), "id");');
    this.addSql('drop index if exists "complex_search_words_gin";');
    this.addSql('drop index if exists "complex_search_by_name";');
    this.addSql('drop index if exists "complex_search_by_id";');
  }
}
