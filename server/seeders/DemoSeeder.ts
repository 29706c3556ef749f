import { randomUUID } from 'node:crypto';
import type { EntityManager } from '@mikro-orm/core';
import { Seeder } from '@mikro-orm/seeder';
import { AppSetting } from '@/server/modules/settings/app-setting.entity';
import { User } from '@/server/modules/auth/user.entity';
import { DEMO_GROUPS, DEMO_PASSWORD, demoAccounts } from '@/server/modules/auth/demo-accounts';
import { hashPassword } from '@/server/modules/auth/password';
import { ResearchGroup } from '@/server/modules/groups/group.entity';
import { GroupMembership } from '@/server/modules/groups/membership.entity';
import { seedDemoLibrary } from '@/server/modules/library/demo-library';

export const DEMO_SEED_KEY = 'demo-seed';
/** Its own marker, so a database seeded before accounts existed still gets the lab's people once. */
export const DEMO_PEOPLE_SEED_KEY = 'demo-seed-people';
/** The lab's library has its own marker too, for databases seeded before the library existed. */
export const DEMO_LIBRARY_SEED_KEY = 'demo-seed-library';

/**
 * The invented Larkspur Coordination Lab (North Fen Institute). Runs once per database: the
 * marker row keeps a second `npm start` from seeding again over the group's own edits.
 */
export class DemoSeeder extends Seeder {
  async run(em: EntityManager): Promise<void> {
    if (!(await em.findOne(AppSetting, { key: DEMO_PEOPLE_SEED_KEY }))) {
      await seedDemoPeople(em);
      em.create(AppSetting, { key: DEMO_PEOPLE_SEED_KEY, value: { seededAt: new Date().toISOString() } });
      await em.flush();
    }
    if (!(await em.findOne(AppSetting, { key: DEMO_LIBRARY_SEED_KEY }))) {
      const library = await seedDemoLibrary(em);
      em.create(AppSetting, { key: DEMO_LIBRARY_SEED_KEY, value: { ...library, seededAt: new Date().toISOString() } });
      await em.flush();
    }
    const done = await em.findOne(AppSetting, { key: DEMO_SEED_KEY });
    if (done) return;
    // Later modules add the lab's library here, before the marker.
    em.create(AppSetting, {
      key: DEMO_SEED_KEY,
      value: { scenario: 'Larkspur Coordination Lab (invented demo data)', seededAt: new Date().toISOString() },
    });
    await em.flush();
  }
}

/** The lab's people and a second, separate group; all verified, all with the demo password. */
async function seedDemoPeople(em: EntityManager): Promise<void> {
  const groups = {
    larkspur: em.create(ResearchGroup, { id: randomUUID(), name: DEMO_GROUPS.larkspur }),
    fenwick: em.create(ResearchGroup, { id: randomUUID(), name: DEMO_GROUPS.fenwick }),
  };
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const memberships: { groupId: string; userId: string; role: (typeof demoAccounts)[number]['role'] }[] = [];
  for (const account of demoAccounts) {
    if (await em.findOne(User, { email: account.email })) continue;
    const user = em.create(User, {
      id: randomUUID(),
      email: account.email,
      displayName: account.displayName,
      passwordHash,
      emailVerifiedAt: new Date(),
    });
    memberships.push({ groupId: groups[account.group].id, userId: user.id, role: account.role });
  }
  // Memberships refer to groups and users by plain id columns (no ORM relation), so the unit of
  // work does not know to insert those first: it did not on an older database. Write them first.
  await em.flush();
  for (const membership of memberships) em.create(GroupMembership, membership);
}
