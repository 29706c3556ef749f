/** Section 1: engine throughput on one core, in a child process (its memory is its own). */
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { EngineInput, EngineResult } from './engine-child';
import { distinctBlocks, repeatingBatch } from './formula-set';

export interface EngineOptions {
  formulasPerRun: number;
  runs: number;
  /** Extra node flags for the child, e.g. ['--cpu-prof', '--cpu-prof-dir=…'] for profiling. */
  nodeFlags?: string[];
  /** Another copy of lib/chem to measure instead of the working tree's (before/after comparisons). */
  engineDir?: string;
}

export const defaultEngineOptions: EngineOptions = { formulasPerRun: 4000, runs: 9 };
const WARMUP_BLOCKS = 3;

export function engineInput(options: EngineOptions): EngineInput & { categories: Record<string, number> } {
  // The first WARMUP_BLOCKS blocks warm up (one block left the first timed runs at a third of the
  // steady speed: V8 was still compiling the hot functions); the rest are the timed runs, each with
  // the same category mix.
  const blocks = distinctBlocks(options.runs + WARMUP_BLOCKS, options.formulasPerRun);
  const categories: Record<string, number> = {};
  for (const entry of blocks[WARMUP_BLOCKS] ?? []) categories[entry.category] = (categories[entry.category] ?? 0) + 1;
  const formulas = blocks.map((block) => block.map((entry) => entry.formula));
  const runBlocks = formulas.slice(WARMUP_BLOCKS);
  return {
    warmup: formulas.slice(0, WARMUP_BLOCKS).flat(),
    distinctRuns: runBlocks,
    // 1000 requests over 150 common formulas (Zipf-like): a library page or a CSV of a lab's stock.
    repeatingBatch: repeatingBatch(1000, 150),
    repeatingRuns: options.runs * 3,
    categories,
  };
}

export async function runEngineBench(root: string, options: EngineOptions = defaultEngineOptions) {
  const { categories, ...input } = engineInput(options);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-bench-engine-'));
  const inputFile = path.join(dir, 'input.json');
  fs.writeFileSync(inputFile, JSON.stringify(input));
  try {
    const output = await new Promise<string>((resolve, reject) => {
      const child = spawn(
        process.execPath,
        [...(options.nodeFlags ?? []), '--import', 'tsx', path.join(root, 'bench/engine-child.ts'), inputFile],
        { cwd: root, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, NODE_ENV: 'production', ...(options.engineDir ? { BENCH_ENGINE_DIR: options.engineDir } : {}) } },
      );
      let stdout = '';
      let stderr = '';
      child.stdout.on('data', (chunk: Buffer) => (stdout += chunk.toString()));
      child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
      child.on('error', reject);
      child.on('exit', (code) => (code === 0 ? resolve(stdout) : reject(new Error(`engine bench exited ${code}: ${stderr.slice(-2000)}`))));
    });
    const result = JSON.parse(output.trim().split('\n').pop() ?? '{}') as EngineResult;
    return { ...result, categories, totalDistinctFormulas: input.warmup.length + input.distinctRuns.flat().length };
  } finally {
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
