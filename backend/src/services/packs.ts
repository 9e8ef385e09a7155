import { and, eq, inArray, isNull, sql } from 'drizzle-orm'
import { holes, intervals, packFiles, packs, type Pack, type Project } from '../../../schema/index'
import type { Db } from '../db/client'
import { ApiError, badRequest, conflict, notFound } from '../http/errors'
import { contentHashOf } from '../exports/hash'
import { isApproved } from '../exports/sign-off'
import { audit } from './audit'
import { newAttempt } from './leases'
import { StoredSelection } from './pack-build'
import { loadPackData, type PackSelection } from './pack-data'
import { getPack } from './pack-records'

export { getPack, listPacks, packFile } from './pack-records'

export const packIssued = () =>
  conflict('An issued pack is frozen: it cannot change.', 'pack_issued')

/** Refuses holes or intervals outside the project (400, naming the field). */
async function checkSelection(db: Db, projectId: number, selection: PackSelection) {
  const holeIds = selection.holeIds ?? []
  const intervalIds = selection.intervalIds ?? []
  const found = holeIds.length
    ? await db
        .select({ id: holes.id })
        .from(holes)
        .where(
          and(eq(holes.projectId, projectId), inArray(holes.id, holeIds), isNull(holes.deletedAt)),
        )
    : []
  if (found.length !== new Set(holeIds).size)
    throw badRequest('Unknown hole in the selection.', [
      { path: 'body.holeIds', message: 'not in this project' },
    ])
  const foundIntervals = intervalIds.length
    ? await db
        .select({ id: intervals.id })
        .from(intervals)
        .innerJoin(holes, eq(holes.id, intervals.holeId))
        .where(and(eq(holes.projectId, projectId), inArray(intervals.id, intervalIds)))
    : []
  if (foundIntervals.length !== new Set(intervalIds).size)
    throw badRequest('Unknown interval in the selection.', [
      { path: 'body.intervalIds', message: 'not in this project' },
    ])
}

/** Records a queued pack; the caller hands its id to the build job. */
export async function createPack(
  db: Db,
  actorId: number,
  project: Project,
  selection: PackSelection,
) {
  await checkSelection(db, project.id, selection)
  return db.transaction(async (tx) => {
    const [row] = await tx
      .insert(packs)
      .values({
        projectId: project.id,
        selection,
        createdBy: actorId,
        message: 'Queued',
        attempt: newAttempt(),
      })
      .returning()
    await audit(tx, {
      projectId: project.id,
      userId: actorId,
      entity: 'pack',
      entityId: row.id,
      action: 'create',
      after: row,
    })
    return row
  })
}

async function lockPack(
  tx: Parameters<Parameters<Db['transaction']>[0]>[0],
  projectId: number,
  packId: string,
): Promise<Pack> {
  const [row] = await tx
    .select()
    .from(packs)
    .where(and(eq(packs.projectId, projectId), eq(packs.id, packId)))
    .for('update')
  if (!row) throw notFound('Pack')
  if (row.status === 'issued') throw packIssued()
  return row
}

const packedIds = (pack: Pack) =>
  (pack.selection as { packed?: { intervalIds?: number[] } }).packed?.intervalIds ?? []

/**
 * Issues a ready pack: fixes its content hash, stamps who and when, and marks the packed intervals
 * issued, all in one transaction. Anything but `ready` is refused, and so is a draft pack (409
 * `pack_draft`) or one whose intervals are no longer all approved (409 `interval_not_approved`).
 */
export async function issuePack(db: Db, actorId: number, project: Project, packId: string) {
  const projectId = project.id
  await db.transaction(async (tx) => {
    const before = await lockPack(tx, projectId, packId)
    if (before.status !== 'ready')
      throw conflict(
        `Only a ready pack can be issued (this one is ${before.status}).`,
        'pack_not_ready',
      )
    if (before.draft)
      throw conflict(
        'A draft pack (built with intervals that were not approved) is a preview: it cannot be issued. Approve the intervals and build a new pack.',
        'pack_draft',
      )
    const packed = packedIds(before)
    // Lock the packed intervals so none is reopened between this check and the issue.
    const current = packed.length
      ? await tx.select().from(intervals).where(inArray(intervals.id, packed)).for('update')
      : []
    const unapproved = current.filter((i) => !isApproved(i))
    if (unapproved.length)
      throw new ApiError(
        409,
        'interval_not_approved',
        `Only approved intervals can be issued: ${unapproved.map((i) => `"${i.name}" is ${i.status}`).join(', ')}.`,
        unapproved.map((i) => ({
          path: 'interval',
          message: `${i.id} "${i.name}" is ${i.status}`,
        })),
      )
    // The rows read now must be the rows the pack was built from, or the pack is stale.
    const { packed: _packed, ...selection } = StoredSelection.parse(before.selection)
    const now = await loadPackData(tx, project, selection)
    if (now.draft || now.inputsHash !== before.inputsHash)
      throw conflict('The data changed since this pack was built: rebuild it first.', 'pack_stale')
    const files = await tx
      .select({ name: packFiles.name, sha256: packFiles.sha256 })
      .from(packFiles)
      .where(eq(packFiles.packId, packId))
    const [after] = await tx
      .update(packs)
      .set({
        status: 'issued',
        issuedBy: actorId,
        issuedAt: new Date(),
        contentHash: contentHashOf(files),
      })
      .where(eq(packs.id, packId))
      .returning()
    const issued = packed.length
      ? await tx
          .update(intervals)
          .set({ status: 'issued', version: sql`${intervals.version} + 1`, updatedAt: new Date() })
          .where(and(inArray(intervals.id, packed), eq(intervals.status, 'approved')))
          .returning({ id: intervals.id })
      : []
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'pack',
      entityId: packId,
      action: 'issue',
      before,
      after: { ...after, intervalIds: packed, newlyIssued: issued.map((i) => i.id) },
    })
  })
  return getPack(db, projectId, packId)
}

/** Deletes a pack that is not issued (its files go with it). */
export async function deletePack(db: Db, actorId: number, projectId: number, packId: string) {
  await db.transaction(async (tx) => {
    const before = await lockPack(tx, projectId, packId)
    await tx.delete(packs).where(eq(packs.id, packId))
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'pack',
      entityId: packId,
      action: 'delete',
      before,
    })
  })
}

/** Puts a failed or ready pack back in the queue (its files are rebuilt from scratch). */
export async function requeuePack(db: Db, actorId: number, projectId: number, packId: string) {
  return db.transaction(async (tx) => {
    const before = await lockPack(tx, projectId, packId)
    const [after] = await tx
      .update(packs)
      .set({
        status: 'queued',
        progress: 0,
        message: 'Queued',
        attempt: newAttempt(),
        leaseUntil: null,
      })
      .where(eq(packs.id, packId))
      .returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'pack',
      entityId: packId,
      action: 'rebuild',
      before,
      after,
    })
    return after
  })
}
