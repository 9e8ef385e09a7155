import { and, asc, eq } from 'drizzle-orm'
import {
  roleAtLeast,
  structures,
  type Hole,
  type Project,
  type ProjectRole,
  type Structure,
  type StructureInputT,
  type StructureUpdate,
} from '../../../schema/index'
import type { Db, Executor, Tx } from '../db/client'
import type { Mailer } from '../mail/transport'
import { forbidden, notFound, staleVersion } from '../http/errors'
import { audit } from './audit'
import { writeOnce, type Answer, type IdempotencyRequest } from './idempotency'
import { assertNotFrozen, demoteChecked, writeAndNotice, type Demoted } from './freeze'
import { assertWithinHole, lockHole, lockedAt } from './structure-context'
import { recomputeStructures } from './structure-recompute'

export { recomputeStructures } from './structure-recompute'

export type Actor = { id: number; role: ProjectRole }

export const listStructures = (db: Executor, holeId: number) =>
  db
    .select()
    .from(structures)
    .where(eq(structures.holeId, holeId))
    .orderBy(asc(structures.depth), asc(structures.id))

/** API input → the stored input columns (a true orientation goes to inputDip/inputDipDirection). */
export function inputColumns(input: Partial<StructureInputT>) {
  const { dip, dipDirection, ...rest } = input
  return {
    ...rest,
    ...(dip !== undefined ? { inputDip: dip } : {}),
    ...(dipDirection !== undefined ? { inputDipDirection: dipDirection } : {}),
  }
}

async function assertUnlocked(db: Executor, role: ProjectRole, holeId: number, depths: number[]) {
  if (roleAtLeast(role, 'engineer')) return
  for (const d of depths) {
    if (await lockedAt(db, holeId, d)) {
      throw forbidden(
        `Depth ${d} m lies in a checked interval: only engineers and leads can change it.`,
      )
    }
  }
}

export interface StructureChange {
  /** Old and new depths: every interval they lie in is touched. */
  depths: number[]
  /** The depth the write asks for, checked against the hole's final depth. */
  sent?: number
  /** Where the request gave that depth, for the 400 (`body.depth` unless said). */
  sentPath?: string
  what: string
  reason: string
}

/**
 * The rules of a structure write, in its transaction and before any row changes: 400 beyond the
 * hole's final depth, 409 in an approved interval (every role), 403 in a checked one for a
 * logger, and a checked interval changed by an engineer or lead goes back to draft. Returns the
 * hole as it is now.
 */
export async function guardStructureWrite(
  tx: Tx,
  actor: Actor,
  hole: Hole,
  { depths, sent, sentPath = 'body.depth', what, reason }: StructureChange,
  demoted: Demoted[],
): Promise<Hole> {
  const current = await lockHole(tx, hole.id)
  if (sent !== undefined) assertWithinHole(current, [{ path: sentPath, depth: sent }])
  await assertNotFrozen(tx, hole.id, { depths }, what)
  await assertUnlocked(tx, actor.role, hole.id, depths)
  demoted.push(
    ...(await demoteChecked(tx, actor.id, current.projectId, hole.id, { depths }, reason)),
  )
  return current
}

async function reread(tx: Tx, id: number): Promise<Structure> {
  const [row] = await tx.select().from(structures).where(eq(structures.id, id))
  return row
}

const at = (depth: number) => `${depth} m`

/**
 * Adds one structure, at most once per idempotency key: a retry after a lost answer gets the
 * first answer again and stores nothing (the key is kept in the write's own transaction).
 */
export async function createStructure(
  db: Db,
  mail: Mailer,
  actor: Actor,
  project: Project,
  hole: Hole,
  input: StructureInputT,
  idempotency?: IdempotencyRequest,
): Promise<Answer<Structure>> {
  const change = {
    depths: [input.depth],
    sent: input.depth,
    what: `A structure at ${at(input.depth)}`,
    reason: `a structure was added at ${at(input.depth)}`,
  }
  return writeAndNotice(db, mail, project.id, hole, (tx, demoted) =>
    writeOnce(tx, idempotency, 201, async () => {
      const current = await guardStructureWrite(tx, actor, hole, change, demoted)
      const [row] = await tx
        .insert(structures)
        .values({
          ...inputColumns(input),
          depth: input.depth,
          type: input.type,
          holeId: hole.id,
          createdBy: actor.id,
          updatedBy: actor.id,
        })
        .returning({ id: structures.id })
      await recomputeStructures(tx, project, current, [input.depth])
      const after = await reread(tx, row.id)
      await audit(tx, {
        projectId: project.id,
        userId: actor.id,
        entity: 'structure',
        entityId: row.id,
        action: 'create',
        after,
      })
      return after
    }),
  )
}

export async function getStructure(db: Executor, holeId: number, id: number): Promise<Structure> {
  const [row] = await db
    .select()
    .from(structures)
    .where(and(eq(structures.id, id), eq(structures.holeId, holeId)))
  if (!row) throw notFound('Structure')
  return row
}

export async function updateStructure(
  db: Db,
  mail: Mailer,
  actor: Actor,
  project: Project,
  hole: Hole,
  id: number,
  input: StructureUpdate,
): Promise<Structure> {
  const { version, ...fields } = input
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const before = await getStructure(tx, hole.id, id)
    const depths = [before.depth, fields.depth ?? before.depth]
    const moved = depths[1] !== depths[0] ? ` (moved to ${at(depths[1])})` : ''
    const change = {
      depths,
      sent: fields.depth,
      what: `Editing the structure at ${at(before.depth)}${moved}`,
      reason: `the structure at ${at(before.depth)} was edited${moved}`,
    }
    const current = await guardStructureWrite(tx, actor, hole, change, demoted)
    const [updated] = await tx
      .update(structures)
      .set({
        ...inputColumns(fields),
        updatedBy: actor.id,
        updatedAt: new Date(),
        version: version + 1,
      })
      .where(and(eq(structures.id, id), eq(structures.version, version)))
      .returning({ id: structures.id })
    if (!updated) throw staleVersion()
    await recomputeStructures(tx, project, current, depths)
    const after = await reread(tx, id)
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: id,
      action: 'update',
      before,
      after,
    })
    return after
  })
}

export async function deleteStructure(
  db: Db,
  mail: Mailer,
  actor: Actor,
  project: Project,
  hole: Hole,
  id: number,
  version: number,
): Promise<void> {
  await writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const before = await getStructure(tx, hole.id, id)
    const change = {
      depths: [before.depth],
      what: `Deleting the structure at ${at(before.depth)}`,
      reason: `the structure at ${at(before.depth)} was deleted`,
    }
    const current = await guardStructureWrite(tx, actor, hole, change, demoted)
    const [gone] = await tx
      .delete(structures)
      .where(and(eq(structures.id, id), eq(structures.version, version)))
      .returning({ id: structures.id })
    if (!gone) throw staleVersion()
    await recomputeStructures(tx, project, current, [before.depth])
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: id,
      action: 'delete',
      before,
    })
  })
}
