import type { EntityManager } from '@mikro-orm/core';
import { Seeder } from '@mikro-orm/seeder';
import { AppSetting } from '@/server/modules/settings/app-setting.entity';

export const DEMO_SEED_KEY = 'demo-seed';

/**
 * The invented Larkspur Coordination Lab (North Fen Institute). Runs once per database: the
 * marker row keeps a second `npm start` from seeding again over the group's own edits.
 */
export class DemoSeeder extends Seeder {
  async run(em: EntityManager): Promise<void> {
    const done = await em.findOne(AppSetting, { key: DEMO_SEED_KEY });
    if (done) return;
    // Later modules add the lab's members, groups and library here, before the marker.
    em.create(AppSetting, {
      key: DEMO_SEED_KEY,
      value: { scenario: 'Larkspur Coordination Lab (invented demo data)', seededAt: new Date().toISOString() },
    });
    await em.flush();
  }
}
