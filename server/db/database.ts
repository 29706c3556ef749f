import path from 'node:path';
import type { Env } from '@/server/env';
import { startPrivateCluster, type PrivateCluster } from './cluster';

/** DATABASE_URL when given, else the private cluster kept under DATA_DIR/postgres. */
export async function resolveDatabase(
  env: Env,
  log: (line: string) => void,
): Promise<{ url: string; cluster: PrivateCluster | null }> {
  if (env.DATABASE_URL) return { url: env.DATABASE_URL, cluster: null };
  const cluster = await startPrivateCluster(path.join(env.dataDirAbsolute, 'postgres'), { log });
  return { url: cluster.url, cluster };
}
