import { RAD2DEG, finite } from './math'
import { cross, dot, lineToVec, norm } from './vector'
import type { Offset, Vec3 } from './types'

/** A survey station: depth along hole (m), azimuth and plunge (degrees, plunge positive down). */
export interface SurveyStation {
  readonly depth: number
  readonly azimuth: number
  readonly plunge: number
}

/** A desurveyed point: offsets from the collar in metres, down positive. */
export interface SurveyPoint extends Offset {
  readonly depth: number
}

/** A station ready for computation: its unit down-hole vector (east, north, up). */
export interface CleanStation {
  readonly depth: number
  readonly t: Vec3
}

/** Depths beyond ±10,000 km are not survey data: rejected, which also keeps sums from overflow. */
export const MAX_DEPTH = 1e7

/** True for a finite depth within ±MAX_DEPTH metres. */
export function validDepth(depth: number): boolean {
  return Number.isFinite(depth) && Math.abs(depth) <= MAX_DEPTH
}

/**
 * Stations with finite values and a valid depth, sorted by depth; of several stations at one depth
 * the first listed is kept, so every segment has positive length.
 */
export function cleanStations(stations: readonly SurveyStation[]): CleanStation[] {
  const valid = stations.filter((s) => validDepth(s.depth) && finite(s.azimuth, s.plunge))
  const sorted = valid
    .map((s, i) => ({ s, i }))
    .sort((a, b) => a.s.depth - b.s.depth || a.i - b.i)
    .map(({ s }) => s)
  const out: CleanStation[] = []
  for (const s of sorted) {
    if (out.length > 0 && out[out.length - 1].depth === s.depth) continue
    out.push({ depth: s.depth, t: lineToVec({ trend: s.azimuth, plunge: s.plunge }) })
  }
  return out
}

/** Dogleg angle between two unit tangents, radians; atan2 keeps small angles precise. */
export function doglegAngle(t1: Vec3, t2: Vec3): number {
  return Math.atan2(norm(cross(t1, t2)), dot(t1, t2))
}

/**
 * Minimum-curvature displacement over a course length L between unit tangents t1 and t2:
 * (L/2)(t1 + t2)·RF with RF = (2/b) tan(b/2), b the dogleg (RF → 1 + b²/12 as b → 0). A reversal
 * (b = 180°) has no unique arc: RF is taken as 1 there (balanced tangential).
 */
export function minimumCurvatureStep(t1: Vec3, t2: Vec3, length: number): Vec3 {
  const b = doglegAngle(t1, t2)
  const rf = b < 1e-4 ? 1 + (b * b) / 12 : b > Math.PI - 1e-9 ? 1 : (2 / b) * Math.tan(b / 2)
  const k = (length / 2) * rf
  return [(t1[0] + t2[0]) * k, (t1[1] + t2[1]) * k, (t1[2] + t2[2]) * k]
}

/** Positions (east, north, up) of the clean stations; straight from the collar to the first. */
export function stationPositions(clean: readonly CleanStation[]): Vec3[] {
  const out: Vec3[] = []
  for (let i = 0; i < clean.length; i++) {
    const s = clean[i]
    if (i === 0) {
      out.push([s.t[0] * s.depth, s.t[1] * s.depth, s.t[2] * s.depth])
      continue
    }
    const p = out[i - 1]
    const step = minimumCurvatureStep(clean[i - 1].t, s.t, s.depth - clean[i - 1].depth)
    out.push([p[0] + step[0], p[1] + step[1], p[2] + step[2]])
  }
  return out
}

/**
 * Desurvey by minimum curvature: one point per valid station (sorted by depth, duplicates of a
 * depth dropped), as offsets from the collar (depth 0) with down positive. Above the first station
 * the hole is taken straight along the first station's direction. Empty input gives [].
 */
export function desurvey(stations: readonly SurveyStation[]): SurveyPoint[] {
  const clean = cleanStations(stations)
  const positions = stationPositions(clean)
  return clean.map((s, i) => {
    const p = positions[i]
    return { depth: s.depth, east: p[0], north: p[1], down: -p[2] }
  })
}

/** One survey segment's dogleg. */
export interface Dogleg {
  readonly fromDepth: number
  readonly toDepth: number
  /** Dogleg angle, degrees. */
  readonly dogleg: number
  /** Dogleg severity, degrees per 30 m. */
  readonly severity: number
}

/** Dogleg angle and severity (degrees per 30 m) of each segment between valid stations. */
export function doglegs(stations: readonly SurveyStation[]): Dogleg[] {
  const clean = cleanStations(stations)
  const out: Dogleg[] = []
  for (let i = 1; i < clean.length; i++) {
    const a = clean[i - 1]
    const b = clean[i]
    const dogleg = doglegAngle(a.t, b.t) * RAD2DEG
    out.push({
      fromDepth: a.depth,
      toDepth: b.depth,
      dogleg,
      severity: (dogleg * 30) / (b.depth - a.depth),
    })
  }
  return out
}
