import type { Orm } from './orm';
import { DemoSeeder } from '@/server/seeders/DemoSeeder';

export async function seedDemo(orm: Orm): Promise<void> {
  await orm.getSeeder().seed(DemoSeeder);
}
