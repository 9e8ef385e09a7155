import { acos, finite } from './math'
import { clusterSets } from './cluster'
import { lineToVec } from './vector'
import type { Line, Vec3 } from './types'

export interface KSuggestion {
  /** Suggested number of sets (1 when no k reaches a mean silhouette of 0.5). */
  readonly k: number
  /** Mean silhouette width for each k tried from 2 to maxK. */
  readonly scores: readonly { readonly k: number; readonly silhouette: number }[]
}

/** At most this many lines enter the silhouette, which costs O(n²). */
const SAMPLE = 400

/** Mean silhouette above which a partition counts as structure (Kaufman & Rousseeuw 1990). */
const MIN_SILHOUETTE = 0.5

/**
 * Suggests a number of sets by the mean silhouette width (Rousseeuw 1987) of clusterSets for
 * k = 2..maxK, with the axial angle acos|x·y| as distance, on an evenly spaced sample of at most
 * 400 lines. The best k is kept when its mean silhouette exceeds 0.5, where Kaufman & Rousseeuw
 * (1990) call the structure reasonable; weaker partitions are what k-means makes of a single
 * cluster or of uniform scatter (about 0.35 on the sphere), so 1 is returned. Undefined for fewer
 * than 3 valid lines.
 */
export function suggestK(lines: readonly Line[], maxK = 6): KSuggestion | undefined {
  const valid = lines.filter((l) => finite(l.trend, l.plunge))
  if (valid.length < 3) return undefined
  const top = Math.min(Math.floor(maxK), valid.length - 1)
  const step = Math.max(1, Math.ceil(valid.length / SAMPLE))
  const sample: number[] = []
  for (let i = 0; i < valid.length && sample.length < SAMPLE; i += step) sample.push(i)
  const v = sample.map((i) => lineToVec(valid[i]))
  const distance = sample.map((_, a) => sample.map((_, b) => axialAngle(v[a], v[b])))
  const scores: { k: number; silhouette: number }[] = []
  for (let k = 2; k <= top; k++) {
    const result = clusterSets(valid, { k })
    if (!result) continue
    const labels = sample.map((i) => result.assignments[i])
    scores.push({ k, silhouette: meanSilhouette(distance, labels, k) })
  }
  const best = scores.reduce<{ k: number; silhouette: number } | undefined>(
    (b, s) => (!b || s.silhouette > b.silhouette ? s : b),
    undefined,
  )
  return { k: best && best.silhouette > MIN_SILHOUETTE ? best.k : 1, scores }
}

function axialAngle(a: Vec3, b: Vec3): number {
  return acos(Math.abs(a[0] * b[0] + a[1] * b[1] + a[2] * b[2]))
}

/** Mean of s(i) = (b − a)/max(a, b); members of one-member sets score 0 (Rousseeuw 1987). */
function meanSilhouette(distance: number[][], labels: number[], k: number): number {
  let total = 0
  for (let i = 0; i < labels.length; i++) {
    const sum = new Float64Array(k)
    const size = new Float64Array(k)
    for (let j = 0; j < labels.length; j++) {
      if (j === i) continue
      sum[labels[j]] += distance[i][j]
      size[labels[j]]++
    }
    const own = labels[i]
    if (size[own] === 0) continue
    const a = sum[own] / size[own]
    let b = Infinity
    for (let c = 0; c < k; c++) if (c !== own && size[c] > 0) b = Math.min(b, sum[c] / size[c])
    const m = Math.max(a, b)
    if (Number.isFinite(b) && m > 0) total += (b - a) / m
  }
  return total / labels.length
}
