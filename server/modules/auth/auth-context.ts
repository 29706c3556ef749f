import type { Orm } from '@/server/db/orm';
import type { Mailer } from '@/server/modules/mail/mailer';
import type { SphereLucia } from './lucia';

/** Limits and lifetimes of the account flows; tests may tighten them through createApp({ auth }). */
export interface AuthSettings {
  /**
   * Failed sign-ins allowed in one window: per address from one client IP (the limit a guesser
   * meets), per client IP over all addresses, and per address over all IPs (a high cap on guessing
   * spread over many IPs). A stranger therefore cannot lock the owner out from elsewhere.
   */
  signInFailuresPerAddressAndIp: number;
  signInFailuresPerAddress: number;
  signInFailuresPerIp: number;
  signInWindowSeconds: number;
  passwordChangeFailures: number;
  /** Password-reset requests (and sign-ups) allowed per address and per IP in one window. */
  mailRequestsPerAddress: number;
  mailRequestsPerIp: number;
  mailWindowSeconds: number;
  verifyTokenHours: number;
  /** A new verification link on sign-in at most once in this many seconds per account. */
  verificationResendSeconds: number;
  /** Invitations allowed per inviter and per group in an hour, and per recipient address in a day. */
  invitationsPerInviterPerHour: number;
  invitationsPerGroupPerHour: number;
  invitationsPerRecipientPerDay: number;
  resetTokenMinutes: number;
  invitationDays: number;
}

export const defaultAuthSettings: AuthSettings = {
  signInFailuresPerAddressAndIp: 5,
  signInFailuresPerAddress: 50,
  /** Password changes (current password wrong) per account in one window. */
  passwordChangeFailures: 5,
  // A whole lab may sit behind one NAT address: the per-IP limit is looser than the per-address one.
  signInFailuresPerIp: 30,
  signInWindowSeconds: 15 * 60,
  mailRequestsPerAddress: 5,
  mailRequestsPerIp: 30,
  mailWindowSeconds: 60 * 60,
  verifyTokenHours: 48,
  verificationResendSeconds: 5 * 60,
  invitationsPerInviterPerHour: 20,
  invitationsPerGroupPerHour: 40,
  invitationsPerRecipientPerDay: 3,
  resetTokenMinutes: 60,
  invitationDays: 7,
};

export interface AccountsContext {
  orm: Orm;
  lucia: SphereLucia;
  mailer: Mailer;
  /** Base of the links in e-mails, without a trailing slash. */
  appUrl: string;
  settings: AuthSettings;
}

/** Who is asking: recorded on the session and used for throttling. Services never see req/res. */
export interface RequestMeta {
  ip: string;
  userAgent: string | null;
}
