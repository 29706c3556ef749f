import pg from 'pg';

/**
 * A fingerprint of everything stored: row count per table plus, for tables with a version or an
 * updated_at column, their sum / newest value (so an UPDATE shows too, not only INSERT/DELETE).
 * Tables that change by design on every request (sessions' sliding expiry) can be left out.
 */
export async function databaseFingerprint(databaseUrl: string, ignore: readonly string[] = []): Promise<Record<string, string>> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const tables = await client.query<{ table_name: string; columns: string[] }>(
      `select t.table_name, array_agg(c.column_name::text) as columns
         from information_schema.tables t join information_schema.columns c
           on c.table_schema = t.table_schema and c.table_name = t.table_name
        where t.table_schema = 'public' and t.table_type = 'BASE TABLE'
        group by t.table_name order by t.table_name`,
    );
    const fingerprint: Record<string, string> = {};
    for (const { table_name: table, columns } of tables.rows) {
      if (ignore.includes(table)) continue;
      const parts = ['count(*)::text'];
      if (columns.includes('version')) parts.push('coalesce(sum(version), 0)::text');
      if (columns.includes('updated_at')) parts.push('coalesce(max(updated_at)::text, \'-\')');
      const row = await client.query<{ f: string }>(`select concat_ws('|', ${parts.join(', ')}) as f from "${table}"`);
      fingerprint[table] = row.rows[0]?.f ?? '';
    }
    return fingerprint;
  } finally {
    await client.end();
  }
}

export async function queryRows<T extends pg.QueryResultRow>(databaseUrl: string, sql: string, params: unknown[] = []): Promise<T[]> {
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    return (await client.query<T>(sql, params)).rows;
  } finally {
    await client.end();
  }
}
