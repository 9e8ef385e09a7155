import { symmetricEigen3 } from './eigen'
import type { Vec3 } from './types'

/** One run of axial spherical k-means from given centres. */
export interface KMeansRun {
  readonly centres: Vec3[]
  readonly assignments: Int32Array
  /** Σ w (1 − (x·c)²): the weighted sum of squared sines to the assigned centre. */
  readonly dispersion: number
  readonly iterations: number
}

/** Index of the centre nearest x as an axis (largest |x·c|), and that |x·c|. */
function nearest(centres: readonly Vec3[], x: number, y: number, z: number): [number, number] {
  let best = 0
  let bestDot = -1
  for (let c = 0; c < centres.length; c++) {
    const v = centres[c]
    const d = Math.abs(x * v[0] + y * v[1] + z * v[2])
    if (d > bestDot) {
      best = c
      bestDot = d
    }
  }
  return [best, bestDot]
}

/**
 * Lloyd iterations for axes: assign each unit vector to the centre with the largest |x·c|, move
 * each centre to the principal eigenvector of its members' orientation tensor (the axis that
 * minimises their summed squared sines), until no assignment changes. An emptied set takes the
 * vector furthest from its centre.
 */
export function axialKMeans(
  xyz: Float64Array,
  weights: Float64Array,
  start: readonly Vec3[],
  maxIterations: number,
): KMeansRun {
  const n = weights.length
  const k = start.length
  const centres = start.slice()
  const assignments = new Int32Array(n).fill(-1)
  const sums = new Float64Array(7 * k)
  let iterations = 0
  let dispersion = 0
  for (; iterations < maxIterations; iterations++) {
    let changed = 0
    dispersion = 0
    sums.fill(0)
    let worst = -1
    let worstDot = 2
    for (let i = 0; i < n; i++) {
      const x = xyz[3 * i]
      const y = xyz[3 * i + 1]
      const z = xyz[3 * i + 2]
      const [c, d] = nearest(centres, x, y, z)
      if (assignments[i] !== c) changed++
      assignments[i] = c
      const w = weights[i]
      dispersion += w * (1 - d * d)
      if (d < worstDot) [worst, worstDot] = [i, d]
      const s = 7 * c
      sums[s] += w * x * x
      sums[s + 1] += w * x * y
      sums[s + 2] += w * x * z
      sums[s + 3] += w * y * y
      sums[s + 4] += w * y * z
      sums[s + 5] += w * z * z
      sums[s + 6] += w
    }
    if (changed === 0 && iterations > 0) break
    for (let c = 0; c < k; c++) {
      const s = 7 * c
      if (sums[s + 6] > 0) {
        const e = symmetricEigen3(
          sums[s],
          sums[s + 1],
          sums[s + 2],
          sums[s + 3],
          sums[s + 4],
          sums[s + 5],
        )
        centres[c] = e.vectors[0]
      } else if (worst >= 0) {
        centres[c] = [xyz[3 * worst], xyz[3 * worst + 1], xyz[3 * worst + 2]]
        worst = -1
      }
    }
  }
  return { centres, assignments, dispersion, iterations }
}

/**
 * k-means++ seeding for axes (Arthur & Vassilvitskii 2007) with distance² = 1 − (x·c)²: the first
 * centre is the given one (e.g. the principal axis of all data), each next is drawn with
 * probability proportional to w·distance² to the nearest centre chosen so far.
 */
export function seedCentres(
  xyz: Float64Array,
  weights: Float64Array,
  first: Vec3,
  k: number,
  random: () => number,
): Vec3[] {
  const n = weights.length
  const centres: Vec3[] = [first]
  const d2 = new Float64Array(n).fill(Infinity)
  while (centres.length < k) {
    const c = centres[centres.length - 1]
    let total = 0
    for (let i = 0; i < n; i++) {
      const d = xyz[3 * i] * c[0] + xyz[3 * i + 1] * c[1] + xyz[3 * i + 2] * c[2]
      d2[i] = Math.min(d2[i], weights[i] * (1 - d * d))
      total += d2[i]
    }
    let pick = n - 1
    let target = random() * total
    for (let i = 0; i < n && total > 0; i++) {
      target -= d2[i]
      if (target < 0) {
        pick = i
        break
      }
    }
    centres.push([xyz[3 * pick], xyz[3 * pick + 1], xyz[3 * pick + 2]])
  }
  return centres
}
