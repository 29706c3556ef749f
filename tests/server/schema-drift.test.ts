import { createTestApp, type TestApp } from '../setup/test-app';

/**
 * The migrations and the entities describe the same tables: every entity property has its column
 * (with a matching nullability), and every column of an entity's table is known to the entity —
 * apart from the ones only SQL reads (generated columns and search helpers), listed here.
 * A migration that adds a column the entity does not declare, or a property without a migration,
 * fails here instead of at run time. Relations are checked through their join columns: a
 * many-to-one property needs its column and a foreign key to the target's table, and the inverse
 * side of a one-to-many owns no column of its own.
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
      // The inverse side of a relation: its rows are the other table's, joined by that table's column.
      if (prop.kind === '1:m' || (prop.kind === 'm:n' && !prop.owner)) continue;
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

interface ForeignKeyRow {
  table_name: string;
  column_name: string;
  target_table: string;
}

it('every many-to-one relation has a foreign key to its target table, and the aggregate is wired both ways', async () => {
  const keys = (await t.orm.em.getConnection().execute(
    `select c.conrelid::regclass::text as table_name, a.attname as column_name, c.confrelid::regclass::text as target_table
       from pg_constraint c
       join pg_attribute a on a.attrelid = c.conrelid and a.attnum = any (c.conkey)
      where c.contype = 'f' and array_length(c.conkey, 1) = 1`,
  )) as ForeignKeyRow[];
  const keyOf = new Map(keys.map((k) => [`${k.table_name}.${k.column_name}`, k.target_table]));
  const problems: string[] = [];
  const relations: string[] = [];
  for (const meta of Object.values(t.orm.getMetadata().getAll())) {
    for (const prop of Object.values(meta.properties)) {
      if (prop.kind !== 'm:1') continue;
      const target = t.orm.getMetadata().find(prop.type);
      for (const field of prop.fieldNames ?? []) {
        relations.push(`${meta.tableName}.${field}`);
        const found = keyOf.get(`${meta.tableName}.${field}`);
        if (found !== target?.tableName) problems.push(`${meta.className}.${prop.name}: ${meta.tableName}.${field} references ${found ?? 'nothing'}, not ${target?.tableName}`);
      }
    }
  }
  expect(problems).toEqual([]);
  // The library entry as an aggregate: these relations are mapped (with their columns unchanged).
  expect(relations).toEqual(
    expect.arrayContaining(['measurement.complex_id', 'measurement.citation_id', 'complex_revision.complex_id', 'complex_review.complex_id', 'complex_review.revision_id', 'attachment.complex_id']),
  );
  const complex = t.orm.getMetadata().find('Complex')!;
  expect(complex.properties.measurements).toMatchObject({ kind: '1:m', mappedBy: 'complex', orphanRemoval: true });
  expect(complex.properties.revisions).toMatchObject({ kind: '1:m', mappedBy: 'complex' });
});
