import path from 'node:path';
import { z } from 'zod';

/** Configuration from the environment, validated once at start (a bad value stops the start with a clear message). */
const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(8080),
  HOST: z.string().min(1).default('127.0.0.1'),
  DATABASE_URL: z
    .string()
    .regex(/^postgres(ql)?:\/\//, 'must be a postgres:// or postgresql:// URL')
    .optional(),
  DATA_DIR: z.string().min(1).default('.data'),
  /** Folder of the exported web app served as static files. */
  WEB_DIR: z.string().min(1).default('dist'),
  LOG_REQUESTS: z.enum(['0', '1']).default('1'),
  /** Outgoing mail server (smtp:// or smtps://). Unset in development and tests: a local sink is started. */
  SMTP_URL: z
    .string()
    .regex(/^smtps?:\/\//, 'must be an smtp:// or smtps:// URL')
    .optional(),
  /** The address people reach the app at, for links in e-mails (default http://HOST:PORT). */
  APP_URL: z.url('must be a URL like https://sphereline.example.org').optional(),
  MAIL_FROM: z.string().min(3).default('Sphereline <no-reply@sphereline.example.org>'),
  /**
   * Further host names this server answers for, comma-separated, besides APP_URL's host and loopback
   * (e.g. a second public name). Any other Host header is refused (DNS rebinding, Host spoofing).
   */
  ALLOWED_HOSTS: z.string().default(''),
  /**
   * Which reverse proxies to believe about the client (X-Forwarded-For, -Proto, -Host): unset means
   * none (the socket's address counts); "loopback", a number of hops, or comma-separated addresses
   * or CIDR ranges (Express "trust proxy" syntax). Set it only when a proxy you run sits in front.
   */
  TRUST_PROXY: z.string().optional(),
  /** Bibliographic metadata service for DOI look-up (GET {METADATA_URL}/works/{doi}). Unset outside production: a local fake. */
  METADATA_URL: z.url('must be a URL like https://api.example.org').optional(),
  /** S3-compatible store for attachments. Unset outside production: a local fake S3 under DATA_DIR/s3. */
  S3_ENDPOINT: z.url('must be a URL like https://s3.example.org').optional(),
  S3_BUCKET: z.string().min(3).max(63).default('sphereline-attachments'),
  S3_ACCESS_KEY: z.string().min(1).optional(),
  S3_SECRET_KEY: z.string().min(1).optional(),
  S3_REGION: z.string().min(1).default('us-east-1'),
});

export type Env = z.infer<typeof envSchema> & { dataDirAbsolute: string; webDirAbsolute: string; appUrl: string };

export class EnvError extends Error {}

export function readEnv(source: Record<string, string | undefined> = process.env): Env {
  const parsed = envSchema.safeParse(source);
  if (!parsed.success) {
    const problems = parsed.error.issues.map((issue) => `${issue.path.join('.')}: ${issue.message}`);
    throw new EnvError(`Invalid environment: ${problems.join('; ')}`);
  }
  const root = process.cwd();
  return {
    ...parsed.data,
    dataDirAbsolute: path.resolve(root, parsed.data.DATA_DIR),
    webDirAbsolute: path.resolve(root, parsed.data.WEB_DIR),
    appUrl: (parsed.data.APP_URL ?? `http://${parsed.data.HOST}:${parsed.data.PORT}`).replace(/\/+$/, ''),
  };
}
