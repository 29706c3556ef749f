import { Router } from 'express';
import type { Orm } from '@/server/db/orm';
import { databaseIsUp } from '@/server/db/orm';

export function healthRoutes(orm: Orm): Router {
  const router = Router();
  router.get('/health', async (_req, res) => {
    const up = await databaseIsUp(orm);
    res.status(up ? 200 : 503).json({ status: up ? 'ok' : 'degraded', db: up ? 'ok' : 'down' });
  });
  return router;
}
