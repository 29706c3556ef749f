import type { Express } from 'express';
import { createApp } from '@/server/app';
import { openOrm, type Orm } from '@/server/db/orm';
import { createTestDatabase } from './test-database';

export interface TestApp {
  app: Express;
  orm: Orm;
  databaseUrl: string;
  close: () => Promise<void>;
}

/** createApp() over a database of its own, for one test file. */
export async function createTestApp(options: { webDir?: string } = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const orm = await openOrm(database.url);
  const app = createApp({ orm, webDir: options.webDir });
  return {
    app,
    orm,
    databaseUrl: database.url,
    close: async () => {
      await orm.close(true);
      await database.drop();
    },
  };
}
