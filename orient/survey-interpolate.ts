import {
  cleanStations,
  doglegAngle,
  minimumCurvatureStep,
  stationPositions,
  validDepth,
} from './survey'
import { vecToDirection } from './vector'
import type { CleanStation, SurveyStation } from './survey'
import type { Line, Offset, Vec3 } from './types'

/** Index of the last station at or above depth (−1 when depth is above the first). */
function segmentIndex(clean: readonly CleanStation[], depth: number): number {
  let lo = 0
  let hi = clean.length - 1
  if (depth < clean[0].depth) return -1
  while (lo < hi) {
    const mid = (lo + hi + 1) >> 1
    if (clean[mid].depth <= depth) lo = mid
    else hi = mid - 1
  }
  return lo
}

/**
 * Spherical interpolation of the tangent: [sin((1−f)b) t1 + sin(f b) t2] / sin b, the direction of
 * the minimum-curvature arc at fraction f. A reversal (b = 180°) has no arc: the nearer end's
 * direction is used.
 */
export function slerp(t1: Vec3, t2: Vec3, f: number): Vec3 {
  const b = doglegAngle(t1, t2)
  let k1: number
  let k2: number
  if (b < 1e-6) {
    k1 = 1 - f
    k2 = f
  } else if (b > Math.PI - 1e-9) {
    return f < 0.5 ? t1 : t2
  } else {
    const s = Math.sin(b)
    k1 = Math.sin((1 - f) * b) / s
    k2 = Math.sin(f * b) / s
  }
  const v: Vec3 = [t1[0] * k1 + t2[0] * k2, t1[1] * k1 + t2[1] * k2, t1[2] * k1 + t2[2] * k2]
  const n = Math.hypot(v[0], v[1], v[2])
  return [v[0] / n, v[1] / n, v[2] / n]
}

function tangentAt(clean: readonly CleanStation[], depth: number): Vec3 {
  const i = segmentIndex(clean, depth)
  if (i < 0) return clean[0].t
  if (i === clean.length - 1) return clean[i].t
  const a = clean[i]
  const b = clean[i + 1]
  return slerp(a.t, b.t, (depth - a.depth) / (b.depth - a.depth))
}

/**
 * Hole direction at a depth: slerp between the stations either side; the first station's direction
 * above it and the last station's beyond it. Up-holes come back with negative plunge. Undefined
 * without a valid station or for a non-finite depth (or beyond ±1e7 m).
 */
export function holeAt(stations: readonly SurveyStation[], depth: number): Line | undefined {
  return prepareSurvey(stations).holeAt(depth)
}

/**
 * holeAt over a column of depths, into trend and plunge columns (allocated once when not given):
 * the survey is prepared once and nothing is allocated per depth. Without a valid station every
 * output is NaN; a non-finite depth gives NaN at its index.
 */
export function holeAtBatch(
  stations: readonly SurveyStation[],
  depths: Float64Array,
  output?: { trend: Float64Array; plunge: Float64Array },
): { trend: Float64Array; plunge: Float64Array } {
  const out = output ?? {
    trend: new Float64Array(depths.length),
    plunge: new Float64Array(depths.length),
  }
  const clean = cleanStations(stations)
  for (let i = 0; i < depths.length; i++) {
    const line =
      clean.length > 0 && validDepth(depths[i])
        ? vecToDirection(tangentAt(clean, depths[i]))
        : undefined
    out.trend[i] = line ? line.trend : NaN
    out.plunge[i] = line ? line.plunge : NaN
  }
  return out
}

/**
 * Position at a depth (offsets from the collar, down positive): the station above plus the
 * minimum-curvature step to the interpolated tangent; straight along the first direction from the
 * collar above the first station; straight along the last direction beyond the last.
 */
export function positionAt(stations: readonly SurveyStation[], depth: number): Offset | undefined {
  return prepareSurvey(stations).positionAt(depth)
}

/** A survey cleaned and desurveyed once, for many look-ups (imports, recomputes). */
export interface PreparedSurvey {
  /** Same as holeAt(stations, depth). */
  holeAt(depth: number): Line | undefined
  /** Same as positionAt(stations, depth). */
  positionAt(depth: number): Offset | undefined
}

/**
 * holeAt and positionAt for one survey with the stations cleaned and their minimum-curvature
 * positions computed once: O(log n) per look-up instead of O(n).
 */
export function prepareSurvey(stations: readonly SurveyStation[]): PreparedSurvey {
  const clean = cleanStations(stations)
  const positions = clean.length ? stationPositions(clean) : []
  return {
    holeAt(depth) {
      if (clean.length === 0 || !validDepth(depth)) return undefined
      return vecToDirection(tangentAt(clean, depth))
    },
    positionAt(depth) {
      if (clean.length === 0 || !validDepth(depth)) return undefined
      const i = segmentIndex(clean, depth)
      if (i < 0) {
        const t = clean[0].t
        return { east: t[0] * depth, north: t[1] * depth, down: -t[2] * depth }
      }
      const p = positions[i]
      const a = clean[i]
      const length = depth - a.depth
      const step: Vec3 =
        i === clean.length - 1
          ? [a.t[0] * length, a.t[1] * length, a.t[2] * length]
          : minimumCurvatureStep(a.t, tangentAt(clean, depth), length)
      return { east: p[0] + step[0], north: p[1] + step[1], down: -(p[2] + step[2]) }
    },
  }
}
