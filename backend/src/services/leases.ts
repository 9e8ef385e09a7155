import { randomUUID } from 'node:crypto'
import { and, eq, isNull, lt, or, sql } from 'drizzle-orm'
import { imports, packs } from '../../../schema/index'
import type { Db } from '../db/client'

/**
 * Long work (an import commit, a pack build) holds a lease on its row while it runs, renewed every
 * LEASE_SECONDS / 3. A server that dies stops renewing; once the lease has lapsed, the sweep marks
 * the row "failed — interrupted" so it can be committed or built again. The work itself is one
 * transaction whose last write names its own attempt, so a lapsed attempt can never also finish:
 * the work is done once or not at all.
 */
export const LEASE_SECONDS = 30
/** How often every server sweeps: an interrupted row shows within LEASE + SWEEP seconds. */
export const SWEEP_SECONDS = 10
export const INTERRUPTED = 'failed — interrupted (the server stopped while this ran); try again'

export const newAttempt = () => randomUUID()
export const leaseEnd = () => sql`now() + make_interval(secs => ${LEASE_SECONDS})`
/** A row whose lease is free to take: none, or lapsed. */
export const leaseFree = (table: typeof imports | typeof packs) =>
  or(isNull(table.leaseUntil), lt(table.leaseUntil, sql`now()`))

/** Keeps renewing the lease of `attempt` on one row until the returned stop is called. */
export function holdLease(
  db: Db,
  table: typeof imports | typeof packs,
  id: string,
  attempt: string,
): () => void {
  const timer = setInterval(
    () => {
      db.update(table)
        .set({ leaseUntil: leaseEnd() })
        .where(and(eq(table.id, id), eq(table.attempt, attempt)))
        .catch(() => {
          // database away: the lease lapses and the sweep reports the row as interrupted
        })
    },
    (LEASE_SECONDS * 1000) / 3,
  )
  timer.unref()
  return () => clearInterval(timer)
}

/** Marks imports and packs whose work lost its server as failed — interrupted. */
export async function sweepInterrupted(db: Db): Promise<{ imports: number; packs: number }> {
  const lapsed = (table: typeof imports | typeof packs, status: 'committing' | 'building') =>
    and(eq(table.status, status), lt(table.leaseUntil, sql`now()`))
  const i = await db
    .update(imports)
    .set({ status: 'failed', message: INTERRUPTED, progress: 0, attempt: null, leaseUntil: null })
    .where(lapsed(imports, 'committing'))
    .returning({ id: imports.id })
  const p = await db
    .update(packs)
    .set({ status: 'failed', message: INTERRUPTED, progress: 0, attempt: null, leaseUntil: null })
    .where(lapsed(packs, 'building'))
    .returning({ id: packs.id })
  return { imports: i.length, packs: p.length }
}

/** Sweeps now and every SWEEP_SECONDS (every server does; the update is idempotent). */
export function startSweeper(db: Db, onError: (err: unknown) => void): () => void {
  const run = () => sweepInterrupted(db).catch(onError)
  void run()
  const timer = setInterval(run, SWEEP_SECONDS * 1000)
  timer.unref()
  return () => clearInterval(timer)
}
