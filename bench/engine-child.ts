/**
 * Engine bench, run in its own process (`tsx bench/engine-child.ts <input.json>`) so the memory
 * figures are the engine's alone. Reads the formula sets the parent generated, prints one JSON
 * line (EngineResult) on stdout.
 *
 * - distinct: every timed run classifies formulas never seen before in this process, so the
 *   engine's memo cannot answer (each run its own slice of the generated set);
 * - repeating: a realistic batch (a few common complexes asked for again and again), where the
 *   memo does answer;
 * - parseOnly: the parser alone (the parse classifyFormula runs) on the distinct formulas, to show where the time goes.
 */
import fs from 'node:fs';
import path from 'node:path';
import { median } from './stats';

// BENCH_ENGINE_DIR points at another copy of lib/chem (e.g. the last commit's) for a before/after
// comparison in the same bench run; by default the working tree's engine.
type ClassifyModule = typeof import('@/lib/chem/classify');
type ParserModule = typeof import('@/lib/chem/formula-parser');
const engineDir = process.env.BENCH_ENGINE_DIR;
/* eslint-disable @typescript-eslint/no-require-imports */
const { classifyFormula } = (engineDir ? require(path.resolve(engineDir, 'classify')) : require('@/lib/chem/classify')) as ClassifyModule;
const parser = (engineDir ? require(path.resolve(engineDir, 'formula-parser')) : require('@/lib/chem/formula-parser')) as ParserModule;
// The parse the classifier itself runs (older copies of lib/chem may only have parseFormula).
const parseAsClassifierDoes: (formula: string) => unknown = parser.parseFormulaWithMolarMass ?? parser.parseFormula;
/* eslint-enable @typescript-eslint/no-require-imports */

export interface EngineInput {
  warmup: string[];
  distinctRuns: string[][];
  repeatingBatch: string[];
  repeatingRuns: number;
}

export interface EngineResult {
  distinct: { perSecondMedian: number; perSecondRuns: number[]; formulasPerRun: number };
  repeating: { perSecondMedian: number; perSecondRuns: number[]; batchSize: number; distinctInBatch: number };
  parseOnly: { perSecondMedian: number };
  memory: {
    rssBeforeBytes: number;
    rssAfterBytes: number;
    maxRssBytes: number;
    heapUsedPeakBytes: number;
    heapUsedBeforeBytes: number;
  };
  errors: number;
}

function timeRun(formulas: readonly string[], onError: () => void): number {
  const started = process.hrtime.bigint();
  for (let index = 0; index < formulas.length; index++) {
    try {
      classifyFormula(formulas[index] as string);
    } catch {
      onError();
    }
  }
  const seconds = Number(process.hrtime.bigint() - started) / 1e9;
  return formulas.length / seconds;
}

function main() {
  const inputFile = process.argv[2];
  if (!inputFile) throw new Error('usage: engine-child.ts <input.json>');
  const input = JSON.parse(fs.readFileSync(inputFile, 'utf8')) as EngineInput;
  const rssBeforeBytes = process.memoryUsage().rss;
  const heapUsedBeforeBytes = process.memoryUsage().heapUsed;
  let heapUsedPeakBytes = heapUsedBeforeBytes;
  const sampleHeap = () => {
    heapUsedPeakBytes = Math.max(heapUsedPeakBytes, process.memoryUsage().heapUsed);
  };
  let errors = 0;
  const onError = () => errors++;

  // Warm-up: its own formulas (disjoint from the timed ones), so the JIT is hot but the memo is cold.
  timeRun(input.warmup, onError);
  sampleHeap();

  const distinctRuns: number[] = [];
  for (const run of input.distinctRuns) {
    distinctRuns.push(timeRun(run, onError));
    sampleHeap();
  }

  const repeatingRuns: number[] = [];
  timeRun(input.repeatingBatch, onError); // first sight of the batch: the memo fills here
  for (let run = 0; run < input.repeatingRuns; run++) {
    repeatingRuns.push(timeRun(input.repeatingBatch, onError));
    sampleHeap();
  }

  // The parser alone (no memo in it), on the first distinct slice.
  const parseRuns: number[] = [];
  const parseSet = input.distinctRuns[0] ?? [];
  for (let run = 0; run < 5; run++) {
    const started = process.hrtime.bigint();
    for (const formula of parseSet) parseAsClassifierDoes(formula);
    parseRuns.push(parseSet.length / (Number(process.hrtime.bigint() - started) / 1e9));
  }
  sampleHeap();

  const result: EngineResult = {
    distinct: {
      perSecondMedian: median(distinctRuns),
      perSecondRuns: distinctRuns,
      formulasPerRun: input.distinctRuns[0]?.length ?? 0,
    },
    repeating: {
      perSecondMedian: median(repeatingRuns),
      perSecondRuns: repeatingRuns,
      batchSize: input.repeatingBatch.length,
      distinctInBatch: new Set(input.repeatingBatch).size,
    },
    parseOnly: { perSecondMedian: median(parseRuns) },
    memory: {
      rssBeforeBytes,
      rssAfterBytes: process.memoryUsage().rss,
      // resourceUsage().maxRSS is in kilobytes.
      maxRssBytes: process.resourceUsage().maxRSS * 1024,
      heapUsedPeakBytes,
      heapUsedBeforeBytes,
    },
    errors,
  };
  process.stdout.write(`${JSON.stringify(result)}\n`);
}

main();
