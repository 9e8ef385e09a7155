import { DEG2RAD, RAD2DEG } from './math'
import type { PairIndex } from './reconcile-match'
import { wrap180 } from './reconcile-prepare'
import type { Prepared } from './reconcile-prepare'
import { estimateRotation, pairRotation } from './reconcile-rotation'
import type { RotationEstimate } from './reconcile-rotation'
import type { ReconcileOptions, ReconcileRun } from './reconcile-types'
import { runVerdict } from './reconcile-verdict'

/** Each run's rotation estimate from its matched pairs (undefined where it has none). */
export function runRotations(
  prepared: Prepared,
  pairs: readonly PairIndex[],
): (RotationEstimate | undefined)[] {
  const byRun = prepared.runs.map(() => [] as ReturnType<typeof pairRotation>[])
  for (const p of pairs) {
    const core = prepared.cores[p.core]
    if (core.run >= 0) byRun[core.run].push(pairRotation(core, prepared.images[p.image]))
  }
  return byRun.map((list) => (list.length ? estimateRotation(list) : undefined))
}

/**
 * The rotation (rad) each run's cores are turned by before poles are compared: the run's estimate
 * once at least minMatches pairs with a defined beta back it, else its applied rotation. Cores
 * outside every run keep their logged beta (rotation 0).
 */
export function alignmentRotations(
  prepared: Prepared,
  estimates: readonly (RotationEstimate | undefined)[],
  minMatches: number,
): Float64Array {
  return Float64Array.from(prepared.runs, (run, k) => {
    const estimate = estimates[k]
    return estimate && estimate.used >= minMatches
      ? estimate.rotation
      : run.appliedRotation * DEG2RAD
  })
}

/**
 * The per-run answer. A rotation is reported once two pairs with a defined beta back it (so it
 * has a spread), even below minMatches — the verdict is then null and the reason says why.
 */
export function runResults(
  prepared: Prepared,
  pairs: readonly PairIndex[],
  estimates: readonly (RotationEstimate | undefined)[],
  options: Required<ReconcileOptions>,
): ReconcileRun[] {
  const matched = new Int32Array(prepared.runs.length)
  for (const p of pairs) {
    const run = prepared.cores[p.core].run
    if (run >= 0) matched[run]++
  }
  return prepared.runs.map((run, k) => {
    const estimate = estimates[k]
    const error = estimate?.error
    const spread = estimate?.spread
    const known = estimate !== undefined && error !== undefined && spread !== undefined
    const rotation = known ? wrap180(estimate.rotation * RAD2DEG) : null
    const rotationError = known ? error * RAD2DEG : null
    const residual = rotation === null ? null : wrap180(rotation - run.appliedRotation)
    const figures = {
      matched: matched[k],
      used: estimate?.used ?? 0,
      directional: estimate?.directional ?? 0,
      residual,
      error: rotationError,
    }
    return {
      runId: run.id,
      fromDepth: run.fromDepth,
      toDepth: run.toDepth,
      matched: matched[k],
      rotation,
      rotationSpread: known ? spread * RAD2DEG : null,
      rotationError,
      appliedRotation: run.appliedRotation,
      residual,
      ...runVerdict(figures, options),
    }
  })
}
