import { and, asc, eq, isNotNull, sql } from 'drizzle-orm'
import { holes, intervals, users, type Hole } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { ApiError, conflict, notFound } from '../http/errors'
import { audit } from './audit'

/** A deleted hole can be restored for this long; after that only an administrator's purge remains. */
export const RESTORE_DAYS = 30

/** What goes with a hole (counted into the audit row of its deletion, restore and purge). */
async function contents(db: Executor, holeId: number) {
  const { rows } = await db.execute<Record<string, number>>(sql`select
      (select count(*)::int from structures where hole_id = ${holeId}) as structures,
      (select count(*)::int from core_runs where hole_id = ${holeId}) as runs,
      (select count(*)::int from survey_stations where hole_id = ${holeId}) as stations,
      (select count(*)::int from intervals where hole_id = ${holeId}) as intervals,
      (select count(*)::int from intervals where hole_id = ${holeId} and status = 'issued') as "issuedIntervals",
      (select count(*)::int from log_curves where hole_id = ${holeId}) as curves`)
  return rows[0]
}

/** Deleting is reversible: the hole leaves every list and route at once, its data stays. */
export async function deleteHole(db: Db, actorId: number, hole: Hole) {
  await db.transaction(async (tx) => {
    const [after] = await tx
      .update(holes)
      .set({ deletedAt: new Date(), deletedBy: actorId, version: sql`${holes.version} + 1` })
      .where(eq(holes.id, hole.id))
      .returning()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'delete',
      before: hole,
      after: {
        deletedAt: after.deletedAt,
        restorableForDays: RESTORE_DAYS,
        ...(await contents(tx, hole.id)),
      },
    })
  })
}

const restoreUntil = (deletedAt: Date) => new Date(deletedAt.getTime() + RESTORE_DAYS * 86_400_000)

/** The project's deleted holes, newest first, with who deleted them and until when they come back. */
export async function listDeletedHoles(db: Executor, projectId: number) {
  const rows = await db
    .select({ hole: holes, deletedByName: users.name })
    .from(holes)
    .leftJoin(users, eq(users.id, holes.deletedBy))
    .where(and(eq(holes.projectId, projectId), isNotNull(holes.deletedAt)))
    .orderBy(asc(holes.name))
  return Promise.all(
    rows.map(async ({ hole, deletedByName }) => ({
      id: hole.id,
      name: hole.name,
      deletedAt: hole.deletedAt!,
      deletedBy: deletedByName,
      restorableUntil: restoreUntil(hole.deletedAt!),
      ...(await contents(db, hole.id)),
    })),
  )
}

async function deletedHole(tx: Executor, projectId: number, holeId: number): Promise<Hole> {
  const [hole] = await tx
    .select()
    .from(holes)
    .where(and(eq(holes.projectId, projectId), eq(holes.id, holeId), isNotNull(holes.deletedAt)))
    .for('update')
  if (!hole) throw notFound('Deleted hole')
  return hole
}

/** Brings a deleted hole back as it was, within RESTORE_DAYS (410 after). Lead or admin. */
export async function restoreHole(db: Db, actorId: number, projectId: number, holeId: number) {
  return db.transaction(async (tx) => {
    const hole = await deletedHole(tx, projectId, holeId)
    if (restoreUntil(hole.deletedAt!) < new Date())
      throw new ApiError(
        410,
        'restore_expired',
        `${hole.name} was deleted more than ${RESTORE_DAYS} days ago: it can no longer be restored.`,
      )
    const [after] = await tx
      .update(holes)
      .set({ deletedAt: null, deletedBy: null, version: sql`${holes.version} + 1` })
      .where(eq(holes.id, hole.id))
      .returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'restore',
      before: { deletedAt: hole.deletedAt },
      after: { deletedAt: null, ...(await contents(tx, hole.id)) },
    })
    return after
  })
}

/**
 * Final removal of a deleted hole and everything in it (administrators only). A hole whose
 * intervals were issued to designers is never purged: its record must stay (409).
 */
export async function purgeHole(db: Db, actorId: number, projectId: number, holeId: number) {
  await db.transaction(async (tx) => {
    const hole = await deletedHole(tx, projectId, holeId)
    const [issued] = await tx
      .select({ id: intervals.id })
      .from(intervals)
      .where(and(eq(intervals.holeId, hole.id), eq(intervals.status, 'issued')))
      .limit(1)
    if (issued)
      throw conflict(
        `${hole.name} has intervals issued to designers: it stays on record and cannot be purged.`,
        'hole_has_issued',
      )
    const gone = await contents(tx, hole.id)
    await tx.delete(holes).where(eq(holes.id, hole.id))
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'purge',
      before: { name: hole.name, deletedAt: hole.deletedAt, ...gone },
    })
  })
}
