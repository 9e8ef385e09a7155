/**
 * Column layout of the orientation-uncertainty propagation: one item per index, degrees (and mm for
 * image picks) as everywhere at orient/'s boundary. Columns keep 100,000 structures in a few flat
 * arrays, so the Monte Carlo allocates nothing per structure or per draw.
 */
export interface UncertaintyColumns {
  count: number
  /** 0 core, 1 true (entered as measured), 2 image pick. */
  source: Uint8Array
  /** Core: alpha (degrees). */
  alpha: Float64Array
  /** Core: beta from the bottom-of-hole line, run rotation already added (degrees). */
  beta: Float64Array
  /** Hole direction at the depth (degrees; plunge positive down, negative for up-holes). */
  holeTrend: Float64Array
  holePlunge: Float64Array
  /** Change of hole direction per metre along hole at the depth (deg/m), for the depth error. */
  holeTrendRate: Float64Array
  holePlungeRate: Float64Array
  /** Survey azimuth 1σ for this item's hole (degrees), chosen by the caller from the instrument. */
  azimuthSd: Float64Array
  /** Image pick: peak-to-trough height, hole diameter (mm) and trough azimuth (degrees). */
  amplitude: Float64Array
  diameter: Float64Array
  trough: Float64Array
  /** Image pick: 1 = north-referenced, 0 = high side. */
  north: Uint8Array
  /** True source: the dip and dip direction as entered (degrees). */
  inputDip: Float64Array
  inputDipDirection: Float64Array
}

/** Per-structure 95 % figures, degrees. */
export interface UncertaintyResult {
  /** 95 % cone half-angle about the computed pole; NaN where the structure has no pole. */
  cone95: Float64Array
  /** 95 % ellipse semi-axes from the tangent-plane covariance (χ²₂ 95 % = 5.991); NaN when wide. */
  major95: Float64Array
  minor95: Float64Array
  /** Direction of the ellipse's major axis as a line in space. */
  axisTrend: Float64Array
  axisPlunge: Float64Array
  /** Bit mask, bit b set for uncertaintyReasonBits[b]. */
  reasons: Uint8Array
}

/**
 * Why a cone is wide, in bit order. 'no-survey' is set by the caller (it knows whether the hole
 * direction came from a survey); orientationUncertainty never sets it but keeps its bit.
 */
export const uncertaintyReasonBits = [
  'steep-hole',
  'alpha-near-90',
  'alpha-near-0',
  'no-survey',
] as const
export type UncertaintyReason = (typeof uncertaintyReasonBits)[number]

export const SOURCE_CORE = 0
export const SOURCE_TRUE = 1
export const SOURCE_IMAGE = 2

/** Zeroed columns for count structures (every item a core structure until told otherwise). */
export function uncertaintyColumns(count: number): UncertaintyColumns {
  const n = Math.max(0, Math.floor(count))
  const f = () => new Float64Array(n)
  return {
    count: n,
    source: new Uint8Array(n),
    alpha: f(),
    beta: f(),
    holeTrend: f(),
    holePlunge: f(),
    holeTrendRate: f(),
    holePlungeRate: f(),
    azimuthSd: f(),
    amplitude: f(),
    diameter: f(),
    trough: f(),
    north: new Uint8Array(n),
    inputDip: f(),
    inputDipDirection: f(),
  }
}

/** Result columns for count structures, every figure NaN and no reasons until computed. */
export function uncertaintyResult(count: number): UncertaintyResult {
  const f = () => new Float64Array(count).fill(NaN)
  return {
    cone95: f(),
    major95: f(),
    minor95: f(),
    axisTrend: f(),
    axisPlunge: f(),
    reasons: new Uint8Array(count),
  }
}
