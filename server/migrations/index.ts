import { Migration20261202000000_foundation } from './Migration20261202000000_foundation';

/**
 * Migrations are listed here (not discovered from the folder) so that tsx, jest and a bundled
 * server all run the same set. A new migration file must be added to this list, in order.
 */
export const migrationsList = [
  { name: 'Migration20261202000000_foundation', class: Migration20261202000000_foundation },
];
