import { DEG2RAD } from './math'
import { imageAlphaIn, imageBetaIn } from './reconcile-prepare'
import type { PreparedCore, PreparedImage } from './reconcile-prepare'

/** One pair's view of its run's rotation (rad) and the weight of that view. */
export interface PairRotation {
  readonly rotation: number
  readonly weight: number
  /** True when beta's sense is in doubt (an alpha below BETA_SENSE_LIMIT): known modulo π. */
  readonly axial: boolean
}

export interface RotationEstimate {
  /** rad, in (−π, π]. */
  readonly rotation: number
  /** rad; undefined below 2 pairs used. */
  readonly spread: number | undefined
  readonly error: number | undefined
  /** Pairs that carried weight in the final estimate. */
  readonly used: number
  /** Of those, pairs whose beta sense is certain: with none, the rotation is known modulo 180°. */
  readonly directional: number
}

/** Above this alpha (degrees) beta is not defined well enough to say anything about a rotation. */
export const BETA_ALPHA_LIMIT = 85
/**
 * Below this alpha (degrees) a pole error of a few degrees can put the down-hole apex at the other
 * end of the long ellipse (at alpha 0 beta and beta + 180 give the same plane), so such a pair only
 * says the rotation modulo 180°.
 */
export const BETA_SENSE_LIMIT = 10

const TWO_PI = 2 * Math.PI
/** Radians into (−π, π]. */
export const wrapPi = (a: number) => a - TWO_PI * Math.ceil((a - Math.PI) / TWO_PI)
/** Residual of a pair about mu: modulo 2π, or modulo π for an axial pair. */
const residualOf = (p: PairRotation, mu: number) => {
  const e = wrapPi(p.rotation - mu)
  return !p.axial ? e : e > Math.PI / 2 ? e - Math.PI : e <= -Math.PI / 2 ? e + Math.PI : e
}

/**
 * The rotation this pair asks for: the image plane's beta in the core's hole (imageBetaIn, as
 * planeToCore gives it, both from the bottom-of-hole line) minus the logged beta, wrapped. The apex
 * direction has length cos α, so a pole error σ moves beta by about σ/cos α: the difference of two
 * betas has variance σ²(1/cos²α_core + 1/cos²α_image), and the weight is 2 over that bracket
 * (cos²α when the alphas agree). Zero when either alpha is above BETA_ALPHA_LIMIT; axial when
 * either is below BETA_SENSE_LIMIT.
 */
export function pairRotation(core: PreparedCore, image: PreparedImage): PairRotation {
  const limit = BETA_ALPHA_LIMIT * DEG2RAD
  const alphaImage = imageAlphaIn(core, image)
  const weight =
    core.alpha > limit || alphaImage > limit
      ? 0
      : 2 / (1 / Math.cos(core.alpha) ** 2 + 1 / Math.cos(alphaImage) ** 2)
  const axial = Math.min(core.alpha, alphaImage) < BETA_SENSE_LIMIT * DEG2RAD
  return { rotation: wrapPi(imageBetaIn(core, image) - core.betaBottom), weight, axial }
}

/**
 * Weighted circular median: the rotation of a directional pair (any pair when none is) minimising
 * Σ w|residual| (at most 400 centres tried).
 */
function circularMedian(pairs: readonly PairRotation[]): number {
  const centres = pairs.some((p) => !p.axial) ? pairs.filter((p) => !p.axial) : pairs
  const stride = Math.ceil(centres.length / 400)
  let best = centres[0].rotation
  let bestCost = Infinity
  for (let i = 0; i < centres.length; i += stride) {
    let cost = 0
    for (const p of pairs) cost += p.weight * Math.abs(residualOf(p, centres[i].rotation))
    if (cost < bestCost) {
      bestCost = cost
      best = centres[i].rotation
    }
  }
  return best
}

const TUKEY_C = 4.685
/** Pairs beyond this many robust σ of the located mean are gross outliers (flips, wrong pairs). */
const OUTLIER_CUT = 8
const MIN_SCALE = 0.5 * DEG2RAD

/**
 * Robust weighted circular mean of the pair rotations (axial pairs taken modulo 180° about the
 * current mean): start at the weighted circular median, then iteratively reweighted least squares
 * with Tukey's biweight (c = 4.685, Beaton & Tukey 1974) on residuals z standardised by √w, scale
 * σ̂ = 1.4826·median|z| (at least 0.5°), to locate the mean. Pairs with |z| ≥ 8σ̂ are dropped as
 * gross outliers; the n kept give a plain weighted mean, spread s = √(Σwe²/Σw · n/(n − 1)) and
 * standard error √(Σwe²/((n − 1)Σw)) = s/√n, the inverse-variance weighted-mean error with σ
 * estimated from the residuals (n − 1 degrees of freedom). Undefined when no pair has a defined
 * beta.
 */
export function estimateRotation(all: readonly PairRotation[]): RotationEstimate | undefined {
  const pairs = all.filter((p) => p.weight > 0)
  if (pairs.length === 0) return undefined
  let mu = circularMedian(pairs)
  const robust = new Float64Array(pairs.length)
  let scale = MIN_SCALE
  for (let iteration = 0; iteration < 50; iteration++) {
    const z = pairs.map((p) => Math.abs(residualOf(p, mu)) * Math.sqrt(p.weight))
    const sorted = [...z].sort((a, b) => a - b)
    const mid = sorted.length >> 1
    const mad = sorted.length % 2 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2
    scale = Math.max(1.4826 * mad, MIN_SCALE)
    const cut = TUKEY_C * scale
    let num = 0
    let den = 0
    pairs.forEach((p, k) => {
      robust[k] = z[k] < cut ? (1 - (z[k] / cut) ** 2) ** 2 : 0
      num += p.weight * robust[k] * residualOf(p, mu)
      den += p.weight * robust[k]
    })
    const step = den > 0 ? num / den : 0
    mu = wrapPi(mu + step)
    if (Math.abs(step) < 1e-10) break
  }
  // Trimming at the biweight's own cut would shave real tails off and understate the error, so
  // only gross outliers are dropped before the plain weighted mean.
  const kept = pairs.filter(
    (p) => Math.abs(residualOf(p, mu)) * Math.sqrt(p.weight) < OUTLIER_CUT * scale,
  )
  const used = kept.length
  const directional = kept.filter((p) => !p.axial).length
  let sw = 0
  let swe = 0
  for (const p of kept) {
    sw += p.weight
    swe += p.weight * residualOf(p, mu)
  }
  mu = wrapPi(mu + swe / sw)
  swe = 0
  for (const p of kept) swe += p.weight * residualOf(p, mu) ** 2
  if (used < 2) return { rotation: mu, spread: undefined, error: undefined, used, directional }
  const error = Math.sqrt(swe / ((used - 1) * sw))
  return { rotation: mu, spread: error * Math.sqrt(used), error, used, directional }
}
