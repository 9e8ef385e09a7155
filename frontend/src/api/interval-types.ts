// Shapes of the depth-view and interval-review API, mirrored by hand from the contract.
import type { Id } from './types'
import type { AnalysisSettingKey, StructureType } from '../../../schema/vocabulary'

export type { AnalysisSettingKey, StructureType }
export type StructureSource = 'core' | 'image' | 'true'
export type IntervalStatus = 'draft' | 'checked' | 'approved' | 'issued'
export type Weighting = 'terzaghi' | 'none'
export type ContourMethod = 'kamb' | 'exponential'

/** An interval's analysis settings: saved with it, shown on its screen, used by its pack. */
export interface AnalysisSettings {
  weighting: Weighting
  contourMethod: ContourMethod
  faceDip: number | null
  faceDipDirection: number | null
  frictionDeg: number | null
  lateralLimitDeg: number
  topplingLimitDeg: number
}

/** A logged structure as the depth view reads it (GET …/holes/:holeId/structures). */
export interface DepthStructure {
  id: Id
  depth: number
  type: StructureType
  source: StructureSource
  alpha: number | null
  beta: number | null
  dip: number | null
  /** Null when the structure is unoriented. */
  dipDirection: number | null
  poleTrend: number | null
  polePlunge: number | null
  holeTrend: number | null
  holePlunge: number | null
  terzaghiWeight: number | null
  flags: string[]
  confidence: 'high' | 'medium' | 'low' | null
  comment: string | null
}

export interface RunMetrics {
  tcr: number
  scr: number
  rqd: number
  frequency: number
  rqdClass: string
}

export interface DepthRun {
  id: Id
  fromDepth: number
  toDepth: number
  markConfidence: string
  metrics: RunMetrics | null
}

/** A LAS curve stored for a hole (GET …/holes/:holeId/logs). */
export interface CurveInfo {
  id: Id
  mnemonic: string
  unit: string
  description: string
  minDepth: number
  maxDepth: number
  sampleCount: number
  /** The LAS file it came from (two files may hold the same mnemonic). */
  sourceFile?: string
}

export interface CurveData {
  id: Id
  mnemonic: string
  unit: string
  depths: number[]
  values: (number | null)[]
}

export interface Domain {
  id: Id
  name: string
  description: string
}

export interface Interval extends AnalysisSettings {
  id: Id
  holeId: Id
  domainId: Id | null
  domainName: string | null
  name: string
  fromDepth: number
  toDepth: number
  status: IntervalStatus
  checkedBy?: Id | null
  checkedAt?: string | null
  approvedBy?: Id | null
  approvedAt?: string | null
  version: number
  structureCount: number
}

export interface IntervalCreate extends Partial<AnalysisSettings> {
  name: string
  fromDepth: number
  toDepth: number
  domainId?: Id | null
}

export type IntervalUpdate = { version: number } & Partial<IntervalCreate>

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

export interface AnalysisStructure {
  id: Id
  depth: number
  type: StructureType
  source: StructureSource
  dip: number | null
  dipDirection: number | null
  poleTrend: number | null
  polePlunge: number | null
  terzaghiWeight: number | null
  flags: string[]
  setId: Id | null
}

export interface SetSpacing {
  apparent: number | null
  true: number | null
  isrmClass: string | null
}

export interface AnalysisSet {
  id: Id
  name: string
  rule: 'cone' | 'cluster'
  centreTrend: number
  centrePlunge: number
  coneAngle: number
  count: number
  weightedCount: number
  percent: number
  mean: { dip: number; dipDirection: number } | null
  meanPole: { trend: number; plunge: number } | null
  kappa: number | null
  alpha95: number | null
  sphericalVariance: number | null
  spacing: SetSpacing | null
  version: number
}

export interface SetIntersection {
  setA: Id
  setB: Id
  nameA: string
  nameB: string
  /** Null when the two means are parallel (no line of intersection). */
  trend: number | null
  plunge: number | null
  /** Acute angle between the two mean planes. */
  angle: number | null
}

export interface ModeShare {
  /** How many structures (planar, toppling) or set pairs (wedge) could fail this way. */
  possible: number
  percent: number
}

export interface KinematicPair {
  setA: Id
  setB: Id
  trend: number | null
  plunge: number | null
  possible: boolean
  /** Sliding along the intersection, or on set A's or B's plane alone. */
  slidesOn: 'intersection' | 'a' | 'b' | null
  reason: string
}

export interface Kinematics {
  face: { dip: number; dipDirection: number }
  friction: number
  lateralLimit: number
  topplingLimit: number
  planar: ModeShare
  toppling: ModeShare
  wedge: ModeShare
  items: {
    structureId: Id
    planar: { possible: boolean; reason: string }
    toppling: { possible: boolean; reason: string }
  }[]
  pairs: KinematicPair[]
}

export interface Analysis {
  interval: Interval
  settings: AnalysisSettingsUsed
  /** Hole direction at mid-interval (null without a survey): the blind zone's axis. */
  hole: { trend: number; plunge: number } | null
  counts: { total: number; oriented: number; unoriented: number; flagged: number }
  structures: AnalysisStructure[]
  sets: AnalysisSet[]
  intersections: SetIntersection[]
  kinematics: Kinematics | null
}

export interface SetCreate {
  name: string
  centreTrend: number
  centrePlunge: number
  coneAngle: number
}

export type SetUpdate = { version: number } & Partial<SetCreate>

export interface KSuggestion {
  k: number
  scores: { k: number; silhouette: number }[]
}
