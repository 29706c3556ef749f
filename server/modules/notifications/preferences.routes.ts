import { Router } from 'express';
import { updateMailPreferencesInputSchema } from '@/lib/schemas/exchange';
import { requestEm } from '@/server/db/request-context';
import { getAuth, requireAuth } from '@/server/http/auth-middleware';
import { parseWith } from '@/server/http/validate';
import { getMailPreferences, updateMailPreferences } from './mail-preferences.service';

/** GET/PATCH /api/auth/me/preferences: the signed-in person's e-mail choices. */
export function preferencesRoutes(): Router {
  const router = Router();
  router.get('/auth/me/preferences', requireAuth, async (_req, res) => {
    res.json(await getMailPreferences(requestEm(), getAuth(res).user.id));
  });
  router.patch('/auth/me/preferences', requireAuth, async (req, res) => {
    const input = parseWith(updateMailPreferencesInputSchema, req.body);
    res.json(await updateMailPreferences(requestEm(), getAuth(res).user.id, input));
  });
  return router;
}
