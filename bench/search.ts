/**
 * Section 3: library search at 100 000 generated entries (issue 8). A throwaway cluster, the
 * real migrations, server/modules/library/generate.ts, then each typical search ~40 times through
 * the real service (searchComplexes) for p50/p95 — and the same searches with index and bitmap
 * scans switched off in the session (an unindexed scan of the same SQL), in the same run, for the
 * speed-up ratio. Figures are milliseconds of wall time per search, page 1–3 of 20.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { EntityManager } from '@mikro-orm/postgresql';
import { complexSearchQuerySchema } from '@/lib/schemas/library';
import { searchComplexes } from '@/server/modules/library/complex-search';
import { buildSearchWorld } from './search-world';
import { percentile, round } from './stats';

export const SEARCH_TARGET_P95_MS = 25;
export const SEARCH_TARGET_RATIO = 20;

/** The three typical searches of issue 8. */
export const typicalSearches: Record<string, Record<string, string>> = {
  'text "Co amm"': { q: 'Co amm' },
  '"ammine" metal=Co verdict=inert': { q: 'ammine', metal: 'Co', verdict: 'inert' },
  'ligand=NH3 measurementKind=water-exchange': { ligand: 'NH3', measurementKind: 'water-exchange' },
};

export interface SearchFigure {
  who: 'viewer' | 'curator';
  search: string;
  total: number;
  indexed: { p50Ms: number; p95Ms: number; runs: number };
  scan: { p50Ms: number; p95Ms: number; runs: number };
  /** scan p50 / indexed p50 */
  ratio: number;
}

export interface SearchBenchResult {
  entries: number;
  generateSeconds: number;
  figures: SearchFigure[];
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
        const timeOne = async (i: number, scan: boolean) => {
          const started = performance.now();
          const run = (em: EntityManager) => searchComplexes(em, userId, { ...query, page: 1 + (i % 3) });
          const result = scan
            ? await world.orm.em.fork().transactional(async (tem) => {
                for (const setting of noIndexes) await tem.execute(setting);
                return run(tem);
              })
            : await run(world.orm.em.fork());
          return { ms: performance.now() - started, total: result.total };
        };
        await timeOne(0, false); // warm the caches and the connection
        const indexed: number[] = [];
        let total = 0;
        for (let i = 0; i < runs; i += 1) {
          const one = await timeOne(i, false);
          indexed.push(one.ms);
          total = one.total;
        }
        const scan: number[] = [];
        for (let i = 0; i < scanRuns; i += 1) {
          const one = await timeOne(i, true);
          scan.push(one.ms);
          if (one.total !== total) throw new Error(`search bench: ${label} counted ${one.total} by scan but ${total} by index`);
        }
        const figure: SearchFigure = {
          who,
          search: label,
          total,
          indexed: { p50Ms: round(percentile(indexed, 50), 1), p95Ms: round(percentile(indexed, 95), 1), runs },
          scan: { p50Ms: round(percentile(scan, 50), 1), p95Ms: round(percentile(scan, 95), 1), runs: scanRuns },
          ratio: round(percentile(scan, 50) / percentile(indexed, 50), 1),
        };
        log(`search: ${who} ${label}: total ${total}, p50 ${figure.indexed.p50Ms} ms, p95 ${figure.indexed.p95Ms} ms, scan p50 ${figure.scan.p50Ms} ms (${figure.ratio}×)`);
        figures.push(figure);
      }
    }
    return { entries, generateSeconds: round(world.generateSeconds, 1), figures };
  } finally {
    await world.orm.close(true);
    await world.cluster.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
