/**
 * Recognises "the database is not there" failures (refused, reset, shut down, pool timeout) so the
 * API can answer 503 instead of 500 and recover by itself when the database returns.
 */
const unavailableCodes = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ETIMEDOUT',
  'EPIPE',
  'ENOTFOUND',
  '57P01', // admin_shutdown
  '57P02', // crash_shutdown
  '57P03', // cannot_connect_now (starting up / shutting down)
  '08000',
  '08001',
  '08003',
  '08006',
]);

const unavailableMessages = [
  'Connection terminated',
  'Timeout acquiring a connection',
  'connect ECONNREFUSED',
  'Client has encountered a connection error',
  'the database system is',
  'Connection ended unexpectedly',
  'terminating connection',
  // knex, when the connection died in the middle of a transaction and the next query finds it closed.
  'Transaction query already complete',
];

export function isDatabaseUnavailable(error: unknown): boolean {
  for (let current: unknown = error, depth = 0; current && depth < 5; depth += 1) {
    if (typeof current !== 'object') break;
    const candidate = current as { code?: unknown; message?: unknown; cause?: unknown; errors?: unknown };
    if (typeof candidate.code === 'string' && unavailableCodes.has(candidate.code)) return true;
    if (typeof candidate.message === 'string' && unavailableMessages.some((m) => (candidate.message as string).includes(m))) {
      return true;
    }
    if (Array.isArray(candidate.errors) && candidate.errors.some(isDatabaseUnavailable)) return true;
    current = candidate.cause;
  }
  return false;
}
