import { azimuthDifference } from './math'
import { apparentDip, planeIntersection } from './planes'
import type { Line, Plane } from './types'

/** Slope face, friction angle and lateral limits (degrees). */
export interface KinematicSettings {
  readonly face: Plane
  readonly friction: number
  /** Planar sliding: largest angle between plane and face dip directions (default 20). */
  readonly lateralLimit?: number
  /** Flexural toppling: largest angle between the plane's dip direction and the direction
   * opposite the face (default 30, common practice; Goodman & Bray 1976 used 10). */
  readonly topplingLimit?: number
}

export interface Verdict {
  readonly possible: boolean
  readonly reason: string
}

const f1 = (x: number) => x.toFixed(1)
const name = (p: Plane) => `${f1(p.dip)}/${f1(p.dipDirection)}`

/**
 * Planar sliding (Markland 1972; Hoek & Bray 1981): dip direction within the lateral limit of the
 * face's, dip below the face dip (daylights), dip above the friction angle.
 */
export function planarVerdict(p: Plane, s: KinematicSettings): Verdict {
  const limit = s.lateralLimit ?? 20
  const off = azimuthDifference(p.dipDirection, s.face.dipDirection)
  if (off > limit)
    return {
      possible: false,
      reason: `dip direction ${f1(off)}° from the face's (limit ${limit}°)`,
    }
  if (p.dip >= s.face.dip)
    return {
      possible: false,
      reason: `dip ${f1(p.dip)}° not below the face dip: does not daylight`,
    }
  if (p.dip <= s.friction)
    return { possible: false, reason: `dip ${f1(p.dip)}° not above friction ${s.friction}°` }
  return {
    possible: true,
    reason: `daylights within ${limit}° of the face and dips above friction`,
  }
}

/**
 * Flexural toppling (Goodman & Bray 1976): the plane dips into the face within the toppling limit
 * and (90 − dip) + friction < face dip.
 */
export function topplingVerdict(p: Plane, s: KinematicSettings): Verdict {
  const limit = s.topplingLimit ?? 30
  const off = azimuthDifference(p.dipDirection, s.face.dipDirection + 180)
  if (off > limit)
    return {
      possible: false,
      reason: `not dipping into the face: ${f1(off)}° off (limit ${limit}°)`,
    }
  const normal = 90 - p.dip
  if (normal + s.friction >= s.face.dip)
    return {
      possible: false,
      reason: `(90 − dip) + friction = ${f1(normal + s.friction)}° not below the face dip`,
    }
  return { possible: true, reason: `dips into the face and (90 − dip) + friction < face dip` }
}

export interface WedgeVerdict extends Verdict {
  readonly line: Line | undefined
  /** Sliding along the line of intersection or on one plane alone; undefined when not possible. */
  readonly slidesOn: 'intersection' | 'a' | 'b' | undefined
}

/** True when azimuth x lies on the shorter arc from a to b. */
function between(x: number, a: number, b: number): boolean {
  return azimuthDifference(a, x) + azimuthDifference(x, b) <= azimuthDifference(a, b) + 1e-9
}

/**
 * Wedge sliding (Hoek & Bray 1981; Wyllie & Mah 2004, §2.6): the line of intersection trends within
 * 90° of the face dip direction, plunges less than the face's apparent dip along its trend, and
 * more than friction. When one plane's dip direction lies between the intersection trend and the
 * face dip direction the block slides on that plane alone (the steeper one if both do); it then
 * also has to daylight along its own dip direction.
 */
export function wedgeVerdict(a: Plane, b: Plane, s: KinematicSettings): WedgeVerdict {
  const no = (reason: string, line?: Line): WedgeVerdict => ({
    possible: false,
    reason,
    line,
    slidesOn: undefined,
  })
  const line = planeIntersection(a, b)
  if (!line) return no('parallel planes: no line of intersection')
  const fdd = s.face.dipDirection
  const off = azimuthDifference(line.trend, fdd)
  if (off > 90) return no(`intersection trends ${f1(off)}° from the face dip direction`, line)
  const apparent = apparentDip(s.face, line.trend) ?? 0
  if (line.plunge >= apparent)
    return no(`plunge ${f1(line.plunge)}° not below the apparent face dip ${f1(apparent)}°`, line)
  if (line.plunge <= s.friction)
    return no(`plunge ${f1(line.plunge)}° not above friction ${s.friction}°`, line)
  const onA = between(a.dipDirection, line.trend, fdd)
  const onB = between(b.dipDirection, line.trend, fdd)
  if (!onA && !onB)
    return {
      possible: true,
      reason: 'wedge daylights and plunges above friction',
      line,
      slidesOn: 'intersection',
    }
  const which = onA && (!onB || a.dip >= b.dip) ? 'a' : 'b'
  const p = which === 'a' ? a : b
  const faceAlong = apparentDip(s.face, p.dipDirection) ?? 0
  if (p.dip >= faceAlong)
    return no(`would slide on the ${name(p)} plane alone, which does not daylight`, line)
  return {
    possible: true,
    reason: `slides on the ${name(p)} plane alone: its dip direction lies between the intersection and the face's`,
    line,
    slidesOn: which,
  }
}
