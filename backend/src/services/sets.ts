import { and, eq, inArray } from 'drizzle-orm'
import { angleBetweenLines, clusterSets, suggestK, type Line } from '../../../orient/index'
import {
  setMembers,
  structures,
  structureSets,
  type Hole,
  type Interval,
} from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { badRequest, conflict, notFound, staleVersion } from '../http/errors'
import { audit } from './audit'
import { loadIntervalData } from './interval-data'

const editable = (interval: Interval) => {
  if (interval.status === 'issued')
    throw conflict('An issued interval cannot change.', 'interval_issued')
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
  actorId: number,
  hole: Hole,
  interval: Interval,
  input: SetFields,
) {
  editable(interval)
  return db.transaction(async (tx) => {
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

const oriented = async (db: Executor, interval: Interval) =>
  (await loadIntervalData(db, interval)).structures.filter(
    (s) => s.poleTrend !== null && s.dip !== null,
  )

/**
 * Replaces the interval's sets with k clusters of its oriented poles (axial spherical k-means,
 * seeded so a rerun gives the same sets), each stored with its explicit members and a cone
 * reaching its farthest member. Runs inside the caller's transaction.
 */
export async function replaceWithClusters(tx: Executor, interval: Interval, k: number) {
  const rows = await oriented(tx, interval)
  const poles: Line[] = rows.map((r) => ({ trend: r.poleTrend!, plunge: r.polePlunge! }))
  if (poles.length < k) {
    throw badRequest(`Only ${poles.length} oriented structures: too few for ${k} sets.`, [
      { path: 'body.k', message: 'more sets than structures' },
    ])
  }
  const result = clusterSets(poles, { k, seed: 7 })
  if (!result)
    throw badRequest('Clustering found no sets in these data.', [
      { path: 'body.k', message: 'no result' },
    ])
  await tx.delete(structureSets).where(eq(structureSets.intervalId, interval.id))
  const created = []
  for (const [i, set] of result.sets.entries()) {
    const memberIdx = result.assignments.map((a, j) => (a === i ? j : -1)).filter((j) => j >= 0)
    const reach = Math.max(5, ...memberIdx.map((j) => angleBetweenLines(set.mean, poles[j]) ?? 0))
    const [row] = await tx
      .insert(structureSets)
      .values({
        intervalId: interval.id,
        name: `Set ${i + 1}`,
        rule: 'cluster',
        centreTrend: set.mean.trend,
        centrePlunge: set.mean.plunge,
        coneAngle: Math.min(90, Math.ceil(reach)),
      })
      .returning()
    if (memberIdx.length) {
      await tx
        .insert(setMembers)
        .values(memberIdx.map((j) => ({ setId: row.id, structureId: rows[j].id })))
    }
    created.push(row)
  }
  return created
}

/** The engineer's "cluster into k sets", audited with the sets it replaced. */
export async function clusterInterval(
  db: Db,
  actorId: number,
  hole: Hole,
  interval: Interval,
  k: number,
) {
  editable(interval)
  return db.transaction(async (tx) => {
    const before = await tx
      .select()
      .from(structureSets)
      .where(eq(structureSets.intervalId, interval.id))
    const created = await replaceWithClusters(tx, interval, k)
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'sets',
      entityId: interval.id,
      action: 'replace',
      before,
      after: { k, sets: created },
    })
    return created
  })
}

export async function suggestSetCount(db: Executor, interval: Interval, maxK: number) {
  const rows = await oriented(db, interval)
  return (
    suggestK(
      rows.map((r) => ({ trend: r.poleTrend!, plunge: r.polePlunge! })),
      maxK,
    ) ?? { k: 1, scores: [] }
  )
}

export async function updateSet(
  db: Db,
  actorId: number,
  hole: Hole,
  interval: Interval,
  setId: number,
  input: Partial<SetFields> & { version: number },
) {
  editable(interval)
  const { version, ...fields } = input
  return db.transaction(async (tx) => {
    const before = await getSet(tx, interval.id, setId)
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
  actorId: number,
  hole: Hole,
  interval: Interval,
  setId: number,
) {
  editable(interval)
  await db.transaction(async (tx) => {
    const before = await getSet(tx, interval.id, setId)
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
  actorId: number,
  hole: Hole,
  interval: Interval,
  setId: number,
  ids: number[],
) {
  editable(interval)
  return db.transaction(async (tx) => {
    const set = await getSet(tx, interval.id, setId)
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
