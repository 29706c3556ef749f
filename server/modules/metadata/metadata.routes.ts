import { Router } from 'express';
import { doiLookupQuerySchema } from '@/lib/schemas/exchange';
import { requireAuth } from '@/server/http/auth-middleware';
import { parseWith } from '@/server/http/validate';
import type { MetadataClient } from './metadata-client';

/** GET /api/citations/lookup?doi=… — signed-in people only (it spends the service's rate limit). */
export function metadataRoutes(client: () => Promise<MetadataClient>): Router {
  const router = Router();
  router.get('/citations/lookup', requireAuth, async (req, res) => {
    const { doi } = parseWith(doiLookupQuerySchema, req.query, 'query');
    res.setHeader('Cache-Control', 'private, max-age=300');
    res.json(await (await client()).lookup(doi));
  });
  return router;
}
