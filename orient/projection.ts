import { RAD2DEG, finite, wrap360 } from './math'
import { lineToVec } from './vector'
import type { Line } from './types'

/** Lower-hemisphere net: equal-area (Lambert, Schmidt net) or equal-angle (stereographic, Wulff). */
export type NetProjection = 'equal-area' | 'equal-angle'

/** A point on a unit net: primitive radius 1, north up (+y), east right (+x). */
export interface NetPoint {
  readonly x: number
  readonly y: number
}

/**
 * Position of a line on a unit lower-hemisphere net. With c = 90 − plunge: equal-area
 * r = √2 sin(c/2), equal-angle r = tan(c/2); x = r sin(trend), y = r cos(trend). Upward lines are
 * first taken to the lower hemisphere. Screen coordinates (y down) are (x, −y).
 */
export function project(
  line: Line,
  projection: NetProjection = 'equal-area',
): NetPoint | undefined {
  if (!finite(line.trend, line.plunge)) return undefined
  const v = lineToVec(line)
  const z = v[2] > 0 ? v[2] : -v[2]
  const h = Math.hypot(v[0], v[1])
  if (h === 0) return { x: 0, y: 0 }
  const s = v[2] > 0 ? -1 : 1
  // From the unit vector directly: sin(c/2) = sqrt((1 − cos c)/2), tan(c/2) = sin c / (1 + cos c).
  const r = projection === 'equal-area' ? Math.sqrt(1 - z) : h / (1 + z)
  // + 0 turns −0 (a vertical line's rounding) into 0.
  return { x: (s * v[0] * r) / h + 0, y: (s * v[1] * r) / h + 0 }
}

/**
 * Line at a point of the unit net (inverse of project). Points a hair outside the primitive are
 * taken onto it; further out (r > 1 + 1e-9) or non-finite: undefined.
 */
export function unproject(
  point: NetPoint,
  projection: NetProjection = 'equal-area',
): Line | undefined {
  const { x, y } = point
  if (!finite(x, y)) return undefined
  const r = Math.hypot(x, y)
  if (r > 1 + 1e-9) return undefined
  const rc = Math.min(r, 1)
  const c = projection === 'equal-area' ? 2 * Math.asin(rc / Math.SQRT2) : 2 * Math.atan(rc)
  const trend = r === 0 ? 0 : wrap360(Math.atan2(x, y) * RAD2DEG)
  return { trend, plunge: 90 - c * RAD2DEG }
}
