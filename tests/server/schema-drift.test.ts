import { createTestApp, type TestApp } from '../setup/test-app';

/**
 * The migrations and the entities describe the same tables: every entity property has its column
 * (with a matching nullability), and every column of an entity's table is known to the entity —
 * apart from the ones only SQL reads (generated columns and search helpers), listed here.
 * A migration that adds a column the entity does not declare, or a property without a migration,
 * fails here instead of at run time.
 */
const SQL_ONLY_COLUMNS: Record<string, string[]> = {
  complex: [
    // Generated from accepted_snapshot and status (migration 20261230), read by the search SQL.
    'is_published',
    // Filled by a trigger from accepted_snapshot (migration 20270136), read by the search SQL.
    ...['name', 'metal', 'oxidation_state', 'd_electrons', 'verdict', 'ligand_ids', 'measurement_kinds', 'has_citation', 'search_text'].map((c) => `published_${c}`),
  ],
};

let t: TestApp;
beforeAll(async () => {
  t = await createTestApp();
});
afterAll(async () => {
  await t.close();
});

interface ColumnRow {
  table_name: string;
  column_name: string;
  is_nullable: 'YES' | 'NO';
}

it('every entity property has its column and every column its property', async () => {
  const columns = (await t.orm.em
    .getConnection()
    .execute(`select table_name, column_name, is_nullable from information_schema.columns where table_schema = 'public'`)) as ColumnRow[];
  const byTable = new Map<string, Map<string, ColumnRow>>();
  for (const c of columns) {
    if (!byTable.has(c.table_name)) byTable.set(c.table_name, new Map());
    byTable.get(c.table_name)!.set(c.column_name, c);
  }
  const problems: string[] = [];
  const entities = Object.values(t.orm.getMetadata().getAll()).filter((meta) => !meta.embeddable && !meta.virtual && meta.tableName);
  expect(entities.length).toBeGreaterThan(10);
  for (const meta of entities) {
    const table = byTable.get(meta.tableName);
    if (!table) {
      problems.push(`${meta.className}: no table "${meta.tableName}"`);
      continue;
    }
    const mapped = new Set<string>();
    for (const prop of Object.values(meta.properties)) {
      if (prop.persist === false) continue;
      for (const field of prop.fieldNames ?? []) {
        mapped.add(field);
        const column = table.get(field);
        if (!column) problems.push(`${meta.className}.${prop.name}: no column ${meta.tableName}.${field}`);
        else if (!prop.primary && !prop.nullable && column.is_nullable === 'YES') problems.push(`${meta.className}.${prop.name}: the column accepts null, the property does not`);
      }
    }
    const sqlOnly = new Set(SQL_ONLY_COLUMNS[meta.tableName] ?? []);
    for (const name of table.keys()) {
      if (!mapped.has(name) && !sqlOnly.has(name)) problems.push(`${meta.tableName}.${name}: no property in ${meta.className}`);
    }
  }
  expect(problems).toEqual([]);
});
