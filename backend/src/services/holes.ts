import { and, asc, eq, isNull, max } from 'drizzle-orm'
import {
  coreRuns,
  holes,
  structures,
  type Hole,
  type HoleCreate,
  type HoleUpdate,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { badRequest, conflict, notFound, staleVersion } from '../http/errors'
import { audit } from './audit'

/** The project's holes; deleted ones (in the bin, see hole-bin.ts) are not among them. */
export const listHoles = (db: Executor, projectId: number) =>
  db
    .select()
    .from(holes)
    .where(and(eq(holes.projectId, projectId), isNull(holes.deletedAt)))
    .orderBy(asc(holes.name))

/**
 * A hole of this project, or 404 (a hole id from another project, or a deleted hole, is simply
 * not found: every route below a hole goes through here).
 */
export async function getHole(db: Executor, projectId: number, holeId: number): Promise<Hole> {
  const [hole] = await db
    .select()
    .from(holes)
    .where(and(eq(holes.projectId, projectId), eq(holes.id, holeId), isNull(holes.deletedAt)))
  if (!hole) throw notFound('Hole')
  return hole
}

export async function createHole(db: Db, actorId: number, projectId: number, input: HoleCreate) {
  return db.transaction(async (tx) => {
    await assertNameFree(tx, projectId, input.name)
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

/** A deleted hole still holds its name until purged: say so rather than a bare duplicate. */
async function assertNameFree(tx: Executor, projectId: number, name: string) {
  const [binned] = await tx
    .select({ deletedAt: holes.deletedAt })
    .from(holes)
    .where(and(eq(holes.projectId, projectId), eq(holes.name, name)))
  if (binned?.deletedAt)
    throw conflict(
      `A deleted hole is named ${name}: restore it, or ask an administrator to purge it first.`,
      'hole_name_in_bin',
    )
}
