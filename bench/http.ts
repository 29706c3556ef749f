/**
 * Section 2: HTTP. The bench server (bench/http-server.ts: the real createApp() plus two bench-only
 * routes) runs in a child process; autocannon drives it from this process, all on 127.0.0.1.
 * Endpoints are measured in interleaved rounds (ping, live, health, classify, batch, then again) so
 * the machine's noise falls on all of them alike; each ratio is taken within a round, then the median.
 *
 * The bare endpoint of the target is `GET /api/health/live`: an API route that does nothing, behind
 * the same middleware as /api/classify (security headers, origin check, session lookup, body
 * parser), so the ratio is the cost of classifying. Two references are reported beside it:
 * `/bench/ping` (no middleware at all: the floor of Express itself) and `GET /api/health` (which
 * asks the database).
 */
import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import autocannon from 'autocannon';
import { classifyRequestSchema } from '@/lib/schemas/chem';
import { classify } from '@/server/modules/chem/chem.service';
import { distinctFormulas } from './formula-set';
import { median } from './stats';

export interface BenchServer {
  baseUrl: string;
  child: ChildProcess;
  stop(): Promise<void>;
}

export async function startBenchServer(root: string, databaseUrl: string, webDir: string): Promise<BenchServer> {
  const child = spawn(process.execPath, ['--import', 'tsx', path.join(root, 'bench/http-server.ts')], {
    cwd: root,
    env: { ...process.env, DATABASE_URL: databaseUrl, WEB_DIR: webDir, NODE_ENV: 'production', LOG_REQUESTS: '0' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const port = await new Promise<number>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`bench server did not start in 60 s:\n${output.slice(-2000)}`)), 60_000);
    child.stdout?.on('data', (chunk: Buffer) => {
      output += chunk.toString();
      const match = /LISTENING (\d+)/.exec(output);
      if (match) {
        clearTimeout(timer);
        resolve(Number(match[1]));
      }
    });
    child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()));
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`bench server exited (${code}):\n${output.slice(-2000)}`));
    });
  });
  return {
    baseUrl: `http://127.0.0.1:${port}`,
    child,
    async stop() {
      if (child.exitCode !== null) return;
      const exited = new Promise((resolve) => child.once('exit', resolve));
      child.kill('SIGTERM');
      await Promise.race([exited, new Promise((resolve) => setTimeout(resolve, 5000))]);
      if (child.exitCode === null) child.kill('SIGKILL');
    },
  };
}

export interface EndpointFigures {
  requestsPerSecond: number;
  /** The server process's CPU time per answered request (µs), from /bench/cpu around the run. */
  serverCpuMicrosPerRequest: number;
  latencyP50Ms: number;
  latencyP99Ms: number;
  non2xx: number;
  errors: number;
}

export interface HttpOptions {
  connections: number[];
  rounds: number;
  secondsPerRun: number;
}

export const defaultHttpOptions: HttpOptions = { connections: [50, 200], rounds: 3, secondsPerRun: 3 };

type EndpointName = 'ping' | 'live' | 'health' | 'classify' | 'classifyBatch1000';

/** What autocannon sends: one path, or several in turn (`paths`), with bodies in turn for a POST. */
export interface RequestSpec {
  method: 'GET' | 'POST';
  path: string;
  paths?: string[];
  bodies?: string[];
  headers?: Record<string, string>;
}

interface Endpoint {
  name: EndpointName;
  spec: RequestSpec;
}

function endpoints(): Endpoint[] {
  // Rotate over distinct formulas so the engine's memo answers (almost) nothing.
  const singles = distinctFormulas(20_000, 99).map((entry) => JSON.stringify({ formula: entry.formula }));
  const batchFormulas = distinctFormulas(20_000, 123).map((entry) => entry.formula);
  const batches: string[] = [];
  for (let start = 0; start < batchFormulas.length; start += 1000) {
    batches.push(JSON.stringify({ formulas: batchFormulas.slice(start, start + 1000) }));
  }
  return [
    { name: 'ping', spec: { method: 'GET', path: '/bench/ping' } },
    { name: 'live', spec: { method: 'GET', path: '/api/health/live' } },
    { name: 'health', spec: { method: 'GET', path: '/api/health' } },
    { name: 'classify', spec: { method: 'POST', path: '/api/classify', bodies: singles } },
    { name: 'classifyBatch1000', spec: { method: 'POST', path: '/api/classify', bodies: batches } },
  ];
}

export async function measure(baseUrl: string, endpoint: { spec: RequestSpec }, connections: number, seconds: number): Promise<EndpointFigures> {
  const { method, path: urlPath, paths, bodies, headers = {} } = endpoint.spec;
  let next = 0;
  let nextPath = 0;
  const cpuBefore = await serverCpuMicros(baseUrl);
  const result = await autocannon({
    url: `${baseUrl}${urlPath}`,
    connections,
    duration: seconds,
    timeout: 30,
    requests: [
      {
        method,
        path: urlPath,
        headers: bodies ? { ...headers, 'content-type': 'application/json' } : headers,
        setupRequest: (request) => {
          if (paths) {
            const pathNow = paths[nextPath % paths.length] ?? urlPath;
            nextPath++;
            request = { ...request, path: pathNow };
          }
          if (!bodies) return request;
          const body = bodies[next % bodies.length] ?? '';
          next++;
          return { ...request, body };
        },
      },
    ],
  });
  await drain(baseUrl);
  const cpuUsed = (await serverCpuMicros(baseUrl)) - cpuBefore;
  return {
    requestsPerSecond: result.requests.total / result.duration,
    serverCpuMicrosPerRequest: Math.round(cpuUsed / Math.max(1, result.requests.total)),
    latencyP50Ms: result.latency.p50,
    latencyP99Ms: result.latency.p99,
    non2xx: result.non2xx,
    errors: result.errors,
  };
}

async function serverCpuMicros(baseUrl: string): Promise<number> {
  const response = await fetch(`${baseUrl}/bench/cpu`);
  return ((await response.json()) as { cpuMicros: number }).cpuMicros;
}

/**
 * Waits until the server has worked off the requests still queued from the last run (autocannon
 * stops sending at the deadline, but a batch run leaves seconds of work behind): three quick
 * pings in a row, or 60 s.
 */
export async function drain(baseUrl: string, quickMs = 25): Promise<number> {
  const started = performance.now();
  let quickInARow = 0;
  while (quickInARow < 3 && performance.now() - started < 60_000) {
    const sent = performance.now();
    try {
      await fetch(`${baseUrl}/bench/ping`);
      quickInARow = performance.now() - sent < quickMs ? quickInARow + 1 : 0;
    } catch {
      quickInARow = 0;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
  }
  return performance.now() - started;
}

/**
 * What the classify handler itself costs, without HTTP: JSON.parse, the shared schema, the engine
 * and JSON.stringify of the answer, in this process over the same bodies the load generator sends
 * (after a warm-up pass). The rest of classify's server CPU per request is HTTP's.
 */
export function handlerMicrosPerRequest(bodies: readonly string[]): number {
  const once = () => {
    for (const body of bodies) {
      try {
        JSON.stringify(classify(classifyRequestSchema.parse(JSON.parse(body))));
      } catch {
        // A formula the engine refuses is answered 400 by the server: its cost is counted all the same.
      }
    }
  };
  once();
  const started = performance.now();
  once();
  return Math.round(((performance.now() - started) * 1000) / bodies.length);
}

export interface HttpResult {
  /** classify's handler alone, in process (µs per request): see handlerMicrosPerRequest. */
  classifyHandlerMicros: number;
  byConnections: Record<
    string,
    {
      endpoints: Record<EndpointName, EndpointFigures & { requestsPerSecondRuns: number[] }>;
      classifyVsLive: number;
      classifyVsLiveRuns: number[];
      classifyVsPing: number;
      liveVsPing: number;
      classifyVsHealth: number;
      /** live's server CPU per request / classify's: the throughput ratio if the server alone were the limit. */
      classifyVsLiveByServerCpu: number;
      batchFormulasPerSecond: number;
    }
  >;
}

export async function runHttpBench(baseUrl: string, options: HttpOptions = defaultHttpOptions, log: (line: string) => void = () => {}): Promise<HttpResult> {
  const list = endpoints();
  const singles = list.find((endpoint) => endpoint.name === 'classify')?.spec.bodies ?? [];
  // A short warm-up of every endpoint (JIT, connection pools, the database pool).
  for (const endpoint of list) {
    await measure(baseUrl, endpoint, 10, 1);
  }
  const result: HttpResult = { classifyHandlerMicros: handlerMicrosPerRequest(singles), byConnections: {} };
  for (const connections of options.connections) {
    const runs = new Map<EndpointName, EndpointFigures[]>();
    for (let round = 0; round < options.rounds; round++) {
      for (const endpoint of list) {
        const figures = await measure(baseUrl, endpoint, connections, options.secondsPerRun);
        runs.set(endpoint.name, [...(runs.get(endpoint.name) ?? []), figures]);
        log(`  ${connections} conn, round ${round + 1}: ${endpoint.name} ${Math.round(figures.requestsPerSecond)} req/s, p99 ${figures.latencyP99Ms} ms`);
      }
    }
    const summarise = (name: EndpointName) => {
      const figures = runs.get(name) ?? [];
      return {
        requestsPerSecond: median(figures.map((f) => f.requestsPerSecond)),
        serverCpuMicrosPerRequest: median(figures.map((f) => f.serverCpuMicrosPerRequest)),
        requestsPerSecondRuns: figures.map((f) => f.requestsPerSecond),
        latencyP50Ms: median(figures.map((f) => f.latencyP50Ms)),
        latencyP99Ms: median(figures.map((f) => f.latencyP99Ms)),
        non2xx: figures.reduce((sum, f) => sum + f.non2xx, 0),
        errors: figures.reduce((sum, f) => sum + f.errors, 0),
      };
    };
    const pingRuns = runs.get('ping') ?? [];
    const liveRuns = runs.get('live') ?? [];
    const healthRuns = runs.get('health') ?? [];
    const classifyRuns = runs.get('classify') ?? [];
    const ratioTo = (base: EndpointFigures[], of: EndpointFigures[] = classifyRuns) =>
      of.map((f, i) => f.requestsPerSecond / (base[i]?.requestsPerSecond ?? Number.NaN));
    const liveRatioRuns = ratioTo(liveRuns);

    const batch = summarise('classifyBatch1000');
    result.byConnections[String(connections)] = {
      endpoints: {
        ping: summarise('ping'),
        live: summarise('live'),
        health: summarise('health'),
        classify: summarise('classify'),
        classifyBatch1000: batch,
      },
      classifyVsLive: median(liveRatioRuns),
      classifyVsLiveRuns: liveRatioRuns,
      classifyVsPing: median(ratioTo(pingRuns)),
      liveVsPing: median(ratioTo(pingRuns, liveRuns)),
      classifyVsHealth: median(ratioTo(healthRuns)),
      classifyVsLiveByServerCpu: median(classifyRuns.map((f, i) => (liveRuns[i]?.serverCpuMicrosPerRequest ?? Number.NaN) / f.serverCpuMicrosPerRequest)),
      batchFormulasPerSecond: batch.requestsPerSecond * 1000,
    };
  }
  return result;
}
