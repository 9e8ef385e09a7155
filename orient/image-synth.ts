import { mulberry32 } from './random'
import { addOctaveRow, hashU32, octaveColumns, octaveRows, type Octave } from './image-synth-noise'
import { darkenSpots } from './image-synth-spots'
import { darkenRow, prepareTrace, traceExtent } from './image-synth-trace'
import type { PlantedTrace, PreparedTrace } from './image-synth-trace'

export type { PlantedTrace } from './image-synth-trace'

/** A synthetic unrolled borehole-wall image (the geometry of ImageRows in sinusoid-detect.ts). */
export interface SynthOptions {
  /** Samples per turn. */
  readonly width: number
  readonly rows: number
  /** Depth (m) of the top edge of row 0. */
  readonly topDepth: number
  /** m per row. */
  readonly rowStep: number
  /** Azimuth (degrees, image reference) of column 0's left edge (default 0). */
  readonly leftAzimuth?: number
  readonly traces: readonly PlantedTrace[]
  readonly seed: number
  /** Standard deviation of the fine speckle, grey units (default 0.03). */
  readonly noise?: number
  /** Amplitude of the rock texture, grey units (default 0.12). */
  readonly texture?: number
  /** Small dark spots per metre of hole (default 30): clutter with sharp edges. */
  readonly spots?: number
}

const BASE_GREY = 0.6
const DEFAULT_NOISE = 0.03
const DEFAULT_TEXTURE = 0.12
const DEFAULT_SPOTS = 30
/** Standard deviation of (u₁ + u₂ − 1) for independent uniforms: √(2/12). */
const TRIANGULAR_SD = Math.sqrt(1 / 6)

/**
 * Value noise at four scales (grains to beds), periodic round the turn; weights sum to 1.
 * Scales are ours, chosen to look like a rock wall at televiewer resolution.
 */
function octaves(seed: number): Octave[] {
  const r = mulberry32(seed)
  const s = () => Math.floor(r() * 4294967296)
  return [
    { depthStep: 0.6, turnNodes: 5, weight: 0.42, seed: s() },
    { depthStep: 0.15, turnNodes: 14, weight: 0.3, seed: s() },
    { depthStep: 0.04, turnNodes: 40, weight: 0.18, seed: s() },
    { depthStep: 0.012, turnNodes: 90, weight: 0.1, seed: s() },
  ]
}

/**
 * Rows [fromRow, toRow) of a synthetic wall image: grey 0..1, row-major, `width` samples a row.
 * Background: smooth value noise at four scales, faint depth banding, fine speckle and small dark
 * spots; each planted trace is a darker band of its thickness along depth(θ) = d₀ + (H/2)·cos(θ −
 * θt), θ the column-centre azimuth, with soft edges, missing over its gap arcs. Every sample is a
 * function of (seed, row, column) alone, so an image rendered in chunks is identical to one
 * rendered whole. A width that is not a positive whole number gives an empty array.
 */
export function renderWallRows(o: SynthOptions, fromRow: number, toRow: number): Float32Array {
  const { width, rowStep, topDepth } = o
  if (!Number.isInteger(width) || width <= 0) return new Float32Array(0)
  const from = Math.max(0, Math.floor(fromRow))
  const to = Math.min(Math.floor(o.rows), Math.floor(toRow))
  const out = new Float32Array(Math.max(0, to - from) * width)
  if (to <= from) return out
  const left = o.leftAzimuth ?? 0
  const texture = o.texture ?? DEFAULT_TEXTURE
  const noise = (o.noise ?? DEFAULT_NOISE) / TRIANGULAR_SD
  const speckleSeed = hashU32(o.seed, 1, 3)
  // A local binding: a bundler's live import binding costs a getter call per pixel.
  const hash = hashU32
  const oct = octaves(o.seed).map((x) => ({ ...x, weight: x.weight * texture }))
  const cols = oct.map((x) => octaveColumns(x, width, left))
  const caches = oct.map(octaveRows)
  const row = new Float64Array(width)
  const scratch = new Float64Array(Math.max(...oct.map((x) => x.turnNodes)))
  const band = mulberry32(hashU32(o.seed, 2, 5))
  const [p1, p2] = [band() * 2 * Math.PI, band() * 2 * Math.PI]
  const top = topDepth + from * rowStep
  const bottom = topDepth + to * rowStep
  const traces = o.traces
    .map((t, i) => ({ t, i, extent: traceExtent(t, rowStep) }))
    .filter(({ extent }) => extent[1] >= top && extent[0] <= bottom)
    .map(({ t, i }) => prepareTrace(t, i, o.seed, width, left, rowStep))
    .sort((a, b) => a.top - b.top)
  let next = 0
  let active: PreparedTrace[] = []
  for (let r = from; r < to; r++) {
    const offset = (r - from) * width
    const depth = topDepth + (r + 0.5) * rowStep
    const banding =
      0.3 *
      texture *
      (0.6 * Math.sin((2 * Math.PI * depth) / 0.37 + p1) +
        0.4 * Math.sin((2 * Math.PI * depth) / 0.113 + p2))
    row.fill(BASE_GREY + banding)
    if (texture !== 0)
      for (let k = 0; k < oct.length; k++)
        addOctaveRow(row, depth, oct[k], cols[k], caches[k], scratch)
    // Traces sorted by their top: each enters the active list once and leaves below its bottom.
    while (next < traces.length && traces[next].top <= depth) active.push(traces[next++])
    if (active.length > 0) active = active.filter((p) => p.bottom >= depth)
    for (const p of active) darkenRow(row, depth, p)
    for (let c = 0; c < width; c++) {
      const h = hash(r, c, speckleSeed)
      const speckle = ((h & 0xffff) + (h >>> 16)) / 65536 - 1
      const v = row[c] + noise * speckle
      out[offset + c] = v < 0 ? 0 : v > 1 ? 1 : v
    }
  }
  darkenSpots(out, o, o.spots ?? DEFAULT_SPOTS, from, to)
  return out
}

/** The whole synthetic image (rows × width, grey 0..1); see renderWallRows. */
export function renderWallImage(o: SynthOptions): Float32Array {
  return renderWallRows(o, 0, o.rows)
}
