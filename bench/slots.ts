/**
 * Sections 3 (library search) and 4 (CSV import): slots that other engineers' modules fill.
 * Each returns a skip with the reason until its module exists.
 */
import fs from 'node:fs';
import path from 'node:path';

export interface SkippedSection {
  skipped: string;
}

/** Library search: 100 000 generated entries in a bench-only database, typical searches vs an unindexed scan. */
export async function runSearchBench(root: string): Promise<SkippedSection | Record<string, unknown>> {
  const generator = path.join(root, 'server/modules/library/generate.ts');
  if (!fs.existsSync(path.join(root, 'server/modules/library'))) return { skipped: 'not built yet (server/modules/library does not exist)' };
  if (!fs.existsSync(generator)) return { skipped: 'not built yet (server/modules/library/generate.ts does not exist)' };
  return { skipped: 'not wired yet: server/modules/library/generate.ts exists, but this slot has not been connected to it' };
}

/** CSV import: rows per second of a large generated CSV through the import service. */
export async function runImportBench(root: string): Promise<SkippedSection | Record<string, unknown>> {
  if (!fs.existsSync(path.join(root, 'server/modules/import'))) return { skipped: 'not built yet' };
  return { skipped: 'not built yet (the import module exists but this slot has not been connected to it)' };
}
