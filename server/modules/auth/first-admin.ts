import { randomBytes } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/core';
import { z } from 'zod';
import { AppError } from '@/server/http/errors';
import { createGroup } from '@/server/modules/groups/groups.service';
import { createUser, issueSetPasswordLink } from './auth.service';
import { DEMO_PASSWORD, demoAccounts } from './demo-accounts';
import { hashPassword, verifyPassword } from './password';
import { User } from './user.entity';

/** The link lives long enough to be passed on by hand, and works once. */
export const FIRST_ADMIN_LINK_HOURS = 72;

export const firstAdminInputSchema = z
  .object({
    email: z.email('Give the new administrator’s e-mail address (--email).').max(254),
    name: z.string().trim().min(1, 'Give the administrator’s name (--name).').max(80),
    group: z.string().trim().min(1, 'Give the name of the first research group (--group).').max(120),
  })
  .strict();
export type FirstAdminInput = z.infer<typeof firstAdminInputSchema>;

/**
 * The first person of a production installation: an account with no usable password, the admin
 * of a new research group, and a one-time link (valid FIRST_ADMIN_LINK_HOURS) on which they choose
 * their password; following it also verifies the address. Refuses an address that already has an account.
 */
export async function createFirstAdmin(em: EntityManager, input: FirstAdminInput, appUrl: string): Promise<{ link: string; userId: string; groupId: string }> {
  const email = input.email.toLowerCase();
  if (await em.findOne(User, { email })) throw new AppError('CONFLICT', `An account for ${email} already exists; use "Forgot password" on the sign-in page instead.`);
  // Nobody knows this password: the account can only be entered through the link.
  const passwordHash = await hashPassword(randomBytes(32).toString('base64url'));
  const user = await createUser(em, { email, displayName: input.name, passwordHash, verified: false });
  const group = await createGroup(em, user.id, input.group);
  const token = await issueSetPasswordLink(em, user.id, FIRST_ADMIN_LINK_HOURS * 3_600_000);
  const url = new URL('/reset-password', appUrl);
  url.searchParams.set('token', token);
  return { link: url.toString(), userId: user.id, groupId: group.id };
}

/**
 * The demo accounts (demo-accounts.ts) that still open with the published demo password. A
 * production server refuses to start while any exists.
 */
export async function demoAccountsWithDemoPassword(em: EntityManager): Promise<string[]> {
  const users = await em.find(User, { email: { $in: demoAccounts.map((account) => account.email) } });
  const open: string[] = [];
  for (const user of users) if (await verifyPassword(user.passwordHash, DEMO_PASSWORD)) open.push(user.email);
  return open;
}
