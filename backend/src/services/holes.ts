import { and, asc, eq, max } from 'drizzle-orm'
import {
  coreRuns,
  holes,
  structures,
  type Hole,
  type HoleCreate,
  type HoleUpdate,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { badRequest, notFound, staleVersion } from '../http/errors'
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

/**
 * 400 naming `body.finalDepth` when the hole would end above its deepest structure or run. Read
 * after the hole row is locked by the update, so a structure written meanwhile is counted.
 */
async function assertHoldsItsData(tx: Executor, holeId: number, finalDepth: number) {
  const [deepest] = await tx
    .select({ depth: max(structures.depth) })
    .from(structures)
    .where(eq(structures.holeId, holeId))
  const [lastRun] = await tx
    .select({ depth: max(coreRuns.toDepth) })
    .from(coreRuns)
    .where(eq(coreRuns.holeId, holeId))
  const problems = [
    { depth: deepest.depth, what: 'its deepest structure' },
    { depth: lastRun.depth, what: 'the end of its deepest core run' },
  ].filter((p): p is { depth: number; what: string } => p.depth !== null && p.depth > finalDepth)
  if (problems.length === 0) return
  const message = problems.map((p) => `shallower than ${p.what} (${p.depth} m)`).join('; ')
  throw badRequest(`The final depth ${finalDepth} m is ${message}.`, [
    { path: 'body.finalDepth', message },
  ])
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
    if (fields.finalDepth !== undefined) await assertHoldsItsData(tx, hole.id, after.finalDepth)
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
