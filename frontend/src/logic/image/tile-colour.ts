// One tile of samples to RGBA pixels under a contrast: done once per tile and display setting,
// after which drawing the tile is a drawImage call.
import { LUT_SIZE } from './colour-maps'
import { WINDOW_SPREAD, type SampleFormat } from './contrast'

export interface TileSamples {
  samples: Uint8Array | Uint16Array
  width: number
  rows: number
}

/** Static: per channel, the raw values drawn at the two ends of the map. */
export interface StaticStretch {
  kind: 'static'
  cuts: readonly (readonly [number, number])[]
}

/** Window: per row and channel, [mean, sd] of the rows around it (windowMoments). */
export interface WindowStretch {
  kind: 'window'
  moments: Float32Array
}

export type Stretch = StaticStretch | WindowStretch

/** Packed RGBA, as colourLut gives it; 0 is a transparent pixel (no value). */
const TRANSPARENT = 0

const level = (t: number) => (t <= 0 ? 0 : t >= 1 ? LUT_SIZE - 1 : (t * (LUT_SIZE - 1) + 0.5) | 0)

/**
 * The tile as packed RGBA pixels (a Uint32Array over an ImageData's bytes): grey images through
 * the colour map `lut`, RGB images each channel stretched on its own (true colour). No-value
 * samples come out transparent.
 */
export function colourTile(
  tile: TileSamples,
  fmt: SampleFormat,
  stretch: Stretch,
  lut: Uint32Array,
): Uint32Array<ArrayBuffer> {
  const out = new Uint32Array(tile.width * tile.rows)
  if (stretch.kind === 'static') colourStatic(tile, fmt, stretch, lut, out)
  else colourWindow(tile, fmt, stretch, lut, out)
  return out
}

const tables = new Map<string, Uint8Array>()

/**
 * A table from every raw value to its 8-bit level, so each sample is two reads. The last few are
 * kept: every tile of a view shares its cuts.
 */
function levelTable(bits: 8 | 16, [lo, hi]: readonly [number, number]): Uint8Array {
  const key = `${bits}:${lo}:${hi}`
  const hit = tables.get(key)
  if (hit) return hit
  const table = new Uint8Array(bits === 8 ? 256 : 65536)
  const span = Math.max(1e-9, hi - lo)
  for (let v = 0; v < table.length; v++) table[v] = level((v - lo) / span)
  if (tables.size >= 8) tables.delete(tables.keys().next().value as string)
  tables.set(key, table)
  return table
}

function colourStatic(
  { samples, width, rows }: TileSamples,
  fmt: SampleFormat,
  { cuts }: StaticStretch,
  lut: Uint32Array,
  out: Uint32Array,
) {
  const n = width * rows
  if (fmt.channels === 1) {
    const table = levelTable(fmt.sampleBits, cuts[0] ?? [0, 2 ** fmt.sampleBits - 1])
    for (let i = 0; i < n; i++) {
      const v = samples[i]
      out[i] = fmt.nullZero && v === 0 ? TRANSPARENT : lut[table[v]]
    }
    return
  }
  const tables = [0, 1, 2].map((c) =>
    levelTable(fmt.sampleBits, cuts[c] ?? [0, 2 ** fmt.sampleBits - 1]),
  )
  for (let i = 0, j = 0; i < n; i++, j += 3) {
    const r = tables[0][samples[j]]
    const g = tables[1][samples[j + 1]]
    const b = tables[2][samples[j + 2]]
    out[i] = ((255 << 24) | (b << 16) | (g << 8) | r) >>> 0
  }
}

function colourWindow(
  { samples, width, rows }: TileSamples,
  fmt: SampleFormat,
  { moments }: WindowStretch,
  lut: Uint32Array,
  out: Uint32Array,
) {
  const ch = fmt.channels
  // t = 0.5 + (v − mean) / (2·SPREAD·sd): the mean mid-map, ±SPREAD sd at its ends.
  const scale = new Float64Array(ch)
  const offset = new Float64Array(ch)
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < ch; c++) {
      const mean = moments[(r * ch + c) * 2]
      const sd = moments[(r * ch + c) * 2 + 1]
      scale[c] = sd > 0 ? 1 / (2 * WINDOW_SPREAD * sd) : 0
      offset[c] = 0.5 - mean * scale[c]
    }
    for (let x = 0; x < width; x++) {
      const i = r * width + x
      const j = i * ch
      if (ch === 1) {
        const v = samples[j]
        out[i] = fmt.nullZero && v === 0 ? TRANSPARENT : lut[level(v * scale[0] + offset[0])]
      } else {
        const r8 = level(samples[j] * scale[0] + offset[0])
        const g8 = level(samples[j + 1] * scale[1] + offset[1])
        const b8 = level(samples[j + 2] * scale[2] + offset[2])
        out[i] = ((255 << 24) | (b8 << 16) | (g8 << 8) | r8) >>> 0
      }
    }
  }
}
