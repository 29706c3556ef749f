import { z } from 'zod';
import { roleSchema } from './groups';

/**
 * Accounts and sessions: one zod schema per request/response DTO, shared by the server (parsing),
 * the app's forms (zodResolver) and the API client (parsing responses). Ids are strings, dates ISO.
 */

export const PASSWORD_MIN_LENGTH = 12; // OWASP ASVS 4.0 V2.1.1
/** Argon2 hashes any length, but a cap keeps a megabyte "password" from costing the server. */
export const PASSWORD_MAX_LENGTH = 256;

export const emailSchema = z
  .string({ error: 'Enter an e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email('Enter a valid e-mail address, like name@example.org.').max(254, 'An e-mail address has at most 254 characters.'));

/** A new password (sign-up, reset). The server also rejects common passwords. */
export const newPasswordSchema = z
  .string({ error: 'Enter a password.' })
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(PASSWORD_MAX_LENGTH, `Use at most ${PASSWORD_MAX_LENGTH} characters.`);

export const displayNameSchema = z
  .string({ error: 'Enter a display name.' })
  .trim()
  .min(1, 'Enter a display name.')
  .max(80, 'A display name has at most 80 characters.');

/** A single-use token from an e-mailed link (verification, reset, invitation). */
export const linkTokenSchema = z
  .string({ error: 'The link token is missing.' })
  .trim()
  .min(16, 'The link token is too short: copy the whole link.')
  .max(128, 'The link token is too long.');

export const signUpInputSchema = z.object({
  email: emailSchema,
  password: newPasswordSchema,
  displayName: displayNameSchema,
});
export type SignUpInput = z.infer<typeof signUpInputSchema>;

export const signInInputSchema = z.object({
  email: emailSchema,
  // No length rule here: a sign-in form only checks that something was typed.
  password: z.string({ error: 'Enter your password.' }).min(1, 'Enter your password.').max(PASSWORD_MAX_LENGTH),
});
export type SignInInput = z.infer<typeof signInInputSchema>;

export const verifyEmailInputSchema = z.object({ token: linkTokenSchema });
export type VerifyEmailInput = z.infer<typeof verifyEmailInputSchema>;

export const passwordResetRequestInputSchema = z.object({ email: emailSchema });
export type PasswordResetRequestInput = z.infer<typeof passwordResetRequestInputSchema>;

export const passwordResetConfirmInputSchema = z.object({ token: linkTokenSchema, password: newPasswordSchema });
export type PasswordResetConfirmInput = z.infer<typeof passwordResetConfirmInputSchema>;

/** Signed in: the current password (re-authentication) and the new one. */
export const passwordChangeInputSchema = z.object({
  currentPassword: z.string({ error: 'Enter your current password.' }).min(1, 'Enter your current password.').max(PASSWORD_MAX_LENGTH),
  newPassword: newPasswordSchema,
});
export type PasswordChangeInput = z.infer<typeof passwordChangeInputSchema>;

export const updateMeInputSchema = z.object({ displayName: displayNameSchema });
export type UpdateMeInput = z.infer<typeof updateMeInputSchema>;

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  displayName: z.string(),
});
export type UserDto = z.infer<typeof userSchema>;

export const membershipSummarySchema = z.object({
  groupId: z.string(),
  groupName: z.string(),
  role: roleSchema,
});
export type MembershipSummary = z.infer<typeof membershipSummarySchema>;

/** GET /api/auth/me, and the answer to a successful sign-in. */
export const meResponseSchema = z.object({
  user: userSchema,
  memberships: z.array(membershipSummarySchema),
});
export type MeResponse = z.infer<typeof meResponseSchema>;

/** GET /api/auth/session: the signed-in person, or null for a visitor (200 either way). */
export const sessionStateResponseSchema = z.object({ me: meResponseSchema.nullable() });
export type SessionStateResponse = z.infer<typeof sessionStateResponseSchema>;

/** Answers that only carry a sentence for the person (sign-up, verify, reset). */
export const messageResponseSchema = z.object({ message: z.string() });
export type MessageResponse = z.infer<typeof messageResponseSchema>;

export const sessionSchema = z.object({
  /** A public handle (a hash of the secret session id): it cannot be used as a cookie. */
  id: z.string(),
  createdAt: z.iso.datetime(),
  expiresAt: z.iso.datetime(),
  userAgent: z.string().nullable(),
  ip: z.string().nullable(),
  current: z.boolean(),
});
export type SessionDto = z.infer<typeof sessionSchema>;

export const sessionsResponseSchema = z.object({ sessions: z.array(sessionSchema) });
export type SessionsResponse = z.infer<typeof sessionsResponseSchema>;

/** GET /api/dev/outbox (development and tests only): what the local mail sink received. */
export const outboxMessageSchema = z.object({
  id: z.string(),
  receivedAt: z.iso.datetime(),
  from: z.string(),
  to: z.array(z.string()),
  subject: z.string(),
  text: z.string(),
  html: z.string(),
  links: z.array(z.string()),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxResponseSchema = z.object({ messages: z.array(outboxMessageSchema) });
