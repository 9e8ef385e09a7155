import { DEG2RAD } from './math'
import { imageAlphaIn, lowerBound } from './reconcile-prepare'
import type { Prepared } from './reconcile-prepare'
import { pairRotation, wrapPi } from './reconcile-rotation'

const BINS = 360 // 1° each
/** Modes kept per run, strongest first. */
const MODES = 3

/**
 * Candidate rotations (rad) for each run, before any pairing: every core of the run votes for the
 * rotation asked by each image structure within ±window of its depth plus the shift, with weight
 * exp(−½(Δα/σα)²)·exp(−½(r/σd)²) (σα = maxAngle/4, σd = window/4, |Δα| ≤ maxAngle; r the depth
 * residual), each core's votes scaled to sum to at most 1, times the pair's beta weight
 * (pairRotation); an axial pair votes half for each sense. True partners all vote for the same
 * rotation while look-alike neighbours scatter. The votes are smoothed on the circle by a Gaussian of
 * bandwidth max(2°, maxAngle/5); its three highest modes, each refined to the vote-weighted circular
 * mean within two bandwidths, are returned strongest first for chooseRotations to test. Empty for
 * runs with fewer than minMatches voting cores.
 */
export function votedRotations(
  prepared: Prepared,
  shift: number,
  window: number,
  maxAngle: number,
  minMatches: number,
): number[][] {
  const { cores, images, imageDepths, runs } = prepared
  const votes = new Float64Array(runs.length * BINS)
  const voters = new Int32Array(runs.length)
  const add = (run: number, bin: number, vote: number) => {
    votes[run * BINS + (((bin % BINS) + BINS) % BINS)] += vote
  }
  const sigmaAlpha = maxAngle / 4
  const sigmaDepth = window / 4
  let scratch = new Float64Array(64)
  for (const core of cores) {
    if (core.run < 0) continue
    const expected = core.depth + shift
    const from = lowerBound(imageDepths, expected - window)
    const to = lowerBound(imageDepths, expected + window)
    if (to - from > scratch.length) scratch = new Float64Array(2 * (to - from))
    let total = 0
    for (let j = from; j < to; j++) {
      const dAlpha = Math.abs(core.alpha - imageAlphaIn(core, images[j]))
      const r = images[j].depth - expected
      const w =
        dAlpha > maxAngle
          ? 0
          : Math.exp(-0.5 * ((dAlpha / sigmaAlpha) ** 2 + (r / sigmaDepth) ** 2))
      scratch[j - from] = w
      total += w
    }
    if (total === 0) continue
    voters[core.run]++
    const scale = 1 / Math.max(1, total)
    for (let j = from; j < to; j++) {
      const w = scratch[j - from]
      if (w === 0) continue
      const pair = pairRotation(core, images[j])
      const bin = Math.round(pair.rotation / DEG2RAD)
      const vote = w * scale * pair.weight
      // An axial pair (beta's sense in doubt) votes half for each sense.
      if (pair.axial) {
        add(core.run, bin, vote / 2)
        add(core.run, bin + 180, vote / 2)
      } else add(core.run, bin, vote)
    }
  }
  const h = Math.max(2, maxAngle / DEG2RAD / 5)
  const reach = Math.ceil(3 * h)
  const kernel = Float64Array.from({ length: 2 * reach + 1 }, (_, i) =>
    Math.exp(-0.5 * ((i - reach) / h) ** 2),
  )
  const spread = Math.ceil(2 * h)
  return runs.map((_, k) => {
    if (voters[k] < minMatches) return []
    const at = (bin: number) => votes[k * BINS + (((bin % BINS) + BINS) % BINS)]
    const density = Float64Array.from({ length: BINS }, (_, b) => {
      let d = 0
      for (let i = -reach; i <= reach; i++) d += at(b + i) * kernel[i + reach]
      return d
    })
    const peaks: number[] = []
    for (let b = 0; b < BINS; b++) {
      const d = density[b]
      if (d > 0 && d > density[(b + BINS - 1) % BINS] && d >= density[(b + 1) % BINS]) peaks.push(b)
    }
    return peaks
      .sort((a, b) => density[b] - density[a])
      .slice(0, MODES)
      .map((peak) => {
        let sin = 0
        let cos = 0
        for (let i = -spread; i <= spread; i++) {
          sin += at(peak + i) * Math.sin((peak + i) * DEG2RAD)
          cos += at(peak + i) * Math.cos((peak + i) * DEG2RAD)
        }
        return wrapPi(Math.atan2(sin, cos))
      })
  })
}
