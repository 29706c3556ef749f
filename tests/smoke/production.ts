/**
 * `npm run test:smoke`: the product as a production server starts it, on a fresh database.
 * Runs `npm start` with NODE_ENV=production (its own private PostgreSQL under a temporary
 * DATA_DIR), then checks from outside: no demo sign-in works, the development outbox answers 404,
 * none of the development stand-ins runs (the server listens on its one port only, the DOI look-up
 * has no fake behind it), a forged Host is refused, the first-administrator command prints a link
 * that sets a password exactly once, that person can sign in, and stopping the server stops the
 * PostgreSQL it started. Exits non-zero on the first failure.
 */
import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { SMTPServer } from 'smtp-server';
import { DEMO_PASSWORD, demoAccounts } from '@/server/modules/auth/demo-accounts';

/** A stand-in for the organisation's mail server (production needs SMTP_URL): accepts and counts. */
async function startMailServer(): Promise<{ url: string; received: () => number; close: () => Promise<void> }> {
  let received = 0;
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    onData(stream, _session, callback) {
      stream.on('data', () => undefined);
      stream.on('end', () => {
        received += 1;
        callback();
      });
    },
  });
  const port = await freePort();
  await new Promise<void>((resolve) => server.listen(port, '127.0.0.1', () => resolve()));
  return { url: `smtp://127.0.0.1:${port}`, received: () => received, close: () => new Promise((resolve) => server.close(() => resolve())) };
}

const root = path.resolve(__dirname, '../..');
const checks: string[] = [];

function check(condition: boolean, what: string): void {
  if (!condition) throw new Error(`production smoke test failed: ${what}`);
  checks.push(what);
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = net.createServer();
    server.listen(0, '127.0.0.1', () => {
      const address = server.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

/**
 * The TCP ports a process listens on, from Linux's /proc: its socket inodes matched against the
 * LISTEN rows of /proc/net/tcp and tcp6. The development mail sink, fake S3 and fake DOI service
 * would each add one.
 */
function listeningPorts(pid: number): number[] {
  const inodes = new Set<string>();
  for (const fd of fs.readdirSync(`/proc/${pid}/fd`)) {
    try {
      const inode = /^socket:\[(\d+)\]$/.exec(fs.readlinkSync(`/proc/${pid}/fd/${fd}`))?.[1];
      if (inode) inodes.add(inode);
    } catch {
      // The descriptor closed while we looked.
    }
  }
  const ports = new Set<number>();
  for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
    if (!fs.existsSync(table)) continue;
    for (const line of fs.readFileSync(table, 'utf8').split('\n').slice(1)) {
      const columns = line.trim().split(/\s+/);
      const [, local = '', , state] = columns;
      const inode = columns[9];
      if (state === '0A' && inode && inodes.has(inode)) ports.add(parseInt(local.split(':')[1] ?? '0', 16));
    }
  }
  return [...ports].sort((a, b) => a - b);
}

/** A raw request with a Host of our choosing (fetch() will not send another Host); the status code. */
function rawStatus(port: number, urlPath: string, host: string): Promise<number> {
  return new Promise<number>((resolve, reject) => {
    const socket = net.connect(port, '127.0.0.1', () => socket.write(`GET ${urlPath} HTTP/1.1\r\nHost: ${host}\r\nConnection: close\r\n\r\n`));
    let reply = '';
    socket.on('data', (chunk: Buffer) => (reply += chunk.toString()));
    socket.on('end', () => resolve(Number(/^HTTP\/1\.1 (\d+)/.exec(reply)?.[1] ?? 0)));
    socket.on('error', reject);
  });
}

/** The server process under `npm start` (npm's child: the start script execs it in place of the shell). */
function serverProcessOf(npmPid: number): number | null {
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const stat = fs.readFileSync(`/proc/${entry}/stat`, 'utf8');
      // Fields after the command name (in parentheses): state, ppid, …
      const ppid = Number(stat.slice(stat.lastIndexOf(')') + 2).split(' ')[1]);
      if (ppid === npmPid && /node/.test(fs.readFileSync(`/proc/${entry}/cmdline`, 'utf8'))) return Number(entry);
    } catch {
      // The process ended while we looked.
    }
  }
  return null;
}

function startServer(env: NodeJS.ProcessEnv): Promise<{ child: ChildProcess; output: () => string }> {
  // `npm start` itself, so the signal the test sends takes the path an operator's does (npm → server).
  const npmCli = process.env.npm_execpath;
  const child = npmCli && npmCli.endsWith('.js')
    ? spawn(process.execPath, [npmCli, 'start'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] })
    : spawn('npm', ['start'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  let output = '';
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`the server did not start in 180 s:\n${output.slice(-3000)}`)), 180_000);
    const poll = setInterval(() => {
      if (/Sphereline is running at/.test(output)) {
        clearInterval(poll);
        clearTimeout(timer);
        resolve({ child, output: () => output });
      }
    }, 100);
    child.on('exit', (code) => {
      clearInterval(poll);
      clearTimeout(timer);
      reject(new Error(`the server exited (${code}) before it was ready:\n${output.slice(-3000)}`));
    });
  });
}

async function main() {
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-smoke-'));
  fs.chmodSync(dataDir, 0o755);
  const port = await freePort();
  const base = `http://127.0.0.1:${port}`;
  const mail = await startMailServer();
  const env: NodeJS.ProcessEnv = { ...process.env, NODE_ENV: 'production', DATA_DIR: dataDir, HOST: '127.0.0.1', PORT: String(port), APP_URL: base, SMTP_URL: mail.url };
  delete env.DATABASE_URL;
  const { child } = await startServer(env);
  const send = (method: string, urlPath: string, body?: unknown) =>
    fetch(`${base}${urlPath}`, {
      method,
      headers: { origin: base, 'content-type': 'application/json' },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
  try {
    for (const account of demoAccounts) {
      const response = await send('POST', '/api/auth/sign-in', { email: account.email, password: DEMO_PASSWORD });
      check(response.status === 401, `demo sign-in of ${account.email} is refused (401)`);
    }
    for (const [urlPath, accept] of [['/api/dev/outbox', 'application/json'], ['/api/dev/outbox', 'text/html'], ['/api/dev/outbox?to=wren.oakes%40northfen.example.org', '*/*'], ['/api/dev', '*/*']] as const) {
      const response = await fetch(`${base}${urlPath}`, { headers: { accept } });
      check(response.status === 404, `the development route ${urlPath} (${accept}) answers 404`);
    }
    const serverPid = child.pid ? serverProcessOf(child.pid) : null;
    check(serverPid !== null, 'npm start runs the server as its own child process');
    const ports = serverPid ? listeningPorts(serverPid) : [];
    check(
      ports.length === 1 && ports[0] === port,
      `the server listens on its own port only — no mail sink, fake S3 or fake DOI service (found ${ports.join(', ') || 'none'})`,
    );
    for (const [urlPath, host] of [['/api/health/live', 'attacker.example.com'], ['/api/dev/outbox', 'attacker.example.com'], ['/', 'rebind.attacker.example'], ['/api/health/live', `127.0.0.1.attacker.example:${port}`]] as const) {
      const status = await rawStatus(port, urlPath, host);
      check(status === 403, `a forged Host (${host}) on ${urlPath} is refused (403, got ${status})`);
    }

    const admin = spawnSync(
      process.execPath,
      ['--import', 'tsx', path.join(root, 'server/admin-cli.ts'), '--email', 'wren.oakes@northfen.example.org', '--name', 'Dr. Wren Oakes', '--group', 'Oakes Coordination Group'],
      { cwd: root, env, encoding: 'utf8' },
    );
    check(admin.status === 0, admin.status === 0 ? 'npm run admin succeeds' : `npm run admin failed: ${admin.stderr.trim()}`);
    check(/keeps running: still used by process/.test(admin.stderr), 'npm run admin shares the running server\'s PostgreSQL and leaves it running');
    const link = /https?:\/\/\S+\/reset-password\?token=\S+/.exec(admin.stdout)?.[0];
    check(link !== undefined, 'npm run admin prints a one-time link');
    const token = new URL(link ?? base).searchParams.get('token') ?? '';
    const password = 'quartz-ligand-octahedron-7';
    const first = await send('POST', '/api/auth/password-reset/confirm', { token, password });
    check(first.status === 200, first.status === 200 ? 'the link sets the first password' : `the link did not set the password: ${first.status} ${await first.text()}`);
    const reuse = await send('POST', '/api/auth/password-reset/confirm', { token, password: 'another-long-passphrase-9' });
    check(reuse.status >= 400 && reuse.status < 500, 'the same link is refused the second time');
    const signIn = await send('POST', '/api/auth/sign-in', { email: 'wren.oakes@northfen.example.org', password });
    check(signIn.status === 200, 'the first administrator signs in');
    const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0] ?? '';
    // Laurenczy et al., Magn. Reson. Chem. 1991: a DOI the development fake would answer for.
    const lookup = await fetch(`${base}/api/citations/lookup?doi=10.1002/mrc.1260291311`, { headers: { cookie } });
    check(lookup.status === 503, `the DOI look-up has no fake service behind it (503 without METADATA_URL, got ${lookup.status})`);
    check(mail.received() >= 1, 'the password change was mailed through SMTP_URL');
  } finally {
    const exited = new Promise((resolve) => child.once('exit', resolve));
    child.kill('SIGTERM');
    await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 20_000))]);
    await mail.close();
  }
  const pidFile = path.join(dataDir, 'postgres', 'postmaster.pid');
  check(!fs.existsSync(pidFile), 'SIGTERM to npm start stopped the server and the PostgreSQL it started');
  fs.rmSync(dataDir, { recursive: true, force: true });
  for (const line of checks) console.log(`ok  ${line}`);
  console.log(`production smoke test: ${checks.length} checks passed`);
}

main().catch((error: Error) => {
  for (const line of checks) console.log(`ok  ${line}`);
  console.error(error.message);
  process.exit(1);
});
