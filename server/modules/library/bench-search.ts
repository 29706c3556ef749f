import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { startPrivateCluster } from '@/server/db/cluster';
import { migrate, openOrm } from '@/server/db/orm';
import { complexSearchQuerySchema } from '@/lib/schemas/library';
import { User } from '@/server/modules/auth/user.entity';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { searchComplexes } from './complex-search';
import { generateSyntheticEntries } from './generate';

/**
 * `npx tsx server/modules/library/bench-search.ts [entries=100000] [runs=60]`: a throwaway
 * cluster, N synthetic entries in one group, then the three typical searches (text, text +
 * filters, filters only) as a viewer and as a curator; prints p50/p95 in milliseconds.
 */
async function main() {
  const count = Number(process.argv[2] ?? 100_000);
  const runs = Number(process.argv[3] ?? 60);
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sphereline-bench-pg-'));
  fs.chmodSync(dir, 0o755);
  const cluster = await startPrivateCluster(dir, { database: 'sphereline_bench', throwaway: true });
  const orm = await openOrm(cluster.url);
  try {
    await migrate(orm);
    const em = orm.em.fork();
    const viewer = em.create(User, { email: 'bench.viewer@larkspur.example.org', displayName: 'bench viewer', passwordHash: 'x' });
    const curator = em.create(User, { email: 'bench.curator@larkspur.example.org', displayName: 'bench curator', passwordHash: 'x' });
    const group = em.create(ResearchGroup, { name: 'Benchmark lab' });
    await em.flush();
    em.create(GroupMembership, { groupId: group.id, userId: viewer.id, role: 'viewer' });
    em.create(GroupMembership, { groupId: group.id, userId: curator.id, role: 'curator' });
    await em.flush();
    let started = Date.now();
    await generateSyntheticEntries(orm.em.fork(), { groupId: group.id, count, createdById: curator.id });
    console.log(`generated ${count} entries in ${((Date.now() - started) / 1000).toFixed(1)} s`);

    const searches: Record<string, Record<string, string>> = {
      'text "Co amm"': { q: 'Co amm' },
      'text + filters "ammine" metal=Co verdict=inert': { q: 'ammine', metal: 'Co', verdict: 'inert' },
      'filters only ligand=NH3 measurementKind=water-exchange': { ligand: 'NH3', measurementKind: 'water-exchange' },
    };
    for (const [who, userId] of [['viewer', viewer.id], ['curator', curator.id]] as const) {
      for (const [label, raw] of Object.entries(searches)) {
        const query = complexSearchQuerySchema.parse({ ...raw, pageSize: '20' });
        const times: number[] = [];
        let total = 0;
        for (let i = 0; i < runs; i += 1) {
          started = performance.now();
          total = (await searchComplexes(orm.em.fork(), userId, { ...query, page: 1 + (i % 3) })).total;
          times.push(performance.now() - started);
        }
        times.sort((a, b) => a - b);
        const at = (p: number) => times[Math.min(times.length - 1, Math.floor(p * times.length))]!.toFixed(1);
        console.log(`${who.padEnd(8)} ${label.padEnd(56)} total=${String(total).padStart(6)}  p50=${at(0.5)} ms  p95=${at(0.95)} ms`);
      }
    }
  } finally {
    await orm.close(true);
    await cluster.stop();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}

main().catch((error: unknown) => {
  console.error(error);
  process.exit(1);
});
