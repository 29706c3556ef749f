import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/core';
import type { User as SessionUser } from 'lucia';
import type {
  MeResponse,
  PasswordChangeInput,
  PasswordResetConfirmInput,
  SessionDto,
  SignInInput,
  SignUpInput,
} from '@/lib/schemas/auth';
import { AppError } from '@/server/http/errors';
import { recordAudit } from '@/server/modules/audit/audit.service';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import {
  alreadyRegisteredMail,
  passwordChangedMail,
  resetPasswordMail,
  resetUnknownAddressMail,
  verifyEmailMail,
} from '@/server/modules/mail/templates';
import type { AccountsContext, RequestMeta } from './auth-context';
import { EmailToken, type EmailTokenPurpose } from './email-token.entity';
import { hashPassword, verifyAgainstDummy, verifyPassword, weakPasswordReason } from './password';
import { clearAttempts, countAttempt, throttledFor, type ThrottleRule } from './throttle';
import { generateLinkToken, hashSecret } from './tokens';
import { User } from './user.entity';
import { UserSession } from './user-session.entity';

const invalidLink = () =>
  new AppError('VALIDATION_FAILED', 'This link is not valid any more: it was already used, it has expired, or a newer one was sent.', {
    token: 'invalid, used or expired',
  });

/** The one answer to every failed sign-in, whatever the reason (no account enumeration). */
const signInFailed = () => new AppError('UNAUTHENTICATED', 'The e-mail address or the password is not right.');

export function rateLimited(retryAfterSeconds: number) {
  return new AppError(
    'RATE_LIMITED',
    `Too many attempts. Try again in ${Math.ceil(retryAfterSeconds / 60)} minute(s).`,
    undefined,
    { retryAfterSeconds },
  );
}

/** `field` names the form field the reason belongs to (`password`, or `newPassword` when changing). */
function assertStrongPassword(password: string, email: string, field = 'password') {
  const reason = weakPasswordReason(password, { email });
  if (reason) throw new AppError('VALIDATION_FAILED', `The password is too weak: ${reason}`, { [field]: reason });
}

// ---- tokens ------------------------------------------------------------------------------------

/** A new single-use token; earlier unused tokens of the same purpose for this user stop working. */
async function issueEmailToken(em: EntityManager, userId: string, purpose: EmailTokenPurpose, lifetimeMs: number) {
  await em.nativeUpdate(EmailToken, { userId, purpose, usedAt: null }, { usedAt: new Date() });
  const token = generateLinkToken();
  em.create(EmailToken, { userId, purpose, tokenHash: hashSecret(token), expiresAt: new Date(Date.now() + lifetimeMs) });
  await em.flush();
  return token;
}

/** A one-time link on which the owner of an account sets a password (the first administrator's). */
export function issueSetPasswordLink(em: EntityManager, userId: string, lifetimeMs: number): Promise<string> {
  return issueEmailToken(em, userId, 'reset-password', lifetimeMs);
}

/** Uses a token up in one atomic statement (two concurrent uses cannot both succeed). */
async function consumeEmailToken(em: EntityManager, token: string, purpose: EmailTokenPurpose): Promise<string> {
  const rows = await em.getConnection().execute<{ user_id: string }[]>(
    `update "email_token" set "used_at" = now()
      where "token_hash" = ? and "purpose" = ? and "used_at" is null and "expires_at" > now()
      returning "user_id"`,
    [hashSecret(token), purpose],
  );
  const userId = rows[0]?.user_id;
  if (!userId) throw invalidLink();
  return userId;
}

const link = (ctx: AccountsContext, route: string, token?: string) =>
  `${ctx.appUrl}${route}${token ? `?token=${encodeURIComponent(token)}` : ''}`;

// ---- users -------------------------------------------------------------------------------------

export async function createUser(
  em: EntityManager,
  input: { email: string; displayName: string; passwordHash: string; verified: boolean },
) {
  const user = em.create(User, {
    id: randomUUID(),
    email: input.email.toLowerCase(),
    displayName: input.displayName,
    passwordHash: input.passwordHash,
    emailVerifiedAt: input.verified ? new Date() : null,
  });
  await em.flush();
  return user;
}

function findUserWithHash(em: EntityManager, email: string) {
  return em.findOne(User, { email: email.toLowerCase() });
}

/**
 * Sign-up answers the same whatever the address: a new address gets a verification link, a
 * verified one a "you already have an account" note. An unverified account is taken over by the
 * newest sign-up (new password, new link): whoever can read the mailbox owns the address.
 */
export async function signUp(ctx: AccountsContext, em: EntityManager, input: SignUpInput, meta: RequestMeta) {
  const retry = await throttledFor(em, mailRules(ctx, input.email, meta.ip));
  if (retry) throw rateLimited(retry);
  assertStrongPassword(input.password, input.email);
  await countAttempt(em, mailRules(ctx, input.email, meta.ip));
  const passwordHash = await hashPassword(input.password);
  const existing = await em.findOne(User, { email: input.email });
  if (existing?.emailVerifiedAt) {
    await ctx.mailer.send(
      alreadyRegisteredMail(existing.email, existing.displayName, link(ctx, '/sign-in'), link(ctx, '/reset-password')),
    );
    return;
  }
  const user = existing ?? (await createUser(em, { ...input, passwordHash, verified: false }));
  if (existing) {
    existing.passwordHash = passwordHash;
    existing.displayName = input.displayName;
  }
  recordAudit(em, { actorId: user.id, action: 'user.signed-up', subjectType: 'user', subjectId: user.id });
  const token = await issueEmailToken(em, user.id, 'verify-email', ctx.settings.verifyTokenHours * 3600_000);
  await ctx.mailer.send(verifyEmailMail(user.email, user.displayName, link(ctx, '/verify', token), ctx.settings.verifyTokenHours));
}

async function sendVerification(ctx: AccountsContext, em: EntityManager, user: { id: string; email: string; displayName: string }) {
  const token = await issueEmailToken(em, user.id, 'verify-email', ctx.settings.verifyTokenHours * 3600_000);
  await ctx.mailer.send(verifyEmailMail(user.email, user.displayName, link(ctx, '/verify', token), ctx.settings.verifyTokenHours));
}

export async function verifyEmail(em: EntityManager, token: string) {
  const userId = await consumeEmailToken(em, token, 'verify-email');
  await em.nativeUpdate(User, { id: userId, emailVerifiedAt: null }, { emailVerifiedAt: new Date() });
  recordAudit(em, { actorId: userId, action: 'user.email-verified', subjectType: 'user', subjectId: userId });
  await em.flush();
}

/**
 * Sign-in throttling that a stranger cannot turn against the owner (OWASP Authentication Cheat
 * Sheet, "Account Lockout": lock-out by account alone lets anyone deny service; count per account
 * and IP, and limit each IP). A guesser meets the address-and-IP limit; the per-IP limit stops one
 * client trying many addresses; the much higher per-address limit slows guessing spread over many
 * IPs. The owner, signing in from their own address, is blocked only by that last cap, and their
 * password-reset link lifts every counter of the address.
 */
function signInRules(ctx: AccountsContext, email: string, ip: string): ThrottleRule[] {
  const window = ctx.settings.signInWindowSeconds;
  return [
    { key: `sign-in:address-ip:${email}|${ip}`, limit: ctx.settings.signInFailuresPerAddressAndIp, windowSeconds: window },
    { key: `sign-in:ip:${ip}`, limit: ctx.settings.signInFailuresPerIp, windowSeconds: window },
    { key: `sign-in:address:${email}`, limit: ctx.settings.signInFailuresPerAddress, windowSeconds: window },
  ];
}

function mailRules(ctx: AccountsContext, email: string, ip: string): ThrottleRule[] {
  const window = ctx.settings.mailWindowSeconds;
  return [
    { key: `mail:address:${email}`, limit: ctx.settings.mailRequestsPerAddress, windowSeconds: window },
    { key: `mail:ip:${ip}`, limit: ctx.settings.mailRequestsPerIp, windowSeconds: window },
  ];
}

/**
 * Checks the password and opens a new session (a new id every time: no fixation). Unverified
 * accounts cannot sign in: with the right password the answer says so and a new link is sent.
 */
export async function signIn(ctx: AccountsContext, em: EntityManager, input: SignInInput, meta: RequestMeta) {
  const rules = signInRules(ctx, input.email, meta.ip);
  const retry = await throttledFor(em, rules);
  if (retry) throw rateLimited(retry);

  const user = await findUserWithHash(em, input.email);
  const passwordOk = user ? await verifyPassword(user.passwordHash, input.password) : await verifyAgainstDummy(input.password);
  if (!user || !passwordOk) {
    await countAttempt(em, rules);
    throw signInFailed();
  }
  await clearAttempts(em, [`sign-in:address-ip:${input.email}|${meta.ip}`]);
  if (!user.emailVerifiedAt) {
    // A new link at most once per window per account: signing in again and again sends no stream of mail.
    const resend: ThrottleRule[] = [{ key: `verify-mail:user:${user.id}`, limit: 1, windowSeconds: ctx.settings.verificationResendSeconds }];
    if ((await throttledFor(em, resend)) === null) {
      await countAttempt(em, resend);
      await sendVerification(ctx, em, user);
    }
    throw new AppError(
      'FORBIDDEN',
      'Confirm your e-mail address first: we have sent you a new link.',
      undefined,
      { reason: 'EMAIL_NOT_VERIFIED' },
    );
  }
  const session = await ctx.lucia.createSession(user.id, {
    createdAt: new Date(),
    userAgent: meta.userAgent?.slice(0, 300) ?? null,
    ip: meta.ip.slice(0, 64),
  });
  return { userId: user.id, session };
}

export async function requestPasswordReset(ctx: AccountsContext, em: EntityManager, email: string, meta: RequestMeta) {
  const rules = mailRules(ctx, email, meta.ip);
  const retry = await throttledFor(em, rules);
  if (retry) throw rateLimited(retry);
  await countAttempt(em, rules);
  const user = await em.findOne(User, { email });
  if (!user) {
    // The unknown address gets a message too, so both paths take about as long.
    await ctx.mailer.send(resetUnknownAddressMail(email, link(ctx, '/sign-up')));
    return;
  }
  const token = await issueEmailToken(em, user.id, 'reset-password', ctx.settings.resetTokenMinutes * 60_000);
  await ctx.mailer.send(resetPasswordMail(user.email, user.displayName, link(ctx, '/reset-password', token), ctx.settings.resetTokenMinutes));
}

/** A reset also proves the address (it came by e-mail), and signs the person out everywhere. */
export async function confirmPasswordReset(ctx: AccountsContext, em: EntityManager, input: PasswordResetConfirmInput) {
  const tokenHash = hashSecret(input.token);
  const pending = await em.findOne(EmailToken, { tokenHash, purpose: 'reset-password', usedAt: null, expiresAt: { $gt: new Date() } });
  const owner = pending ? await em.findOne(User, { id: pending.userId }) : null;
  if (!owner) throw invalidLink();
  assertStrongPassword(input.password, owner.email);
  const userId = await consumeEmailToken(em, input.token, 'reset-password');
  const passwordHash = await hashPassword(input.password);
  await em.nativeUpdate(User, { id: userId }, { passwordHash, emailVerifiedAt: owner.emailVerifiedAt ?? new Date(), updatedAt: new Date() });
  await ctx.lucia.invalidateUserSessions(userId);
  await clearAttempts(em, [`sign-in:address:${owner.email}`], [`sign-in:address-ip:${owner.email}|`]);
  recordAudit(em, { actorId: userId, action: 'user.password-reset', subjectType: 'user', subjectId: userId });
  await em.flush();
  await ctx.mailer.send(passwordChangedMail(owner.email, owner.displayName, 'reset', link(ctx, '/forgot-password')));
}

/**
 * A signed-in change of password: the current password first (a session left open on a shared
 * computer is not enough, ASVS V3.7.1), wrong guesses throttled like sign-ins. The session that
 * asked stays; every other one ends; the owner gets an e-mail about it.
 */
export async function changePassword(
  ctx: AccountsContext,
  em: EntityManager,
  userId: string,
  currentSessionId: string,
  input: PasswordChangeInput,
) {
  const rules: ThrottleRule[] = [
    { key: `password-change:user:${userId}`, limit: ctx.settings.passwordChangeFailures, windowSeconds: ctx.settings.signInWindowSeconds },
  ];
  const retry = await throttledFor(em, rules);
  if (retry) throw rateLimited(retry);
  const user = await em.findOneOrFail(User, { id: userId });
  if (!(await verifyPassword(user.passwordHash, input.currentPassword))) {
    await countAttempt(em, rules);
    throw new AppError('VALIDATION_FAILED', 'The current password is not right.', { currentPassword: 'That is not your current password.' });
  }
  if (input.newPassword === input.currentPassword) {
    throw new AppError('VALIDATION_FAILED', 'The new password is the same as the current one.', { newPassword: 'Choose a password different from the current one.' });
  }
  assertStrongPassword(input.newPassword, user.email, 'newPassword');
  await em.nativeUpdate(User, { id: userId }, { passwordHash: await hashPassword(input.newPassword), updatedAt: new Date() });
  await em.nativeDelete(UserSession, { userId, id: { $ne: hashSecret(currentSessionId) } });
  await clearAttempts(em, rules.map((rule) => rule.key));
  recordAudit(em, { actorId: userId, action: 'user.password-changed', subjectType: 'user', subjectId: userId });
  await em.flush();
  await ctx.mailer.send(passwordChangedMail(user.email, user.displayName, 'changed', link(ctx, '/forgot-password')));
}

// ---- me and sessions ---------------------------------------------------------------------------

export async function getMe(em: EntityManager, userId: string): Promise<MeResponse> {
  const user = await em.findOneOrFail(User, { id: userId });
  const memberships = await em.find(GroupMembership, { userId });
  const groups = memberships.length
    ? await em.find(ResearchGroup, { id: { $in: memberships.map((m) => m.groupId) } })
    : [];
  const nameOf = new Map(groups.map((g) => [g.id, g.name]));
  return {
    user: { id: user.id, email: user.email, displayName: user.displayName },
    memberships: memberships
      .map((m) => ({ groupId: m.groupId, groupName: nameOf.get(m.groupId) ?? '', role: m.role }))
      .sort((a, b) => a.groupName.localeCompare(b.groupName)),
  };
}

/** The same answer as getMe, from what the session lookup already read (no query). */
export function meFromSession(user: SessionUser): MeResponse {
  return {
    user: { id: user.id, email: user.email, displayName: user.displayName },
    memberships: [...user.memberships].sort((a, b) => a.groupName.localeCompare(b.groupName)),
  };
}

export async function updateDisplayName(em: EntityManager, userId: string, displayName: string) {
  const user = await em.findOneOrFail(User, { id: userId });
  user.displayName = displayName;
  await em.flush();
}

export async function listSessions(em: EntityManager, userId: string, currentSessionId: string): Promise<SessionDto[]> {
  const currentHandle = hashSecret(currentSessionId);
  const rows = await em.find(UserSession, { userId, expiresAt: { $gt: new Date() } }, { orderBy: { createdAt: 'desc' } });
  return rows.map((row) => ({
    id: row.id,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
    userAgent: row.userAgent ?? null,
    ip: row.ip ?? null,
    current: row.id === currentHandle,
  }));
}

/** Ends one of the person's own sessions by its public handle; true when it was the current one. */
export async function endSession(em: EntityManager, userId: string, handle: string, currentSessionId: string) {
  const deleted = await em.nativeDelete(UserSession, { id: handle, userId });
  if (deleted === 0) throw new AppError('NOT_FOUND', 'That session was not found.');
  return handle === hashSecret(currentSessionId);
}
