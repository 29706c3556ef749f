import type { Server } from 'node:http';
import { createApp } from './app';
import { ensureWebBuild } from './build-web';
import { resolveDatabase } from './db/database';
import { migrate, openOrm } from './db/orm';
import { seedDemo } from './db/seed';
import { readEnv } from './env';
import { ClusterError } from './db/cluster';

const log = (line: string) => console.log(`[sphereline] ${line}`);

/** `npm start`: build the web app if stale, start the database, migrate, seed once, serve. */
async function main() {
  const env = readEnv();
  const root = process.cwd();
  await ensureWebBuild(root, env.webDirAbsolute, log);

  const { url, cluster } = await resolveDatabase(env, log);
  const orm = await openOrm(url);
  const applied = await migrate(orm);
  if (applied.length > 0) log(`Applied migrations: ${applied.join(', ')}`);
  await seedDemo(orm);

  const app = createApp({ orm, webDir: env.webDirAbsolute, logRequests: env.LOG_REQUESTS === '1' });
  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(env.PORT, env.HOST, () => resolve(listening));
    listening.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.PORT;
  console.log(`
  Sphereline is running at http://${env.HOST}:${port}/
  API health:              http://${env.HOST}:${port}/api/health
  Database:                ${cluster ? `private PostgreSQL on 127.0.0.1:${cluster.port} (data in ${env.DATA_DIR}/postgres)` : 'DATABASE_URL'}
  Press Ctrl+C to stop.
`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping …`);
    await new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections();
    await orm.close(true);
    if (cluster) await cluster.stop();
    log('Stopped cleanly.');
    process.exit(0);
  };
  process.on('SIGINT', () => void stop('SIGINT'));
  process.on('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error: unknown) => {
  if (error instanceof ClusterError || (error instanceof Error && error.name === 'EnvError')) {
    console.error(`[sphereline] ${error.message}`);
  } else {
    console.error('[sphereline] Could not start:', error);
  }
  process.exit(1);
});
