import { and, asc, eq } from 'drizzle-orm'
import { holes, type Hole, type HoleCreate, type HoleUpdate } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { notFound, staleVersion } from '../http/errors'
import { audit } from './audit'

export const listHoles = (db: Executor, projectId: number) =>
  db.select().from(holes).where(eq(holes.projectId, projectId)).orderBy(asc(holes.name))

/** A hole of this project, or 404 (a hole id from another project is simply not found). */
export async function getHole(db: Executor, projectId: number, holeId: number): Promise<Hole> {
  const [hole] = await db
    .select()
    .from(holes)
    .where(and(eq(holes.projectId, projectId), eq(holes.id, holeId)))
  if (!hole) throw notFound('Hole')
  return hole
}

export async function createHole(db: Db, actorId: number, projectId: number, input: HoleCreate) {
  return db.transaction(async (tx) => {
    const [hole] = await tx
      .insert(holes)
      .values({ ...input, projectId })
      .returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'create',
      after: hole,
    })
    return hole
  })
}

export async function updateHole(db: Db, actorId: number, hole: Hole, input: HoleUpdate) {
  const { version, ...fields } = input
  return db.transaction(async (tx) => {
    const [after] = await tx
      .update(holes)
      .set({ ...fields, version: version + 1, updatedAt: new Date() })
      .where(and(eq(holes.id, hole.id), eq(holes.version, version)))
      .returning()
    if (!after) throw staleVersion()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'update',
      before: hole,
      after,
    })
    return after
  })
}

export async function deleteHole(db: Db, actorId: number, hole: Hole) {
  await db.transaction(async (tx) => {
    await tx.delete(holes).where(eq(holes.id, hole.id))
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'hole',
      entityId: hole.id,
      action: 'delete',
      before: hole,
    })
  })
}
