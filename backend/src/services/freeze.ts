import { and, asc, eq, gt, inArray, lt, lte, or, sql, type SQL } from 'drizzle-orm'
import { intervals, type Interval } from '../../../schema/index'
import type { Db, Executor, Tx } from '../db/client'
import { ApiError } from '../http/errors'
import type { Mailer } from '../mail/transport'
import { audit } from './audit'
import { notifyProject } from './notify'

/**
 * What a write touches in a hole: the whole hole (survey, runs, project conventions: every
 * structure may be recomputed), some depths (a structure written, moved or deleted), depth ranges,
 * or named intervals (set edits, analysis settings).
 */
export type FreezeScope =
  | { hole: true }
  | { depths: number[] }
  | { ranges: { from: number; to: number }[] }
  | { intervalIds: number[] }

/** From approval on, an interval's analysis inputs cannot change (issued is approved and more). */
const FROZEN: Interval['status'][] = ['approved', 'issued']

function scopeWhere(scope: FreezeScope): SQL | undefined {
  if ('hole' in scope) return undefined
  if ('intervalIds' in scope)
    return scope.intervalIds.length ? inArray(intervals.id, scope.intervalIds) : sql`false`
  const ranges =
    'depths' in scope ? scope.depths.map((d) => ({ from: d, to: d, point: true })) : scope.ranges
  if (ranges.length === 0) return sql`false`
  return or(
    ...ranges.map((r) =>
      'point' in r
        ? and(lte(intervals.fromDepth, r.from), gt(intervals.toDepth, r.from))
        : and(lt(intervals.fromDepth, r.to), gt(intervals.toDepth, r.from)),
    ),
  )
}

/**
 * The hole's intervals in a status list that a write in `scope` would touch, shallowest first.
 * With `lock`, every interval in scope (whatever its status) is locked until the transaction ends,
 * so no review step can slip in between this check and the write's commit.
 */
export async function intervalsTouched(
  db: Executor,
  holeId: number,
  scope: FreezeScope,
  statuses: Interval['status'][],
  lock = false,
): Promise<Interval[]> {
  const query = db
    .select()
    .from(intervals)
    .where(and(eq(intervals.holeId, holeId), scopeWhere(scope)))
    .orderBy(asc(intervals.fromDepth), asc(intervals.id))
  const rows = lock ? await query.for('update') : await query
  return rows.filter((i) => statuses.includes(i.status))
}

export const describeInterval = (i: Pick<Interval, 'name' | 'fromDepth' | 'toDepth'>) =>
  `"${i.name}" (${i.fromDepth}–${i.toDepth} m)`

/**
 * Refuses (409 `interval_approved`, for every role) a write that would change the analysis inputs
 * of an approved or issued interval, naming it; a lead must reopen it with a reason first.
 */
export async function assertNotFrozen(
  db: Executor,
  holeId: number,
  scope: FreezeScope,
  what = 'This change',
): Promise<void> {
  const hit = await intervalsTouched(db, holeId, scope, FROZEN, true)
  if (hit.length === 0) return
  const names = hit.map(describeInterval).join(', ')
  const status = hit[0].status
  throw new ApiError(
    409,
    'interval_approved',
    `${what} would change the ${status} interval ${names}: a lead must reopen it first.`,
    hit.map((i) => ({
      path: 'interval',
      message: `${i.id} ${describeInterval(i)} is ${i.status}`,
    })),
    { intervalIds: hit.map((i) => i.id) },
  )
}

export interface Demoted {
  interval: Interval
  checkedBy: number | null
  /** Why it went back to draft, as audited. */
  reason: string
}

/**
 * A change inside a checked interval returns it to draft (checker stamps cleared, version bumped),
 * audited in the caller's transaction. Returns what was demoted so the caller can tell each
 * checker after the commit with `noticeDemoted`.
 */
export async function demoteChecked(
  tx: Executor,
  actorId: number,
  projectId: number,
  holeId: number,
  scope: FreezeScope,
  reason: string,
): Promise<Demoted[]> {
  const hit = await intervalsTouched(tx, holeId, scope, ['checked'], true)
  const out: Demoted[] = []
  for (const before of hit) {
    const [after] = await tx
      .update(intervals)
      .set({
        status: 'draft',
        checkedBy: null,
        checkedAt: null,
        version: sql`${intervals.version} + 1`,
        updatedAt: new Date(),
      })
      .where(eq(intervals.id, before.id))
      .returning()
    await audit(tx, {
      projectId,
      userId: actorId,
      entity: 'interval',
      entityId: before.id,
      action: 'back-to-draft',
      before: { status: before.status, checkedBy: before.checkedBy, checkedAt: before.checkedAt },
      after: { status: after.status, reason },
    })
    out.push({ interval: after, checkedBy: before.checkedBy, reason })
  }
  return out
}

/** Tells each checker that their checked interval went back to draft (after the commit). */
export async function noticeDemoted(
  db: Db,
  mail: Mailer,
  projectId: number,
  hole: { id: number; name: string },
  demoted: Demoted[],
  reason?: string,
): Promise<void> {
  for (const d of demoted) {
    if (d.checkedBy === null) continue
    await notifyProject(db, mail, {
      projectId,
      userIds: [d.checkedBy],
      subject: `Back to draft: ${hole.name} ${d.interval.name}`,
      text: `${hole.name} ${describeInterval(d.interval)} went back to draft after a change inside it (${reason ?? d.reason}). Check it again when ready.`,
      link: `/projects/${projectId}/holes/${hole.id}/intervals/${d.interval.id}`,
    })
  }
}

/** What a write is, for the 409 message (`what`) and for the audit row and the notice (`reason`). */
export interface FreezeChange {
  what: string
  reason: string
}

/**
 * The two freeze rules of one write in `scope`, inside its transaction: 409 when an approved or
 * issued interval is touched, then every checked one back to draft. Returns the demoted ones.
 */
export async function guardWrite(
  tx: Executor,
  actorId: number,
  projectId: number,
  holeId: number,
  scope: FreezeScope,
  change: FreezeChange,
): Promise<Demoted[]> {
  await assertNotFrozen(tx, holeId, scope, change.what)
  return demoteChecked(tx, actorId, projectId, holeId, scope, change.reason)
}

/**
 * Runs a write in one transaction with a list to collect the intervals it demotes, then tells
 * their checkers once it has committed (a mail failure never undoes the write).
 */
export async function writeAndNotice<T>(
  db: Db,
  mail: Mailer,
  projectId: number,
  hole: { id: number; name: string },
  work: (tx: Tx, demoted: Demoted[]) => Promise<T>,
): Promise<T> {
  const demoted: Demoted[] = []
  const out = await db.transaction((tx) => work(tx, demoted))
  await noticeDemoted(db, mail, projectId, hole, demoted)
  return out
}
