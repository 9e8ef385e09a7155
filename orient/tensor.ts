import { finite, twoSum } from './math'
import { symmetricEigen3 } from './eigen'
import { lineToVec, vecToLine } from './vector'
import type { SymmetricEigen } from './eigen'
import type { Line } from './types'

/**
 * Unit vectors of lines as one interleaved column [x0, y0, z0, x1, ...] in the world frame
 * (east, north, up): the input of the batch statistics. Invalid lines become NaN triplets, which
 * the batch functions skip.
 */
export function linesToXyz(
  lines: readonly Line[],
  out = new Float64Array(lines.length * 3),
): Float64Array {
  for (let i = 0; i < lines.length; i++) {
    const l = lines[i]
    const v = finite(l.trend, l.plunge) ? lineToVec(l) : [NaN, NaN, NaN]
    out[3 * i] = v[0]
    out[3 * i + 1] = v[1]
    out[3 * i + 2] = v[2]
  }
  return out
}

/** Weighted orientation tensor (1/N) Σ w x xᵀ of valid items, with N = Σ w and the item count. */
export interface TensorSums {
  readonly weight: number
  readonly count: number
  readonly eigen: SymmetricEigen
}

/**
 * Σ w x xᵀ over the valid items of an xyz column (finite components, finite positive weight),
 * each of the six sums compensated with Knuth's TwoSum so a million terms lose nothing, then the
 * eigen-decomposition of the normalised tensor. Undefined when no weight is left.
 */
export function tensorSums(xyz: Float64Array, weights?: Float64Array): TensorSums | undefined {
  const count = Math.floor(xyz.length / 3)
  // acc holds [sum, compensation] pairs for xx, xy, xz, yy, yz, zz and the weight.
  const acc = new Float64Array(14)
  let used = 0
  for (let i = 0; i < count; i++) {
    const x = xyz[3 * i]
    const y = xyz[3 * i + 1]
    const z = xyz[3 * i + 2]
    const w = weights ? weights[i] : 1
    // x − x is 0 only for finite x.
    if (!(w > 0) || x - x !== 0 || y - y !== 0 || z - z !== 0 || w - w !== 0) continue
    used++
    const wx = w * x
    const wy = w * y
    twoSum(acc, 0, wx * x)
    twoSum(acc, 2, wx * y)
    twoSum(acc, 4, wx * z)
    twoSum(acc, 6, wy * y)
    twoSum(acc, 8, wy * z)
    twoSum(acc, 10, w * z * z)
    twoSum(acc, 12, w)
  }
  const weight = acc[12] + acc[13]
  if (used === 0 || !(weight > 0)) return undefined
  const k = 1 / weight
  const eigen = symmetricEigen3(
    (acc[0] + acc[1]) * k,
    (acc[2] + acc[3]) * k,
    (acc[4] + acc[5]) * k,
    (acc[6] + acc[7]) * k,
    (acc[8] + acc[9]) * k,
    (acc[10] + acc[11]) * k,
  )
  return { weight, count: used, eigen }
}

/** Orientation tensor summary (Woodcock 1977). */
export interface OrientationTensor {
  /** Number of lines used (valid input), and their total weight. */
  readonly count: number
  readonly weight: number
  /** Normalised eigenvalues S1 ≥ S2 ≥ S3, summing to 1. */
  readonly eigenvalues: readonly [number, number, number]
  /** Principal axes e1, e2, e3 as lower-hemisphere lines. */
  readonly eigenvectors: readonly [Line, Line, Line]
  /**
   * Shape K = ln(S1/S2) / ln(S2/S3): above 1 clusters, below 1 girdles. 0 for lines in one plane
   * (S3 = 0), Infinity for S2 = S3 > 0, undefined where it is 0/0 (all lines parallel, or uniform).
   */
  readonly shapeK: number | undefined
  /** Strength C = ln(S1/S3); Infinity when S3 = 0 (all lines in one plane or parallel). */
  readonly strengthC: number
}

/** Below this an eigenvalue is zero: rounding of a tensor of unit vectors is ~1e-16. */
const ZERO = 1e-14

function summarise(sums: TensorSums): OrientationTensor {
  const [s1, s2, s3] = sums.eigen.values.map((s) => Math.max(s, 0))
  const [e1, e2, e3] = sums.eigen.vectors
  const lnS2S3 = s3 < ZERO ? (s2 < ZERO ? NaN : Infinity) : Math.log(s2 / s3)
  const lnS1S2 = s2 < ZERO ? Infinity : Math.log(s1 / s2)
  const k = lnS1S2 / lnS2S3
  return {
    count: sums.count,
    weight: sums.weight,
    eigenvalues: [s1, s2, s3],
    eigenvectors: [vecToLine(e1), vecToLine(e2), vecToLine(e3)],
    shapeK: Number.isNaN(k) ? undefined : k,
    strengthC: s3 < ZERO ? Infinity : Math.log(s1 / s3),
  }
}

/**
 * Orientation tensor T = (1/N) Σ w x xᵀ of lines, its eigenvalues and axes, and Woodcock's (1977)
 * shape K and strength C. Invalid lines (non-finite) and invalid weights (zero, negative, non-finite)
 * are left out. Undefined when nothing valid is left.
 */
export function orientationTensor(
  lines: readonly Line[],
  options: { weights?: readonly number[] } = {},
): OrientationTensor | undefined {
  const w = options.weights
  if (w && w.length !== lines.length) return undefined
  return orientationTensorBatch(linesToXyz(lines), w ? Float64Array.from(w) : undefined)
}

/** orientationTensor over an interleaved xyz column of unit vectors (see linesToXyz). */
export function orientationTensorBatch(
  xyz: Float64Array,
  weights?: Float64Array,
): OrientationTensor | undefined {
  const sums = tensorSums(xyz, weights)
  return sums && summarise(sums)
}
