import { DEG2RAD, RAD2DEG } from './math'
import type { CoreOptions } from './types'

/** Column arrays of oriented-core measurements, one item per index, degrees. */
export interface CoreBatchInput {
  readonly alpha: Float64Array
  readonly beta: Float64Array
  /** Hole trend (azimuth) at each measurement's depth. */
  readonly holeTrend: Float64Array
  /** Hole plunge at each measurement's depth, positive down. */
  readonly holePlunge: Float64Array
}

/** Column arrays of planes, degrees. */
export interface PlaneBatch {
  readonly dipDirection: Float64Array
  readonly dip: Float64Array
}

export interface CoreBatchResult extends PlaneBatch {
  /** Items whose input was invalid (non-finite, or alpha outside 0–90): both outputs are NaN. */
  readonly invalid: number
}

/**
 * coreToPlane over columns: item i of the input gives item i of the output. The count is
 * input.alpha.length; every other array must be at least that long (RangeError otherwise — a
 * programming error, not a data error). Output arrays are allocated once when not supplied and may
 * alias nothing in the input. Nothing is allocated per item. Invalid items come out as NaN in both
 * outputs and are counted in `invalid`; the same vector method and vertical-hole convention as
 * coreToPlane apply (results agree to rounding).
 */
export function coreToPlaneBatch(
  input: CoreBatchInput,
  output?: PlaneBatch,
  options: CoreOptions = {},
): CoreBatchResult {
  const count = input.alpha.length
  const { beta, holeTrend, holePlunge } = input
  const alphaIn = input.alpha
  const out = output ?? { dipDirection: new Float64Array(count), dip: new Float64Array(count) }
  const lengths = [beta.length, holeTrend.length, holePlunge.length]
  if (lengths.some((l) => l < count) || out.dip.length < count || out.dipDirection.length < count)
    throw new RangeError(`coreToPlaneBatch: every array needs at least ${count} items`)
  const { dip, dipDirection } = out
  const betaOffset = options.reference === 'top' ? Math.PI : 0
  let invalid = 0
  for (let i = 0; i < count; i++) {
    const a = alphaIn[i]
    const b = beta[i] * DEG2RAD + betaOffset
    const t = holeTrend[i] * DEG2RAD
    const p = holePlunge[i] * DEG2RAD
    // x − x is 0 only for finite x: one test rejects NaN and ±Infinity.
    if (!(a >= 0 && a <= 90) || b - b !== 0 || t - t !== 0 || p - p !== 0) {
      dip[i] = NaN
      dipDirection[i] = NaN
      invalid++
      continue
    }
    // Sine and cosine from one tan of the half angle, t = tan(x/2): sin = 2t/(1 + t²),
    // cos = (1 − t²)/(1 + t²). One call instead of two, accurate to a few ulps everywhere.
    const ta = Math.tan(0.5 * a * DEG2RAD)
    const qa = 1 / (1 + ta * ta)
    const sa = 2 * ta * qa
    const ca = (1 - ta * ta) * qa
    const tb = Math.tan(0.5 * b)
    const qb = 1 / (1 + tb * tb)
    const sb = 2 * tb * qb
    const cb = (1 - tb * tb) * qb
    const tA = Math.tan(0.5 * t)
    const qA = 1 / (1 + tA * tA)
    const sA = 2 * tA * qA
    const cA = (1 - tA * tA) * qA
    const tP = Math.tan(0.5 * p)
    const qP = 1 / (1 + tP * tP)
    const sP = 2 * tP * qP
    const cP = (1 - tP * tP) * qP
    // n = sin(alpha) z' − cos(alpha) (cos(beta) x' + sin(beta) y'), expanded (see holeFrame).
    let nx = sa * sA * cP + ca * (cb * sA * sP + sb * cA)
    let ny = sa * cA * cP + ca * (cb * cA * sP - sb * sA)
    let nz = ca * cb * cP - sa * sP
    if (nz < 0) {
      // The upward pole leans toward the dip direction.
      nx = -nx
      ny = -ny
      nz = -nz
    }
    const h = Math.sqrt(nx * nx + ny * ny)
    // asin for gentle dips and acos for steep ones: each well conditioned where used, and
    // cheaper than atan2.
    dip[i] = (nz > 0.7 ? Math.asin(h) : Math.acos(nz)) * RAD2DEG
    dipDirection[i] = h < 1e-12 ? 0 : azimuthOf(nx, ny)
  }
  return { dipDirection, dip, invalid }
}

/** atan2(x, y) in degrees, [0, 360), by one atan of the smaller ratio: faster than atan2 in V8. */
function azimuthOf(x: number, y: number): number {
  let r: number
  if (Math.abs(y) >= Math.abs(x)) {
    r = Math.atan(x / y)
    if (y < 0) r += Math.PI
  } else {
    r = Math.PI / 2 - Math.atan(y / x)
    if (x < 0) r += Math.PI
  }
  const deg = r * RAD2DEG
  const wrapped = deg < 0 ? deg + 360 : deg
  // −1e-15 + 360 rounds to 360 itself.
  return wrapped >= 360 ? 0 : wrapped
}
