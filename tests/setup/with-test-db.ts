import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startPrivateCluster } from '@/server/db/cluster';

/**
 * `npm test`: a throwaway PostgreSQL cluster (unless DATABASE_URL is given), then jest with the
 * given arguments; the cluster is removed afterwards, also when tests fail or the run is interrupted.
 */
/**
 * The package scripts pass `--selectProjects a b c` first; jest reads every word after it as a project
 * name, so `npm test -- tests/lib/chem/route.test.ts` would select no file and run everything. Put
 * the script's project list last, and drop it when the caller chooses projects.
 */
function withProjectsLast(args: string[]): string[] {
  if (args[0] !== '--selectProjects') return args;
  let end = 1;
  while (end < args.length && !args[end]!.startsWith('-') && !args[end]!.includes('/') && !args[end]!.includes('.')) end += 1;
  const defaults = args.slice(0, end);
  const rest = args.slice(end);
  return rest.includes('--selectProjects') ? rest : [...rest, ...defaults];
}

async function main() {
  const jestArgs = withProjectsLast(process.argv.slice(2));
  let cleanup = async () => {};
  const env = { ...process.env };
  if (!env.DATABASE_URL) {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-test-pg-'));
    fs.chmodSync(dir, 0o755);
    const cluster = await startPrivateCluster(dir, { database: 'sphereline_test', throwaway: true });
    env.DATABASE_URL = cluster.url;
    cleanup = async () => {
      await cluster.stop().catch(() => {});
      fs.rmSync(dir, { recursive: true, force: true });
    };
  }
  let interrupted = false;
  const child = spawn(process.execPath, [require.resolve('jest/bin/jest'), ...jestArgs], {
    stdio: 'inherit',
    // The server tests' browser helper addresses the app as sphereline.test (tests/server/auth-helpers.ts).
    // The tests stand in for clients behind a proxy with X-Forwarded-For from the loopback test client.
    env: { ...env, NODE_ENV: 'test', ALLOWED_HOSTS: env.ALLOWED_HOSTS ?? 'sphereline.test', TRUST_PROXY: env.TRUST_PROXY ?? 'loopback' },
  });
  const forward = (signal: NodeJS.Signals) => {
    interrupted = true;
    child.kill(signal);
  };
  process.on('SIGINT', forward);
  process.on('SIGTERM', forward);
  const code: number = await new Promise((resolve) => child.on('exit', (c) => resolve(c ?? 1)));
  await cleanup();
  process.exit(interrupted && code === 0 ? 1 : code);
}

main().catch((error: Error) => {
  console.error(error.message);
  process.exit(1);
});
