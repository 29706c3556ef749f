import { Router } from 'express';
import { classifyRequestSchema, marcusRequestSchema, routeRequestSchema } from '@/lib/schemas/chem';
import { parseWith } from '@/server/http/validate';
import * as chem from './chem.service';

/** The public engine endpoints: no sign-in, no database. */
export function chemRoutes(): Router {
  const router = Router();
  router.post('/classify', (req, res) => {
    res.json(chem.classify(parseWith(classifyRequestSchema, req.body)));
  });
  router.post('/route', (req, res) => {
    res.json(chem.route(parseWith(routeRequestSchema, req.body)));
  });
  router.post('/marcus', (req, res) => {
    res.json(chem.marcus(parseWith(marcusRequestSchema, req.body)));
  });
  return router;
}
