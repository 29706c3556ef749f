import { randomBytes } from 'node:crypto';
import pg from 'pg';

/** The template database every server test file copies (migrated once by the global setup). */
export const TEMPLATE_DATABASE = 'sphereline_template';

export function requireDatabaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: run the tests with `npm test`.');
  return url;
}

export function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}

export async function adminQuery(sql: string): Promise<void> {
  const client = new pg.Client({ connectionString: withDatabase(requireDatabaseUrl(), 'postgres') });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}

/** A fresh database for one test file, copied from the migrated template. */
export async function createTestDatabase(): Promise<{ url: string; drop: () => Promise<void> }> {
  const name = `sphereline_t_${randomBytes(5).toString('hex')}`;
  await adminQuery(`create database "${name}" template "${TEMPLATE_DATABASE}"`);
  return {
    url: withDatabase(requireDatabaseUrl(), name),
    drop: () => adminQuery(`drop database if exists "${name}" with (force)`),
  };
}
