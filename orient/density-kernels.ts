import { RAD2DEG, acos } from './math'

export type DensityMethod = 'kamb' | 'exponential'

/** A counting kernel sized for N poles, with the expectation and spread of a uniform sample. */
export interface DensityKernel {
  readonly method: DensityMethod
  /** Smoothing constant k of the exponential kernel (undefined for Kamb). */
  readonly k: number | undefined
  /** Poles count only where |x·p| ≥ this (the Kamb cap, or the exponential truncation). */
  readonly cosCutoff: number
  /** Expected value E at a node for N uniformly scattered poles. */
  readonly expected: number
  /** Standard deviation sigma of that value. */
  readonly sigma: number
  /** ∫ of one pole's kernel over the lower hemisphere (steradians; the pole taken as an axis). */
  readonly area: number
}

/** Weights below this fraction of the peak are dropped by the exponential kernel. */
export const EXPONENTIAL_TRUNCATION = 1e-6

/**
 * Kamb (1959): a counting cap of area A = 9/(N + 9) of the hemisphere (cos(theta) = N/(N + 9)),
 * so that E = NA = 3 sigma with the binomial sigma = sqrt(NA(1 − A)). Poles count as axes.
 */
export function kambKernel(n: number): DensityKernel {
  const a = 9 / (n + 9)
  return {
    method: 'kamb',
    k: undefined,
    cosCutoff: 1 - a,
    expected: n * a,
    sigma: Math.sqrt(n * a * (1 - a)),
    area: 2 * Math.PI * a,
  }
}

/**
 * Exponential kernel (Robin & Jowett 1986; Vollmer 1995): W = exp(k(|x·p| − 1)), k = 2(1 + N/9).
 * For uniform poles |x·p| is uniform on [0, 1], so per pole mean (1 − e^−k)/k and variance
 * (1 − e^−2k)/(2k) − mean², giving E and sigma (E ≈ 3 sigma; Vollmer's sqrt(N(k/2 − 1)/k²) is the
 * large-k limit). Truncated where W < 1e-6: the dropped tail is below 1e-6 of each pole's weight.
 */
export function exponentialKernel(n: number): DensityKernel {
  const k = 2 * (1 + n / 9)
  const mean = -Math.expm1(-k) / k
  const meanSquare = -Math.expm1(-2 * k) / (2 * k)
  return {
    method: 'exponential',
    k,
    cosCutoff: Math.max(0, 1 + Math.log(EXPONENTIAL_TRUNCATION) / k),
    expected: n * mean,
    sigma: Math.sqrt(n * Math.max(meanSquare - mean * mean, 0)),
    area: 2 * Math.PI * mean,
  }
}

/**
 * Half-angle (degrees) of a counting cap covering a fraction of the hemisphere: acos(1 − fraction);
 * the 1 % cap of common practice is 8.11°.
 */
export function countingCapAngle(areaFraction: number): number | undefined {
  if (!(areaFraction >= 0 && areaFraction <= 1)) return undefined
  return acos(1 - areaFraction) * RAD2DEG
}
