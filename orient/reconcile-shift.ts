import { lowerBound, imageAlphaIn } from './reconcile-prepare'
import type { Prepared } from './reconcile-prepare'

/**
 * Half-width of the depth-shift search (m): max(3, 3·depthWindow). Wireline and driller's depths
 * commonly differ by tens of centimetres and seldom by more than a couple of metres (common
 * practice, from memory); 3 m covers that with margin while keeping spurious pairs few.
 */
export function shiftSearchRange(depthWindow: number): number {
  return Math.max(3, 3 * depthWindow)
}

/**
 * First estimate of the depth shift (image − core, m), blind to any rotation of the orientation
 * line: every core/image pair within ±shiftSearchRange whose alphas (the image plane's alpha in the
 * core's hole) differ by at most maxAngle votes for its depth difference with weight
 * exp(−½(Δα/σα)²), σα = maxAngle/4; each core's votes are scaled to sum to at most 1, so a core
 * with many look-alike neighbours cannot outvote the rest. |Δα| is a lower bound on the angle
 * between the poles, so no true pair is excluded. The votes are binned and smoothed by a Gaussian
 * kernel of bandwidth h = max(0.05 m, depthWindow/10) (Silverman 1986, Density Estimation, §3.3);
 * the mode is taken, then refined to the vote-weighted mean within ±h of it. Spurious pairs spread
 * their votes over the whole range while true pairs pile up at the shift, so the mode is robust to
 * many of them. Undefined when no pair votes.
 */
export function votedShift(
  prepared: Prepared,
  depthWindow: number,
  maxAngle: number,
): number | undefined {
  const range = shiftSearchRange(depthWindow)
  const h = Math.max(0.05, depthWindow / 10)
  const step = h / 5
  const bins = Math.ceil((2 * range) / step) + 1
  const votes = new Float64Array(bins)
  const sigma = maxAngle / 4
  const { cores, images, imageDepths } = prepared
  const weight = (dAlpha: number) =>
    dAlpha > maxAngle ? 0 : Math.exp(-0.5 * (dAlpha / sigma) ** 2)
  let scratch = new Float64Array(64)
  for (const core of cores) {
    const from = lowerBound(imageDepths, core.depth - range)
    const to = lowerBound(imageDepths, core.depth + range + step)
    if (to - from > scratch.length) scratch = new Float64Array(2 * (to - from))
    let total = 0
    for (let j = from; j < to; j++) {
      const w = weight(Math.abs(core.alpha - imageAlphaIn(core, images[j])))
      scratch[j - from] = w
      total += w
    }
    if (total === 0) continue
    const scale = 1 / Math.max(1, total)
    for (let j = from; j < to; j++) {
      const k = Math.round((images[j].depth - core.depth + range) / step)
      if (k >= 0 && k < bins) votes[k] += scratch[j - from] * scale
    }
  }
  const reach = 15 // bins: three bandwidths
  const kernel = Float64Array.from({ length: 2 * reach + 1 }, (_, i) =>
    Math.exp(-0.5 * (((i - reach) * step) / h) ** 2),
  )
  let best = -1
  let bestDensity = 0
  for (let k = 0; k < bins; k++) {
    let density = 0
    for (let i = -reach; i <= reach; i++)
      if (k + i >= 0 && k + i < bins) density += votes[k + i] * kernel[i + reach]
    if (density > bestDensity) {
      bestDensity = density
      best = k
    }
  }
  if (best < 0) return undefined
  let sum = 0
  let weightSum = 0
  for (let i = -5; i <= 5; i++) {
    const k = best + i
    if (k < 0 || k >= bins) continue
    sum += votes[k] * (k * step - range)
    weightSum += votes[k]
  }
  return weightSum > 0 ? sum / weightSum : best * step - range
}

/** Median of a non-empty list (a copy is sorted). */
export function median(values: readonly number[]): number {
  const s = [...values].sort((a, b) => a - b)
  const m = s.length >> 1
  return s.length % 2 ? s[m] : (s[m - 1] + s[m]) / 2
}
