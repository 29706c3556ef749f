/**
 * The server under test, started by the bench in its own process: the real createApp() over a
 * throwaway database, wrapped in an outer express app that adds two bench-only routes (never in
 * production code):
 *   GET /bench/ping   bare JSON, no middleware: the floor the API endpoints are compared with;
 *   GET /bench/blank  a tiny HTML page: the floor for the browser's time to first result;
 *   GET /bench/cpu    this process's CPU time so far (µs, user + system): the bench reads it before
 *                     and after each run for the server's own CPU per request, a figure the load
 *                     generator sharing the machine's cores does not blur.
 * Prints "LISTENING <port>" on stdout when ready. DATABASE_URL and WEB_DIR come from the parent.
 */
import express from 'express';
import path from 'node:path';
import { createApp } from '@/server/app';
import { startChangeFeed } from '@/server/db/change-feed';
import { migrate, openOrm } from '@/server/db/orm';

// Same "result" test id as the Check screen, so the browser waits for the same selector on both.
const BLANK_HTML =
  '<!doctype html><html><head><meta charset="utf-8"><title>blank</title></head>' +
  '<body><div data-testid="check-result">blank</div></body></html>';

async function main() {
  const databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) throw new Error('DATABASE_URL is not set');
  const orm = await openOrm(databaseUrl);
  await migrate(orm);
  const webDir = path.resolve(process.env.WEB_DIR ?? 'dist');

  const outer = express();
  outer.disable('x-powered-by');
  outer.get('/bench/ping', (_req, res) => {
    res.json({ status: 'ok' });
  });
  outer.get('/bench/cpu', (_req, res) => {
    const { user, system } = process.cpuUsage();
    res.json({ cpuMicros: user + system });
  });
  outer.get('/bench/blank', (_req, res) => {
    res.type('html').send(BLANK_HTML);
  });
  const changeFeed = await startChangeFeed(orm, databaseUrl);
  outer.use(createApp({ orm, webDir, logRequests: false, changeFeed }));

  const server = outer.listen(0, '127.0.0.1', () => {
    const address = server.address();
    const port = typeof address === 'object' && address ? address.port : 0;
    process.stdout.write(`LISTENING ${port}\n`);
  });
  // Keep-alive longer than autocannon's runs so connections are reused, as a browser would.
  server.keepAliveTimeout = 60_000;
  const stop = async () => {
    server.closeAllConnections();
    server.close();
    await changeFeed.stop();
    await orm.close(true);
    process.exit(0);
  };
  process.on('SIGTERM', () => void stop());
  process.on('SIGINT', () => void stop());
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
