import { runMetricsOf } from '../../../orient/index'
import type { CoreRun } from '../../../schema/index'

export interface RunSummary {
  /** Length-weighted mean RQD (%) over the runs overlapping the interval, by overlap length. */
  rqd: number | null
  /** Natural fractures per metre: each run's count prorated by its overlap, over the overlap length. */
  frequency: number | null
  /** Metres of run within the interval. */
  length: number
}

/** RQD and fracture frequency of a depth interval [from, to) from the core runs that overlap it. */
export function intervalRunSummary(runs: readonly CoreRun[], from: number, to: number): RunSummary {
  let length = 0
  let rqdSum = 0
  let fractures = 0
  for (const run of runs) {
    const overlap = Math.min(run.toDepth, to) - Math.max(run.fromDepth, from)
    if (overlap <= 0) continue
    const m = runMetricsOf(run)
    if (!m) continue
    length += overlap
    rqdSum += m.rqd * overlap
    fractures += m.frequency * overlap
  }
  return length > 0
    ? { rqd: rqdSum / length, frequency: fractures / length, length }
    : { rqd: null, frequency: null, length: 0 }
}
