import { createHash } from 'node:crypto';
import { setTimeout as sleep } from 'node:timers/promises';
import { and, eq, lt, sql } from 'drizzle-orm';
import type { RequestHandler } from 'express';
import type { Db } from '../db/client';
import { idempotentRequests } from '../db/schema';
import { getActor } from '../lib/actor';
import { AppError } from '../lib/app-error';
import type { Logger } from '../lib/logger';

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';
const KEY_PATTERN = /^[A-Za-z0-9_-]{8,128}$/;
const KEEP_HOURS = 24;

export type IdempotencyOptions = {
  /** How long a repeat waits for the first request to finish before answering 409 (default 15 s). */
  waitMs?: number;
  pollMs?: number;
  logger?: Logger;
};

const WRITE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/**
 * A write sent twice with the same `Idempotency-Key` (a double click, a retry after a lost answer) is done once:
 * the repeat gets the first answer again, with `Idempotent-Replayed: true`; while the first still runs, the repeat
 * waits for it. Only successful answers are kept (a refused write may succeed when sent again after a fix). The
 * same key with another method, path or body is 422 IDEMPOTENCY_KEY_REUSED. Keys are per person and kept a day.
 * Follows the IETF httpapi draft "The Idempotency-Key HTTP Header Field" (sections 2 and 2.6). JSON writes only:
 * multipart uploads pass by (their body is read later by their route).
 */
export function idempotentWrites(db: Db, opts: IdempotencyOptions = {}): RequestHandler {
  const waitMs = opts.waitMs ?? 15_000;
  const pollMs = opts.pollMs ?? 100;
  let sinceSweep = 0;

  return async (req, res, next) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    if (key === undefined || !WRITE_METHODS.has(req.method) || req.is('multipart/form-data')) return next();
    if (!KEY_PATTERN.test(key)) {
      const message = `${IDEMPOTENCY_HEADER} must be 8 to 128 letters, digits, "-" or "_".`;
      throw new AppError(400, 'IDEMPOTENCY_KEY_INVALID', message, [{ path: IDEMPOTENCY_HEADER, message }]);
    }
    const userId = getActor(res).userId;
    const fingerprint = createHash('sha256')
      .update(`${req.method} ${req.originalUrl}\n${JSON.stringify(req.body ?? null)}`)
      .digest('hex');
    const mine = and(eq(idempotentRequests.userId, userId), eq(idempotentRequests.key, key));

    if (++sinceSweep >= 100) {
      sinceSweep = 0;
      await db
        .delete(idempotentRequests)
        .where(lt(idempotentRequests.createdAt, sql`now() - make_interval(hours => ${KEEP_HOURS})`));
    }

    for (const deadline = Date.now() + waitMs; ;) {
      const claimed = await db
        .insert(idempotentRequests)
        .values({ userId, key, fingerprint })
        .onConflictDoNothing()
        .returning();
      if (claimed.length > 0) break;
      const [earlier] = await db.select().from(idempotentRequests).where(mine);
      if (!earlier) continue; // the first one failed and let go of the key meanwhile: claim it now
      if (earlier.fingerprint !== fingerprint) {
        throw new AppError(
          422,
          'IDEMPOTENCY_KEY_REUSED',
          `This ${IDEMPOTENCY_HEADER} was already used for another request; send a new key for a new request.`,
          [{ path: IDEMPOTENCY_HEADER, message: 'used for another request' }],
        );
      }
      if (earlier.statusCode !== null) {
        res.set('Idempotent-Replayed', 'true');
        res.status(earlier.statusCode).json(earlier.responseBody);
        return;
      }
      if (Date.now() >= deadline) {
        throw new AppError(
          409,
          'IDEMPOTENCY_IN_PROGRESS',
          'The same request is still being handled; wait for it and reload.',
        );
      }
      await sleep(pollMs);
    }

    let body: unknown = null;
    const json = res.json.bind(res);
    res.json = (value: unknown) => {
      body = value;
      return json(value);
    };
    res.on('finish', () => {
      const kept = res.statusCode >= 200 && res.statusCode < 300;
      const done = kept
        ? db.update(idempotentRequests).set({ statusCode: res.statusCode, responseBody: body }).where(mine)
        : db.delete(idempotentRequests).where(mine);
      done.catch((error: unknown) => opts.logger?.error({ err: error }, 'could not record an idempotent answer'));
    });
    res.on('close', () => {
      if (!res.writableFinished)
        void db
          .delete(idempotentRequests)
          .where(mine)
          .catch(() => undefined);
    });
    next();
  };
}
