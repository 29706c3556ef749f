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
});

export type Env = z.infer<typeof envSchema> & { dataDirAbsolute: string; webDirAbsolute: string };

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
  };
}
