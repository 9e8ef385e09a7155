import { DEG2RAD } from './math'
import type { Line, Vec3 } from './types'

/** Orthonormal frame of a hole: z down-hole, x bottom of hole, y = z × x. */
export interface HoleFrame {
  readonly z: Vec3
  readonly x: Vec3
  readonly y: Vec3
}

/**
 * Frame of a hole (trend = azimuth, plunge positive down, negative for up-holes):
 * z' = (sinA cosP, cosA cosP, −sinP) points down-hole; x' = (−sinA sinP, −cosA sinP, −cosP) is the
 * bottom of hole (the low side of the hole wall); y' = z' × x' = (−cosA, sinA, 0) lies 90°
 * clockwise from x' looking down-hole, so beta turns from x' toward y'.
 *
 * In a vertical hole (plunge ±90) the bottom of hole is undefined. The formula then takes the
 * stated hole trend as the high side: the bottom-of-hole line points to trend + 180, the limit of
 * an inclined hole of that trend steepening to vertical. Give a vertical hole trend 0 to measure
 * from north (top reference) or south (bottom reference).
 */
export function holeFrame(hole: Line): HoleFrame {
  const a = hole.trend * DEG2RAD
  const p = hole.plunge * DEG2RAD
  const sA = Math.sin(a)
  const cA = Math.cos(a)
  const sP = Math.sin(p)
  const cP = Math.cos(p)
  return {
    z: [sA * cP, cA * cP, -sP],
    x: [-sA * sP, -cA * sP, -cP],
    y: [-cA, sA, 0],
  }
}

/**
 * True when the hole is within (90 − thresholdDeg) of vertical. Gravity-based orientation marks are
 * unreliable there (common practice): warn, and require an explicit reference azimuth.
 */
export function isSteepHole(hole: Line, thresholdDeg = 85): boolean {
  return Math.abs(hole.plunge) >= thresholdDeg
}
