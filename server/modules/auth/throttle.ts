import type { EntityManager } from '@mikro-orm/core';

/**
 * Fixed-window attempt counters in PostgreSQL (table auth_throttle), shared by every server
 * process over the same database. Times come from the database clock, not the process clock.
 */
export interface ThrottleRule {
  key: string;
  limit: number;
  windowSeconds: number;
}

/** Seconds until the first exhausted rule frees up, or null when every rule still allows an attempt. */
export async function throttledFor(em: EntityManager, rules: ThrottleRule[]): Promise<number | null> {
  let retryAfter: number | null = null;
  for (const rule of rules) {
    const rows = await em.getConnection().execute<{ retry: string | number }[]>(
      `select ceil(extract(epoch from ("window_started_at" + make_interval(secs => ?) - now()))) as retry
         from "auth_throttle"
        where "key" = ? and "attempts" >= ? and "window_started_at" > now() - make_interval(secs => ?)`,
      [rule.windowSeconds, rule.key, rule.limit, rule.windowSeconds],
    );
    const row = rows[0];
    if (row) {
      const seconds = Math.max(1, Number(row.retry));
      retryAfter = Math.max(retryAfter ?? 0, seconds);
    }
  }
  return retryAfter;
}

/** Counts one attempt against each rule (one atomic upsert each; a stale window starts over). */
export async function countAttempt(em: EntityManager, rules: ThrottleRule[]): Promise<void> {
  for (const rule of rules) {
    await em.getConnection().execute(
      `insert into "auth_throttle" ("key", "attempts", "window_started_at") values (?, 1, now())
       on conflict ("key") do update set
         "attempts" = case when "auth_throttle"."window_started_at" <= now() - make_interval(secs => ?)
                           then 1 else "auth_throttle"."attempts" + 1 end,
         "window_started_at" = case when "auth_throttle"."window_started_at" <= now() - make_interval(secs => ?)
                           then now() else "auth_throttle"."window_started_at" end`,
      [rule.key, rule.windowSeconds, rule.windowSeconds],
      'run',
    );
  }
}

/** Removes the counters with these keys, and every counter whose key starts with one of `prefixes`. */
export async function clearAttempts(em: EntityManager, keys: string[], prefixes: string[] = []): Promise<void> {
  for (const key of keys) {
    await em.getConnection().execute('delete from "auth_throttle" where "key" = ?', [key], 'run');
  }
  for (const prefix of prefixes) {
    await em.getConnection().execute(`delete from "auth_throttle" where left("key", ?) = ?`, [prefix.length, prefix], 'run');
  }
}
