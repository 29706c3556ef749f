import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { findPostgresBinaries, startPrivateCluster } from '@/server/db/cluster';

/**
 * The private PostgreSQL across restarts (what `npm start` runs under DATA_DIR/postgres): stopping
 * stops the server the process started or adopted unless another live process still uses it; a
 * server left running by a process that died is adopted and stopped with the next one; a recorded
 * port that another program took meanwhile is replaced by a free one, recorded and announced.
 */

let dir: string;
let lines: string[] = [];
const log = (line: string) => lines.push(line);
const children: ChildProcess[] = [];

const pgData = () => path.join(dir, 'pgdata');
const isRunning = () => fs.existsSync(path.join(pgData(), 'postmaster.pid'));
const recordedPort = () => (JSON.parse(fs.readFileSync(path.join(dir, 'cluster.json'), 'utf8')) as { port: number }).port;

async function answers(url: string): Promise<boolean> {
  const client = new pg.Client({ connectionString: url, connectionTimeoutMillis: 3000 });
  try {
    await client.connect();
    return (await client.query('select 1 as one')).rows[0]?.one === 1;
  } catch {
    return false;
  } finally {
    await client.end().catch(() => undefined);
  }
}

/** Another process (as a second `npm start` would be) that opens the cluster and waits. */
function holdInAnotherProcess(): Promise<ChildProcess> {
  const code = `require(${JSON.stringify(path.resolve('server/db/cluster.ts'))}).startPrivateCluster(${JSON.stringify(dir)}, { throwaway: true })` +
    `.then(() => { console.log('READY'); setInterval(() => {}, 1000); }, (e) => { console.error(e); process.exit(1); });`;
  const child = spawn(process.execPath, ['--import', 'tsx', '-e', code], { stdio: ['ignore', 'pipe', 'pipe'] });
  children.push(child);
  return new Promise((resolve, reject) => {
    let output = '';
    child.stdout?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('READY')) resolve(child);
    });
    child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.on('exit', (code) => reject(new Error(`the other process exited (${code}): ${output}`)));
  });
}

beforeAll(() => {
  findPostgresBinaries();
  dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-ownership-'));
  fs.chmodSync(dir, 0o755);
});

afterAll(async () => {
  for (const child of children) child.kill('SIGKILL');
  // Whatever happened above, leave no server behind.
  if (isRunning()) await (await startPrivateCluster(dir, { throwaway: true })).stop();
  fs.rmSync(dir, { recursive: true, force: true });
}, 60_000);

beforeEach(() => {
  lines = [];
});

it('stops what it started; after a restart that finds its port taken it moves to a free one and records it', async () => {
  const first = await startPrivateCluster(dir, { throwaway: true, log });
  expect(first).toMatchObject({ startedHere: true, adopted: false });
  expect(await answers(first.url)).toBe(true);
  expect(await first.stop()).toBe('stopped');
  expect(isRunning()).toBe(false);

  // Meanwhile a plain server (another checkout's database, say) takes the recorded port.
  const squatter = net.createServer();
  await new Promise<void>((resolve) => squatter.listen(first.port, '127.0.0.1', () => resolve()));
  try {
    lines = [];
    const second = await startPrivateCluster(dir, { throwaway: true, log });
    expect(second.startedHere).toBe(true);
    expect(second.port).not.toBe(first.port);
    expect(recordedPort()).toBe(second.port);
    expect(lines.join('\n')).toContain(`Port ${first.port} on 127.0.0.1`);
    expect(lines.join('\n')).toContain(`now uses port ${second.port}`);
    expect(await answers(second.url)).toBe(true);
    expect(await second.stop()).toBe('stopped');
  } finally {
    await new Promise<void>((resolve) => squatter.close(() => resolve()));
  }

  // The next start keeps the new port (nothing to move).
  lines = [];
  const third = await startPrivateCluster(dir, { throwaway: true, log });
  expect(third.port).toBe(recordedPort());
  expect(lines.join('\n')).not.toContain('is taken');
  expect(await third.stop()).toBe('stopped');
  expect(isRunning()).toBe(false);
}, 60_000);

it('shares a server another live process uses, and leaves it running for that process', async () => {
  const other = await holdInAnotherProcess();
  const mine = await startPrivateCluster(dir, { throwaway: true, log });
  expect(mine).toMatchObject({ startedHere: false, adopted: true });
  expect(lines.join('\n')).toContain(`in use by process ${other.pid}`);
  lines = [];
  expect(await mine.stop()).toBe('left-running');
  expect(lines.join('\n')).toContain(`keeps running: still used by process ${other.pid}`);
  expect(isRunning()).toBe(true);
  expect(await answers(mine.url)).toBe(true);

  // That process is killed (SIGKILL: no clean stop). The server it left is adopted by the next
  // start and stopped with it.
  const exited = new Promise((resolve) => other.once('exit', resolve));
  other.kill('SIGKILL');
  await exited;
  expect(isRunning()).toBe(true);
  lines = [];
  const next = await startPrivateCluster(dir, { throwaway: true, log });
  expect(next).toMatchObject({ startedHere: false, adopted: true });
  expect(lines.join('\n')).toContain('left by a process that is gone: adopted; it stops when this one stops');
  lines = [];
  expect(await next.stop()).toBe('stopped');
  expect(lines.join('\n')).toContain('(adopted at start)');
  expect(isRunning()).toBe(false);
}, 60_000);

it('two handles in one process: the last one out stops the server', async () => {
  const a = await startPrivateCluster(dir, { throwaway: true, log });
  const b = await startPrivateCluster(dir, { throwaway: true, log });
  expect(a.startedHere).toBe(true);
  expect(b.adopted).toBe(true);
  expect(await a.stop()).toBe('left-running');
  expect(await answers(b.url)).toBe(true);
  expect(await b.stop()).toBe('stopped');
  expect(isRunning()).toBe(false);
  // stop() twice is harmless and gives the same answer.
  expect(await b.stop()).toBe('stopped');
}, 60_000);
