import { Router } from 'express';
import { updateMailPreferencesInputSchema } from '@/lib/schemas/exchange';
import { libraryColumnsSchema } from '@/lib/schemas/library';
import { requestEm } from '@/server/db/request-context';
import { getAuth, requireAuth } from '@/server/http/auth-middleware';
import { parseWith } from '@/server/http/validate';
import { getLibraryPreferences, setLibraryColumns } from '@/server/modules/library/library-preferences.service';
import { getMailPreferences, updateMailPreferences } from './mail-preferences.service';

/** A change of any preference: the e-mail choices and/or the library table's columns. */
const updatePreferencesInputSchema = updateMailPreferencesInputSchema.extend({ libraryColumns: libraryColumnsSchema.optional() }).strict();

/**
 * GET/PATCH /api/auth/me/preferences: the signed-in person's e-mail choices and library columns
 * (`libraryColumns`: the table's shown columns, null for all), so both follow the person.
 */
export function preferencesRoutes(): Router {
  const router = Router();
  router.get('/auth/me/preferences', requireAuth, async (_req, res) => {
    const userId = getAuth(res).user.id;
    res.json({ ...(await getMailPreferences(requestEm(), userId)), ...(await getLibraryPreferences(requestEm(), userId)) });
  });
  router.patch('/auth/me/preferences', requireAuth, async (req, res) => {
    const { libraryColumns, ...mail } = parseWith(updatePreferencesInputSchema, req.body);
    const em = requestEm();
    const userId = getAuth(res).user.id;
    const mailNow = Object.keys(mail).length > 0 ? await updateMailPreferences(em, userId, mail) : await getMailPreferences(em, userId);
    const libraryNow = libraryColumns !== undefined ? await setLibraryColumns(em, userId, libraryColumns) : await getLibraryPreferences(em, userId);
    res.json({ ...mailNow, ...libraryNow });
  });
  return router;
}
