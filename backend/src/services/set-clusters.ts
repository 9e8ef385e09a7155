import { eq } from 'drizzle-orm'
import { angleBetweenLines, clusterSets, suggestK, type Line } from '../../../orient/index'
import { setMembers, structureSets, type Hole, type Interval } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import type { Mailer } from '../mail/transport'
import { badRequest } from '../http/errors'
import { audit } from './audit'
import { guardWrite, writeAndNotice } from './freeze'
import { loadIntervalData } from './interval-data'

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

/**
 * The engineer's "cluster into k sets", audited with the sets it replaced: 409 on an approved or
 * issued interval, and a checked one goes back to draft.
 */
export async function clusterInterval(
  db: Db,
  mail: Mailer,
  actorId: number,
  hole: Hole,
  interval: Interval,
  k: number,
) {
  return writeAndNotice(db, mail, hole.projectId, hole, async (tx, demoted) => {
    const change = {
      what: `Re-clustering the sets into ${k}`,
      reason: `its sets were re-clustered into ${k}`,
    }
    const scope = { intervalIds: [interval.id] }
    demoted.push(...(await guardWrite(tx, actorId, hole.projectId, hole.id, scope, change)))
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
