import { and, asc, eq, gt, lt, ne, sql } from 'drizzle-orm'
import {
  analysisSettingKeys,
  domains,
  holes,
  intervals,
  structures,
  type AnalysisSettingKey,
  type Hole,
  type Interval,
  type IntervalCreate,
  type IntervalUpdate,
} from '../../../schema/index'
import type { Db, Executor, Tx } from '../db/client'
import type { Mailer } from '../mail/transport'
import { ApiError, badRequest, notFound, staleVersion } from '../http/errors'
import { audit } from './audit'
import { assertNotFrozen, demoteChecked, noticeDemoted } from './freeze'

/** The analysis settings an interval holds (what its pack uses and its approval records). */
export type AnalysisSettings = Pick<Interval, AnalysisSettingKey>

/** An interval's saved analysis settings, e.g. for the approval's audit row. */
export function settingsOf(interval: Interval): AnalysisSettings {
  return Object.fromEntries(analysisSettingKeys.map((k) => [k, interval[k]])) as AnalysisSettings
}

/** The saved settings with the given overrides on top, and which keys the overrides changed. */
export function resolveSettings(
  interval: Interval,
  overrides: Partial<{ [K in AnalysisSettingKey]: AnalysisSettings[K] | undefined }>,
) {
  const saved = settingsOf(interval)
  const used = { ...saved } as Record<AnalysisSettingKey, unknown>
  for (const k of analysisSettingKeys) if (overrides[k] !== undefined) used[k] = overrides[k]
  const overridden = analysisSettingKeys.filter((k) => used[k] !== saved[k])
  return { saved, used: used as AnalysisSettings, overridden }
}

/** Fields whose change alters the analysis: a checked interval goes back to draft. */
const analysisInputs = ['fromDepth', 'toDepth', ...analysisSettingKeys] as const

/** Intervals of a hole with their domain name and how many structures fall inside. */
export async function listIntervals(db: Executor, holeId: number) {
  const rows = await db
    .select({
      interval: intervals,
      domainName: domains.name,
      structureCount: sql<number>`(select count(*)::int from ${structures} s
        where s.hole_id = ${intervals.holeId} and s.depth >= ${intervals.fromDepth} and s.depth < ${intervals.toDepth})`,
    })
    .from(intervals)
    .leftJoin(domains, eq(domains.id, intervals.domainId))
    .where(eq(intervals.holeId, holeId))
    .orderBy(asc(intervals.fromDepth))
  return rows.map((r) => ({
    ...r.interval,
    domainName: r.domainName,
    structureCount: r.structureCount,
  }))
}

export async function getInterval(db: Executor, holeId: number, id: number): Promise<Interval> {
  const [row] = await db
    .select()
    .from(intervals)
    .where(and(eq(intervals.id, id), eq(intervals.holeId, holeId)))
  if (!row) throw notFound('Interval')
  return row
}

/** Intervals of a hole never overlap ([from, to) ranges); checked under a lock on the hole. */
async function assertNoOverlap(tx: Tx, hole: Hole, from: number, to: number, exceptId?: number) {
  await tx.select({ id: holes.id }).from(holes).where(eq(holes.id, hole.id)).for('update')
  const [clash] = await tx
    .select()
    .from(intervals)
    .where(
      and(
        eq(intervals.holeId, hole.id),
        lt(intervals.fromDepth, to),
        gt(intervals.toDepth, from),
        exceptId ? ne(intervals.id, exceptId) : undefined,
      ),
    )
  if (clash) {
    const where = `"${clash.name}" ${clash.fromDepth}–${clash.toDepth} m`
    throw new ApiError(409, 'interval_overlap', `Overlaps interval ${where}.`, [
      { path: 'body.fromDepth', message: `overlaps ${where}` },
    ])
  }
}

async function assertDomain(tx: Tx, projectId: number, domainId: number | null | undefined) {
  if (domainId == null) return
  const [d] = await tx
    .select()
    .from(domains)
    .where(and(eq(domains.id, domainId), eq(domains.projectId, projectId)))
  if (!d)
    throw badRequest('No such domain in this project', [
      { path: 'body.domainId', message: 'no such domain' },
    ])
}

export async function createInterval(db: Db, actorId: number, hole: Hole, input: IntervalCreate) {
  return db.transaction(async (tx) => {
    await assertDomain(tx, hole.projectId, input.domainId)
    await assertNoOverlap(tx, hole, input.fromDepth, input.toDepth)
    const [row] = await tx
      .insert(intervals)
      .values({ ...input, holeId: hole.id })
      .returning()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'interval',
      entityId: row.id,
      action: 'create',
      after: row,
    })
    return row
  })
}

/**
 * Edits an interval under its version. An approved or issued interval refuses every edit (409
 * `interval_approved`); a changed range or analysis setting returns a checked interval to draft,
 * and its checker is told after the commit.
 */
export async function updateInterval(
  db: Db,
  mail: Mailer,
  actorId: number,
  hole: Hole,
  id: number,
  input: IntervalUpdate,
) {
  const { version, ...fields } = input
  const reason = 'its range or analysis settings changed'
  const { after, demoted } = await db.transaction(async (tx) => {
    // Refuses a frozen interval and locks the row first, so no review step slips in before commit.
    await assertNotFrozen(tx, hole.id, { intervalIds: [id] }, 'Editing this interval')
    const before = await getInterval(tx, hole.id, id)
    await assertDomain(tx, hole.projectId, fields.domainId)
    const from = fields.fromDepth ?? before.fromDepth
    const to = fields.toDepth ?? before.toDepth
    if (to <= from)
      throw badRequest('toDepth must be greater than fromDepth', [
        { path: 'body.toDepth', message: 'must be greater than fromDepth' },
      ])
    await assertNoOverlap(tx, hole, from, to, id)
    const [updated] = await tx
      .update(intervals)
      .set({ ...fields, version: version + 1, updatedAt: new Date() })
      .where(and(eq(intervals.id, id), eq(intervals.version, version)))
      .returning()
    if (!updated) throw staleVersion()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'interval',
      entityId: id,
      action: 'update',
      before,
      after: updated,
    })
    const changed = analysisInputs.some((k) => updated[k] !== before[k])
    const demoted = changed
      ? await demoteChecked(tx, actorId, hole.projectId, hole.id, { intervalIds: [id] }, reason)
      : []
    return { after: demoted[0]?.interval ?? updated, demoted }
  })
  await noticeDemoted(db, mail, hole.projectId, hole, demoted, reason)
  return after
}

export async function deleteInterval(
  db: Db,
  actorId: number,
  hole: Hole,
  id: number,
  version: number,
) {
  await db.transaction(async (tx) => {
    await assertNotFrozen(tx, hole.id, { intervalIds: [id] }, 'Deleting this interval')
    const before = await getInterval(tx, hole.id, id)
    const [gone] = await tx
      .delete(intervals)
      .where(and(eq(intervals.id, id), eq(intervals.version, version)))
      .returning({ id: intervals.id })
    if (!gone) throw staleVersion()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'interval',
      entityId: id,
      action: 'delete',
      before,
    })
  })
}
