import { finite } from './math'
import { axialKMeans, seedCentres } from './cluster-core'
import { fisherStats } from './fisher'
import { mulberry32 } from './random'
import { linesToXyz, tensorSums } from './tensor'
import { lineToVec, vecToLine } from './vector'
import type { KMeansRun } from './cluster-core'
import type { FisherStats } from './fisher'
import type { Line } from './types'

export type ClusterOptions = ({ readonly k: number } | { readonly seeds: readonly Line[] }) & {
  /** Non-negative weight per line (e.g. Terzaghi): pulls centres, counted in dispersion. */
  readonly weights?: readonly number[]
  /** PRNG seed of the k-means++ draws (default 1). */
  readonly seed?: number
  /** Seeded starts tried when k is given; the lowest dispersion wins (default 5). */
  readonly restarts?: number
  readonly maxIterations?: number
}

export interface ClusterSet {
  /** Fisher mean of the members (the k-means centre for an empty or one-member set). */
  readonly mean: Line
  readonly count: number
  /** Axial Fisher statistics of the members (weighted when weights are given). */
  readonly stats: FisherStats | undefined
}

export interface ClusterResult {
  readonly k: number
  /** Set index per input line (sets ordered by count, largest first); −1 for invalid lines. */
  readonly assignments: number[]
  readonly sets: ClusterSet[]
  /** Σ w sin²(angle to the set's centre) over assigned lines. */
  readonly dispersion: number
}

/**
 * Axial spherical k-means: lines are axes, distance² = 1 − (x·c)², centres the principal axis of
 * their members. With `seeds` one run starts from them; with `k` the runs start from k-means++
 * (Arthur & Vassilvitskii 2007) seeded by a fixed PRNG, the first centre being the principal axis
 * of all data, so results are reproducible; the best of `restarts` runs is kept. Set assignment is
 * an interpretation: review it on the net. Undefined for k < 1, k above the number of valid lines,
 * or weights of the wrong length.
 */
export function clusterSets(
  lines: readonly Line[],
  options: ClusterOptions,
): ClusterResult | undefined {
  const w = options.weights
  if (w && w.length !== lines.length) return undefined
  const valid: number[] = []
  lines.forEach((l, i) => {
    const weight = w ? w[i] : 1
    if (finite(l.trend, l.plunge, weight) && weight > 0) valid.push(i)
  })
  const xyz = linesToXyz(valid.map((i) => lines[i]))
  const weights = Float64Array.from(valid, (i) => (w ? w[i] : 1))
  const maxIterations = whole(options.maxIterations, 100)
  let best: KMeansRun | undefined
  if ('seeds' in options) {
    const seeds = options.seeds.filter((s) => finite(s.trend, s.plunge))
    if (seeds.length === 0 || valid.length === 0) return undefined
    best = axialKMeans(xyz, weights, seeds.map(lineToVec), maxIterations)
  } else {
    const k = Math.floor(options.k)
    if (!(k >= 1) || k > valid.length) return undefined
    const first = tensorSums(xyz, weights)?.eigen.vectors[0] ?? [0, 0, -1]
    const random = mulberry32(options.seed ?? 1)
    for (let r = 0; r < whole(options.restarts, 5); r++) {
      const run = axialKMeans(
        xyz,
        weights,
        seedCentres(xyz, weights, first, k, random),
        maxIterations,
      )
      if (!best || run.dispersion < best.dispersion - 1e-12) best = run
    }
  }
  return summarise(best!, lines, valid, w)
}

/** A count option: a finite number ≥ 1 rounded down, else the default. */
function whole(value: number | undefined, fallback: number): number {
  return value !== undefined && Number.isFinite(value) && value >= 1 ? Math.floor(value) : fallback
}

function summarise(
  run: KMeansRun,
  lines: readonly Line[],
  valid: readonly number[],
  weights: readonly number[] | undefined,
): ClusterResult {
  const k = run.centres.length
  const members: number[][] = Array.from({ length: k }, () => [])
  valid.forEach((index, j) => members[run.assignments[j]].push(index))
  const sets = members.map((m, c) => {
    const stats = fisherStats(
      m.map((i) => lines[i]),
      { weights: weights && m.map((i) => weights[i]) },
    )
    return { mean: stats?.mean ?? vecToLine(run.centres[c]), count: m.length, stats }
  })
  // Largest set first; ties by mean trend then plunge, so the labels are reproducible.
  const order = sets
    .map((_, c) => c)
    .sort(
      (a, b) =>
        sets[b].count - sets[a].count ||
        sets[a].mean.trend - sets[b].mean.trend ||
        sets[a].mean.plunge - sets[b].mean.plunge,
    )
  const label = new Int32Array(k)
  order.forEach((c, rank) => (label[c] = rank))
  const assignments = new Array<number>(lines.length).fill(-1)
  valid.forEach((index, j) => (assignments[index] = label[run.assignments[j]]))
  return { k, assignments, sets: order.map((c) => sets[c]), dispersion: run.dispersion }
}
