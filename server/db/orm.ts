import { MikroORM } from '@mikro-orm/postgresql';
import { buildOrmConfig } from '@/mikro-orm.config';

export type Orm = MikroORM;

export async function openOrm(databaseUrl: string): Promise<Orm> {
  // connect: false lets the server start (and answer 503) while the database is still away.
  return MikroORM.init({ ...buildOrmConfig(databaseUrl), connect: false });
}

export async function migrate(orm: Orm): Promise<string[]> {
  const applied = await orm.getMigrator().up();
  return applied.map((migration) => migration.name);
}

/** Health probe: a trivial query with a short deadline. */
export async function databaseIsUp(orm: Orm, timeoutMs = 2000): Promise<boolean> {
  let timer: ReturnType<typeof setTimeout> | undefined;
  const deadline = new Promise<boolean>((resolve) => {
    timer = setTimeout(() => resolve(false), timeoutMs);
  });
  const probe = orm.em
    .getConnection()
    .execute('select 1')
    .then(() => true)
    .catch(() => false);
  try {
    return await Promise.race([probe, deadline]);
  } finally {
    clearTimeout(timer);
  }
}
