import type { EntityManager } from '@mikro-orm/postgresql';
import type { MailPreferences, UpdateMailPreferencesInput } from '@/lib/schemas/exchange';
import { UserMailPreference } from './mail-preference.entity';

export const defaultMailPreferences: MailPreferences = { reviewSubmissions: true, reviewDecisions: true };

export async function getMailPreferences(em: EntityManager, userId: string): Promise<MailPreferences> {
  const row = await em.findOne(UserMailPreference, { userId }, { refresh: true });
  return row ? { reviewSubmissions: row.reviewSubmissions, reviewDecisions: row.reviewDecisions } : { ...defaultMailPreferences };
}

export async function updateMailPreferences(em: EntityManager, userId: string, input: UpdateMailPreferencesInput): Promise<MailPreferences> {
  const merged = { ...(await getMailPreferences(em, userId)), ...input };
  await em.execute(
    `insert into user_mail_preference (user_id, review_submissions, review_decisions, updated_at) values (?, ?, ?, now())
     on conflict (user_id) do update set review_submissions = excluded.review_submissions, review_decisions = excluded.review_decisions, updated_at = now()`,
    [userId, merged.reviewSubmissions, merged.reviewDecisions],
  );
  return merged;
}

/** Ids of the people (among `userIds`) who turned the given mail off. */
export async function optedOut(em: EntityManager, userIds: string[], which: keyof MailPreferences): Promise<Set<string>> {
  if (userIds.length === 0) return new Set();
  const rows = await em.find(UserMailPreference, { userId: { $in: userIds } });
  return new Set(rows.filter((row) => !row[which]).map((row) => row.userId));
}
