import { betaFromBottom, corePole, validCoreInput } from './core'
import { holeFrame } from './hole-frame'
import type { HoleFrame } from './hole-frame'
import { DEG2RAD, acos, asin, finite, wrap360 } from './math'
import type { ReconcileCoreItem, ReconcileImageItem, ReconcileRunItem } from './reconcile-types'
import { dot, planeToPoleVec } from './vector'
import type { Vec3 } from './types'

/** A core structure ready for the hot loops: radians, its hole frame, its run's index. */
export interface PreparedCore {
  readonly item: ReconcileCoreItem
  readonly depth: number
  /** alpha (rad). */
  readonly alpha: number
  /** Logged beta from the bottom-of-hole line (rad). */
  readonly betaBottom: number
  readonly frame: HoleFrame
  /** Index into Prepared.runs, −1 outside every run passed in. */
  readonly run: number
}

export interface PreparedImage {
  readonly item: ReconcileImageItem
  readonly depth: number
  /** Lower-hemisphere unit pole. */
  readonly pole: Vec3
}

export interface Prepared {
  /** Valid core structures in depth order. */
  readonly cores: PreparedCore[]
  /** Valid image structures in depth order, their depths alongside for binary search. */
  readonly images: PreparedImage[]
  readonly imageDepths: Float64Array
  /** Runs in depth order. */
  readonly runs: ReconcileRunItem[]
  /** Ids that cannot take part (non-finite values, alpha outside 0–90): always unmatched. */
  readonly invalidCore: number[]
  readonly invalidImage: number[]
}

const byDepth = <T extends { depth: number }>(a: T, b: T) => a.depth - b.depth

/** Validates, converts once to radians and unit vectors, and sorts both sides by depth. */
export function prepare(
  core: readonly ReconcileCoreItem[],
  image: readonly ReconcileImageItem[],
  runs: readonly ReconcileRunItem[],
): Prepared {
  const sortedRuns = [...runs].sort((a, b) => a.fromDepth - b.fromDepth)
  const runIndex = new Map(sortedRuns.map((r, i) => [r.id, i]))
  const cores: PreparedCore[] = []
  const invalidCore: number[] = []
  // Invalid items leave before sorting: a NaN depth would break the sort's ordering.
  const goodCore = core.filter((item) => {
    const ok = finite(item.depth) && validCoreInput(item, item.hole)
    if (!ok) invalidCore.push(item.id)
    return ok
  })
  for (const item of goodCore.sort(byDepth)) {
    const beta = betaFromBottom(item.beta, { reference: item.reference })
    cores.push({
      item,
      depth: item.depth,
      alpha: item.alpha * DEG2RAD,
      betaBottom: wrap360(beta) * DEG2RAD,
      frame: holeFrame(item.hole),
      run: item.runId === null ? -1 : (runIndex.get(item.runId) ?? -1),
    })
  }
  const images: PreparedImage[] = []
  const invalidImage: number[] = []
  const goodImage = image.filter((item) => {
    const ok = finite(item.depth, item.plane.dip, item.plane.dipDirection)
    if (!ok) invalidImage.push(item.id)
    return ok
  })
  for (const item of goodImage.sort(byDepth))
    images.push({ item, depth: item.depth, pole: planeToPoleVec(item.plane) })
  const imageDepths = Float64Array.from(images, (m) => m.depth)
  return { cores, images, imageDepths, runs: sortedRuns, invalidCore, invalidImage }
}

/** Index of the first depth ≥ value in an ascending array (its length when none). */
export function lowerBound(depths: Float64Array, value: number): number {
  let lo = 0
  let hi = depths.length
  while (lo < hi) {
    const mid = (lo + hi) >>> 1
    if (depths[mid] < value) lo = mid + 1
    else hi = mid
  }
  return lo
}

/** An angle in degrees wrapped into (−180, 180]. */
export function wrap180(deg: number): number {
  const w = wrap360(deg)
  return w > 180 ? w - 360 : w
}

/** Down-hole pole of the core plane with its logged beta turned by `rotation` (rad). */
export function corePoleTurned(core: PreparedCore, rotation: number): Vec3 {
  return corePole(core.alpha, core.betaBottom + rotation, core.frame).n
}

/**
 * alpha of the image plane in the core's hole (rad): the plane's angle to the local hole axis,
 * asin|m·z'| as in planeToCore. A rotation of the orientation line cannot change it.
 */
export function imageAlphaIn(core: PreparedCore, image: PreparedImage): number {
  return asin(Math.abs(dot(image.pole, core.frame.z)))
}

/**
 * beta of the image plane in the core's hole, from the bottom-of-hole line (rad): the down-hole
 * apex direction d = (m·z')z' − m with the pole m taken down-hole, atan2(d·y', d·x'), exactly as
 * planeToCore does it (0 for a plane perpendicular to the core).
 */
export function imageBetaIn(core: PreparedCore, image: PreparedImage): number {
  const { x, y, z } = core.frame
  const p = image.pole
  const sense = dot(p, z) < 0 ? -1 : 1
  const c = sense * dot(p, z)
  const d: Vec3 = [c * z[0] - sense * p[0], c * z[1] - sense * p[1], c * z[2] - sense * p[2]]
  return Math.atan2(dot(d, y), dot(d, x))
}

/** Angle between two axes (rad), either sense. */
export function axisAngle(a: Vec3, b: Vec3): number {
  return acos(Math.abs(dot(a, b)))
}
