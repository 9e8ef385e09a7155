import { and, eq, sql } from 'drizzle-orm'
import { idempotencyKeys } from '../../../schema/index'
import type { Executor } from '../db/client'
import { ApiError } from '../http/errors'
import { sha256Hex, canonicalJson } from '../exports/hash'

/** A client's retry key for one request (`Idempotency-Key` header), bound to user and route. */
export interface IdempotencyRequest {
  userId: number
  key: string
  route: string
  body: unknown
}

export interface Answer<T> {
  status: number
  body: { data: T }
  /** True when this is the stored answer of an earlier request with the same key. */
  replayed: boolean
}

/**
 * Runs `write` at most once per key, in the caller's transaction: the key row is claimed first
 * (a concurrent request with the same key waits on it, then replays), and the answer is stored in
 * the same transaction as the write, so a crash leaves neither. The same key with another body or
 * route → 422 `idempotency_key_reused`. Without a key, `write` simply runs.
 */
export async function writeOnce<T>(
  tx: Executor,
  req: IdempotencyRequest | undefined,
  status: number,
  write: () => Promise<T>,
): Promise<Answer<T>> {
  if (!req) return { status, body: { data: await write() }, replayed: false }
  const requestHash = sha256Hex(canonicalJson(req.body ?? {}))
  const claimed = await tx
    .insert(idempotencyKeys)
    .values({
      userId: req.userId,
      key: req.key,
      route: req.route,
      requestHash,
      status: 0,
      body: {},
    })
    .onConflictDoNothing()
    .returning({ key: idempotencyKeys.key })
  if (claimed.length === 0) {
    const [earlier] = await tx
      .select()
      .from(idempotencyKeys)
      .where(and(eq(idempotencyKeys.userId, req.userId), eq(idempotencyKeys.key, req.key)))
    if (!earlier || earlier.route !== req.route || earlier.requestHash !== requestHash)
      throw new ApiError(
        422,
        'idempotency_key_reused',
        'This Idempotency-Key was used for another request: use a new key for a new request.',
        [{ path: 'header.idempotency-key', message: 'already used for another request' }],
      )
    return { status: earlier.status, body: earlier.body as { data: T }, replayed: true }
  }
  const data = await write()
  // Stored as the client will read it (dates as ISO strings), so a replay is byte-for-byte the same.
  const body = JSON.parse(JSON.stringify({ data })) as { data: T }
  await tx
    .update(idempotencyKeys)
    .set({ status, body })
    .where(and(eq(idempotencyKeys.userId, req.userId), eq(idempotencyKeys.key, req.key)))
  return { status, body, replayed: false }
}

/** Keys older than this are forgotten (a retry comes within minutes, not days). */
export const IDEMPOTENCY_KEEP_HOURS = 24

export async function forgetOldKeys(db: Executor): Promise<number> {
  const gone = await db
    .delete(idempotencyKeys)
    .where(
      sql`${idempotencyKeys.createdAt} < now() - make_interval(hours => ${IDEMPOTENCY_KEEP_HOURS})`,
    )
    .returning({ key: idempotencyKeys.key })
  return gone.length
}
