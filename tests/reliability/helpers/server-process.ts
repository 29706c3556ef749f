import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { findFreePort } from '@/server/db/cluster';

const ROOT = path.resolve(__dirname, '../../..');

/**
 * The real server (`tsx server/index.ts`, what `npm start` runs) as a child process on a free
 * port of 127.0.0.1, over a given DATABASE_URL. The web build is replaced by a stand-in folder
 * whose stamp says "fresh", so the server never starts an Expo export during a test.
 */
export interface ServerProcess {
  name: string;
  port: number;
  baseUrl: string;
  child: ChildProcess;
  /** Everything the process printed (for failure messages). */
  output(): string;
  /** Resolves with the exit code or signal once the process has ended. */
  exited: Promise<string>;
  alive(): boolean;
  kill(signal: NodeJS.Signals): Promise<string>;
}

export function standInWebDir(): string {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-web-'));
  fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><html><head><title>Sphereline</title></head><body><div id="root"></div></body></html>');
  fs.writeFileSync(path.join(dir, '.sphereline-build.json'), JSON.stringify({ sourcesMtimeMs: Number.MAX_SAFE_INTEGER, builtAt: 'stand-in' }));
  return dir;
}

export async function startServerProcess(options: {
  name: string;
  databaseUrl: string;
  dataDir: string;
  webDir: string;
  port?: number;
  readyTimeoutMs?: number;
}): Promise<ServerProcess> {
  const port = options.port ?? (await findFreePort());
  const baseUrl = `http://127.0.0.1:${port}`;
  // `node --import tsx` rather than the tsx CLI: the CLI runs the server in a child process, so a
  // SIGKILL to it would leave the real server running as an orphan.
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: ROOT,
    env: {
      ...process.env,
      NODE_ENV: 'test',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: options.databaseUrl,
      DATA_DIR: options.dataDir,
      WEB_DIR: options.webDir,
      LOG_REQUESTS: '0',
      AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const keep = (chunk: Buffer) => {
    output = (output + chunk.toString()).slice(-20_000);
  };
  child.stdout?.on('data', keep);
  child.stderr?.on('data', keep);
  let running = true;
  const exited = new Promise<string>((resolve) =>
    child.on('exit', (code, signal) => {
      running = false;
      resolve(signal ?? String(code));
    }),
  );
  const server: ServerProcess = {
    name: options.name,
    port,
    baseUrl,
    child,
    output: () => output,
    exited,
    alive: () => running,
    async kill(signal) {
      if (running) child.kill(signal);
      return exited;
    },
  };
  const deadline = Date.now() + (options.readyTimeoutMs ?? 90_000);
  while (Date.now() < deadline) {
    if (!running) throw new Error(`${options.name} exited before it was ready:\n${output}`);
    try {
      const response = await fetch(`${baseUrl}/api/health`, { signal: AbortSignal.timeout(2000) });
      if (response.status === 200) return server;
    } catch {
      // not listening yet
    }
    await new Promise((r) => setTimeout(r, 250));
  }
  await server.kill('SIGKILL');
  throw new Error(`${options.name} was not ready in time:\n${output}`);
}
