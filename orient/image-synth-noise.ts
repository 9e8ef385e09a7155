/**
 * Stateless integer hash of (i, j, seed) to 32 bits (hash01: to [0, 1)): the mixing steps of mulberry32 (T. Ettinger
 * 2017, as in random.ts) applied to a key instead of a running state, so any pixel or lattice
 * node has its value without drawing the ones before it — rows can be rendered in any order.
 */
export function hashU32(i: number, j: number, seed: number): number {
  let t = (Math.imul(i | 0, 0x9e3779b1) ^ Math.imul(j | 0, 0x85ebca6b) ^ seed) >>> 0
  t = (t + 0x6d2b79f5) >>> 0
  t = Math.imul(t ^ (t >>> 15), t | 1)
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
  return (t ^ (t >>> 14)) >>> 0
}

export const hash01 = (i: number, j: number, seed: number): number =>
  hashU32(i, j, seed) / 4294967296

/** One octave of value noise on a lattice: nodes every `depthStep` m and 360/`turnNodes` degrees. */
export interface Octave {
  readonly depthStep: number
  readonly turnNodes: number
  readonly weight: number
  readonly seed: number
}

/** Smoothstep weight: value noise with continuous slope across lattice cells (common practice). */
const smooth = (f: number) => f * f * (3 - 2 * f)

/**
 * Per-column lattice lookups of an octave for a given image width: the two lattice columns each
 * image column lies between (wrapping round the turn, so the texture is seamless at 0/360) and
 * the smoothed weight of the second.
 */
export interface OctaveColumns {
  readonly j0: Int32Array
  readonly j1: Int32Array
  readonly w: Float32Array
}

export function octaveColumns(o: Octave, width: number, leftAzimuth: number): OctaveColumns {
  const j0 = new Int32Array(width)
  const j1 = new Int32Array(width)
  const w = new Float32Array(width)
  for (let c = 0; c < width; c++) {
    const turn = ((((leftAzimuth + ((c + 0.5) * 360) / width) / 360) % 1) + 1) % 1
    const x = turn * o.turnNodes
    const i = Math.floor(x)
    j0[c] = i % o.turnNodes
    j1[c] = (i + 1) % o.turnNodes
    w[c] = smooth(x - i)
  }
  return { j0, j1, w }
}

/** The lattice row pair an octave last used, so its nodes are hashed once per lattice row. */
export interface OctaveRows {
  row: number
  readonly top: Float32Array
  readonly bottom: Float32Array
}

export function octaveRows(o: Octave): OctaveRows {
  return { row: NaN, top: new Float32Array(o.turnNodes), bottom: new Float32Array(o.turnNodes) }
}

/**
 * Adds weight × value noise (in [−1, 1]) of one octave to the row at depth `depth` (m): the lattice
 * rows either side are blended once per row, then each column blends two nodes.
 */
export function addOctaveRow(
  row: Float64Array,
  depth: number,
  o: Octave,
  cols: OctaveColumns,
  cache: OctaveRows,
  scratch: Float64Array,
): void {
  const y = depth / o.depthStep
  const i = Math.floor(y)
  const wy = smooth(y - i)
  if (cache.row !== i) {
    cache.row = i
    for (let j = 0; j < o.turnNodes; j++) {
      cache.top[j] = hash01(i, j, o.seed)
      cache.bottom[j] = hash01(i + 1, j, o.seed)
    }
  }
  for (let j = 0; j < o.turnNodes; j++)
    scratch[j] = cache.top[j] + (cache.bottom[j] - cache.top[j]) * wy
  const k = 2 * o.weight
  const { j0, j1, w } = cols
  for (let c = 0; c < row.length; c++) {
    const a = scratch[j0[c]]
    row[c] += k * (a + (scratch[j1[c]] - a) * w[c] - 0.5)
  }
}
