import { EventEmitter } from 'node:events';
import { Client } from 'pg';
import type { Orm } from './orm';

/**
 * Tells every server process when data behind its in-memory caches changed, so the caches can be
 * dropped at once rather than trusted for a lifetime.
 *
 * - Across processes: triggers on the tables (migration 20270130000000) call
 *   `pg_notify('sphereline_change', '<topic>')`; PostgreSQL delivers the notification after the
 *   writing transaction commits, to every process that LISTENs here.
 * - Within this process: every INSERT/UPDATE/DELETE the ORM sends drops the matching caches before
 *   the write's own answer leaves, so a person always reads their own writes.
 *
 * While the listening connection is down, `healthy` is false and the caches must not be used; when it
 * comes back, everything cached is dropped (notifications may have been missed meanwhile).
 */
export type ChangeTopic = 'session' | 'library';

export const CHANGE_CHANNEL = 'sphereline_change';

/** Tables whose rows a cached session lookup (person, groups, roles) is read from. */
const SESSION_TABLES = new Set(['user_session', 'app_user', 'group_membership', 'research_group']);
/** Writes to these never change what the caches hold. */
const UNRELATED_TABLES = new Set(['auth_throttle', 'email_token', 'dev_outbox_message', 'audit_event', 'import_job', 'user_mail_preference', 'group_invitation', 'app_setting']);

const WRITE = /^\s*(?:insert\s+into|update|delete\s+from|truncate(?:\s+table)?)\s+(?:only\s+)?"?([a-z_][a-z0-9_]*)"?/i;

/** Which caches a statement may invalidate (none for reads). */
export function topicsWrittenBy(sql: string): ChangeTopic[] {
  const table = WRITE.exec(sql)?.[1]?.toLowerCase();
  if (!table || UNRELATED_TABLES.has(table)) return [];
  return SESSION_TABLES.has(table) ? ['session'] : ['library'];
}

const RECONNECT_MS = 1000;

export class ChangeFeed {
  private client: Client | null = null;
  private listening = false;
  private stopped = false;
  private retryTimer: ReturnType<typeof setTimeout> | null = null;
  private readonly events = new EventEmitter();

  constructor(private readonly databaseUrl: string) {
    this.events.setMaxListeners(50);
  }

  /** True while notifications are being received: only then may a cache be read. */
  get healthy(): boolean {
    return this.listening && !this.stopped;
  }

  on(topic: ChangeTopic, drop: () => void): void {
    this.events.on(topic, drop);
  }

  changed(topic: ChangeTopic): void {
    this.events.emit(topic);
  }

  private dropEverything(): void {
    this.changed('session');
    this.changed('library');
  }

  /** Connects and LISTENs; resolves once listening (or rejects, and keeps trying in the background). */
  async start(): Promise<void> {
    this.stopped = false;
    const client = new Client({ connectionString: this.databaseUrl, connectionTimeoutMillis: 3000 });
    client.on('notification', (message) => {
      if (message.channel !== CHANGE_CHANNEL) return;
      if (message.payload === 'session' || message.payload === 'library') this.changed(message.payload);
      else this.dropEverything();
    });
    client.on('error', () => this.lost(client));
    client.on('end', () => this.lost(client));
    this.client = client;
    try {
      await client.connect();
      await client.query(`LISTEN ${CHANGE_CHANNEL}`);
    } catch (error) {
      this.lost(client);
      throw error;
    }
    // Whatever was cached while deaf may be stale.
    this.dropEverything();
    this.listening = true;
  }

  private lost(client: Client): void {
    if (this.client !== client) return;
    this.listening = false;
    this.client = null;
    this.dropEverything();
    client.removeAllListeners('notification');
    client.end().catch(() => undefined);
    if (this.stopped || this.retryTimer) return;
    const timer = setTimeout(() => {
      this.retryTimer = null;
      if (!this.stopped) this.start().catch(() => undefined);
    }, RECONNECT_MS);
    // A retry alone must not keep the process alive.
    (timer as unknown as { unref?: () => void }).unref?.();
    this.retryTimer = timer;
  }

  /** Drops caches when this process writes (see the class comment). */
  watchWrites(orm: Orm): void {
    orm.em
      .getConnection()
      .getKnex()
      .on('query', (query: { sql?: string }) => {
        for (const topic of topicsWrittenBy(query.sql ?? '')) this.changed(topic);
      });
  }

  async stop(): Promise<void> {
    this.stopped = true;
    this.listening = false;
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = null;
    const client = this.client;
    this.client = null;
    this.dropEverything();
    if (client) await client.end().catch(() => undefined);
  }
}

/**
 * A small in-memory cache that is only read while the feed is healthy, is emptied on its topic, and
 * forgets entries after `ttlMs` as a last line of defence. Oldest entries go first when full.
 */
export class FeedCache<V> {
  private readonly entries = new Map<string, { value: V; storedAt: number }>();
  /** Bumped on every change: a load that began before it must not be stored. */
  private generation = 0;

  constructor(
    private readonly feed: ChangeFeed,
    topics: ChangeTopic[],
    private readonly options: { maxEntries: number; ttlMs: number },
  ) {
    for (const topic of topics) {
      feed.on(topic, () => {
        this.entries.clear();
        this.generation += 1;
      });
    }
  }

  get(key: string): V | undefined {
    if (!this.feed.healthy) return undefined;
    const entry = this.entries.get(key);
    if (!entry) return undefined;
    if (Date.now() - entry.storedAt > this.options.ttlMs) {
      this.entries.delete(key);
      return undefined;
    }
    return entry.value;
  }

  /**
   * Reads through the cache; `undefined` (not found) is never stored. The generation check keeps a
   * value read before a change from being stored after it.
   */
  async through(key: string, load: () => Promise<V | undefined>): Promise<V | undefined> {
    const hit = this.get(key);
    if (hit !== undefined) return hit;
    const generation = this.generation;
    const value = await load();
    if (value !== undefined && this.feed.healthy && generation === this.generation) this.set(key, value);
    return value;
  }

  private set(key: string, value: V): void {
    if (this.entries.size >= this.options.maxEntries) {
      const oldest = this.entries.keys().next().value;
      if (oldest !== undefined) this.entries.delete(oldest);
    }
    this.entries.set(key, { value, storedAt: Date.now() });
  }

  delete(key: string): void {
    this.entries.delete(key);
  }

  get size(): number {
    return this.entries.size;
  }
}

/** A feed for this process's ORM, listening (or retrying in the background when it cannot yet). */
export async function startChangeFeed(orm: Orm, databaseUrl: string): Promise<ChangeFeed> {
  const feed = new ChangeFeed(databaseUrl);
  feed.watchWrites(orm);
  // Until it listens, nothing is cached: correct, only slower.
  await feed.start().catch(() => undefined);
  return feed;
}
