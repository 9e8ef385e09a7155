import { and, eq, inArray } from 'drizzle-orm'
import {
  setMembers,
  structures,
  structureSets,
  type Hole,
  type Interval,
} from '../../../schema/index'
import type { Db, Executor, Tx } from '../db/client'
import type { Mailer } from '../mail/transport'
import { badRequest, notFound, staleVersion } from '../http/errors'
import { audit } from './audit'
import { guardWrite, writeAndNotice, type Demoted, type FreezeChange } from './freeze'

export { clusterInterval, replaceWithClusters, suggestSetCount } from './set-clusters'

/**
 * A set edit changes its interval's analysis: 409 once the interval is approved or issued (every
 * role), and a checked one goes back to draft.
 */
async function guardSets(
  tx: Tx,
  actorId: number,
  hole: Hole,
  interval: Interval,
  change: FreezeChange,
  demoted: Demoted[],
) {
  const scope = { intervalIds: [interval.id] }
  demoted.push(...(await guardWrite(tx, actorId, hole.projectId, hole.id, scope, change)))
}

export async function getSet(db: Executor, intervalId: number, setId: number) {
  const [row] = await db
    .select()
    .from(structureSets)
    .where(and(eq(structureSets.id, setId), eq(structureSets.intervalId, intervalId)))
  if (!row) throw notFound('Set')
  return row
}

type SetFields = { name: string; centreTrend: number; centrePlunge: number; coneAngle: number }

/** A set defined by a centre (a pole) and a cone angle. */
export async function createConeSet(
  db: Db,
  mail: Mailer,
  actorId: number,
  hole: Hole,
  interval: Interval,
  input: SetFields,
) {
  return writeAndNotice(db, mail, hole.projectId, hole, async (tx, demoted) => {
    const change = { what: `Adding set "${input.name}"`, reason: `set "${input.name}" was added` }
    await guardSets(tx, actorId, hole, interval, change, demoted)
    const [row] = await tx
      .insert(structureSets)
      .values({ ...input, intervalId: interval.id, rule: 'cone' })
      .returning()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'set',
      entityId: row.id,
      action: 'create',
      after: row,
    })
    return row
  })
}

export async function updateSet(
  db: Db,
  mail: Mailer,
  actorId: number,
  hole: Hole,
  interval: Interval,
  setId: number,
  input: Partial<SetFields> & { version: number },
) {
  const { version, ...fields } = input
  return writeAndNotice(db, mail, hole.projectId, hole, async (tx, demoted) => {
    const before = await getSet(tx, interval.id, setId)
    const change = {
      what: `Editing set "${before.name}"`,
      reason: `set "${before.name}" was edited`,
    }
    await guardSets(tx, actorId, hole, interval, change, demoted)
    const [after] = await tx
      .update(structureSets)
      .set({ ...fields, version: version + 1 })
      .where(and(eq(structureSets.id, setId), eq(structureSets.version, version)))
      .returning()
    if (!after) throw staleVersion()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'set',
      entityId: setId,
      action: 'update',
      before,
      after,
    })
    return after
  })
}

export async function deleteSet(
  db: Db,
  mail: Mailer,
  actorId: number,
  hole: Hole,
  interval: Interval,
  setId: number,
) {
  await writeAndNotice(db, mail, hole.projectId, hole, async (tx, demoted) => {
    const before = await getSet(tx, interval.id, setId)
    const change = {
      what: `Deleting set "${before.name}"`,
      reason: `set "${before.name}" was deleted`,
    }
    await guardSets(tx, actorId, hole, interval, change, demoted)
    await tx.delete(structureSets).where(eq(structureSets.id, setId))
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'set',
      entityId: setId,
      action: 'delete',
      before,
    })
  })
}

/**
 * Membership by hand: the set holds exactly these structures (of this interval), which leave any
 * other set; the set then keeps explicit members (rule cluster).
 */
export async function setMembersOf(
  db: Db,
  mail: Mailer,
  actorId: number,
  hole: Hole,
  interval: Interval,
  setId: number,
  ids: number[],
) {
  return writeAndNotice(db, mail, hole.projectId, hole, async (tx, demoted) => {
    const set = await getSet(tx, interval.id, setId)
    const change = {
      what: `Changing the members of set "${set.name}"`,
      reason: `the members of set "${set.name}" changed`,
    }
    await guardSets(tx, actorId, hole, interval, change, demoted)
    const unique = [...new Set(ids)]
    if (unique.length) {
      const found = await tx
        .select({ id: structures.id, depth: structures.depth })
        .from(structures)
        .where(and(eq(structures.holeId, hole.id), inArray(structures.id, unique)))
      const inside = new Set(
        found
          .filter((f) => f.depth >= interval.fromDepth && f.depth < interval.toDepth)
          .map((f) => f.id),
      )
      const outside = unique.filter((id) => !inside.has(id))
      if (outside.length) {
        throw badRequest('Some structures are not in this interval.', [
          {
            path: 'body.structureIds',
            message: `not in the interval: ${outside.slice(0, 20).join(', ')}`,
          },
        ])
      }
    }
    const siblings = (
      await tx
        .select({ id: structureSets.id })
        .from(structureSets)
        .where(eq(structureSets.intervalId, interval.id))
    ).map((s) => s.id)
    if (unique.length)
      await tx
        .delete(setMembers)
        .where(and(inArray(setMembers.setId, siblings), inArray(setMembers.structureId, unique)))
    await tx.delete(setMembers).where(eq(setMembers.setId, setId))
    if (unique.length)
      await tx.insert(setMembers).values(unique.map((structureId) => ({ setId, structureId })))
    const [after] = await tx
      .update(structureSets)
      .set({ rule: 'cluster', version: set.version + 1 })
      .where(eq(structureSets.id, setId))
      .returning()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'set_members',
      entityId: setId,
      action: 'replace',
      after: { structureIds: unique },
    })
    return after
  })
}
