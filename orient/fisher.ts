import { EPSILON, RAD2DEG, acos, twoSum } from './math'
import { linesToXyz, tensorSums } from './tensor'
import { vecToDirection, vecToLine } from './vector'
import type { Line } from './types'

export interface FisherOptions {
  /** Treat lines as axes (default true): each is flipped to the side of the principal axis. */
  readonly axial?: boolean
  /** Non-negative weight per line (e.g. Terzaghi weights). */
  readonly weights?: readonly number[]
}

/** Fisher (1953) statistics of a set of lines. */
export interface FisherStats {
  /** Weighted count N = Σw (the number of lines when unweighted). */
  readonly n: number
  /** Number of valid lines used. */
  readonly count: number
  /** Length of the resultant, R = |Σ w x|. */
  readonly resultant: number
  /** Mean direction Σwx / R (lower hemisphere for axial data). */
  readonly mean: Line
  /** Concentration k = (N − 1)/(N − R); Infinity when all lines coincide. */
  readonly kappa: number
  /** Semi-angle of the 95 % confidence cone, degrees; 0 when all lines coincide. */
  readonly alpha95: number
  /** Spherical variance (N − R)/N (Fisher, Lewis & Embleton 1987). */
  readonly sphericalVariance: number
}

/**
 * Fisher statistics of lines (Fisher 1953): R = |Σx|, mean = Σx/R, k = (N−1)/(N−R),
 * cos(a95) = 1 − ((N−R)/R)(20^(1/(N−1)) − 1), spherical variance (N−R)/N.
 *
 * Axial (default): each vector is flipped so x·e1 ≥ 0, e1 the principal axis of the orientation
 * tensor — forcing the lower hemisphere instead would split clusters of near-horizontal lines.
 *
 * Weights: n = Σw and the mean is Σwx/|Σwx|. The concentration comes from the weighted mean
 * resultant length R̄ = R/n, while kappa and alpha95 count the lines actually measured, m:
 * kappa = (m − 1)/(m(1 − R̄)) and alpha95 from N = m, R = m·R̄ — weighting for sampling bias shifts
 * the mean but does not add observations. Unweighted, these are Fisher's formulas. Spherical
 * variance is 1 − R̄. Undefined with fewer than 2 valid lines or no resultant (non-axial data that
 * cancel out).
 */
export function fisherStats(
  lines: readonly Line[],
  options: FisherOptions = {},
): FisherStats | undefined {
  const w = options.weights
  if (w && w.length !== lines.length) return undefined
  return fisherStatsBatch(linesToXyz(lines), {
    axial: options.axial,
    weights: w ? Float64Array.from(w) : undefined,
  })
}

/**
 * fisherStats over an interleaved xyz column of unit vectors (see linesToXyz) with an optional
 * weight column: two passes (tensor, then flipped resultant), compensated sums, no allocation per
 * item.
 */
export function fisherStatsBatch(
  xyz: Float64Array,
  options: { axial?: boolean; weights?: Float64Array } = {},
): FisherStats | undefined {
  const axial = options.axial ?? true
  const weights = options.weights
  const sums = tensorSums(xyz, weights)
  if (!sums || sums.count < 2) return undefined
  const [ex, ey, ez] = sums.eigen.vectors[0]
  const count = Math.floor(xyz.length / 3)
  const acc = new Float64Array(6)
  for (let i = 0; i < count; i++) {
    const x = xyz[3 * i]
    const y = xyz[3 * i + 1]
    const z = xyz[3 * i + 2]
    const w = weights ? weights[i] : 1
    if (!(w > 0) || x - x !== 0 || y - y !== 0 || z - z !== 0 || w - w !== 0) continue
    const s = axial && x * ex + y * ey + z * ez < 0 ? -w : w
    twoSum(acc, 0, s * x)
    twoSum(acc, 2, s * y)
    twoSum(acc, 4, s * z)
  }
  const rx = acc[0] + acc[1]
  const ry = acc[2] + acc[3]
  const rz = acc[4] + acc[5]
  const n = sums.weight
  const resultant = Math.hypot(rx, ry, rz)
  if (resultant < EPSILON * n) return undefined
  const mean = axial ? vecToLine([rx, ry, rz]) : vecToDirection([rx, ry, rz])
  const rBar = Math.min(resultant / n, 1)
  const m = sums.count
  // Rounding leaves 1 − R̄ ≈ 1e-16 for identical lines: call that a perfect cluster.
  const spread = 1 - rBar < 1e-13 ? 0 : 1 - rBar
  const kappa = spread === 0 ? Infinity : (m - 1) / (m * spread)
  const cosA95 = spread === 0 ? 1 : 1 - (spread / rBar) * (Math.pow(20, 1 / (m - 1)) - 1)
  return {
    n,
    count: m,
    resultant,
    mean,
    kappa,
    alpha95: acos(cosA95) * RAD2DEG,
    sphericalVariance: spread,
  }
}
