/**
 * `npx tsx bench/profile-engine.ts`: runs the engine bench child under `node --cpu-prof` and prints
 * the functions with the most self time (the .cpuprofile is kept in bench-results/profiles/ for
 * Chrome DevTools).
 */
import fs from 'node:fs';
import path from 'node:path';
import { runEngineBench } from './engine';

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  hitCount?: number;
}

async function main() {
  const root = path.resolve(__dirname, '..');
  const dir = path.join(root, 'bench-results', 'profiles');
  fs.mkdirSync(dir, { recursive: true });
  const before = new Set(fs.readdirSync(dir));
  const result = await runEngineBench(root, { formulasPerRun: 4000, runs: 9, nodeFlags: ['--cpu-prof', `--cpu-prof-dir=${dir}`] });
  console.log(`distinct ${Math.round(result.distinct.perSecondMedian)}/s, repeating ${Math.round(result.repeating.perSecondMedian)}/s, parse only ${Math.round(result.parseOnly.perSecondMedian)}/s (profiled: slower than the bench)`);
  const file = fs.readdirSync(dir).find((name) => !before.has(name) && name.endsWith('.cpuprofile'));
  if (!file) throw new Error('no profile written');
  const profile = JSON.parse(fs.readFileSync(path.join(dir, file), 'utf8')) as { nodes: ProfileNode[] };
  const selfHits = new Map<string, number>();
  let total = 0;
  for (const node of profile.nodes) {
    const hits = node.hitCount ?? 0;
    total += hits;
    const where = `${node.callFrame.functionName || '(anonymous)'} ${node.callFrame.url.replace(/^.*\/work\/main\//, '')}:${node.callFrame.lineNumber + 1}`;
    selfHits.set(where, (selfHits.get(where) ?? 0) + hits);
  }
  const top = [...selfHits].sort((a, b) => b[1] - a[1]).slice(0, Number(process.argv[2] ?? 30));
  for (const [where, hits] of top) console.log(`${((hits / total) * 100).toFixed(1).padStart(5)} %  ${where}`);
  console.log(`profile: ${path.join(dir, file)}`);
}

void main();
