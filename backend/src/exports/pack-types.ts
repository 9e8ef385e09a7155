import type { Hole, Interval, Project, Structure, SurveyStation } from '../../../schema/index'
import type { analyseInterval } from '../services/analysis'
import type { AnalysisSettings } from '../services/intervals'
import type { listRuns } from '../services/runs'
import type { RunSummary } from './run-summary'

// What a design pack shows, read once by services/pack-data.ts; every formatter here takes it.

/** Who checked and who approved an interval, and when (null where that step was not taken). */
export interface SignOff {
  checkedBy: string | null
  checkedAt: Date | null
  approvedBy: string | null
  approvedAt: Date | null
}

export type Analysis = Awaited<ReturnType<typeof analyseInterval>>
export type RunWithMetrics = Awaited<ReturnType<typeof listRuns>>[number]

export interface PackInterval {
  interval: Interval
  hole: Hole
  domain: string
  analysis: Analysis
  /** The interval's saved settings, which its analysis used. */
  settings: AnalysisSettings
  signOff: SignOff
  runs: RunSummary
}

export interface PackData {
  project: Project
  holes: Hole[]
  stations: SurveyStation[]
  runs: Map<number, RunWithMetrics[]>
  structures: Structure[]
  intervals: PackInterval[]
  /** Structure id → its interval and set names (first interval that holds it). */
  assignment: Map<number, { interval: string; intervalId: number; set: string }>
  /** Some packed interval is not approved: every file says DRAFT and the pack is never issued. */
  draft: boolean
  inputsHash: string
}
