import type { Express } from 'express';
import { createApp } from '@/server/app';
import { startChangeFeed, type ChangeFeed } from '@/server/db/change-feed';
import { openOrm, type Orm } from '@/server/db/orm';
import { createTestDatabase } from './test-database';

export interface TestApp {
  app: Express;
  orm: Orm;
  databaseUrl: string;
  changeFeed: ChangeFeed;
  close: () => Promise<void>;
}

/** createApp() over a database of its own, for one test file. */
export async function createTestApp(options: { webDir?: string } = {}): Promise<TestApp> {
  const database = await createTestDatabase();
  const orm = await openOrm(database.url);
  // As in production: session lookups and searches are cached, and every write drops them.
  const changeFeed = await startChangeFeed(orm, database.url);
  // Review e-mails go out in the background after a commit: let them finish before the database goes.
  let settleMail: () => Promise<void> = async () => {};
  const app = createApp({ orm, webDir: options.webDir, changeFeed, onReviewMail: (mail) => (settleMail = () => mail.settle()) });
  return {
    app,
    orm,
    databaseUrl: database.url,
    changeFeed,
    close: async () => {
      await settleMail();
      await changeFeed.stop();
      await orm.close(true);
      await database.drop();
    },
  };
}
