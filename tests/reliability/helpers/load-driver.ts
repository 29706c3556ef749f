import { HttpClient } from './http-client';

/**
 * A bounded load generator: `workers` loops (one keep-alive connection each, spread over the given
 * servers) that run a weighted mix of reads, searches, classifications and writes until the
 * deadline. Every request has a timeout, so a hang is counted, never waited out. Writes are
 * accounted: a 201 with an id is an acknowledged create, a 200 on PATCH an acknowledged version.
 */

export interface Persona {
  email: string;
  /** Session cookie value (signed in beforehand, on any server). */
  cookie: string;
  canWrite: boolean;
}

export type Operation = 'list' | 'filter' | 'search' | 'me' | 'classify' | 'create' | 'edit';

export interface Sample {
  op: Operation;
  server: number;
  startedAtMs: number;
  ms: number;
  /** 0 = no answer (network error or timeout). */
  status: number;
  errorCode?: string;
}

export interface LoadReport {
  samples: Sample[];
  acknowledgedCreates: string[];
  /** Entry id → the highest version a PATCH was acknowledged with. */
  acknowledgedEdits: Map<string, number>;
  /** Every acknowledged (id, version) pair, to find its revision. */
  acknowledgedEditVersions: { id: string; version: number }[];
  failures: string[];
  /** 409s that followed an unanswered change of the same entry (its commit raced the outage). */
  conflictsAfterUnansweredChange: number;
  /** Creates answered 503 or not at all, with what a client needs to send them again (same Idempotency-Key). */
  unansweredCreates: { client: HttpClient; key: string; body: { formula: string; name: string; notes: string } }[];
}

const FORMULAS = ['[Co(NH3)6]3+', '[Cr(H2O)6]3+', '[Fe(CN)6]4-', '[Ni(en)3]2+', '[Cu(NH3)4]2+', '[Rh(NH3)5Cl]2+', 'K3[Cr(ox)3]', '[Ru(bpy)3]2+', '[Mn(H2O)6]2+', '[V(H2O)6]3+'];
const SEARCHES = ['cobalt', 'Co amm', 'hexaaqua', 'chromium', 'oxalato', 'ru bpy', 'nickel', 'zzzz-no-match'];
const FILTERS = ['metal=Co', 'verdict=inert', 'status=accepted', 'measurementKind=water-exchange', 'hasCitation=true', 'dCount=6', 'oxidationState=3', 'ligand=NH3'];
const WEIGHTS: [Operation, number][] = [['list', 12], ['filter', 10], ['search', 14], ['me', 10], ['classify', 20], ['create', 14], ['edit', 20]];

/** Small deterministic PRNG (mulberry32), one per worker, so a run can be repeated. */
function random(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

export async function runLoad(options: {
  servers: string[];
  personas: Persona[];
  workers: number;
  durationMs: number;
  timeoutMs?: number;
  /** Statuses that count as fine besides 2xx (e.g. [503] while the database is away). */
  tolerated?: number[];
  seed?: number;
}): Promise<LoadReport> {
  const report: LoadReport = { samples: [], acknowledgedCreates: [], acknowledgedEdits: new Map(), acknowledgedEditVersions: [], failures: [], conflictsAfterUnansweredChange: 0, unansweredCreates: [] };
  // Idempotency keys unique to this run (the same database may see several runs).
  const runTag = Math.random().toString(36).slice(2, 10);
  const started = Date.now();
  const deadline = started + options.durationMs;
  const tolerated = new Set(options.tolerated ?? []);
  const totalWeight = WEIGHTS.reduce((sum, [, w]) => sum + w, 0);

  const worker = async (index: number) => {
    const persona = options.personas[index % options.personas.length] as Persona;
    const serverIndex = index % options.servers.length;
    const client = new HttpClient(options.servers[serverIndex] as string, options.timeoutMs ?? 10_000);
    client.cookie = persona.cookie;
    const next = random((options.seed ?? 9) * 1000 + index);
    // `uncertain`: a change to it went unanswered (503 or no answer). It may have committed before
    // the read-back failed, so the next save may rightly get 409 with the current version.
    const own: { id: string; version: number; uncertain?: boolean }[] = [];
    let created = 0;
    while (Date.now() < deadline) {
      let pick = next() * totalWeight;
      let op: Operation = 'list';
      for (const [candidate, weight] of WEIGHTS) {
        pick -= weight;
        if (pick < 0) {
          op = candidate;
          break;
        }
      }
      // A writer's first request creates an entry, so that its later edits have something to work on.
      if (persona.canWrite && created === 0) op = 'create';
      if ((op === 'create' || op === 'edit') && !persona.canWrite) op = 'search';
      if (op === 'edit' && own.length === 0) op = 'create';
      const choose = <T>(items: readonly T[]) => items[Math.floor(next() * items.length)] as T;
      const startedAtMs = Date.now() - started;
      const t0 = performance.now();
      const sample: Sample = { op, server: serverIndex, startedAtMs, ms: 0, status: 0 };
      let editing: (typeof own)[number] | null = null;
      let toleratedConflict = false;
      try {
        let result;
        if (op === 'list') result = await client.get(`/api/complexes?page=${1 + Math.floor(next() * 3)}&pageSize=20`);
        else if (op === 'filter') result = await client.get(`/api/complexes?${choose(FILTERS)}`);
        else if (op === 'search') result = await client.get(`/api/complexes?q=${encodeURIComponent(choose(SEARCHES))}`);
        else if (op === 'me') result = await client.get('/api/auth/me');
        else if (op === 'classify') result = await client.post('/api/classify', { formula: choose(FORMULAS) });
        else if (op === 'create') {
          created += 1;
          const body = { formula: choose(FORMULAS), name: `load entry w${index}-${created}`, notes: `worker ${index}` };
          const key = `load-${runTag}-w${index}-${created}`;
          result = await client.request('POST', '/api/complexes', body, { headers: { 'Idempotency-Key': key } }).catch((error: unknown) => {
            report.unansweredCreates.push({ client, key, body });
            throw error;
          });
          if (result.status === 503) report.unansweredCreates.push({ client, key, body });
          const id = (result.body as { id?: unknown }).id;
          if (result.status === 201 && typeof id === 'string') {
            report.acknowledgedCreates.push(id);
            own.push({ id, version: Number((result.body as { version?: unknown }).version) });
          }
        } else {
          const entry = choose(own);
          editing = entry;
          result = await client.patch(`/api/complexes/${entry.id}`, { version: entry.version, notes: `edited by worker ${index} at ${Date.now()}` });
          const version = (result.body as { version?: unknown }).version;
          if (result.status === 200 && typeof version === 'number') {
            entry.version = version;
            report.acknowledgedEditVersions.push({ id: entry.id, version });
            report.acknowledgedEdits.set(entry.id, Math.max(version, report.acknowledgedEdits.get(entry.id) ?? 0));
          } else if (result.status === 409) {
            // Only this worker edits its entries: a 409 is a phantom write unless the last change went unanswered.
            const current = (result.body as { error?: { currentVersion?: unknown } }).error?.currentVersion;
            if (typeof current === 'number') entry.version = current;
            if (entry.uncertain) {
              entry.uncertain = false;
              report.conflictsAfterUnansweredChange += 1;
              toleratedConflict = true;
            }
          } else {
            entry.uncertain = true;
          }
        }
        sample.status = result.status;
        if (result.status >= 400) {
          const code = (result.body as { error?: { code?: unknown } }).error?.code;
          if (typeof code === 'string') sample.errorCode = code;
        }
        const ok = result.status < 400 || tolerated.has(result.status) || toleratedConflict;
        if (!ok && report.failures.length < 50) report.failures.push(`${op} on server ${serverIndex}: ${result.status} ${JSON.stringify(result.body).slice(0, 200)}`);
      } catch (error) {
        if (editing) editing.uncertain = true;
        sample.status = 0;
        sample.errorCode = (error as Error).name;
        if (report.failures.length < 50) report.failures.push(`${op} on server ${serverIndex}: no answer (${(error as Error).name}: ${(error as Error).message})`);
      }
      sample.ms = performance.now() - t0;
      report.samples.push(sample);
      // Back off a little after a failure so a dead database is not hammered in a tight loop.
      if (sample.status === 0 || sample.status >= 500) await new Promise((r) => setTimeout(r, 50));
    }
  };
  await Promise.all(Array.from({ length: options.workers }, (_, i) => worker(i)));
  return report;
}

export function summarise(report: LoadReport) {
  const byStatus: Record<string, number> = {};
  for (const s of report.samples) byStatus[String(s.status)] = (byStatus[String(s.status)] ?? 0) + 1;
  const latencies = report.samples.map((s) => s.ms).sort((a, b) => a - b);
  const at = (q: number) => Math.round(latencies[Math.min(latencies.length - 1, Math.floor(q * latencies.length))] ?? 0);
  return {
    requests: report.samples.length,
    byStatus,
    noAnswer: report.samples.filter((s) => s.status === 0).length,
    serverErrors: report.samples.filter((s) => s.status >= 500).length,
    p50Ms: at(0.5),
    p99Ms: at(0.99),
    maxMs: Math.round(latencies[latencies.length - 1] ?? 0),
    creates: report.acknowledgedCreates.length,
    edits: report.acknowledgedEditVersions.length,
  };
}
