import { Router } from 'express';
import { classifyRequestSchema, formationRequestSchema, marcusRequestSchema, routeRequestSchema, sequenceRequestSchema } from '@/lib/schemas/chem';
import { requestEm } from '@/server/db/request-context';
import { isUuid, resolveAuth } from '@/server/http/auth-middleware';
import { AppError } from '@/server/http/errors';
import { parseWith } from '@/server/http/validate';
import * as chem from './chem.service';

/**
 * The public engine endpoints: no sign-in and no database, except POST /api/classify with a
 * `groupId`, where the signed-in member's group library decides for the species it has measured.
 */
export function chemRoutes(): Router {
  const router = Router();
  router.post('/classify', async (req, res) => {
    const request = parseWith(classifyRequestSchema, req.body);
    const answer = chem.classify(request);
    if (request.groupId === undefined) {
      res.json(answer);
      return;
    }
    const auth = await resolveAuth(req, res);
    if (!auth) throw new AppError('UNAUTHENTICATED', 'Sign in to classify against your group’s library (groupId).');
    const wanted = isUuid(request.groupId) ? request.groupId.toLowerCase() : '';
    if (!auth.user.memberships.some((m) => m.groupId === wanted)) throw new AppError('NOT_FOUND', 'That group was not found.');
    res.json(await chem.decideWithLibrary(requestEm(), wanted, answer));
  });
  router.post('/route', (req, res) => {
    res.json(chem.route(parseWith(routeRequestSchema, req.body)));
  });
  router.post('/marcus', (req, res) => {
    res.json(chem.marcus(parseWith(marcusRequestSchema, req.body)));
  });
  router.post('/formation', (req, res) => {
    res.json(chem.formation(parseWith(formationRequestSchema, req.body)));
  });
  router.post('/sequence', (req, res) => {
    res.json(chem.sequence(parseWith(sequenceRequestSchema, req.body)));
  });
  return router;
}
