/**
 * Sections 3 (library search) and 4 (CSV import). Each runs on a throwaway database of its own
 * (bench/search.ts, bench/import.ts), prints its figures (target, measured, met / short) and
 * returns them for the JSON report. A section whose module is missing returns a skip with the reason.
 */
import fs from 'node:fs';
import path from 'node:path';
import { IMPORT_TARGET_SECONDS, runImportBenchOn } from './import';
import { runSearchBenchOn, SEARCH_TARGET_P95_MS, SEARCH_TARGET_RATIO } from './search';

export interface SkippedSection {
  skipped: string;
}

const log = (line: string) => console.log(`[bench] ${line}`);

function printRows(title: string, rows: [string, string, string, string][]) {
  const widths = [0, 1, 2, 3].map((i) => Math.max(...rows.map((row) => row[i]!.length)));
  console.log(`\n${title}`);
  for (const row of rows) console.log(`  ${row.map((cell, i) => cell.padEnd(widths[i] ?? 0)).join(' │ ')}`);
  console.log('');
}

const verdict = (met: boolean, factor: number) => (met ? 'met' : `short by ${factor.toFixed(2)}×`);

/** Library search: 100 000 generated entries in a bench-only database, typical searches vs an unindexed scan. */
export async function runSearchBench(root: string, options: { quick?: boolean } = {}): Promise<SkippedSection | Record<string, unknown>> {
  const generator = path.join(root, 'server/modules/library/generate.ts');
  if (!fs.existsSync(path.join(root, 'server/modules/library'))) return { skipped: 'not built yet (server/modules/library does not exist)' };
  if (!fs.existsSync(generator)) return { skipped: 'not built yet (server/modules/library/generate.ts does not exist)' };
  const result = await runSearchBenchOn({ runs: options.quick ? 15 : 40, scanRuns: options.quick ? 4 : 10, log });
  const rows: [string, string, string, string][] = [['search (100 000 entries)', 'target', 'measured', 'met / short']];
  for (const f of result.figures) {
    rows.push([
      `${f.who} ${f.search} (${f.total} hits): p50 / p95`,
      `p95 ≤ ${SEARCH_TARGET_P95_MS} ms`,
      `${f.indexed.p50Ms} / ${f.indexed.p95Ms} ms`,
      verdict(f.indexed.p95Ms <= SEARCH_TARGET_P95_MS, f.indexed.p95Ms / SEARCH_TARGET_P95_MS),
    ]);
    rows.push([
      `${f.who} ${f.search}: unindexed scan p50 / p95`,
      `≥ ${SEARCH_TARGET_RATIO}× faster`,
      `${f.scan.p50Ms} / ${f.scan.p95Ms} ms → ${f.ratio}×`,
      verdict(f.ratio >= SEARCH_TARGET_RATIO, SEARCH_TARGET_RATIO / f.ratio),
    ]);
  }
  printRows(`Library search (generated ${result.entries} in ${result.generateSeconds} s)`, rows);
  return { ...result };
}

/** CSV import: a 10 000-row CSV through POST /api/imports (dry run, then the import, wait=true). */
export async function runImportBench(root: string): Promise<SkippedSection | Record<string, unknown>> {
  if (!fs.existsSync(path.join(root, 'server/modules/exchange/import.service.ts'))) return { skipped: 'not built yet (server/modules/exchange/import.service.ts does not exist)' };
  const result = await runImportBenchOn({ log });
  printRows('CSV import', [
    ['import (10 000 rows)', 'target', 'measured', 'met / short'],
    ['dry run (POST …&dryRun=true&wait=true)', `≤ ${IMPORT_TARGET_SECONDS} s`, `${result.dryRunSeconds} s`, verdict(result.dryRunSeconds <= IMPORT_TARGET_SECONDS, result.dryRunSeconds / IMPORT_TARGET_SECONDS)],
    [`import (${result.entries} entries, ${result.measurements} measurements)`, `≤ ${IMPORT_TARGET_SECONDS} s`, `${result.importSeconds} s (${result.rowsPerSecond} rows/s)`, verdict(result.importSeconds <= IMPORT_TARGET_SECONDS, result.importSeconds / IMPORT_TARGET_SECONDS)],
  ]);
  return { ...result };
}
