import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { Session, User } from 'lucia';
import { parseCookies } from 'oslo/cookie';
import { verifyRequestOrigin } from 'oslo/request';
import { roleAtLeast, type Role } from '@/lib/schemas/groups';
import type { AccountsContext } from '@/server/modules/auth/auth-context';
import { SESSION_COOKIE_NAME } from '@/server/modules/auth/lucia';
import { AppError } from './errors';

/**
 * Authentication and authorisation for every API route, in one place:
 * - `attachAccounts(ctx)` (mounted once on /api) makes the session resolvable for the request;
 * - `requireAuth` → 401 UNAUTHENTICATED when signed out;
 * - `requireGroupRole(minRole)` reads `:groupId` → 401 signed out, 404 NOT_FOUND when the group
 *   does not exist *or* the person is not a member (the two look the same, so ids leak nothing),
 *   403 FORBIDDEN when a member's role is below `minRole` (viewer < contributor < curator < admin);
 * - `getAuth(res)`, `getMembership(res)` read the result in a handler.
 */

export interface AuthState {
  user: User;
  session: Session;
}

export interface MembershipState {
  groupId: string;
  groupName: string;
  role: Role;
}

declare global {
  namespace Express {
    interface Locals {
      accounts?: AccountsContext;
      authPromise?: Promise<AuthState | null>;
      auth?: AuthState;
      membership?: MembershipState;
    }
  }
}

export const ABSOLUTE_SESSION_LIFETIME_MS = 30 * 86_400_000;

const uuidPattern = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isUuid = (value: unknown): value is string => typeof value === 'string' && uuidPattern.test(value);

/**
 * Over HTTPS the cookie carries the `__Host-` prefix: browsers then accept it only when Secure, with
 * Path=/ and no Domain, so a sibling subdomain cannot plant or overwrite it (RFC 6265bis, cookie
 * prefixes). Over plain HTTP (development) the name has no prefix, which browsers would refuse.
 */
export function sessionCookieNameFor(req: Request): string {
  return req.secure ? `__Host-${SESSION_COOKIE_NAME}` : SESSION_COOKIE_NAME;
}

/** Writes the session cookie: HttpOnly, SameSite=Lax, Path=/, Secure (and `__Host-`) when the request came over HTTPS. */
function setSessionCookie(req: Request, res: Response, ctx: AccountsContext, sessionId: string | null) {
  const cookie = sessionId ? ctx.lucia.createSessionCookie(sessionId) : ctx.lucia.createBlankSessionCookie();
  res.cookie(sessionCookieNameFor(req), cookie.value, {
    httpOnly: true,
    sameSite: 'lax',
    path: '/',
    // req.secure honours X-Forwarded-Proto only from a proxy named in TRUST_PROXY (none by default).
    secure: req.secure,
    maxAge: (cookie.attributes.maxAge ?? 0) * 1000,
  });
}

export function startSession(req: Request, res: Response, sessionId: string) {
  setSessionCookie(req, res, accountsOf(res), sessionId);
}

export function clearSessionCookie(req: Request, res: Response) {
  setSessionCookie(req, res, accountsOf(res), null);
}

function accountsOf(res: Response): AccountsContext {
  const ctx = res.locals.accounts;
  if (!ctx) throw new Error('attachAccounts() is not mounted before this route.');
  return ctx;
}

/** The session id from the cookie this request's scheme uses (only the prefixed one over HTTPS). */
export function readSessionId(req: Request, _res: Response): string | null {
  return parseCookies(req.headers.cookie ?? '').get(sessionCookieNameFor(req)) || null;
}

/** The signed-in person for this request, or null; looked up once, only when a route asks. */
export function resolveAuth(req: Request, res: Response): Promise<AuthState | null> {
  res.locals.authPromise ??= (async () => {
    const ctx = accountsOf(res);
    const sessionId = readSessionId(req, res);
    if (!sessionId) return null;
    const { session, user } = await ctx.lucia.validateSession(sessionId);
    // Absolute limit on top of the sliding one: re-authenticate at least every 30 days (ASVS 4.0 V3.3.2).
    const tooOld = session && Date.now() - session.createdAt.getTime() > ABSOLUTE_SESSION_LIFETIME_MS;
    if (!session || tooOld) {
      if (tooOld) await ctx.lucia.invalidateSession(session.id);
      setSessionCookie(req, res, ctx, null);
      return null;
    }
    // Sliding expiry: lucia moved the expiry forward; send the cookie again with the new date.
    if (session.fresh) setSessionCookie(req, res, ctx, session.id);
    res.locals.auth = { session, user };
    return res.locals.auth;
  })();
  return res.locals.authPromise;
}

export function attachAccounts(ctx: AccountsContext): RequestHandler {
  return (_req, res, next) => {
    res.locals.accounts = ctx;
    next();
  };
}

export const requireAuth: RequestHandler = async (req, res, next) => {
  const auth = await resolveAuth(req, res);
  if (!auth) throw new AppError('UNAUTHENTICATED', 'Sign in to continue.');
  next();
};

/** The membership read with the session (one statement per request, see lucia.ts). */
function membershipIn(auth: AuthState, groupId: unknown): MembershipState | null {
  if (!isUuid(groupId)) return null;
  const wanted = groupId.toLowerCase();
  return auth.user.memberships.find((m) => m.groupId === wanted) ?? null;
}

/** Signed in, a member of `:groupId`, with at least `minRole`. */
export function requireGroupRole(minRole: Role): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const auth = await resolveAuth(req, res);
    if (!auth) throw new AppError('UNAUTHENTICATED', 'Sign in to continue.');
    const membership = membershipIn(auth, req.params.groupId);
    if (!membership) throw new AppError('NOT_FOUND', 'That group was not found.');
    if (!roleAtLeast(membership.role, minRole)) {
      throw new AppError('FORBIDDEN', `This needs the ${minRole} role or higher in this group; you are a ${membership.role}.`);
    }
    res.locals.membership = membership;
    next();
  };
}

export function getAuth(res: Response): AuthState {
  const auth = res.locals.auth;
  if (!auth) throw new Error('getAuth() used on a route without requireAuth/requireGroupRole.');
  return auth;
}

export function getMembership(res: Response): MembershipState {
  const membership = res.locals.membership;
  if (!membership) throw new Error('getMembership() used on a route without requireGroupRole.');
  return membership;
}

const stateChanging = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * CSRF defence by origin (OWASP CSRF cheat sheet, "verifying origin with standard headers"):
 * a state-changing request must name our own origin when it carries the session cookie or an
 * Origin header; the Referer stands in when a cookie comes without Origin. Requests with neither
 * (command-line clients of the public engine endpoints) pass. Allowed: the Host the request was
 * sent to, and the host of APP_URL (a proxy in front may rewrite Host).
 */
export function originCheck(appUrl: string): RequestHandler {
  const appHost = new URL(appUrl).host;
  return (req, _res, next) => {
    if (!stateChanging.has(req.method)) return next();
    const allowed = [req.get('host') ?? '', appHost].filter(Boolean);
    const origin = req.get('origin');
    const hasSessionCookie = (req.headers.cookie ?? '').split(';').some((c) => /^(__Host-)?[^=]+=/.test(c.trim()) && c.trim().replace(/^__Host-/, '').startsWith(`${SESSION_COOKIE_NAME}=`));
    if (origin !== undefined) {
      if (verifyRequestOrigin(origin, allowed)) return next();
      return next(new AppError('FORBIDDEN', 'This request came from another site and was refused.'));
    }
    if (!hasSessionCookie) return next();
    const referer = req.get('referer');
    if (referer && verifyRequestOrigin(referer, allowed)) return next();
    next(new AppError('FORBIDDEN', 'This request did not say where it came from and was refused (missing Origin).'));
  };
}
