import { randomUUID } from 'node:crypto'
import { and, eq, isNull, lt, or, sql } from 'drizzle-orm'
import { images, imports, packs } from '../../../schema/index'
import type { Db } from '../db/client'

/**
 * Long work (an import commit, a pack build, an image's tiling) holds a lease on its row while it
 * runs, renewed every LEASE_SECONDS / 3. A server that dies stops renewing; once the lease has
 * lapsed, the sweep marks the row "failed — interrupted" so it can be committed or built again
 * (an image is uploaded again). The work itself is one transaction whose last write names its
 * own attempt, so a lapsed attempt can never also finish: the work is done once or not at all.
 */
export const LEASE_SECONDS = 30
/** How often every server sweeps: an interrupted row shows within LEASE + SWEEP seconds. */
export const SWEEP_SECONDS = 10
export const INTERRUPTED = 'failed — interrupted (the server stopped while this ran); try again'

/** An image is not tiled again by itself: its file is uploaded anew. */
export const IMAGE_INTERRUPTED =
  'failed — interrupted (the server stopped while this was tiled); upload the file again'

export const newAttempt = () => randomUUID()
/** The rows long work runs on: imports and packs (uuid ids), images (serial ids). */
type LeasedTable = typeof imports | typeof packs | typeof images
export const leaseEnd = () => sql`now() + make_interval(secs => ${LEASE_SECONDS})`
/** A row whose lease is free to take: none, or lapsed. */
export const leaseFree = (table: LeasedTable) =>
  or(isNull(table.leaseUntil), lt(table.leaseUntil, sql`now()`))

/** Keeps renewing the lease of `attempt` on one row until the returned stop is called. */
export function holdLease(
  db: Db,
  table: LeasedTable,
  id: string | number,
  attempt: string,
): () => void {
  const timer = setInterval(
    () => {
      db.update(table as typeof imports)
        .set({ leaseUntil: leaseEnd() })
        .where(and(eq(table.id, id as string), eq(table.attempt, attempt)))
        .catch(() => {
          // database away: the lease lapses and the sweep reports the row as interrupted
        })
    },
    (LEASE_SECONDS * 1000) / 3,
  )
  timer.unref()
  return () => clearInterval(timer)
}

/** Marks imports, packs and images whose work lost its server as failed — interrupted. */
export async function sweepInterrupted(
  db: Db,
): Promise<{ imports: number; packs: number; images: number }> {
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
  const g = await db
    .update(images)
    .set({
      status: 'failed',
      message: IMAGE_INTERRUPTED,
      progress: 0,
      attempt: null,
      leaseUntil: null,
    })
    .where(and(eq(images.status, 'processing'), lt(images.leaseUntil, sql`now()`)))
    .returning({ id: images.id })
  return { imports: i.length, packs: p.length, images: g.length }
}

/** Sweeps now and every SWEEP_SECONDS (every server does; the update is idempotent). */
export function startSweeper(db: Db, onError: (err: unknown) => void): () => void {
  const run = () => sweepInterrupted(db).catch(onError)
  void run()
  const timer = setInterval(run, SWEEP_SECONDS * 1000)
  timer.unref()
  return () => clearInterval(timer)
}
