import { AsyncLocalStorage } from 'node:async_hooks';
import { createHash } from 'node:crypto';
import type { NextFunction, Request, RequestHandler, Response } from 'express';
import type { EntityManager } from '@mikro-orm/postgresql';
import type { Orm } from '@/server/db/orm';
import { getAuth } from './auth-middleware';
import { AppError } from './errors';

/**
 * Safe retries for writes. A client sends `Idempotency-Key: <its own unique text>` with a write;
 * the service records the key inside the write's own transaction (claimIdempotencyKey), so the
 * record exists exactly when the write committed. A later request with the same key and the same
 * body gets the first result (stored after the reply, or rebuilt from the written resource when
 * the reply never left) and writes nothing. Records are kept for a day.
 */

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const KEY_PATTERN = /^[\x21-\x7e]{8,200}$/;
const KEEP_FOR = "interval '1 day'";

interface PendingKey {
  userId: string;
  key: string;
  requestHash: string;
  status: number;
  claimed: boolean;
}

const pending = new AsyncLocalStorage<PendingKey>();

/**
 * Inside a write's transaction: records the request's key (if it has one) with the resource it
 * wrote. A concurrent request with the same key fails here on the primary key, and rolls back.
 */
export async function claimIdempotencyKey(tem: EntityManager, resourceId: string): Promise<void> {
  const current = pending.getStore();
  if (!current || current.claimed) return;
  await tem.execute(
    `insert into idempotency_record (user_id, key, request_hash, status, resource_id, created_at) values (?, ?, ?, ?, ?, now())`,
    [current.userId, current.key, current.requestHash, current.status, resourceId],
  );
  current.claimed = true;
}

interface StoredRecord {
  request_hash: string;
  status: number;
  resource_id: string | null;
  body: unknown;
}

/** Rebuilds the reply for a write whose result was never stored (the reply was lost). */
export type Replay = (req: Request, res: Response, resourceId: string) => Promise<unknown>;

/**
 * Route middleware (after requireAuth) for one write. `status` is the write's success status;
 * `replay` answers a retry whose first reply was not stored.
 */
export function idempotent(orm: Orm, status: number, replay: Replay): RequestHandler {
  return async (req: Request, res: Response, next: NextFunction) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    if (key === undefined) return next();
    try {
      if (!KEY_PATTERN.test(key)) {
        throw new AppError('VALIDATION_FAILED', `The ${IDEMPOTENCY_HEADER} header must be 8–200 printable characters without spaces, unique per write.`, {
          [IDEMPOTENCY_HEADER]: 'Use 8–200 printable characters without spaces, e.g. a random UUID.',
        });
      }
      const userId = getAuth(res).user.id;
      const requestHash = createHash('sha256')
        .update(`${req.method} ${req.baseUrl}${req.path}\n${JSON.stringify(req.body ?? null)}`)
        .digest('hex');
      const connection = orm.em.getConnection();
      const [found] = (await connection.execute(
        `select request_hash, status, resource_id, body from idempotency_record where user_id = ? and key = ? and created_at > now() - ${KEEP_FOR}`,
        [userId, key],
      )) as StoredRecord[];
      if (found) {
        if (found.request_hash !== requestHash) {
          throw new AppError('CONFLICT', `This ${IDEMPOTENCY_HEADER} was already used for a different request; use a new key for a new write.`);
        }
        res.setHeader('Idempotent-Replayed', 'true');
        const body = found.body ?? (found.resource_id ? await replay(req, res, found.resource_id) : null);
        res.status(found.status).json(body);
        return;
      }
      const state: PendingKey = { userId, key, requestHash, status, claimed: false };
      // Store the first reply with the record once it has been sent; the key itself was written with the change.
      const send = res.json.bind(res);
      res.json = (body: unknown) => {
        if (state.claimed && res.statusCode === status) {
          connection
            .execute(`update idempotency_record set body = ? where user_id = ? and key = ?`, [JSON.stringify(body), userId, key])
            .catch(() => {});
          connection.execute(`delete from idempotency_record where user_id = ? and created_at < now() - ${KEEP_FOR}`, [userId]).catch(() => {});
        }
        return send(body);
      };
      pending.run(state, () => next());
    } catch (error) {
      next(error);
    }
  };
}

/** True when a write failed because a concurrent request with the same key claimed it first. */
export function isKeyClash(error: unknown): boolean {
  const e = error as { code?: string; constraint?: string };
  return e?.code === '23505' && e.constraint === 'idempotency_record_pkey';
}
