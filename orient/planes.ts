import { DEG2RAD, EPSILON, RAD2DEG, acos, finite, wrap360 } from './math'
import {
  cross,
  dot,
  lineToVec,
  norm,
  planeToPoleVec,
  poleVecToPlane,
  scale,
  vecToLine,
} from './vector'
import type { Line, Plane } from './types'

/** Lower-hemisphere pole of a plane: trend dd + 180, plunge 90 − dip. */
export function poleOf(plane: Plane): Line | undefined {
  if (!finite(plane.dipDirection, plane.dip)) return undefined
  return vecToLine(planeToPoleVec(plane))
}

/** Plane normal to a line (either sense): dip direction = trend + 180 of the lower pole. */
export function planeOfPole(line: Line): Plane | undefined {
  if (!finite(line.trend, line.plunge)) return undefined
  return poleVecToPlane(lineToVec(line))
}

/**
 * Line of intersection of two planes, n1 × n2 taken into the lower hemisphere. Undefined for
 * parallel planes (|n1 × n2| below 1e-9, about 2e-7 degrees apart) or non-finite input.
 */
export function planeIntersection(a: Plane, b: Plane): Line | undefined {
  if (!finite(a.dipDirection, a.dip, b.dipDirection, b.dip)) return undefined
  const v = cross(planeToPoleVec(a), planeToPoleVec(b))
  const n = norm(v)
  return n < 1e-9 ? undefined : vecToLine(scale(v, 1 / n))
}

/** Acute angle between two planes (0–90 degrees): acos|n1·n2|. Undefined for non-finite input. */
export function angleBetweenPlanes(a: Plane, b: Plane): number | undefined {
  if (!finite(a.dipDirection, a.dip, b.dipDirection, b.dip)) return undefined
  return acos(Math.abs(dot(planeToPoleVec(a), planeToPoleVec(b)))) * RAD2DEG
}

/** Acute angle between two lines taken as axes (0–90 degrees). */
export function angleBetweenLines(a: Line, b: Line): number | undefined {
  if (!finite(a.trend, a.plunge, b.trend, b.plunge)) return undefined
  return acos(Math.abs(dot(lineToVec(a), lineToVec(b)))) * RAD2DEG
}

/**
 * Apparent dip of a plane in a vertical section of the given azimuth: tan(da) = tan(dip) cos(beta),
 * beta = section azimuth − dip direction. Signed: negative when the plane rises toward the section
 * azimuth. A vertical plane seen along its strike gives 0 (the section contains the plane).
 */
export function apparentDip(plane: Plane, sectionAzimuth: number): number | undefined {
  if (!finite(plane.dipDirection, plane.dip, sectionAzimuth)) return undefined
  const beta = wrap360(wrap360(sectionAzimuth) - wrap360(plane.dipDirection)) * DEG2RAD
  const d = plane.dip * DEG2RAD
  // atan2(sin d cos beta, cos d) avoids tan(90°); cos of exact right angles is snapped to zero.
  const cb = Math.abs(Math.cos(beta)) < EPSILON ? 0 : Math.cos(beta)
  const cd = Math.abs(Math.cos(d)) < EPSILON ? 0 : Math.cos(d)
  return Math.atan2(Math.sin(d) * cb, cd) * RAD2DEG
}
