// Shapes of the depth-view and interval-review API: rows from schema/, statistics and verdicts
// from orient/ (type-only imports), and what the analysis adds declared beside them.
import type { Id, Run, Structure, Wire } from './types'
import type { FisherStats, Line, Plane, Verdict, WedgeVerdict } from '../../../orient/index'
import type {
  Domain as DomainRow,
  Interval as IntervalRow,
  LogCurve,
  StructureSet,
} from '../../../schema/index'
import type { AnalysisSettingKey, StructureSource } from '../../../schema/vocabulary'

export type { IntervalCreate, IntervalUpdate, SetCreate, SetUpdate } from '../../../schema/index'
export type { KSuggestion, RunMetrics } from '../../../orient/index'
export type {
  AnalysisSettingKey,
  AnalysisWeighting as Weighting,
  ContourMethod,
  IntervalStatus,
  StructureSource,
  StructureType,
} from '../../../schema/vocabulary'

/** An interval's analysis settings: saved with it, shown on its screen, used by its pack. */
export type AnalysisSettings = Pick<IntervalRow, AnalysisSettingKey>

/** A logged structure as the depth view reads it (GET …/holes/:holeId/structures). */
export type DepthStructure = Pick<
  Structure,
  | 'id'
  | 'depth'
  | 'type'
  | 'source'
  | 'alpha'
  | 'beta'
  | 'dip'
  | 'dipDirection'
  | 'poleTrend'
  | 'polePlunge'
  | 'holeTrend'
  | 'holePlunge'
  | 'declinationApplied'
  | 'terzaghiWeight'
  | 'flags'
  | 'confidence'
  | 'comment'
  | 'betaRotationApplied'
  | 'depthShiftApplied'
  | 'uncertainty95'
  | 'uncertaintyMajor'
  | 'uncertaintyMinor'
  | 'uncertaintyAxisTrend'
  | 'uncertaintyAxisPlunge'
  | 'uncertaintyReasons'
>

/** A core run as the depth view reads it (GET …/holes/:holeId/runs). */
export type DepthRun = Pick<Run, 'id' | 'fromDepth' | 'toDepth' | 'markConfidence' | 'metrics'>

/** A LAS curve stored for a hole (GET …/holes/:holeId/logs); sourceFile names the LAS file. */
export type CurveInfo = Pick<
  LogCurve,
  'id' | 'mnemonic' | 'unit' | 'description' | 'minDepth' | 'maxDepth' | 'sourceFile'
> & { sampleCount: number }

/** One curve with its samples; `values` holds null where a sample is absent. */
export type CurveData = Pick<LogCurve, 'id' | 'mnemonic' | 'unit' | 'depths'> & {
  values: (number | null)[]
}

export type Domain = DomainRow

/** An interval with its domain's name; the hole's list also counts the structures inside. */
export type Interval = Wire<IntervalRow> & { domainName: string | null; structureCount?: number }

/** Filters, and settings that override the saved ones for exploring (left out = saved). */
export interface AnalysisQuery extends Partial<AnalysisSettings> {
  types?: readonly string[]
  sources?: readonly StructureSource[]
}

/** Which settings the analysis used, the interval's saved ones, and the keys that differ. */
export interface AnalysisSettingsUsed {
  saved: AnalysisSettings
  used: AnalysisSettings
  overridden: AnalysisSettingKey[]
}

export type AnalysisStructure = Pick<
  Structure,
  | 'id'
  | 'depth'
  | 'type'
  | 'source'
  | 'dip'
  | 'dipDirection'
  | 'poleTrend'
  | 'polePlunge'
  | 'terzaghiWeight'
  | 'flags'
> & { setId: Id | null }

export interface SetSpacing {
  apparent: number | null
  true: number | null
  isrmClass: string | null
}

/** A set with its members' Fisher statistics (Fisher 1953), rounded; null with too few poles. */
export type AnalysisSet = Pick<
  StructureSet,
  'id' | 'name' | 'rule' | 'centreTrend' | 'centrePlunge' | 'coneAngle' | 'version'
> & { [K in 'kappa' | 'alpha95' | 'sphericalVariance']: FisherStats[K] | null } & {
  count: number
  weightedCount: number
  percent: number
  mean: Plane | null
  meanPole: Line | null
  spacing: SetSpacing | null
  /** Survey error shared by the hole's structures (95 %, degrees): it does not shrink with N. */
  systematic95: number | null
  /** Sampling and survey combined: √(alpha95² + systematic95²) (degrees). */
  uncertainty95: number | null
}

/** A line as the analysis rounds it: null when there is none (parallel means). */
type MaybeLine = { [K in keyof Line]: Line[K] | null }

export type SetIntersection = MaybeLine & {
  setA: Id
  setB: Id
  nameA: string
  nameB: string
  /** Acute angle between the two mean planes. */
  angle: number | null
}

export interface ModeShare {
  /** How many structures (planar, toppling) or set pairs (wedge) could fail this way. */
  possible: number
  percent: number
}

/** Wedge sliding on a pair of set means: along the intersection, or on set A's or B's plane alone. */
export type KinematicPair = MaybeLine &
  Pick<WedgeVerdict, 'possible' | 'reason'> & {
    setA: Id
    setB: Id
    slidesOn: NonNullable<WedgeVerdict['slidesOn']> | null
  }

export interface Kinematics {
  face: Plane
  friction: number
  lateralLimit: number
  topplingLimit: number
  planar: ModeShare
  toppling: ModeShare
  wedge: ModeShare
  items: { structureId: Id; planar: Verdict; toppling: Verdict }[]
  pairs: KinematicPair[]
}

export interface Analysis {
  interval: Interval
  settings: AnalysisSettingsUsed
  /** Hole direction at mid-interval (null without a survey): the blind zone's axis. */
  hole: Line | null
  counts: { total: number; oriented: number; unoriented: number; flagged: number }
  structures: AnalysisStructure[]
  sets: AnalysisSet[]
  intersections: SetIntersection[]
  kinematics: Kinematics | null
}
