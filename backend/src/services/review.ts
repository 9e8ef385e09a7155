import { and, eq } from 'drizzle-orm'
import {
  intervals,
  projects,
  roleAtLeast,
  type Hole,
  type Interval,
  type ProjectRole,
} from '../../../schema/index'
import type { Db, Tx } from '../db/client'
import type { Mailer } from '../mail/transport'
import { ApiError, conflict, forbidden, staleVersion } from '../http/errors'
import { audit } from './audit'
import { notifyProject } from './notify'
import { getInterval, settingsOf } from './intervals'

type Step = 'check' | 'approve' | 'reopen'
const from: Record<Step, Interval['status'][]> = {
  check: ['draft'],
  approve: ['checked'],
  reopen: ['checked', 'approved'],
}
const to: Record<Step, Interval['status']> = {
  check: 'checked',
  approve: 'approved',
  reopen: 'draft',
}

interface Actor {
  id: number
  name: string
  role: ProjectRole
}

/** Who may take a step: engineers check (and reopen a checked interval), leads approve and reopen any. */
function mayTake(step: Step, role: ProjectRole, status: Interval['status']) {
  if (step === 'approve') return roleAtLeast(role, 'lead')
  if (step === 'reopen' && status === 'approved') return roleAtLeast(role, 'lead')
  return roleAtLeast(role, 'engineer')
}

/**
 * Four eyes (a project setting, on by default): the lead who approves must not be the one who
 * checked. 409 `four_eyes` otherwise.
 */
async function assertFourEyes(tx: Tx, actor: Actor, projectId: number, interval: Interval) {
  if (interval.checkedBy !== actor.id) return
  const [project] = await tx
    .select({ fourEyes: projects.fourEyes })
    .from(projects)
    .where(eq(projects.id, projectId))
  if (!project?.fourEyes) return
  throw new ApiError(
    409,
    'four_eyes',
    'Four-eyes rule: you checked this interval, so another lead must approve it.',
    [{ path: 'interval', message: `${interval.id} was checked by the same account` }],
  )
}

/**
 * Moves an interval along draft → checked → approved (issued comes with a design pack); reopening
 * goes back to draft with a reason. Audited in the same transaction; the team is told by e-mail
 * after the commit (a mail failure never undoes the step).
 */
export async function reviewStep(
  db: Db,
  mail: Mailer,
  actor: Actor,
  hole: Hole & { name: string },
  intervalId: number,
  step: Step,
  input: { version: number; reason?: string },
) {
  const after = await db.transaction(async (tx) => {
    const before = await getInterval(tx, hole.id, intervalId)
    if (before.status === 'issued')
      throw conflict('An issued interval cannot change.', 'interval_issued')
    if (!from[step].includes(before.status)) {
      throw new ApiError(
        409,
        'wrong_status',
        `Cannot ${step} an interval that is ${before.status}.`,
      )
    }
    if (!mayTake(step, actor.role, before.status)) {
      throw forbidden(
        step === 'approve' ? 'Only the project lead approves.' : 'Your role cannot do that here.',
      )
    }
    if (step === 'approve') await assertFourEyes(tx, actor, hole.projectId, before)
    const stamp =
      step === 'check'
        ? { checkedBy: actor.id, checkedAt: new Date() }
        : step === 'approve'
          ? { approvedBy: actor.id, approvedAt: new Date() }
          : { checkedBy: null, checkedAt: null, approvedBy: null, approvedAt: null }
    const [row] = await tx
      .update(intervals)
      .set({ status: to[step], ...stamp, version: input.version + 1, updatedAt: new Date() })
      .where(and(eq(intervals.id, intervalId), eq(intervals.version, input.version)))
      .returning()
    if (!row) throw staleVersion()
    await audit(tx, {
      projectId: hole.projectId,
      userId: actor.id,
      entity: 'interval',
      entityId: intervalId,
      action: step,
      before: { status: before.status },
      after: {
        status: row.status,
        ...(input.reason ? { reason: input.reason } : {}),
        // what the approver saw: the analysis settings the pack will use
        ...(step === 'approve' ? { settings: settingsOf(row) } : {}),
      },
    })
    return { row, before }
  })
  await tellTeam(db, mail, actor, hole, step, after, input.reason)
  return after.row
}

/**
 * The team hears of each step after the commit; a reopening also reaches the interval's own
 * checker and approver (by user id, whatever their role is now).
 */
async function tellTeam(
  db: Db,
  mail: Mailer,
  actor: Actor,
  hole: Hole & { name: string },
  step: Step,
  { row: after, before }: { row: Interval; before: Interval },
  reason?: string,
) {
  const what = `${hole.name} ${after.name} (${after.fromDepth}–${after.toDepth} m)`
  const subject =
    step === 'approve'
      ? `Approved: ${what}`
      : step === 'reopen'
        ? `Reopened: ${what}`
        : `Checked: ${what}`
  const text =
    step === 'reopen'
      ? `${actor.name} reopened ${what}: ${reason}`
      : `${actor.name} marked ${what} as ${after.status}.`
  await notifyProject(db, mail, {
    projectId: hole.projectId,
    roles: step === 'check' ? ['lead'] : ['engineer', 'lead'],
    userIds:
      step === 'reopen'
        ? [before.checkedBy, before.approvedBy].filter((id): id is number => id !== null)
        : [],
    subject,
    text,
    link: `/projects/${hole.projectId}/holes/${hole.id}/intervals/${after.id}`,
  })
}

/** Asks the engineers to check an interval; changes nothing but the audit trail. */
export async function submitForChecking(
  db: Db,
  mail: Mailer,
  actor: Actor,
  hole: Hole,
  interval: Interval,
) {
  if (interval.status !== 'draft')
    throw new ApiError(409, 'wrong_status', 'Only a draft interval is submitted for checking.')
  await db.transaction((tx) =>
    audit(tx, {
      projectId: hole.projectId,
      userId: actor.id,
      entity: 'interval',
      entityId: interval.id,
      action: 'submit',
    }),
  )
  const sent = await notifyProject(db, mail, {
    projectId: hole.projectId,
    roles: ['engineer'],
    subject: `Ready for checking: ${hole.name} ${interval.name}`,
    text: `${actor.name} submitted ${hole.name} ${interval.name} (${interval.fromDepth}–${interval.toDepth} m) for checking.`,
    link: `/projects/${hole.projectId}/holes/${hole.id}/intervals/${interval.id}`,
  })
  return { notified: sent }
}
