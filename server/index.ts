import type { Server } from 'node:http';
import { createApp } from './app';
import { ensureWebBuild } from './build-web';
import { resolveDatabase } from './db/database';
import { startChangeFeed } from './db/change-feed';
import { migrate, openOrm } from './db/orm';
import { seedDemo } from './db/seed';
import { developmentTools, registerDevelopmentTools } from './development-tools';
import { readEnv } from './env';
import { ClusterError, type PrivateCluster } from './db/cluster';
import { DEMO_PASSWORD, demoAccounts } from './modules/auth/demo-accounts';
import { demoAccountsWithDemoPassword } from './modules/auth/first-admin';
import { createMailer } from './modules/mail/mailer';
import { failAbandonedImports } from './modules/exchange/import.service';

const log = (line: string) => console.log(`[sphereline] ${line}`);

/** A start-up refusal with a message that says what to do (printed without a stack). */
class StartRefused extends Error {}

/** The private PostgreSQL this start opened: stopped again if the start fails half-way. */
let openedCluster: PrivateCluster | null = null;

/**
 * Outside production: the local mail sink, fake S3 and fake DOI service of server/dev (their
 * packages are devDependencies). A dynamic import, so a production start never loads that folder;
 * after `npm ci --omit=dev` a development start goes on without them and says so.
 */
async function loadDevelopmentTools(): Promise<void> {
  try {
    const dev = await import('./dev');
    registerDevelopmentTools(dev.developmentTools);
  } catch (error) {
    const code = (error as { code?: string }).code;
    if (code !== 'ERR_MODULE_NOT_FOUND' && code !== 'MODULE_NOT_FOUND') throw error;
    log('The development tools are not installed (devDependencies omitted): no local mail sink, object store or DOI service. Set SMTP_URL, S3_* and METADATA_URL, or run npm install.');
  }
}

/** `npm start`: build the web app if stale, start the database, migrate, seed once, serve. */
async function main() {
  const env = readEnv();
  if (env.NODE_ENV !== 'production') await loadDevelopmentTools();
  const root = process.cwd();
  await ensureWebBuild(root, env.webDirAbsolute, log);

  const { url, cluster } = await resolveDatabase(env, log);
  openedCluster = cluster;
  const orm = await openOrm(url);
  const applied = await migrate(orm);
  if (applied.length > 0) log(`Applied migrations: ${applied.join(', ')}`);
  if (env.NODE_ENV === 'production') {
    // Production never seeds the demo, and will not run with a demo account that opens with the
    // published password (a database copied from a demo installation, say).
    // Start-up, before any request: a fork of its own.
    const open = await demoAccountsWithDemoPassword(orm.em.fork());
    if (open.length > 0) {
      await orm.close(true);
      throw new StartRefused(
        `Refusing to start in production: demo account(s) ${open.join(', ')} still open with the published demo password. ` +
          'Delete them or change their passwords, then start again.',
      );
    }
  } else {
    await seedDemo(orm);
  }
  // Imports whose server stopped mid-way wrote nothing (one transaction); say so on their job rows.
  const abandoned = await failAbandonedImports(orm);
  if (abandoned > 0) log(`Marked ${abandoned} interrupted import(s) as failed.`);

  // Without SMTP_URL (development): a local mail sink; its messages are listed at /api/dev/outbox.
  const mailer = createMailer({ orm, smtpUrl: env.SMTP_URL, nodeEnv: env.NODE_ENV, from: env.MAIL_FROM, keepProcessAlive: true });
  const mailDestination = await mailer.start();
  if (env.NODE_ENV === 'production' && !env.SMTP_URL) log('SMTP_URL is not set: e-mail (sign-up, reset, invitations) cannot be sent.');

  const changeFeed = await startChangeFeed(orm, url);
  const app = createApp({ orm, webDir: env.webDirAbsolute, logRequests: env.LOG_REQUESTS === '1', mailer, changeFeed });
  const server: Server = await new Promise((resolve, reject) => {
    const listening = app.listen(env.PORT, env.HOST, () => resolve(listening));
    listening.once('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : env.PORT;
  console.log(`
  Sphereline is running at http://${env.HOST}:${port}/
  API health:              http://${env.HOST}:${port}/api/health
  Database:                ${
    cluster
      ? `private PostgreSQL on 127.0.0.1:${cluster.port} (data in ${env.DATA_DIR}/postgres; ${cluster.adopted ? 'was already running, adopted' : 'started by this server'})`
      : 'DATABASE_URL'
  }
  E-mail:                  ${mailDestination}${developmentTools(env.NODE_ENV) && !env.SMTP_URL ? `\n  Outbox:                  http://${env.HOST}:${port}/api/dev/outbox` : ''}

${
  env.NODE_ENV === 'production'
    ? '  Production: no demo accounts. Make the first administrator with\n    npm run --silent admin -- --email <address> --name "<name>" --group "<research group>"\n'
    : `  Demo sign-ins (invented people; password for all: ${DEMO_PASSWORD}):\n${demoAccounts.map((a) => `    ${a.email.padEnd(36)} ${a.role.padEnd(12)} ${a.displayName}, ${a.part}`).join('\n')}\n`
}
  Press Ctrl+C to stop.
`);

  let stopping = false;
  const stop = async (signal: string) => {
    if (stopping) return;
    stopping = true;
    log(`${signal}: stopping …`);
    await new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeAllConnections();
    await mailer.close();
    await changeFeed.stop();
    await orm.close(true);
    // Stops the PostgreSQL this server started or adopted, unless another process still uses it (it says which).
    if (cluster) await cluster.stop();
    log('Stopped cleanly.');
    process.exit(0);
  };
  // `npm start` runs this process in place of its shell (exec in package.json), so the SIGTERM or
  // SIGINT that npm passes on arrives here; SIGHUP when the terminal closes.
  for (const signal of ['SIGINT', 'SIGTERM', 'SIGHUP'] as const) process.on(signal, () => void stop(signal));
}

main().catch(async (error: unknown) => {
  await openedCluster?.stop().catch(() => undefined);
  if (error instanceof ClusterError || error instanceof StartRefused || (error instanceof Error && error.name === 'EnvError')) {
    console.error(`[sphereline] ${error.message}`);
  } else {
    console.error('[sphereline] Could not start:', error);
  }
  process.exit(1);
});
