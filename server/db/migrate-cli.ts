import { readEnv } from '@/server/env';
import { resolveDatabase } from './database';
import { migrate, openOrm } from './orm';
import { seedDemo } from './seed';

/** `npm run db:migrate` / `npm run db:seed` (with --seed): against DATABASE_URL or the private cluster. */
async function main() {
  const seed = process.argv.includes('--seed');
  const env = readEnv();
  const { url, cluster } = await resolveDatabase(env, console.log);
  const orm = await openOrm(url);
  try {
    const applied = await migrate(orm);
    console.log(applied.length ? `Applied: ${applied.join(', ')}` : 'No pending migrations.');
    if (seed) {
      await seedDemo(orm);
      console.log('Demo data present.');
    }
  } finally {
    await orm.close(true);
    await cluster?.stop();
  }
}

main().catch((error: Error) => {
  console.error(error.message);
  process.exit(1);
});
