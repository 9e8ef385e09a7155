import { DEG2RAD } from './math'
import { lowerBound } from './reconcile-prepare'
import { median } from './reconcile-shift'
import type { Prepared, PreparedCore, PreparedImage } from './reconcile-prepare'

export interface MatchSettings {
  /** m: largest |depth residual| of a pair. */
  readonly window: number
  /** rad: largest angle of a pair. */
  readonly maxAngle: number
  /** Score scales: depth (m) and angle (rad). */
  readonly sigmaDepth: number
  readonly sigmaAngle: number
  /** The depth shift expected at a core depth (image − core, m). */
  readonly shiftAt: (depth: number) => number
  /** Angle (rad) between the pole of core[coreIndex] (turned by its run's rotation) and the image's. */
  readonly angle: (core: PreparedCore, coreIndex: number, image: PreparedImage) => number
}

/** A matched pair by index into Prepared.cores and Prepared.images. */
export interface PairIndex {
  readonly core: number
  readonly image: number
  /** image − core − expected shift (m). */
  readonly residual: number
  /** rad, as MatchSettings.angle gave it. */
  readonly angle: number
  readonly score: number
}

/**
 * One-to-one pairing. Candidates are the image structures within ±window of each core depth plus
 * its expected shift (binary search in the depth-sorted images, so the cost grows with the pairs in
 * the window, not with core × image) whose angle is at most maxAngle. Each is scored
 * exp(−½((r/σd)² + (θ/σθ)²)), r the depth residual and θ the angle: 1 for a perfect pair, falling
 * as either grows, a Gaussian likelihood in both. Pairs are then taken greedily, best score first
 * (ties: smaller |r|, then depth order), skipping any whose core or image is already used. Greedy
 * matching keeps at least half the best possible total score (Avis 1983, Networks 13, from memory)
 * and, where each true pair clearly outscores its rivals, finds the same pairs as an exact method.
 */
export function matchPairs(prepared: Prepared, settings: MatchSettings): PairIndex[] {
  const { cores, images, imageDepths } = prepared
  const { window, maxAngle, sigmaDepth, sigmaAngle } = settings
  const candidates: PairIndex[] = []
  cores.forEach((core, i) => {
    const expected = core.depth + settings.shiftAt(core.depth)
    for (let j = lowerBound(imageDepths, expected - window); j < images.length; j++) {
      const residual = images[j].depth - expected
      if (residual > window) break
      const angle = settings.angle(core, i, images[j])
      if (!(angle <= maxAngle)) continue
      const score = Math.exp(-0.5 * ((residual / sigmaDepth) ** 2 + (angle / sigmaAngle) ** 2))
      candidates.push({ core: i, image: j, residual, angle, score })
    }
  })
  candidates.sort(
    (a, b) =>
      b.score - a.score ||
      Math.abs(a.residual) - Math.abs(b.residual) ||
      a.core - b.core ||
      a.image - b.image,
  )
  const coreUsed = new Uint8Array(cores.length)
  const imageUsed = new Uint8Array(images.length)
  const pairs: PairIndex[] = []
  for (const c of candidates) {
    if (coreUsed[c.core] || imageUsed[c.image]) continue
    coreUsed[c.core] = 1
    imageUsed[c.image] = 1
    pairs.push(c)
  }
  return pairs.sort((a, b) => a.core - b.core)
}

/** How many pairs of `next` are not in `last`, plus any pairs `last` has beyond them. */
export function changedPairs(last: readonly PairIndex[], next: readonly PairIndex[]): number {
  const partner = new Map(last.map((p) => [p.core, p.image]))
  const changed = next.filter((p) => partner.get(p.core) !== p.image).length
  return changed + Math.max(0, last.length - next.length)
}

/** Score scales from the last pairing: robust depth and angle spreads, floored and capped. */
export function scalesOf(pairs: readonly PairIndex[], window: number, maxAngle: number) {
  if (pairs.length < 3) return { sigmaDepth: window / 4, sigmaAngle: maxAngle / 4 }
  const mad = 1.4826 * median(pairs.map((p) => Math.abs(p.residual)))
  // The angle between two poles with circular-normal errors is Rayleigh: median = 1.1774σ.
  const angle = median(pairs.map((p) => p.angle)) / 1.1774
  return {
    sigmaDepth: Math.min(window / 2, Math.max(0.01, mad)),
    sigmaAngle: Math.min(maxAngle / 2, Math.max(DEG2RAD, angle)),
  }
}
