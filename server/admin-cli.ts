/**
 * `npm run --silent admin -- --email <address> --name "<name>" --group "<research group>"`
 *
 * Makes the first administrator of an installation (production never seeds demo accounts): an
 * account without a usable password, admin of a new research group, and a one-time link, printed
 * here, on which they choose their password. Uses DATABASE_URL, or the private cluster of `npm start`
 * under DATA_DIR; applies pending migrations first, so it works on a fresh database.
 */
import { resolveDatabase } from './db/database';
import { migrate, openOrm } from './db/orm';
import { readEnv } from './env';
import { AppError } from './http/errors';
import { createFirstAdmin, FIRST_ADMIN_LINK_HOURS, firstAdminInputSchema } from './modules/auth/first-admin';

const USAGE = 'Usage: npm run --silent admin -- --email <address> --name "<name>" --group "<research group>"';

function readFlags(argv: string[]): Record<string, string> {
  const flags: Record<string, string> = {};
  for (let i = 0; i < argv.length; i += 1) {
    const arg = argv[i] ?? '';
    if (!arg.startsWith('--')) throw new AppError('VALIDATION_FAILED', `Unexpected argument "${arg}". ${USAGE}`);
    const value = argv[i + 1];
    if (value === undefined || value.startsWith('--')) throw new AppError('VALIDATION_FAILED', `${arg} needs a value. ${USAGE}`);
    flags[arg.slice(2)] = value;
    i += 1;
  }
  return flags;
}

async function main() {
  const parsed = firstAdminInputSchema.safeParse(readFlags(process.argv.slice(2)));
  if (!parsed.success) throw new AppError('VALIDATION_FAILED', `${parsed.error.issues.map((issue) => issue.message).join(' ')}\n${USAGE}`);
  const env = readEnv();
  const { url, cluster } = await resolveDatabase(env, (line) => console.error(line));
  const orm = await openOrm(url);
  try {
    await migrate(orm);
    // A command-line run has no request context.
    const { link } = await createFirstAdmin(orm.em.fork(), parsed.data, env.appUrl);
    console.log(`Administrator ${parsed.data.email} created, admin of "${parsed.data.group}".`);
    console.log(`Send them this link; it works once, within ${FIRST_ADMIN_LINK_HOURS} hours, to choose a password:`);
    console.log(link);
  } finally {
    await orm.close(true);
    // Stops the private PostgreSQL unless a running server still uses it.
    await cluster?.stop();
  }
}

main().catch((error: Error) => {
  console.error(error.message);
  process.exit(1);
});
