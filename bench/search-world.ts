/**
 * The search bench's world: a throwaway cluster (or the given folder's), migrated, with one group,
 * a viewer and a curator, and N generated accepted entries (server/modules/library/generate.ts).
 */
import { startPrivateCluster, type PrivateCluster } from '@/server/db/cluster';
import { migrate, openOrm, type Orm } from '@/server/db/orm';
import { User } from '@/server/modules/auth/user.entity';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { generateSyntheticEntries } from '@/server/modules/library/generate';

export interface SearchWorld {
  cluster: PrivateCluster;
  orm: Orm;
  groupId: string;
  viewerId: string;
  curatorId: string;
  generateSeconds: number;
}

export async function buildSearchWorld(dir: string, entries: number): Promise<SearchWorld> {
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
    const started = performance.now();
    await generateSyntheticEntries(orm.em.fork(), { groupId: group.id, count: entries, createdById: curator.id });
    const generateSeconds = (performance.now() - started) / 1000;
    return { cluster, orm, groupId: group.id, viewerId: viewer.id, curatorId: curator.id, generateSeconds };
  } catch (error) {
    await orm.close(true);
    await cluster.stop();
    throw error;
  }
}
