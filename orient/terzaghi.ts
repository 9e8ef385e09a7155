import { finite } from './math'
import { dot, lineToVec, planeToPoleVec } from './vector'
import type { Line, Plane } from './types'

/** The cap on Terzaghi weights (|cos delta| ≥ 0.1), after Priest (1993). */
export const TERZAGHI_CAP = 10

/**
 * Terzaghi (1965) weight of a plane sampled by a hole (or scanline): w = 1/|cos(delta)|, delta the
 * angle between the hole axis and the plane's pole (on core: w = 1/sin(alpha)). Capped at `cap`
 * (default 10, i.e. |cos(delta)| ≥ 0.1) after Priest (1993, Discontinuity Analysis for Rock
 * Engineering): planes sub-parallel to the hole lie in its blind zone, are under-sampled, and an
 * uncapped weight would let a few of them dominate. Undefined for non-finite input or cap < 1.
 */
export function terzaghiWeight(plane: Plane, hole: Line, cap = TERZAGHI_CAP): number | undefined {
  if (!finite(plane.dipDirection, plane.dip, hole.trend, hole.plunge, cap) || cap < 1)
    return undefined
  const cosDelta = Math.abs(dot(planeToPoleVec(plane), lineToVec(hole)))
  return cosDelta * cap <= 1 ? cap : 1 / cosDelta
}

/**
 * The same weight from a core angle alone: alpha is the angle between the plane and the core
 * axis, so delta = 90° − alpha and w = 1/sin(alpha), capped alike. Needs no beta, so unoriented
 * core is weighted too. Undefined for non-finite input or cap < 1.
 */
export function terzaghiWeightOfAlpha(alpha: number, cap = TERZAGHI_CAP): number | undefined {
  if (!finite(alpha, cap) || cap < 1) return undefined
  const sin = Math.abs(Math.sin((alpha * Math.PI) / 180))
  return sin * cap <= 1 ? cap : 1 / sin
}

/** True when a plane lies in the hole's blind zone: its Terzaghi weight reaches the cap. */
export function inBlindZone(plane: Plane, hole: Line, cap = TERZAGHI_CAP): boolean {
  const w = terzaghiWeight(plane, hole, cap)
  return w !== undefined && w >= cap
}
