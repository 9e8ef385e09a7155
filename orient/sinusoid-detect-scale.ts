/** median |g| = 0.6745 σ for a zero-mean normal gradient (half-normal median). */
const HALF_NORMAL_MEDIAN = 0.6745
/** Mean |g| = 0.7979 σ (half-normal mean), for blocks where more than half the samples are flat. */
const HALF_NORMAL_MEAN = 0.7979
/** Rows of one block of the depth-varying texture scale, as a length (m). */
const BLOCK_M = 0.25
const MAX_SAMPLES = 4096

/**
 * The texture's gradient scale σ at every row: estimated robustly per block of BLOCK_M (median
 * |g| / 0.6745; traces are a small share of a block's samples, so they barely move it) and linear
 * between block centres so it has no step at a border. Blocks without data take their nearest
 * neighbour's (not a tiny scale that would make the rows beside them all edges). At least
 * `floor`, and never 0.
 */
export function rowScale(
  g: Float32Array,
  width: number,
  rows: number,
  rowStep: number,
  floor: number,
): Float64Array {
  const blockRows = Math.max(16, Math.round(BLOCK_M / rowStep))
  const blocks = Math.ceil(rows / blockRows)
  const scale = new Float64Array(blocks)
  for (let b = 0; b < blocks; b++)
    scale[b] = blockScale(g, width, b * blockRows, Math.min(rows, (b + 1) * blockRows), floor)
  fillFromNearest(scale, floor)
  const out = new Float64Array(rows)
  for (let r = 0; r < rows; r++) {
    const f = Math.min(blocks - 1, Math.max(0, (r + 0.5) / blockRows - 0.5))
    const b = Math.floor(f)
    out[r] = scale[b] + (scale[Math.min(blocks - 1, b + 1)] - scale[b]) * (f - b)
  }
  return out
}

/** NaN entries take the value of the nearest finite one (all NaN: `fallback`). */
function fillFromNearest(a: Float64Array, fallback: number): void {
  const known: number[] = []
  a.forEach((v, i) => {
    if (!Number.isNaN(v)) known.push(i)
  })
  if (known.length === 0) {
    a.fill(Math.max(fallback, Number.MIN_VALUE))
    return
  }
  let k = 0
  for (let i = 0; i < a.length; i++) {
    while (k + 1 < known.length && Math.abs(known[k + 1] - i) <= Math.abs(known[k] - i)) k++
    if (Number.isNaN(a[i])) a[i] = a[known[k]]
  }
}

/**
 * Texture gradient scale of rows [from, to): median |g| / 0.6745, mean-based if the median is 0;
 * NaN when the block holds no gradient at all.
 */
function blockScale(g: Float32Array, width: number, from: number, to: number, floor: number) {
  const n = (to - from) * width
  const stride = Math.max(1, Math.floor(n / MAX_SAMPLES))
  const sample = new Float64Array(Math.ceil(n / stride))
  let m = 0
  let sum = 0
  for (let i = from * width; i < to * width; i += stride)
    if (!Number.isNaN(g[i])) sum += sample[m++] = Math.abs(g[i])
  if (m === 0) return NaN
  const median = middle(sample.subarray(0, m))
  const mean = sum / m
  const sigma = median > 0 ? median / HALF_NORMAL_MEDIAN : mean / HALF_NORMAL_MEAN
  return Math.max(floor, sigma, Number.MIN_VALUE)
}

/**
 * Each column's median |g| over the whole image ÷ the median of those, kept within [0.5, 2]: an
 * off-centre tool records one side of the hole weaker, and that side's edges count as much.
 */
export function columnGain(g: Float32Array, width: number, rows: number): Float64Array {
  const stride = Math.max(1, Math.floor(rows / 512))
  const medians = new Float64Array(width)
  const sample = new Float64Array(Math.ceil(rows / stride))
  for (let c = 0; c < width; c++) {
    let m = 0
    for (let r = 0; r < rows; r += stride) {
      const v = g[r * width + c]
      if (!Number.isNaN(v)) sample[m++] = Math.abs(v)
    }
    medians[c] = m > 0 ? middle(sample.subarray(0, m)) : NaN
  }
  const positive = medians.filter((x) => x > 0)
  const overall = positive.length > 0 ? middle(positive) : 0
  return medians.map((x) => (overall > 0 && x > 0 ? Math.min(2, Math.max(0.5, x / overall)) : 1))
}

/** Median (upper for an even count; 0 when empty) by quickselect (Hoare 1961), reordering `a`. */
export function middle(a: Float64Array): number {
  if (a.length === 0) return 0
  const k = a.length >> 1
  let lo = 0
  let hi = a.length - 1
  while (lo < hi) {
    const pivot = a[(lo + hi) >> 1]
    let i = lo
    let j = hi
    while (i <= j) {
      while (a[i] < pivot) i++
      while (a[j] > pivot) j--
      if (i <= j) {
        const t = a[i]
        a[i++] = a[j]
        a[j--] = t
      }
    }
    if (k <= j) hi = j
    else if (k >= i) lo = i
    else break
  }
  return a[k]
}
