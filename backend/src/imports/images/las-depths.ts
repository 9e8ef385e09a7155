import { IMAGE_LIMITS, refuseFile } from './limits'

/**
 * How the file's samples become image rows: row i is centred at firstDepth + i·step (m), its
 * source sample `source[i]` (−1: none within one step). Row i covers centre ± step/2, so the
 * image spans firstDepth − step/2 … firstDepth + (rows − ½)·step.
 */
export interface LasRows {
  rows: number
  step: number
  topDepth: number
  bottomDepth: number
  source: Int32Array
  notes: string[]
}

/**
 * Lays the samples of a depth index (m, strictly monotonic as the LAS reader leaves it) on a
 * regular grid. Regular when every depth lies within half a mean step of its place on the grid:
 * the rows are the samples. Otherwise (a changing step, gaps) every row takes the nearest sample
 * at the median step, and a row with none within one step is left without value. Bottom-up
 * logs are turned over. Linear after one sort of the steps.
 */
export function lasRows(depthsM: Float64Array): LasRows {
  const n = depthsM.length
  const notes: string[] = []
  const up = n > 1 && depthsM[n - 1] < depthsM[0]
  const depth = (i: number) => (up ? depthsM[n - 1 - i] : depthsM[i])
  const at = (i: number) => (up ? n - 1 - i : i)
  if (up) notes.push('Depths decrease down the file: rows turned over, shallowest first.')
  if (n < 2) throw refuseFile('invalid_file', 'The log holds one depth sample: an image needs two.')
  const first = depth(0)
  const mean = (depth(n - 1) - first) / (n - 1)
  let regular = true
  for (let i = 0; i < n && regular; i++)
    regular = Math.abs(depth(i) - (first + i * mean)) <= 0.5 * mean
  if (regular)
    return grid(
      first,
      mean,
      n,
      Int32Array.from({ length: n }, (_, i) => at(i)),
      notes,
    )
  const steps = Float64Array.from({ length: n - 1 }, (_, i) => depth(i + 1) - depth(i)).sort()
  const step = steps[(n - 1) >> 1]
  const rows = Math.round((depth(n - 1) - first) / step) + 1
  if (!(rows <= IMAGE_LIMITS.maxHeight))
    throw refuseFile(
      'image_too_large',
      `Depths ${first}–${depth(n - 1)} m at the median step ${step} m make ${rows} rows: at most ${IMAGE_LIMITS.maxHeight} are read.`,
      undefined,
      413,
    )
  const source = new Int32Array(rows).fill(-1)
  let k = 0
  let empty = 0
  for (let i = 0; i < rows; i++) {
    const t = first + i * step
    while (k + 1 < n && Math.abs(depth(k + 1) - t) <= Math.abs(depth(k) - t)) k++
    // one step, with room for the rounding in the file's decimals
    if (Math.abs(depth(k) - t) <= step * (1 + 1e-6)) source[i] = at(k)
    else empty++
  }
  const mm = (m: number) => +(m * 1000).toPrecision(3)
  notes.push(
    `Depth steps irregular (${mm(steps[0])}–${mm(steps[n - 2])} mm): resampled to the median step ${mm(step)} mm by nearest sample, ${rows} rows${empty ? `, ${empty} without a sample within one step left empty` : ''}.`,
  )
  return grid(first, step, rows, source, notes)
}

function grid(first: number, step: number, rows: number, source: Int32Array, notes: string[]) {
  return {
    rows,
    step,
    // to the nanometre: float noise in the sums is not a depth
    topDepth: +(first - step / 2).toFixed(9),
    bottomDepth: +(first + (rows - 0.5) * step).toFixed(9),
    source,
    notes,
  }
}
