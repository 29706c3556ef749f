import { Migration20261202000000_foundation } from './Migration20261202000000_foundation';
import { Migration20261210000000_accounts } from './Migration20261210000000_accounts';
import { Migration20261215000000_library } from './Migration20261215000000_library';
import { Migration20261220000000_exchange } from './Migration20261220000000_exchange';
import { Migration20261230000000_library_search } from './Migration20261230000000_library_search';
import { Migration20261231000000_library_search_order } from './Migration20261231000000_library_search_order';
import { Migration20270125000000_citation_kind } from './Migration20270125000000_citation_kind';
import { Migration20270130000000_change_feed } from './Migration20270130000000_change_feed';
import { Migration20270135000000_review_words } from './Migration20270135000000_review_words';
import { Migration20270135500000_idempotency } from './Migration20270135500000_idempotency';
import { Migration20270135600000_import_duplicates } from './Migration20270135600000_import_duplicates';
import { Migration20270136000000_published_search } from './Migration20270136000000_published_search';
import { Migration20270137000000_attachment_review } from './Migration20270137000000_attachment_review';
import { Migration20270140000000_review_revision } from './Migration20270140000000_review_revision';
import { Migration20270141000000_library_columns } from './Migration20270141000000_library_columns';
import { Migration20270141100000_library_sort_updated } from './Migration20270141100000_library_sort_updated';
import { Migration20270142000000_import_created } from './Migration20270142000000_import_created';
import { Migration20270142100000_import_suggested_names } from './Migration20270142100000_import_suggested_names';

/**
 * Migrations are listed here (not discovered from the folder) so that tsx, jest and a bundled
 * server all run the same set. A new migration file must be added to this list, in order.
 */
export const migrationsList = [
  { name: 'Migration20261202000000_foundation', class: Migration20261202000000_foundation },
  { name: 'Migration20261210000000_accounts', class: Migration20261210000000_accounts },
  { name: 'Migration20261215000000_library', class: Migration20261215000000_library },
  { name: 'Migration20261220000000_exchange', class: Migration20261220000000_exchange },
  { name: 'Migration20261230000000_library_search', class: Migration20261230000000_library_search },
  { name: 'Migration20261231000000_library_search_order', class: Migration20261231000000_library_search_order },
  { name: 'Migration20270125000000_citation_kind', class: Migration20270125000000_citation_kind },
  { name: 'Migration20270130000000_change_feed', class: Migration20270130000000_change_feed },
  { name: 'Migration20270135000000_review_words', class: Migration20270135000000_review_words },
  { name: 'Migration20270135500000_idempotency', class: Migration20270135500000_idempotency },
  { name: 'Migration20270135600000_import_duplicates', class: Migration20270135600000_import_duplicates },
  { name: 'Migration20270136000000_published_search', class: Migration20270136000000_published_search },
  { name: 'Migration20270137000000_attachment_review', class: Migration20270137000000_attachment_review },
  { name: 'Migration20270140000000_review_revision', class: Migration20270140000000_review_revision },
  { name: 'Migration20270141000000_library_columns', class: Migration20270141000000_library_columns },
  { name: 'Migration20270141100000_library_sort_updated', class: Migration20270141100000_library_sort_updated },
  { name: 'Migration20270142000000_import_created', class: Migration20270142000000_import_created },
  { name: 'Migration20270142100000_import_suggested_names', class: Migration20270142100000_import_suggested_names },
];
