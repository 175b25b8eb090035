import { createHash } from 'node:crypto';
import { and, eq, lt, sql } from 'drizzle-orm';
import type { Request, RequestHandler } from 'express';
import {
  IDEMPOTENCY_KEY_HEADER,
  IDEMPOTENCY_KEY_TTL_HOURS,
  idempotencyKeySchema,
} from '@batchproof/shared';
import type { Database } from '../db/database';
import { idempotencyKeys } from '../db/schema';
import { AppError, conflict } from './app-error';

/** A create's work: validates, writes and reads back through `db`, and returns the body. */
export type CreateWork = (req: Request, db: Database) => Promise<unknown>;

/** The key from the header; undefined when none was sent, 400 when it is malformed. */
function readKey(req: Request): string | undefined {
  const raw = req.get(IDEMPOTENCY_KEY_HEADER);
  if (raw === undefined) return undefined;
  const parsed = idempotencyKeySchema.safeParse(raw);
  if (parsed.success) return parsed.data;
  throw new AppError(400, 'validation_failed', 'The Idempotency-Key header is not valid.', {
    [IDEMPOTENCY_KEY_HEADER]: parsed.error.issues.map((i) => i.message),
  });
}

/** What makes two requests the same: method, path, body and the uploaded file's bytes. */
function requestHash(req: Request): string {
  const file = req.file
    ? [req.file.originalname, createHash('sha256').update(req.file.buffer).digest('hex')]
    : null;
  return createHash('sha256')
    .update(JSON.stringify([req.method, req.baseUrl + req.path, req.body ?? null, file]))
    .digest('hex');
}

/**
 * A create route that a client may retry safely. Without an `Idempotency-Key` header the work
 * runs as usual. With one, the key is claimed, the work runs and its answer is stored, all in one
 * transaction: a retry with the same key (same workshop and user) waits for the first request,
 * then gets its status and body back byte for byte (with `Idempotent-Replayed: true`) instead of
 * creating a second record. A first request that failed stored nothing, so its retry runs again.
 * The same key with a different request is refused with 422.
 */
export function idempotentCreate(db: Database, work: CreateWork, status = 201): RequestHandler {
  return async (req, res) => {
    const key = readKey(req);
    if (key === undefined) {
      res.status(status).json(await work(req, db));
      return;
    }
    const hash = requestHash(req);
    const user = req.user!;
    const scope = and(
      eq(idempotencyKeys.workshopId, user.workshopId),
      eq(idempotencyKeys.userId, user.id),
    );
    const answer = await db.transaction(async (tx) => {
      const cutoff = sql`now() - make_interval(hours => ${IDEMPOTENCY_KEY_TTL_HOURS})`;
      await tx.delete(idempotencyKeys).where(and(scope, lt(idempotencyKeys.createdAt, cutoff)));
      // A concurrent request holding the same key makes this insert wait until it commits.
      const claimed = await tx
        .insert(idempotencyKeys)
        .values({ workshopId: user.workshopId, userId: user.id, key, requestHash: hash })
        .onConflictDoNothing()
        .returning({ key: idempotencyKeys.key });
      if (claimed.length === 0) {
        const [first] = await tx
          .select()
          .from(idempotencyKeys)
          .where(and(scope, eq(idempotencyKeys.key, key)));
        return { replayed: true, ...first };
      }
      const body = JSON.stringify(await work(req, tx));
      await tx
        .update(idempotencyKeys)
        .set({ responseStatus: status, responseBody: body })
        .where(and(scope, eq(idempotencyKeys.key, key)));
      return { replayed: false, requestHash: hash, responseStatus: status, responseBody: body };
    });
    if (answer.requestHash !== hash) {
      throw new AppError(
        422,
        'idempotency_key_reused',
        'This Idempotency-Key was already used for a different request. Send a new key with a new request.',
      );
    }
    if (answer.responseStatus == null || answer.responseBody == null) {
      throw conflict(
        'The first request with this Idempotency-Key has not finished; retry shortly.',
      );
    }
    if (answer.replayed) res.set('Idempotent-Replayed', 'true');
    res.status(answer.responseStatus).type('json').send(answer.responseBody);
  };
}
