/**
 * Section 3: library search at 100 000 generated entries. A throwaway cluster, the
 * real migrations, server/modules/library/generate.ts, then each typical search ~40 times through
 * the real service (searchComplexes) for p50/p95 — and the same searches with index and bitmap
 * scans switched off in the session (an unindexed scan of the same SQL), in the same run, for the
 * speed-up ratio. Figures are milliseconds of wall time per search, page 1–3 of 20.
 *
 * Two unindexed baselines, both with index and bitmap scans off: the service's own statements
 * (same SQL; for a text search that is one scan per rank level it probes), and the single-pass
 * strategy (every match ranked in one scan, then sorted). The ratio is taken against the faster
 * of the two, so the baseline is never one that repeats scans only because indexes are off.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { EntityManager } from '@mikro-orm/postgresql';
import { complexSearchQuerySchema } from '@/lib/schemas/library';
import { searchComplexes, type SearchStrategy } from '@/server/modules/library/complex-search';
import { buildSearchWorld } from './search-world';
import { percentile, round } from './stats';

export const SEARCH_TARGET_P95_MS = 25;
export const SEARCH_TARGET_RATIO = 20;

/** The three typical searches the bench times. */
export const typicalSearches: Record<string, Record<string, string>> = {
  'text "Co amm"': { q: 'Co amm' },
  '"ammine" metal=Co verdict=inert': { q: 'ammine', metal: 'Co', verdict: 'inert' },
  'ligand=NH3 measurementKind=water-exchange': { ligand: 'NH3', measurementKind: 'water-exchange' },
};

/** Column orders of the library table (`sort`, `dir`), timed the same way on the same entries, pages 1–3 of 20. */
export const columnSorts: Record<string, Record<string, string>> = {
  'sort=name': { sort: 'name', dir: 'asc' },
  'sort=updated dir=desc': { sort: 'updated', dir: 'desc' },
  'sort=verdict': { sort: 'verdict', dir: 'asc' },
  'sort=measurements dir=desc': { sort: 'measurements', dir: 'desc' },
  '"ammine" sort=formula': { q: 'ammine', sort: 'formula', dir: 'asc' },
};

export interface SortFigure {
  who: 'viewer' | 'curator';
  search: string;
  total: number;
  totalIsLowerBound: boolean;
  indexed: { p50Ms: number; p95Ms: number; runs: number };
}

export interface SearchFigure {
  who: 'viewer' | 'curator';
  search: string;
  total: number;
  /** True when the search stopped counting at its cap ("1000+"). */
  totalIsLowerBound: boolean;
  indexed: { p50Ms: number; p95Ms: number; runs: number };
  /** Page 1 alone, and pages 2–3 alone (the same runs as `indexed`, split). */
  firstPage: { p50Ms: number; p95Ms: number; runs: number };
  laterPages: { p50Ms: number; p95Ms: number; runs: number };
  /** The faster unindexed baseline (see scanPlan); both are in scans. */
  scan: { p50Ms: number; p95Ms: number; runs: number };
  scanPlan: 'same-sql' | 'single-pass';
  scans: Record<'same-sql' | 'single-pass', { p50Ms: number; p95Ms: number; runs: number }>;
  /** scan p50 / indexed p50 */
  ratio: number;
}

export interface SearchBenchResult {
  entries: number;
  generateSeconds: number;
  figures: SearchFigure[];
  sorts: SortFigure[];
}

const noIndexes = ['set local enable_indexscan = off', 'set local enable_bitmapscan = off', 'set local enable_indexonlyscan = off'];

export async function runSearchBenchOn(options: { entries?: number; runs?: number; scanRuns?: number; log?: (line: string) => void } = {}): Promise<SearchBenchResult> {
  const entries = options.entries ?? 100_000;
  const runs = options.runs ?? 40;
  const scanRuns = options.scanRuns ?? 10;
  const log = options.log ?? (() => {});
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-bench-search-pg-'));
  fs.chmodSync(dir, 0o755);
  log(`search: generating ${entries} entries in a throwaway database …`);
  const world = await buildSearchWorld(dir, entries);
  try {
    log(`search: generated in ${world.generateSeconds.toFixed(1)} s; ${runs} runs per search (indexed), ${scanRuns} (scan) …`);
    const figures: SearchFigure[] = [];
    for (const [who, userId] of [['viewer', world.viewerId], ['curator', world.curatorId]] as const) {
      for (const [label, raw] of Object.entries(typicalSearches)) {
        const query = complexSearchQuerySchema.parse({ ...raw, pageSize: '20' });
        const timeOne = async (i: number, scan: boolean, strategy: SearchStrategy = 'auto') => {
          const started = performance.now();
          const run = (em: EntityManager) => searchComplexes(em, userId, { ...query, page: 1 + (i % 3) }, { strategy });
          const result = scan
            ? await world.orm.em.fork().transactional(async (tem) => {
                for (const setting of noIndexes) await tem.execute(setting);
                return run(tem);
              })
            : await run(world.orm.em.fork());
          return { ms: performance.now() - started, total: result.total, totalIsLowerBound: result.totalIsLowerBound };
        };
        await timeOne(0, false); // warm the caches and the connection
        const indexed: number[] = [];
        const firstPage: number[] = [];
        const laterPages: number[] = [];
        let total = 0;
        let totalIsLowerBound = false;
        for (let i = 0; i < runs; i += 1) {
          const one = await timeOne(i, false);
          indexed.push(one.ms);
          (i % 3 === 0 ? firstPage : laterPages).push(one.ms);
          total = one.total;
          totalIsLowerBound = one.totalIsLowerBound;
        }
        const scanTimes: Record<'same-sql' | 'single-pass', number[]> = { 'same-sql': [], 'single-pass': [] };
        for (let i = 0; i < scanRuns; i += 1) {
          for (const plan of ['same-sql', 'single-pass'] as const) {
            const one = await timeOne(i, true, plan === 'same-sql' ? 'auto' : 'single-pass');
            scanTimes[plan].push(one.ms);
            if (one.total !== total) throw new Error(`search bench: ${label} counted ${one.total} by ${plan} scan but ${total} by index`);
          }
        }
        const summary = (ms: number[]) => ({ p50Ms: round(percentile(ms, 50), 1), p95Ms: round(percentile(ms, 95), 1), runs: ms.length });
        const scanPlan = percentile(scanTimes['single-pass'], 50) <= percentile(scanTimes['same-sql'], 50) ? 'single-pass' : 'same-sql';
        const figure: SearchFigure = {
          who,
          search: label,
          total,
          totalIsLowerBound,
          indexed: summary(indexed),
          firstPage: summary(firstPage),
          laterPages: summary(laterPages),
          scan: summary(scanTimes[scanPlan]),
          scanPlan,
          scans: { 'same-sql': summary(scanTimes['same-sql']), 'single-pass': summary(scanTimes['single-pass']) },
          ratio: round(percentile(scanTimes[scanPlan], 50) / percentile(indexed, 50), 1),
        };
        log(
          `search: ${who} ${label}: total ${total}${totalIsLowerBound ? '+' : ''}, p50 ${figure.indexed.p50Ms} ms, p95 ${figure.indexed.p95Ms} ms ` +
            `(page 1 p50/p95 ${figure.firstPage.p50Ms}/${figure.firstPage.p95Ms}, pages 2–3 ${figure.laterPages.p50Ms}/${figure.laterPages.p95Ms}), ` +
            `scan p50 same SQL ${figure.scans['same-sql'].p50Ms} ms, single pass ${figure.scans['single-pass'].p50Ms} ms → ${figure.ratio}× (vs ${scanPlan})`,
        );
        figures.push(figure);
      }
    }
    const sorts: SortFigure[] = [];
    for (const [who, userId] of [['viewer', world.viewerId], ['curator', world.curatorId]] as const) {
      for (const [label, raw] of Object.entries(columnSorts)) {
        const query = complexSearchQuerySchema.parse({ ...raw, pageSize: '20' });
        const timed: number[] = [];
        let result = await searchComplexes(world.orm.em.fork(), userId, query); // warm-up
        for (let i = 0; i < runs; i += 1) {
          const started = performance.now();
          result = await searchComplexes(world.orm.em.fork(), userId, { ...query, page: 1 + (i % 3) });
          timed.push(performance.now() - started);
        }
        const figure: SortFigure = {
          who,
          search: label,
          total: result.total,
          totalIsLowerBound: result.totalIsLowerBound,
          indexed: { p50Ms: round(percentile(timed, 50), 1), p95Ms: round(percentile(timed, 95), 1), runs: timed.length },
        };
        log(`search: ${who} ${label}: total ${figure.total}${figure.totalIsLowerBound ? '+' : ''}, p50 ${figure.indexed.p50Ms} ms, p95 ${figure.indexed.p95Ms} ms`);
        sorts.push(figure);
      }
    }
    return { entries, generateSeconds: round(world.generateSeconds, 1), figures, sorts };
  } finally {
    await world.orm.close(true);
    await world.cluster.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
