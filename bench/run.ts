/**
 * `npm run bench`: engine, HTTP, library search, CSV import and web figures. Writes
 * bench-results/bench-<time>.json and latest.json (git-ignored) and prints a table of target,
 * measured, met / short by how much.
 *
 * Every figure is a median over repeated runs; every comparison is a ratio measured in the same
 * run (these machines are noisy). Runs in a few minutes on 2 cores.
 *
 * Flags: --only=engine,http,signedin,search,import,web   --quick (fewer, shorter runs)
 *        --no-build (measure dist/ as it is)    --baseline=<dir> (also run the engine bench on
 *        another copy of lib/chem, e.g. the last commit's, and report the speed-up)
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ensureWebBuild, webBuildIsFresh } from '@/server/build-web';
import { startPrivateCluster, type PrivateCluster } from '@/server/db/cluster';
import { defaultEngineOptions, runEngineBench } from './engine';
import { defaultHttpOptions, runHttpBench, startBenchServer, type BenchServer, type HttpResult } from './http';
import { IMPORT_TARGET_SECONDS, runImportBenchOn } from './import';
import { runSearchBenchOn, SEARCH_TARGET_P95_MS, SEARCH_TARGET_RATIO } from './search';
import {
  defaultSignedInOptions,
  ME_TARGET_RATIO,
  runSignedInBench,
  SEARCH_TARGET_P99_MS,
  SEARCH_TARGET_RATIO_TO_LIVE,
  SIGNED_IN_LIBRARY_SIZE,
} from './signed-in';
import { formatBytes, formatRate, round } from './stats';
import { measureBundle, measureFirstResult, type BundleResult, type FirstResultTiming } from './web';

const root = path.resolve(__dirname, '..');
const log = (line: string) => console.log(`[bench] ${line}`);

const ENGINE_TARGET_PER_SECOND = 250_000;
const HTTP_TARGET_RATIO = 0.8;
const BUNDLE_TARGET_GZIP_BYTES = 500 * 1024;
const FIRST_SCREEN_WIRE_TARGET_BYTES = 250 * 1024;
const FIRST_RESULT_TARGET_RATIO = 3;

interface Row {
  figure: string;
  target: string;
  measured: string;
  verdict: string;
}

function parseArgs(argv: string[]) {
  const value = (name: string) => argv.find((arg) => arg.startsWith(`--${name}=`))?.split('=')[1];
  const only = value('only')?.split(',') ?? ['engine', 'http', 'signedin', 'search', 'import', 'web'];
  return {
    only: new Set(only),
    quick: argv.includes('--quick'),
    build: !argv.includes('--no-build'),
    baseline: value('baseline'),
  };
}

const shortBy = (measured: number, target: number, higherIsBetter = true) => {
  const met = higherIsBetter ? measured >= target : measured <= target;
  if (met) return 'met';
  const factor = higherIsBetter ? target / measured : measured / target;
  return `short by ${factor.toFixed(2)}×`;
};

function printTable(rows: Row[]) {
  const headers: Row = { figure: 'figure', target: 'target', measured: 'measured', verdict: 'met / short' };
  const widths = (Object.keys(headers) as (keyof Row)[]).map((key) => Math.max(...[headers, ...rows].map((row) => row[key].length)));
  const line = (row: Row) => (Object.keys(headers) as (keyof Row)[]).map((key, i) => row[key].padEnd(widths[i] ?? 0)).join(' │ ');
  console.log(`\n${line(headers)}\n${widths.map((w) => '─'.repeat(w)).join('─┼─')}`);
  for (const row of rows) console.log(line(row));
  console.log('');
}

async function main() {
  const args = parseArgs(process.argv.slice(2));
  const started = Date.now();
  const report: Record<string, unknown> = {
    startedAt: new Date().toISOString(),
    machine: { cpus: os.cpus().length, cpuModel: os.cpus()[0]?.model ?? 'unknown', node: process.version, totalMemoryBytes: os.totalmem() },
    options: { ...args, only: [...args.only] },
  };
  const rows: Row[] = [];
  const notes: string[] = [];

  // 1. Engine (first, while nothing else runs on the machine).
  if (args.only.has('engine')) {
    const engineOptions = args.quick ? { formulasPerRun: 3000, runs: 5 } : defaultEngineOptions;
    log(`engine: ${engineOptions.runs} runs × ${engineOptions.formulasPerRun} distinct formulas (child process) …`);
    const engine = await runEngineBench(root, engineOptions);
    report.engine = engine;
    rows.push({
      figure: 'engine: classifications/s, all distinct (1 core)',
      target: `≥ ${formatRate(ENGINE_TARGET_PER_SECOND)}`,
      measured: formatRate(engine.distinct.perSecondMedian),
      verdict: shortBy(engine.distinct.perSecondMedian, ENGINE_TARGET_PER_SECOND),
    });
    rows.push({
      figure: `engine: repeating batch (${engine.repeating.batchSize} of ${engine.repeating.distinctInBatch} formulas)`,
      target: '(memo hits; no target)',
      measured: formatRate(engine.repeating.perSecondMedian),
      verdict: `${(engine.repeating.perSecondMedian / engine.distinct.perSecondMedian).toFixed(1)}× distinct`,
    });
    rows.push({
      figure: 'engine: parser alone, distinct',
      target: '(where the time goes)',
      measured: formatRate(engine.parseOnly.perSecondMedian),
      verdict: '',
    });
    rows.push({
      figure: 'engine: peak memory (maxRSS / heap peak)',
      target: '(no target)',
      measured: `${formatBytes(engine.memory.maxRssBytes)} / ${formatBytes(engine.memory.heapUsedPeakBytes)}`,
      verdict: `RSS at start ${formatBytes(engine.memory.rssBeforeBytes)}`,
    });
    if (engine.errors > 0) notes.push(`engine: ${engine.errors} formulas threw (the generator should only give parsable ones)`);
    if (args.baseline) {
      log(`engine: the same runs on ${args.baseline} …`);
      const before = await runEngineBench(root, { ...engineOptions, engineDir: path.resolve(args.baseline) });
      report.engineBaseline = { dir: args.baseline, ...before };
      rows.push({
        figure: 'engine: distinct vs baseline copy',
        target: '(before → after)',
        measured: `${formatRate(before.distinct.perSecondMedian)} → ${formatRate(engine.distinct.perSecondMedian)}`,
        verdict: `${(engine.distinct.perSecondMedian / before.distinct.perSecondMedian).toFixed(1)}× faster`,
      });
      rows.push({
        figure: 'engine: repeating vs baseline copy',
        target: '(before → after)',
        measured: `${formatRate(before.repeating.perSecondMedian)} → ${formatRate(engine.repeating.perSecondMedian)}`,
        verdict: `${(engine.repeating.perSecondMedian / before.repeating.perSecondMedian).toFixed(1)}× faster`,
      });
      rows.push({
        figure: 'engine: peak RSS vs baseline copy',
        target: '(before → after)',
        measured: `${formatBytes(before.memory.maxRssBytes)} → ${formatBytes(engine.memory.maxRssBytes)}`,
        verdict: '',
      });
    }
  }

  // 2 & 5 need the bench server; 3 & 4 start databases of their own.
  const needServer = args.only.has('http') || args.only.has('signedin') || args.only.has('web');
  const webDir = path.join(root, 'dist');
  let bundle: BundleResult | null = null;
  if (args.only.has('web')) {
    if (args.build) {
      try {
        const built = await ensureWebBuild(root, webDir, (line) => log(`web: ${line}`));
        if (!built) log('web: dist/ is up to date');
      } catch (error) {
        notes.push(`web: the export failed, measuring the existing dist/ (${(error as Error).message.split('\n')[0]})`);
      }
    } else if (!webBuildIsFresh(root, webDir)) {
      notes.push('web: --no-build and dist/ is older than the sources: the figures are of the old build');
    }
    if (fs.existsSync(path.join(webDir, 'index.html'))) bundle = measureBundle(webDir);
  }

  let cluster: PrivateCluster | null = null;
  let server: BenchServer | null = null;
  const dbDir = needServer ? fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-bench-pg-')) : null;
  try {
    if (needServer && dbDir) {
      fs.chmodSync(dbDir, 0o755);
      log('starting a throwaway PostgreSQL and the bench server …');
      cluster = await startPrivateCluster(dbDir, { database: 'sphereline_bench', throwaway: true });
      server = await startBenchServer(root, cluster.url, webDir);
    }

    if (args.only.has('http') && server) {
      const httpOptions = args.quick ? { ...defaultHttpOptions, rounds: 2, secondsPerRun: 2 } : defaultHttpOptions;
      log(`http: ${httpOptions.rounds} rounds × ${httpOptions.secondsPerRun} s per endpoint at ${httpOptions.connections.join(' and ')} connections …`);
      const http: HttpResult = await runHttpBench(server.baseUrl, httpOptions, log);
      report.http = http;
      for (const [connections, figures] of Object.entries(http.byConnections)) {
        const { ping, live, classify, classifyBatch1000, health } = figures.endpoints;
        rows.push({
          figure: `http ${connections} conn: POST /api/classify vs bare GET /api/health/live`,
          target: `≥ ${HTTP_TARGET_RATIO}×`,
          measured: `${figures.classifyVsLive.toFixed(2)}× (${Math.round(classify.requestsPerSecond)} vs ${Math.round(live.requestsPerSecond)} req/s)`,
          verdict: shortBy(figures.classifyVsLive, HTTP_TARGET_RATIO),
        });
        rows.push({
          figure: `http ${connections} conn: server CPU per request, classify vs live`,
          target: '(why)',
          measured: `${classify.serverCpuMicrosPerRequest} vs ${live.serverCpuMicrosPerRequest} µs`,
          verdict: `${figures.classifyVsLiveByServerCpu.toFixed(2)}× if the server alone were the limit`,
        });
        rows.push({
          figure: `http ${connections} conn: of classify's extra CPU, the handler's own work`,
          target: '(why)',
          measured: `${http.classifyHandlerMicros} of ${classify.serverCpuMicrosPerRequest - live.serverCpuMicrosPerRequest} µs`,
          verdict: 'parse + schema + engine + serialise, in process; the rest is HTTP (POST body, larger answer)',
        });
        rows.push({
          figure: `http ${connections} conn: vs /bench/ping (no middleware)`,
          target: '(reference)',
          measured: `classify ${figures.classifyVsPing.toFixed(2)}×, live ${figures.liveVsPing.toFixed(2)}× (ping ${Math.round(ping.requestsPerSecond)} req/s)`,
          verdict: '',
        });
        rows.push({
          figure: `http ${connections} conn: classify latency p50 / p99`,
          target: '(no target)',
          measured: `${classify.latencyP50Ms} / ${classify.latencyP99Ms} ms`,
          verdict: `ping ${ping.latencyP50Ms} / ${ping.latencyP99Ms} ms`,
        });
        rows.push({
          figure: `http ${connections} conn: GET /api/health (database)`,
          target: '(reference)',
          measured: `${Math.round(health.requestsPerSecond)} req/s, p99 ${health.latencyP99Ms} ms`,
          verdict: `classify ${figures.classifyVsHealth.toFixed(2)}× health`,
        });
        rows.push({
          figure: `http ${connections} conn: batch of 1000`,
          target: '(no target)',
          measured: `${formatRate(figures.batchFormulasPerSecond, ' formulas/s')}, p50 ${classifyBatch1000.latencyP50Ms} ms, p99 ${classifyBatch1000.latencyP99Ms} ms`,
          verdict: `${round(classifyBatch1000.requestsPerSecond, 1)} req/s`,
        });
        const failures = Object.entries(figures.endpoints).filter(([, f]) => f.non2xx > 0 || f.errors > 0);
        for (const [name, f] of failures) notes.push(`http ${connections} conn: ${name} had ${f.non2xx} non-2xx responses and ${f.errors} errors`);
      }
    }

    if (args.only.has('signedin') && server && cluster) {
      const options = args.quick ? { ...defaultSignedInOptions, rounds: 2, secondsPerRun: 2 } : defaultSignedInOptions;
      const signedIn = await runSignedInBench(server.baseUrl, cluster.url, options, log);
      report.signedIn = signedIn;
      const { live, me, searchViewer, searchCurator } = signedIn.at50;
      rows.push({
        figure: 'signed-in 50 conn: GET /api/auth/me vs live',
        target: `≥ ${ME_TARGET_RATIO}×`,
        measured: `${signedIn.meVsLive.toFixed(2)}× (${Math.round(me.requestsPerSecond)} vs ${Math.round(live.requestsPerSecond)} req/s)`,
        verdict: shortBy(signedIn.meVsLive, ME_TARGET_RATIO),
      });
      for (const [who, figure, ratio] of [
        ['viewer', searchViewer, signedIn.searchViewerVsLive],
        ['curator', searchCurator, signedIn.searchCuratorVsLive],
      ] as const) {
        rows.push({
          figure: `signed-in 50 conn: search as ${who} (${SIGNED_IN_LIBRARY_SIZE} entries) vs live`,
          target: `≥ ${SEARCH_TARGET_RATIO_TO_LIVE}×`,
          measured: `${ratio.toFixed(2)}× (${Math.round(figure.requestsPerSecond)} req/s, p99 ${figure.latencyP99Ms} ms)`,
          verdict: shortBy(ratio, SEARCH_TARGET_RATIO_TO_LIVE),
        });
      }
      for (const who of ['viewer', 'curator'] as const) {
        const load = signedIn.underLoad[who];
        rows.push({
          figure: `signed-in ${load.connections} conn: search as ${who}, p50 / p99`,
          target: `p99 ≤ ${SEARCH_TARGET_P99_MS} ms`,
          measured: `${load.latencyP50Ms} / ${load.latencyP99Ms} ms (${Math.round(load.requestsPerSecond)} req/s)`,
          verdict: shortBy(load.latencyP99Ms, SEARCH_TARGET_P99_MS, false),
        });
        if (load.non2xx > 0 || load.errors > 0) notes.push(`signed-in: search as ${who} at ${load.connections} conn had ${load.non2xx} non-2xx and ${load.errors} errors`);
      }
      for (const [name, f] of Object.entries(signedIn.at50)) {
        if (f.non2xx > 0 || f.errors > 0) notes.push(`signed-in 50 conn: ${name} had ${f.non2xx} non-2xx responses and ${f.errors} errors`);
      }
    }

    if (args.only.has('search')) {
      const search = await runSearchBenchOn({ runs: args.quick ? 15 : 40, scanRuns: args.quick ? 4 : 10, log });
      report.search = search;
      for (const f of search.figures) {
        const hits = `${f.total}${f.totalIsLowerBound ? '+' : ''} hits`;
        rows.push({
          figure: `search ${f.who}: ${f.search} (${hits}) p50 / p95`,
          target: `p95 ≤ ${SEARCH_TARGET_P95_MS} ms`,
          measured: `${f.indexed.p50Ms} / ${f.indexed.p95Ms} ms`,
          verdict: shortBy(f.indexed.p95Ms, SEARCH_TARGET_P95_MS, false),
        });
        rows.push({
          figure: `search ${f.who}: ${f.search} vs unindexed scan (p50)`,
          target: `≥ ${SEARCH_TARGET_RATIO}×`,
          measured: `${f.ratio}× (scan ${f.scan.p50Ms} ms, ${f.scanPlan})`,
          verdict: shortBy(f.ratio, SEARCH_TARGET_RATIO),
        });
      }
      for (const f of search.sorts) {
        rows.push({
          figure: `search ${f.who}: ${f.search} (${f.total}${f.totalIsLowerBound ? '+' : ''} hits) p50 / p95`,
          target: `p95 ≤ ${SEARCH_TARGET_P95_MS} ms`,
          measured: `${f.indexed.p50Ms} / ${f.indexed.p95Ms} ms`,
          verdict: shortBy(f.indexed.p95Ms, SEARCH_TARGET_P95_MS, false),
        });
      }
    }
    if (args.only.has('import')) {
      const imported = await runImportBenchOn({ log });
      report.import = imported;
      rows.push({
        figure: `import: ${imported.rows} CSV rows, dry run`,
        target: `≤ ${IMPORT_TARGET_SECONDS} s`,
        measured: `${imported.dryRunSeconds} s`,
        verdict: shortBy(imported.dryRunSeconds, IMPORT_TARGET_SECONDS, false),
      });
      rows.push({
        figure: `import: ${imported.rows} CSV rows (${imported.entries} entries, ${imported.measurements} measurements)`,
        target: `≤ ${IMPORT_TARGET_SECONDS} s`,
        measured: `${imported.importSeconds} s (${imported.rowsPerSecond} rows/s)`,
        verdict: shortBy(imported.importSeconds, IMPORT_TARGET_SECONDS, false),
      });
    }

    if (args.only.has('web')) {
      if (bundle) {
        report.bundle = bundle;
        rows.push({
          figure: 'web: first-screen JS (gzip / raw)',
          target: `≤ ${formatBytes(BUNDLE_TARGET_GZIP_BYTES)} gzip`,
          measured: `${formatBytes(bundle.firstScreenGzipBytes)} / ${formatBytes(bundle.firstScreenRawBytes)}`,
          verdict: shortBy(bundle.firstScreenGzipBytes, BUNDLE_TARGET_GZIP_BYTES, false),
        });
      } else {
        rows.push({ figure: 'web: first-screen JS', target: '≤ 500 KB gzip', measured: '—', verdict: 'skipped: no dist/index.html' });
      }
      if (server && bundle) {
        const loads = args.quick ? 3 : 5;
        log(`web: ${loads} cold loads each of /check?formula=… and a blank page in Chromium 390×844 …`);
        try {
          const timing: FirstResultTiming = await measureFirstResult(server.baseUrl, loads);
          report.firstResult = timing;
          rows.push({
            figure: 'web: cold first Check result vs blank page',
            target: `≤ ${FIRST_RESULT_TARGET_RATIO}× blank`,
            measured: `${timing.ratio.toFixed(1)}× (${Math.round(timing.checkMedianMs)} ms vs ${Math.round(timing.blankMedianMs)} ms)`,
            verdict: shortBy(timing.ratio, FIRST_RESULT_TARGET_RATIO, false),
          });
          const encodings = [...new Set(timing.firstScreenFiles.map((file) => file.encoding))].join(', ');
          rows.push({
            figure: 'web: first screen over the wire (all files before the first Check result)',
            target: `≤ ${formatBytes(FIRST_SCREEN_WIRE_TARGET_BYTES)}`,
            measured: `${formatBytes(timing.firstScreenWireBytes)} in ${timing.firstScreenFiles.length} files (${encodings})`,
            verdict: shortBy(timing.firstScreenWireBytes, FIRST_SCREEN_WIRE_TARGET_BYTES, false),
          });
          if (!timing.firstScreenFiles.some((file) => file.encoding === 'br')) {
            notes.push('web: this Chromium was sent no brotli copies, so the wire figure is gzip or plain; browsers offer brotli over HTTPS');
          }
        } catch (error) {
          notes.push(`web: browser timing failed: ${(error as Error).message.split('\n')[0]}`);
        }
      }
    }
  } finally {
    await server?.stop();
    await cluster?.stop().catch(() => {});
    if (dbDir) fs.rmSync(dbDir, { recursive: true, force: true });
  }

  report.rows = rows;
  report.notes = notes;
  report.durationSeconds = round((Date.now() - started) / 1000, 1);
  const outDir = path.join(root, 'bench-results');
  fs.mkdirSync(outDir, { recursive: true });
  const stamp = new Date().toISOString().replace(/[:.]/g, '-');
  const file = path.join(outDir, `bench-${stamp}.json`);
  fs.writeFileSync(file, `${JSON.stringify(report, null, 2)}\n`);
  fs.writeFileSync(path.join(outDir, 'latest.json'), `${JSON.stringify(report, null, 2)}\n`);

  printTable(rows);
  if (bundle) {
    console.log('Largest modules of the first screen (raw bytes, named by a string they contain):');
    for (const module of bundle.largestModules.slice(0, 10)) console.log(`  ${formatBytes(module.rawBytes).padStart(9)}  ${module.hint.slice(0, 70)}`);
    console.log('');
  }
  for (const note of notes) console.log(`note: ${note}`);
  console.log(`Report: ${path.relative(root, file)} (${report.durationSeconds} s)`);
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
