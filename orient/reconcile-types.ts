import type { Line, Plane } from './types'

/** A structure measured on oriented core, with the hole direction at its depth. */
export interface ReconcileCoreItem {
  id: number
  /** Driller's depth along hole (m). */
  depth: number
  /** As logged (degrees); beta clockwise looking down-hole from the reference line. */
  alpha: number
  beta: number
  /** beta's reference line (see betaFromBottom in core.ts). */
  reference: 'bottom' | 'top'
  /** Hole direction at this depth. */
  hole: Line
  /** Core run containing the depth; null outside runs (or a run not passed in). */
  runId: number | null
}

/** A structure picked on a televiewer image: already a true plane. */
export interface ReconcileImageItem {
  id: number
  /** Image (wireline) depth as logged, before any depth shift was applied (m). */
  depth: number
  plane: Plane
}

/** A core run and the rotation of its orientation line in force now (degrees). */
export interface ReconcileRunItem {
  id: number
  fromDepth: number
  toDepth: number
  appliedRotation: number
}

export interface ReconcileOptions {
  /**
   * m: a matched pair's |image − core − shift| is at most this, the shift from the depth model at
   * the core depth. The shift itself is searched within ±max(3 m, 3·depthWindow).
   */
  depthWindow?: number
  /** Degrees: largest angle between matched poles after the run's estimated rotation. */
  maxAngle?: number
  /** Degrees: |residual rotation| at most this (and a standard error at most this) → 'ok'. */
  okAngle?: number
  /** Degrees: |residual| above this and significant against its standard error → 'wrong'. */
  wrongAngle?: number
  /** Fewer matches in a run → verdict null. */
  minMatches?: number
}

export const RECONCILE_DEFAULTS: Readonly<Required<ReconcileOptions>> = {
  depthWindow: 1,
  maxAngle: 20,
  okAngle: 5,
  wrongAngle: 15,
  minMatches: 3,
}

/** One core structure paired with one image structure. */
export interface ReconcileMatch {
  coreId: number
  imageId: number
  coreDepth: number
  imageDepth: number
  /** image − core (m), logged depths. */
  depthDifference: number
  /** Degrees between poles with the run's applied rotation (what is stored now). */
  angle: number
  /**
   * Degrees between poles after the run's estimated rotation, once at least minMatches pairs with
   * a defined beta back the estimate; otherwise after its applied rotation (0 outside runs).
   */
  alignedAngle: number
  /**
   * exp(−½((r/σd)² + (θ/σθ)²)): r the depth residual about the depth model, θ the pole angle the
   * pairing used (alignedAngle once settled); σd = 1.4826·median|r| (1 cm to depthWindow/2) and
   * σθ = median θ / 1.1774 (1° to maxAngle/2) from the previous pairing (see matchPairs, scalesOf).
   */
  score: number
}

/** The estimate for one core run. Angles in degrees. */
export interface ReconcileRun {
  runId: number
  fromDepth: number
  toDepth: number
  matched: number
  /** Clockwise looking down-hole to ADD to the run's logged betas, in (−180, 180]. */
  rotation: number | null
  /** Weighted 1σ spread of the per-pair rotations. */
  rotationSpread: number | null
  /** Standard error of the estimate. */
  rotationError: number | null
  appliedRotation: number
  /** rotation − appliedRotation, wrapped to (−180, 180]. */
  residual: number | null
  verdict: 'ok' | 'suspect' | 'wrong' | null
  /** One plain sentence saying why. */
  reason: string
}

/** shift = intercept + slope·(coreDepth − referenceDepth), m. */
export interface ReconcileDepthTrend {
  slope: number
  intercept: number
  referenceDepth: number
  slopeError: number
}

export interface ReconcileResult {
  /** Median image − core of the matches (m), null with no matches. */
  depthShift: number | null
  /** 1σ of the matches' depth differences about depthShift (m); null below 2 matches. */
  depthShiftSpread: number | null
  /** Reported only when the matches support it (see fitDepthTrend). */
  depthTrend: ReconcileDepthTrend | null
  matches: ReconcileMatch[]
  unmatchedCore: number[]
  unmatchedImage: number[]
  /** Every run passed in, in depth order. */
  runs: ReconcileRun[]
  options: Required<ReconcileOptions>
}
