import { Router } from 'express';
import type { Orm } from '@/server/db/orm';
import { databaseIsUp } from '@/server/db/orm';

/**
 * Two probes for whoever runs the server (a process manager, a load balancer):
 * - `GET /api/health/live`: the process answers HTTP through the whole API stack; no database,
 *   so a restart is not triggered by a database outage the server rides out by itself;
 * - `GET /api/health`: ready to serve — the process and the database (503 `db: down` otherwise).
 */
export function healthRoutes(orm: Orm): Router {
  const router = Router();
  router.get('/health/live', (_req, res) => {
    res.json({ status: 'ok' });
  });
  router.get('/health', async (_req, res) => {
    const up = await databaseIsUp(orm);
    res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' });
  });
  return router;
}
