import { DEG2RAD, RAD2DEG, finite, wrap360 } from './math'
import { holeFrame } from './hole-frame'
import type { HoleFrame } from './hole-frame'
import { combine, dot, planeToPoleVec, poleVecToPlane } from './vector'
import type { CoreAngles, CoreOptions, Line, Plane, Vec3 } from './types'

/** beta from the bottom-of-hole line, whichever reference the logger used. */
export function betaFromBottom(beta: number, options: CoreOptions): number {
  return options.reference === 'top' ? wrap360(beta) + 180 : beta
}

/** True for alpha in [0, 90] and finite beta and hole angles: the API-edge check. */
export function validCoreInput(core: CoreAngles, hole: Line): boolean {
  return (
    finite(core.alpha, core.beta, hole.trend, hole.plunge) && core.alpha >= 0 && core.alpha <= 90
  )
}

/**
 * Down-hole pole n = sin(alpha) z' − cos(alpha) d with d = cos(beta) x' + sin(beta) y', the
 * direction of the down-hole apex of the ellipse (beta from bottom of hole, radians in).
 */
export function corePole(
  alpha: number,
  betaBottom: number,
  frame: HoleFrame,
): { n: Vec3; d: Vec3 } {
  const d = combine(frame.x, Math.cos(betaBottom), frame.y, Math.sin(betaBottom))
  return { n: combine(frame.z, Math.sin(alpha), d, -Math.cos(alpha)), d }
}

/**
 * Plane of a structure measured on oriented core (vector method; agrees with the stereonet
 * construction of Marjoribanks 2010, Geological Methods in Mineral Exploration and Mining, App. D).
 *
 * alpha: 0–90 between core axis and ellipse long axis; beta: clockwise looking down-hole from the
 * reference line (bottom of hole by default; top of hole = bottom + 180) to the down-hole apex.
 * Up-holes (negative plunge) work unchanged. In a vertical hole the stated hole trend is taken as
 * the high side (see holeFrame). Returns undefined for non-finite input or alpha outside 0–90.
 */
export function coreToPlane(
  core: CoreAngles,
  hole: Line,
  options: CoreOptions = {},
): Plane | undefined {
  if (!validCoreInput(core, hole)) return undefined
  const beta = betaFromBottom(core.beta, options) * DEG2RAD
  const { n } = corePole(core.alpha * DEG2RAD, beta, holeFrame(hole))
  return poleVecToPlane(n)
}

/**
 * Inverse of coreToPlane: the core angles a plane would show in this hole. alpha = asin(n·z') with
 * the pole taken down-hole; beta from the direction d = −(n − (n·z')z'). A plane perpendicular to
 * the core (alpha 90) has no apex: beta is then 0 (reference line). Undefined for non-finite input.
 */
export function planeToCore(
  plane: Plane,
  hole: Line,
  options: CoreOptions = {},
): CoreAngles | undefined {
  if (!finite(plane.dipDirection, plane.dip, hole.trend, hole.plunge)) return undefined
  const frame = holeFrame(hole)
  let n = planeToPoleVec(plane)
  if (dot(n, frame.z) < 0) n = [-n[0], -n[1], -n[2]]
  const c = dot(n, frame.z)
  // Apex direction d ∝ (n·z')z' − n, of length cos(alpha).
  const d = combine(frame.z, c, n, -1)
  const r = Math.sqrt(dot(d, d))
  // atan2 keeps alpha precise near 90, where asin(n·z') flattens.
  const alpha = Math.atan2(c, r) * RAD2DEG
  const beta = r < 1e-14 ? 0 : Math.atan2(dot(d, frame.y), dot(d, frame.x)) * RAD2DEG
  return { alpha, beta: wrap360(options.reference === 'top' ? beta - 180 : beta) }
}
