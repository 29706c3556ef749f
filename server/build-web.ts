import { spawn } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { precompressWebApp } from './web/compress';
import { addPreloads } from './web/preload';

/** Sources whose change makes the exported web app stale. */
const SOURCES = ['app', 'components', 'lib', 'data', 'assets', 'app.json', 'package-lock.json', 'babel.config.js'];
const STAMP = '.sphereline-build.json';
/** Bumped when the build's output changes shape (2: pre-compressed copies; 3: preload links), so older builds are redone. */
const BUILD_FORMAT = 3;

function newestMtimeMs(entry: string): number {
  if (!fs.existsSync(entry)) return 0;
  const stat = fs.statSync(entry);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const child of fs.readdirSync(entry)) newest = Math.max(newest, newestMtimeMs(path.join(entry, child)));
  return newest;
}

export function webBuildIsFresh(root: string, webDir: string): boolean {
  const stampFile = path.join(webDir, STAMP);
  if (!fs.existsSync(stampFile) || !fs.existsSync(path.join(webDir, 'index.html'))) return false;
  const { sourcesMtimeMs, format } = JSON.parse(fs.readFileSync(stampFile, 'utf8')) as { sourcesMtimeMs: number; format?: number };
  if (format !== BUILD_FORMAT) return false;
  const current = Math.max(...SOURCES.map((s) => newestMtimeMs(path.join(root, s))));
  return current <= sourcesMtimeMs;
}

/** Exports the web app with Expo (offline, no telemetry) into webDir. */
export async function buildWeb(root: string, webDir: string, log: (line: string) => void = console.log) {
  const sourcesMtimeMs = Math.max(...SOURCES.map((s) => newestMtimeMs(path.join(root, s))));
  log('Building the web app (first time about a minute) …');
  const started = Date.now();
  await new Promise<void>((resolve, reject) => {
    const child = spawn(
      process.execPath,
      [require.resolve('expo/bin/cli'), 'export', '--platform', 'web', '--output-dir', webDir],
      {
        cwd: root,
        stdio: ['ignore', 'pipe', 'pipe'],
        env: { ...process.env, EXPO_OFFLINE: '1', EXPO_NO_TELEMETRY: '1', CI: '1', NODE_ENV: 'production' },
      },
    );
    let output = '';
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.stderr.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.on('error', reject);
    child.on('exit', (code) =>
      code === 0 ? resolve() : reject(new Error(`Web export failed (exit ${code}):\n${output.slice(-4000)}`)),
    );
  });
  const preloaded = addPreloads(webDir);
  const compressed = precompressWebApp(webDir);
  fs.writeFileSync(path.join(webDir, STAMP), JSON.stringify({ sourcesMtimeMs, format: BUILD_FORMAT, builtAt: new Date().toISOString() }));
  const kb = (bytes: number) => `${Math.round(bytes / 1024)} KB`;
  log(
    `Web app built in ${((Date.now() - started) / 1000).toFixed(1)} s; ${preloaded.length} files preloaded, ${compressed.files} pre-compressed ` +
      `(${kb(compressed.rawBytes)} → brotli ${kb(compressed.brotliBytes)}, gzip ${kb(compressed.gzipBytes)}).`,
  );
}

export async function ensureWebBuild(root: string, webDir: string, log?: (line: string) => void) {
  if (webBuildIsFresh(root, webDir)) return false;
  await buildWeb(root, webDir, log);
  return true;
}

if (require.main === module) {
  const root = process.cwd();
  const force = process.argv.includes('--force');
  const webDir = path.resolve(root, process.env.WEB_DIR ?? 'dist');
  (force ? buildWeb(root, webDir) : ensureWebBuild(root, webDir)).catch((error: Error) => {
    console.error(error.message);
    process.exit(1);
  });
}
