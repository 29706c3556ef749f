import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureWebBuild } from '../../server/build-web';
import { findFreePort, startPrivateCluster } from '../../server/db/cluster';

/**
 * `npm run test:e2e`: exports the web app (when stale), starts the real server on a free port over a
 * throwaway PostgreSQL, then runs the browser specs (node's test runner + Playwright driving Debian's
 * Chromium). Screenshots go to test-results/screenshots (git-ignored).
 */
const root = path.resolve(__dirname, '../..');

async function waitForHealth(baseUrl: string, server: ChildProcess, timeoutMs = 60_000) {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (server.exitCode !== null) throw new Error(`The server exited early (code ${server.exitCode}).`);
    try {
      const response = await fetch(`${baseUrl}/api/health`);
      if (response.ok) return;
    } catch {
      // not listening yet
    }
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
  throw new Error('The server did not become healthy in time.');
}

const onlySpecs = process.argv.slice(2);

async function main() {
  const webDir = path.join(root, 'dist');
  await ensureWebBuild(root, webDir, (line) => console.log(`[e2e] ${line}`));

  const dbDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-e2e-pg-'));
  fs.chmodSync(dbDir, 0o755);
  const cluster = await startPrivateCluster(dbDir, { database: 'sphereline_e2e', throwaway: true });
  const port = await findFreePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  let serverLog = '';
  const server = spawn(process.execPath, [require.resolve('tsx/cli'), 'server/index.ts'], {
    cwd: root,
    // Development mode: the demo lab is seeded only outside production (the production start is
    // checked by `npm run test:smoke`). The web app is the same exported build either way.
    env: { ...process.env, PORT: String(port), DATABASE_URL: cluster.url, LOG_REQUESTS: '0', NODE_ENV: 'development' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  server.stdout?.on('data', (chunk: Buffer) => (serverLog += chunk.toString()));
  server.stderr?.on('data', (chunk: Buffer) => (serverLog += chunk.toString()));

  let code = 1;
  try {
    await waitForHealth(baseUrl, server);
    const specs = fs
      .readdirSync(__dirname)
      .filter((file) => file.endsWith('.e2e.ts'))
      // `npm run test:e2e -- check library` runs only the specs whose names contain those words.
      .filter((file) => onlySpecs.length === 0 || onlySpecs.some((word) => file.includes(word)))
      .sort()
      .map((file) => path.join('tests/e2e', file));
    const runner = spawn(process.execPath, [require.resolve('tsx/cli'), '--test', '--test-concurrency=1', ...specs], {
      cwd: root,
      env: { ...process.env, E2E_BASE_URL: baseUrl },
      stdio: 'inherit',
    });
    code = await new Promise((resolve) => runner.on('exit', (c) => resolve(c ?? 1)));
  } catch (error) {
    console.error(`[e2e] ${(error as Error).message}\n--- server output ---\n${serverLog.slice(-4000)}`);
  } finally {
    server.kill('SIGTERM');
    await new Promise((resolve) => setTimeout(resolve, 500));
    await cluster.stop().catch(() => {});
    fs.rmSync(dbDir, { recursive: true, force: true });
  }
  process.exit(code);
}

void main();
