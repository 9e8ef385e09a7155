import { DEG2RAD, RAD2DEG, finite, wrap360 } from './math'
import { corePole } from './core'
import { holeFrame } from './hole-frame'
import { cross, dot, normalise, poleVecToPlane, scale } from './vector'
import type { Line, Plane, Vec3 } from './types'

/** A sinusoid picked on an oriented borehole image. */
export interface ImagePick {
  /** Peak-to-trough height of the sinusoid along the hole (same unit as diameter). */
  readonly amplitude: number
  /** Borehole diameter. */
  readonly diameter: number
  /** Image azimuth of the trough (deepest point), degrees clockwise looking down-hole. */
  readonly troughAzimuth: number
  /** What image azimuth 0 is: the high side (top of hole) or north (true north: correct first). */
  readonly reference: 'highside' | 'north'
}

/**
 * Plane of a sinusoid picked on a borehole image. Dip relative to the hole = atan(H/D), toward the
 * trough (Crain's Petrophysical Handbook, image-log dip), so alpha = 90 − atan(H/D) and the trough
 * direction plays the part of the core's apex direction.
 *
 * High-side images: beta (bottom of hole) = trough − 180. North-referenced images: azimuth 0 is
 * north projected onto the plane normal to the hole, normalise(N − (N·t)t) — in a deviated hole
 * that differs from the high side by more than the hole azimuth, so no azimuth offset is used.
 * Undefined for non-finite input, diameter ≤ 0, negative amplitude, or a north-referenced image in
 * a horizontal north–south hole (where projected north vanishes). Vertical holes with a high-side
 * image follow holeFrame's convention (stated trend = high side).
 */
export function imagePickToPlane(pick: ImagePick, hole: Line): Plane | undefined {
  const { amplitude, diameter, troughAzimuth } = pick
  if (!finite(amplitude, diameter, troughAzimuth, hole.trend, hole.plunge)) return undefined
  if (!(diameter > 0) || amplitude < 0) return undefined
  const alpha = Math.PI / 2 - Math.atan2(amplitude, diameter)
  const frame = holeFrame(hole)
  let x = scale(frame.x, -1)
  if (pick.reference === 'north') {
    const r = projectedNorth(frame.z)
    if (!r) return undefined
    x = r
  }
  // y = t × x keeps image azimuth clockwise looking down-hole, as for beta on core.
  const { n } = corePole(alpha, troughAzimuth * DEG2RAD, { z: frame.z, x, y: cross(frame.z, x) })
  return poleVecToPlane(n)
}

/** Angle (degrees, clockwise looking down-hole) from projected north to the high side. */
export function highSideFromNorth(hole: Line): number | undefined {
  if (!finite(hole.trend, hole.plunge)) return undefined
  const { z: t, x } = holeFrame(hole)
  const r = projectedNorth(t)
  if (!r) return undefined
  const high = scale(x, -1)
  return wrap360(Math.atan2(dot(high, cross(t, r)), dot(high, r)) * RAD2DEG)
}

/** normalise(N − (N·t)t): north in the plane normal to the hole; undefined when t is along N. */
function projectedNorth(t: Vec3): Vec3 | undefined {
  return normalise([-t[1] * t[0], 1 - t[1] * t[1], -t[1] * t[2]])
}
