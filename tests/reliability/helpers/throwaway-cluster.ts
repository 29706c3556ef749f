import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startPrivateCluster, type PrivateCluster } from '@/server/db/cluster';

/**
 * A PostgreSQL cluster of one test file's own, so it can be stopped and started again without
 * disturbing the shared test cluster. Removed (folder and all) by `remove()`.
 */
export interface ThrowawayCluster {
  dir: string;
  url: string;
  /** Stops PostgreSQL (fast shutdown: open connections are cut). */
  stop(): Promise<void>;
  /** Starts it again on the same folder, port and data. */
  start(): Promise<void>;
  remove(): Promise<void>;
}

export async function startThrowawayCluster(prefix: string, database = 'sphereline'): Promise<ThrowawayCluster> {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), `sphereline-${prefix}-`));
  fs.chmodSync(dir, 0o755);
  let cluster: PrivateCluster | null = await startPrivateCluster(dir, { database, throwaway: true });
  const url = cluster.url;
  return {
    dir,
    url,
    async stop() {
      await cluster?.stop();
      cluster = null;
    },
    async start() {
      cluster = await startPrivateCluster(dir, { database, throwaway: true });
    },
    async remove() {
      await cluster?.stop().catch(() => {});
      cluster = null;
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
