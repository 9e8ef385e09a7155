import { DEG2RAD, EPSILON, RAD2DEG, wrap360 } from './math'
import type { Line, Plane, Vec3 } from './types'

// World frame: x = east, y = north, z = up; lines plunge positive downward.

/** Scalar product a·b. */
export function dot(a: Vec3, b: Vec3): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2]
}

/** Vector product a × b (right-handed). */
export function cross(a: Vec3, b: Vec3): Vec3 {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]]
}

/** a·k. */
export function scale(a: Vec3, k: number): Vec3 {
  return [a[0] * k, a[1] * k, a[2] * k]
}

/** a·ka + b·kb */
export function combine(a: Vec3, ka: number, b: Vec3, kb: number): Vec3 {
  return [a[0] * ka + b[0] * kb, a[1] * ka + b[1] * kb, a[2] * ka + b[2] * kb]
}

/** Euclidean length |a|. */
export function norm(a: Vec3): number {
  return Math.sqrt(dot(a, a))
}

/** Unit vector along a, or undefined for a (near-)zero vector. */
export function normalise(a: Vec3): Vec3 | undefined {
  const n = norm(a)
  return n < EPSILON ? undefined : scale(a, 1 / n)
}

/** The same axis pointing into the lower hemisphere (z ≤ 0). */
export function lower(a: Vec3): Vec3 {
  return a[2] > 0 ? scale(a, -1) : a
}

/** Unit vector of a line: (sin t cos p, cos t cos p, −sin p). */
export function lineToVec(line: Line): Vec3 {
  const t = line.trend * DEG2RAD
  const p = line.plunge * DEG2RAD
  const cp = Math.cos(p)
  return [Math.sin(t) * cp, Math.cos(t) * cp, -Math.sin(p)]
}

/**
 * Line of a vector, flipped into the lower hemisphere. A vertical line gets trend 0; the vector
 * need not be unit length but must not be zero.
 */
export function vecToLine(v: Vec3): Line {
  const u = lower(v)
  const h = Math.sqrt(u[0] * u[0] + u[1] * u[1])
  const n = Math.sqrt(h * h + u[2] * u[2])
  // atan2 for the plunge keeps full precision near vertical and horizontal, unlike asin alone.
  const plunge = Math.atan2(-u[2], h) * RAD2DEG
  const trend = h < EPSILON * n ? 0 : wrap360(Math.atan2(u[0], u[1]) * RAD2DEG)
  return { trend, plunge }
}

/** Line of a vector without flipping: negative plunge for upward vectors (up-holes). */
export function vecToDirection(v: Vec3): Line {
  const h = Math.sqrt(v[0] * v[0] + v[1] * v[1])
  const trend = h < EPSILON * norm(v) ? 0 : wrap360(Math.atan2(v[0], v[1]) * RAD2DEG)
  return { trend, plunge: Math.atan2(-v[2], h) * RAD2DEG }
}

/** Lower-hemisphere unit pole of a plane: line(dd + 180, 90 − dip). */
export function planeToPoleVec(plane: Plane): Vec3 {
  const dd = plane.dipDirection * DEG2RAD
  const d = plane.dip * DEG2RAD
  const sd = Math.sin(d)
  return [-Math.sin(dd) * sd, -Math.cos(dd) * sd, -Math.cos(d)]
}

/** Plane whose pole is the vector (either sense). A horizontal plane gets dip direction 0. */
export function poleVecToPlane(v: Vec3): Plane {
  const up = v[2] < 0 ? scale(v, -1) : v
  const h = Math.sqrt(up[0] * up[0] + up[1] * up[1])
  // The upward pole leans toward the dip direction; its angle from vertical is the dip.
  const dip = Math.atan2(h, up[2]) * RAD2DEG
  const dipDirection = h < EPSILON * norm(up) ? 0 : wrap360(Math.atan2(up[0], up[1]) * RAD2DEG)
  return { dipDirection, dip }
}
