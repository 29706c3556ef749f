import { Router, type ErrorRequestHandler, type Request } from 'express';
import {
  passwordChangeInputSchema,
  passwordResetConfirmInputSchema,
  passwordResetRequestInputSchema,
  signInInputSchema,
  signUpInputSchema,
  updateMeInputSchema,
  verifyEmailInputSchema,
  type MessageResponse,
} from '@/lib/schemas/auth';
import {
  clearSessionCookie,
  getAuth,
  readSessionId,
  requireAuth,
  resolveAuth,
  startSession,
} from '@/server/http/auth-middleware';
import { requestEm } from '@/server/db/request-context';
import { AppError } from '@/server/http/errors';
import { parseWith } from '@/server/http/validate';
import type { AccountsContext, RequestMeta } from './auth-context';
import * as auth from './auth.service';

const metaOf = (req: Request): RequestMeta => ({
  ip: req.ip ?? req.socket.remoteAddress ?? 'unknown',
  userAgent: req.get('user-agent') ?? null,
});

const message = (text: string): MessageResponse => ({ message: text });

/** Sends Retry-After with every 429 from these routes (RFC 9110 §10.2.3). */
export const retryAfterHeader: ErrorRequestHandler = (error, _req, res, next) => {
  if (error instanceof AppError && error.code === 'RATE_LIMITED') {
    const seconds = Number(error.extra?.retryAfterSeconds);
    if (Number.isFinite(seconds) && seconds > 0) res.setHeader('Retry-After', String(Math.ceil(seconds)));
  }
  next(error);
};

export function authRoutes(ctx: AccountsContext): Router {
  const router = Router();
  const em = requestEm;

  router.post('/auth/sign-up', async (req, res) => {
    const input = parseWith(signUpInputSchema, req.body);
    await auth.signUp(ctx, em(), input, metaOf(req));
    res.status(202).json(message('Check your e-mail: we have sent a link to confirm your address.'));
  });

  router.post('/auth/verify', async (req, res) => {
    const { token } = parseWith(verifyEmailInputSchema, req.body);
    await auth.verifyEmail(em(), token);
    res.json(message('Your e-mail address is confirmed. You can sign in now.'));
  });

  router.post('/auth/sign-in', async (req, res) => {
    const input = parseWith(signInInputSchema, req.body);
    const manager = em();
    const { userId, session } = await auth.signIn(ctx, manager, input, metaOf(req));
    // A session presented before sign-in is ended, never promoted (no session fixation).
    const previous = readSessionId(req, res);
    if (previous) await ctx.lucia.invalidateSession(previous);
    startSession(req, res, session.id);
    res.json(await auth.getMe(manager, userId));
  });

  router.post('/auth/sign-out', async (req, res) => {
    const current = await resolveAuth(req, res);
    if (current) await ctx.lucia.invalidateSession(current.session.id);
    clearSessionCookie(req, res);
    res.status(204).end();
  });

  router.post('/auth/sign-out-everywhere', requireAuth, async (req, res) => {
    await ctx.lucia.invalidateUserSessions(getAuth(res).user.id);
    clearSessionCookie(req, res);
    res.status(204).end();
  });

  // For the app: who is signed in, if anyone. Signed out is an answer here (200 with `me: null`), not a
  // failure, so a visitor's browser logs no error; /auth/me keeps its 401 for scripts.
  router.get('/auth/session', async (req, res) => {
    const current = await resolveAuth(req, res);
    res.setHeader('Cache-Control', 'no-store');
    res.json({ me: current ? auth.meFromSession(current.user) : null });
  });

  router.get('/auth/me', requireAuth, async (_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json(auth.meFromSession(getAuth(res).user));
  });

  router.patch('/auth/me', requireAuth, async (req, res) => {
    const { displayName } = parseWith(updateMeInputSchema, req.body);
    const manager = em();
    await auth.updateDisplayName(manager, getAuth(res).user.id, displayName);
    res.json(await auth.getMe(manager, getAuth(res).user.id));
  });

  router.post('/auth/password-reset/request', async (req, res) => {
    const { email } = parseWith(passwordResetRequestInputSchema, req.body);
    await auth.requestPasswordReset(ctx, em(), email, metaOf(req));
    res.status(202).json(message('If that address has an account, a link to choose a new password is on its way.'));
  });

  router.post('/auth/password-reset/confirm', async (req, res) => {
    const input = parseWith(passwordResetConfirmInputSchema, req.body);
    await auth.confirmPasswordReset(ctx, em(), input);
    clearSessionCookie(req, res);
    res.json(message('Your password is changed and you are signed out everywhere. Sign in with the new password.'));
  });

  router.post('/auth/password', requireAuth, async (req, res) => {
    const input = parseWith(passwordChangeInputSchema, req.body);
    const { user, session } = getAuth(res);
    await auth.changePassword(ctx, em(), user.id, session.id, input);
    res.json(message('Your password is changed. Other devices where you were signed in have been signed out.'));
  });

  router.get('/auth/sessions', requireAuth, async (_req, res) => {
    const { user, session } = getAuth(res);
    res.setHeader('Cache-Control', 'no-store');
    res.json({ sessions: await auth.listSessions(em(), user.id, session.id) });
  });

  router.delete('/auth/sessions/:id', requireAuth, async (req, res) => {
    const { user, session } = getAuth(res);
    const handle = String(req.params.id);
    if (!/^[0-9a-f]{64}$/.test(handle)) throw new AppError('NOT_FOUND', 'That session was not found.');
    const wasCurrent = await auth.endSession(em(), user.id, handle, session.id);
    if (wasCurrent) clearSessionCookie(req, res);
    res.status(204).end();
  });

  router.use('/auth', retryAfterHeader);
  return router;
}
