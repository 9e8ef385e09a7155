// What an apply records, built from the estimate the user is looking at: the request body (totals
// from the logged records, exactly as the server estimated them) and the sentences that say it.
import type { ReconciliationAnswer } from '../../../../schema/index'
import { formatRange, formatRotation, formatShift, type ReconcileRun } from './reconcile-words'

export interface ApplyChoice {
  /** Record the estimated depth shift. */
  depthShift: boolean
  /** Runs whose estimated rotation is recorded. */
  runIds: number[]
  reason: string
}

export interface ApplyBody {
  depthShift?: number
  runRotations?: { runId: number; rotation: number }[]
  reason?: string
}

/** A run's rotation can be recorded only when the server gave it one and a verdict. */
export const selectable = (run: ReconcileRun) => run.verdict !== null && run.rotation !== null

/**
 * The POST body for the choice: the GET's depthShift and each chosen run's rotation, unrounded, so
 * what is recorded is what was shown; null when nothing recordable is chosen.
 */
export function applyBody(answer: ReconciliationAnswer, choice: ApplyChoice): ApplyBody | null {
  const body: ApplyBody = {}
  if (choice.depthShift && answer.depthShift !== null) body.depthShift = answer.depthShift
  const chosen = new Set(choice.runIds)
  const rotations = answer.runs
    .filter((r) => chosen.has(r.runId) && selectable(r))
    .map((r) => ({ runId: r.runId, rotation: r.rotation as number }))
  if (rotations.length > 0) body.runRotations = rotations
  if (body.depthShift === undefined && !body.runRotations) return null
  const reason = choice.reason.trim()
  if (reason) body.reason = reason
  return body
}

/** One sentence per recorded value, then what follows from recording them. */
export function describeApply(answer: ReconciliationAnswer, body: ApplyBody): string[] {
  const lines: string[] = []
  if (body.depthShift !== undefined) {
    const inForce = answer.appliedDepthShift
    const now =
      inForce === 0 ? '' : ` (a shift of ${formatShift(inForce)} is in force now and is replaced)`
    lines.push(
      `Image depths move by ${formatShift(-body.depthShift)} from their logged values onto core depths${now}.`,
    )
  }
  for (const r of body.runRotations ?? []) {
    const run = answer.runs.find((x) => x.runId === r.runId)
    const range = run ? formatRange(run.fromDepth, run.toDepth) : `id ${r.runId}`
    const now =
      run && run.appliedRotation !== 0
        ? ` (${formatRotation(run.appliedRotation)} in force now is replaced)`
        : ''
    lines.push(
      `Run ${range}: logged betas turn by ${formatRotation(r.rotation)} clockwise looking down-hole${now}.`,
    )
  }
  lines.push(
    "The hole's structures are recomputed; the logged values are kept, and each adjustment can be undone.",
  )
  return lines
}
