import type { Router } from 'express';
import type { Orm } from './db/orm';
import type { S3Settings } from './modules/attachments/object-storage';

/**
 * The stand-ins a developer's machine and the tests use instead of real services: a local mail
 * sink with its outbox page, a fake S3 object store and a fake DOI metadata service. They live in
 * `server/dev/` with their packages in devDependencies; production code never imports that folder
 * (ESLint keeps it so). `npm start` loads them with a dynamic import only when NODE_ENV is not
 * production, the jest setup registers them for the tests, and production ignores them even if
 * something registered them.
 */
export interface DevelopmentTools {
  /** An SMTP server on 127.0.0.1 (a free port) that keeps every message for the outbox. */
  startMailSink(orm: Orm, options?: { keepProcessAlive?: boolean }): Promise<{ host: string; port: number; close(): Promise<void> }>;
  /** A fake S3 on 127.0.0.1 that answers only loopback Hosts and requests signed with its credentials. */
  startFakeS3(options?: {
    directory?: string;
    bucket?: string;
    credentials?: { accessKeyId: string; secretAccessKey: string };
  }): Promise<{ settings: S3Settings; close(): Promise<void> }>;
  /** A fake bibliographic metadata service on 127.0.0.1; the URL to give the metadata client. */
  startFakeMetadataService(): Promise<{ url: string }>;
  /** GET /dev/outbox: what the mail sink received (loopback Host only). */
  outboxRoutes(): Router;
}

let registered: DevelopmentTools | null = null;

export function registerDevelopmentTools(tools: DevelopmentTools | null): void {
  registered = tools;
}

/** The registered tools, or null in production (whatever was registered) and when none are. */
export function developmentTools(nodeEnv: string): DevelopmentTools | null {
  return nodeEnv === 'production' ? null : registered;
}
