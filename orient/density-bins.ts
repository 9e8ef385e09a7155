/**
 * Poles sorted into a g × g grid of cells over the equal-area net (counting sort, compressed
 * rows): cell (cx, cy) holds the poles start[cy·g + cx] ≤ i < start[cy·g + cx + 1] of xyz and w.
 */
export interface PoleBins {
  readonly g: number
  readonly start: Int32Array
  /** Lower-hemisphere unit vectors of the valid poles, interleaved, in cell order. */
  readonly xyz: Float64Array
  readonly w: Float64Array
  /** Number of valid poles and their total weight. */
  readonly count: number
  readonly weight: number
}

/** Equal-area net coordinate of a lower-hemisphere unit vector component: c/sqrt(1 − z). */
export function cellOf(c: number, z: number, g: number): number {
  const u = Math.floor(((c / Math.sqrt(1 - z) + 1) * g) / 2)
  return u < 0 ? 0 : u >= g ? g - 1 : u
}

/**
 * Bins the valid poles of an xyz column (finite, with a finite positive weight), each taken into
 * the lower hemisphere. g is chosen by the caller from the kernel's reach.
 */
export function binPoles(
  xyz: Float64Array,
  weights: Float64Array | undefined,
  g: number,
): PoleBins {
  const total = Math.floor(xyz.length / 3)
  const cell = new Int32Array(total)
  const start = new Int32Array(g * g + 1)
  let count = 0
  let weight = 0
  for (let i = 0; i < total; i++) {
    const x = xyz[3 * i]
    const y = xyz[3 * i + 1]
    const z = xyz[3 * i + 2]
    const w = weights ? weights[i] : 1
    if (!(w > 0) || x - x !== 0 || y - y !== 0 || z - z !== 0 || w - w !== 0) {
      cell[i] = -1
      continue
    }
    const s = z > 0 ? -1 : 1
    const c = cellOf(s * y, s * z, g) * g + cellOf(s * x, s * z, g)
    cell[i] = c
    start[c + 1]++
    count++
    weight += w
  }
  for (let c = 0; c < g * g; c++) start[c + 1] += start[c]
  const next = start.slice(0, g * g)
  const sorted = new Float64Array(3 * count)
  const w = new Float64Array(count)
  for (let i = 0; i < total; i++) {
    const c = cell[i]
    if (c < 0) continue
    const j = next[c]++
    const s = xyz[3 * i + 2] > 0 ? -1 : 1
    sorted[3 * j] = s * xyz[3 * i]
    sorted[3 * j + 1] = s * xyz[3 * i + 1]
    sorted[3 * j + 2] = s * xyz[3 * i + 2]
    w[j] = weights ? weights[i] : 1
  }
  return { g, start, xyz: sorted, w, count, weight }
}
