import type { PairIndex } from './reconcile-match'
import type { Prepared } from './reconcile-prepare'
import { median } from './reconcile-shift'
import type { ReconcileDepthTrend } from './reconcile-types'

/** The depth shift as a constant (median) and, when supported, as a linear trend with depth. */
export interface DepthModel {
  readonly shift: number
  readonly spread: number | null
  readonly trend: ReconcileDepthTrend | null
}

/** The shift the model expects at a core depth (m). */
export const shiftAt = (model: DepthModel) => (depth: number) =>
  model.trend
    ? model.trend.intercept + model.trend.slope * (depth - model.trend.referenceDepth)
    : model.shift

/** Depth model of a pairing: median, 1σ about it, and the trend if fitDepthTrend reports one. */
export function depthModelOf(
  prepared: Prepared,
  pairs: readonly PairIndex[],
): DepthModel | undefined {
  if (pairs.length === 0) return undefined
  const depths = pairs.map((p) => prepared.cores[p.core].depth)
  const differences = pairs.map((p, k) => prepared.images[p.image].depth - depths[k])
  const shift = median(differences)
  const n = differences.length
  const spread =
    n < 2 ? null : Math.sqrt(differences.reduce((s, d) => s + (d - shift) ** 2, 0) / (n - 1))
  return { shift, spread, trend: fitDepthTrend(depths, differences) ?? null }
}

/** Trend-test thresholds: enough pairs, depth span, t-ratio and change over the span. */
export const TREND_TEST = { minMatches: 10, minSpan: 10, minT: 3, minChange: 0.05 } as const

/**
 * Least-squares line of the depth difference on core depth (centred on the mean depth, two-pass
 * sums), slope standard error sqrt(s²/Sxx) with s² = SSR/(n − 2) (e.g. Draper & Smith 1998,
 * Applied Regression Analysis, §1.4). Reported only when n ≥ 10, the depth span ≥ 10 m,
 * |slope| > 3·slopeError and the change over the span |slope|·span ≥ 0.05 m (finer than driller's
 * depths resolve, common practice); otherwise undefined.
 */
export function fitDepthTrend(
  depths: readonly number[],
  differences: readonly number[],
): ReconcileDepthTrend | undefined {
  const n = depths.length
  if (n < TREND_TEST.minMatches) return undefined
  const span = Math.max(...depths) - Math.min(...depths)
  if (span < TREND_TEST.minSpan) return undefined
  const mx = depths.reduce((s, x) => s + x, 0) / n
  const my = differences.reduce((s, y) => s + y, 0) / n
  let sxx = 0
  let sxy = 0
  for (let i = 0; i < n; i++) {
    sxx += (depths[i] - mx) ** 2
    sxy += (depths[i] - mx) * (differences[i] - my)
  }
  const slope = sxy / sxx
  let ssr = 0
  for (let i = 0; i < n; i++) ssr += (differences[i] - my - slope * (depths[i] - mx)) ** 2
  const slopeError = Math.sqrt(ssr / (n - 2) / sxx)
  const supported =
    Math.abs(slope) > TREND_TEST.minT * slopeError && Math.abs(slope) * span >= TREND_TEST.minChange
  return supported ? { slope, intercept: my, referenceDepth: mx, slopeError } : undefined
}
