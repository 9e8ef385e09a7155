// Contrast from the samples themselves: a percentile stretch from the histogram of what is shown
// (static), or each row scaled by the mean and spread of the rows around it (moving window).
// Values are the raw stored samples: for LAS arrays the map to physical values is linear and
// increasing, so cuts and spreads keep their meaning, and 0 is no value there.

/** What the contrast code needs to know of an image's samples. */
export interface SampleFormat {
  channels: number
  sampleBits: 8 | 16
  /** LAS arrays: a stored 0 means no value, left out of every statistic and drawn transparent. */
  nullZero: boolean
}

/** Histogram bins per channel: one per level for 8-bit samples, 16 levels per bin for 16-bit. */
export const binsOf = (bits: 8 | 16) => (bits === 8 ? 256 : 4096)
const shiftOf = (bits: 8 | 16) => (bits === 8 ? 0 : 4)

/**
 * Adds rows [fromRow, toRow) of a tile (`width` samples per row, channels interleaved) to `into`,
 * one histogram per channel laid end to end.
 */
export function addHistogram(
  into: Uint32Array,
  samples: Uint8Array | Uint16Array,
  width: number,
  fmt: SampleFormat,
  fromRow: number,
  toRow: number,
): void {
  const { channels, nullZero } = fmt
  const bins = binsOf(fmt.sampleBits)
  const shift = shiftOf(fmt.sampleBits)
  const end = Math.min(samples.length, toRow * width * channels)
  for (let i = Math.max(0, fromRow * width * channels); i < end; i += channels) {
    for (let c = 0; c < channels; c++) {
      const v = samples[i + c]
      if (nullZero && v === 0) continue
      into[c * bins + (v >> shift)]++
    }
  }
}

/**
 * Per channel, the raw sample values at the `low` and `high` percentiles (0–100) of the
 * histogram: the lower edge of the bin where the count first reaches low %, the upper edge of the
 * bin where it reaches high %. Undefined for a channel with no samples.
 */
export function percentileCuts(
  histogram: Uint32Array,
  fmt: SampleFormat,
  low: number,
  high: number,
): ([number, number] | undefined)[] {
  const bins = binsOf(fmt.sampleBits)
  const width = 2 ** shiftOf(fmt.sampleBits)
  const lo = Math.max(0, Math.min(100, Math.min(low, high)))
  const hi = Math.max(0, Math.min(100, Math.max(low, high)))
  return Array.from({ length: fmt.channels }, (_, c) => {
    const h = histogram.subarray(c * bins, (c + 1) * bins)
    let total = 0
    for (const n of h) total += n
    if (total === 0) return undefined
    const at = (p: number, upper: boolean) => {
      const target = (p / 100) * total
      let run = 0
      for (let b = 0; b < bins; b++) {
        run += h[b]
        if (h[b] > 0 && run >= target) return (b + (upper ? 1 : 0)) * width - (upper ? 1 : 0)
      }
      return bins * width - 1
    }
    const a = at(lo, false)
    const b = Math.max(at(hi, true), a + 1)
    return [a, b] as [number, number]
  })
}

/** Per row and channel: [count, sum, sum of squares] of the samples that have a value. */
export function rowStats(
  samples: Uint8Array | Uint16Array,
  width: number,
  rows: number,
  fmt: SampleFormat,
): Float64Array {
  const { channels, nullZero } = fmt
  const out = new Float64Array(rows * channels * 3)
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < channels; c++) {
      let n = 0
      let s = 0
      let ss = 0
      for (let i = r * width * channels + c, e = i + width * channels; i < e; i += channels) {
        const v = samples[i]
        if (nullZero && v === 0) continue
        n++
        s += v
        ss += v * v
      }
      const o = (r * channels + c) * 3
      out[o] = n
      out[o + 1] = s
      out[o + 2] = ss
    }
  }
  return out
}

/**
 * Mean and standard deviation of the rows within ±half rows of each row in [from, to), per
 * channel, from `stats` (rowStats laid end to end for rows extFirst … ; rows not loaded are zeros
 * and simply count for nothing). Returns [mean, sd] pairs, row-major then channel.
 */
export function windowMoments(
  stats: Float64Array,
  extFirst: number,
  channels: number,
  from: number,
  to: number,
  half: number,
): Float32Array {
  const extRows = stats.length / (channels * 3)
  const out = new Float32Array((to - from) * channels * 2)
  // Prefix sums over the extended rows: a window is then two reads, whatever its length.
  const prefix = new Float64Array((extRows + 1) * channels * 3)
  for (let r = 0; r < extRows; r++)
    for (let k = 0; k < channels * 3; k++)
      prefix[(r + 1) * channels * 3 + k] =
        prefix[r * channels * 3 + k] + stats[r * channels * 3 + k]
  for (let row = from; row < to; row++) {
    const a = Math.max(0, row - half - extFirst)
    const b = Math.min(extRows, row + half + 1 - extFirst)
    for (let c = 0; c < channels; c++) {
      const o = (k: number) =>
        prefix[b * channels * 3 + c * 3 + k] - prefix[a * channels * 3 + c * 3 + k]
      const n = o(0)
      const mean = n > 0 ? o(1) / n : 0
      const variance = n > 0 ? Math.max(0, o(2) / n - mean * mean) : 0
      out[((row - from) * channels + c) * 2] = mean
      out[((row - from) * channels + c) * 2 + 1] = Math.sqrt(variance)
    }
  }
  return out
}

/** Standard deviations each side of the window mean that span the colour map in window contrast. */
export const WINDOW_SPREAD = 2

/** Rows of level-step `step` (m) in half a window of `windowM` metres (at least 1). */
export const windowHalfRows = (windowM: number, step: number) =>
  Math.max(1, Math.round(windowM / 2 / step))
