import { execFileSync } from 'node:child_process';
import path from 'node:path';
import { TEMPLATE_DATABASE, adminQuery, requireDatabaseUrl, withDatabase } from './test-database';

/**
 * Once per run: a template database with every migration applied (through the same
 * `npm run db:migrate` entry point the project uses); each server test file copies it.
 */
export default async function globalSetup() {
  const url = requireDatabaseUrl();
  await adminQuery(`drop database if exists "${TEMPLATE_DATABASE}" with (force)`);
  await adminQuery(`create database "${TEMPLATE_DATABASE}"`);
  const root = path.resolve(__dirname, '../..');
  execFileSync(process.execPath, [require.resolve('tsx/cli', { paths: [root] }), 'server/db/migrate-cli.ts'], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: withDatabase(url, TEMPLATE_DATABASE) },
    stdio: 'pipe',
  });
}
