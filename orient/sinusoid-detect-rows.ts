import type { ImageRows } from './sinusoid-detect'

/** Rows finer than this (m) are averaged in groups: the edge scales are set for about 2 mm a row. */
const FINEST_ROW_M = 0.0015
const WORKING_ROW_M = 0.002

/**
 * Means of groups of rows (no-value samples left out) when rows are finer than FINEST_ROW_M: a
 * finer image spreads each edge over more rows while speckle stays per row, so the per-row
 * gradient loses contrast; binning restores it and costs less. Coarser images are returned as
 * they are.
 */
export function binRows(img: ImageRows): ImageRows {
  const k = img.rowStep < FINEST_ROW_M ? Math.round(WORKING_ROW_M / img.rowStep) : 1
  if (k <= 1) return img
  const { width } = img
  const rows = Math.ceil(img.rows / k)
  const values = new Float32Array(rows * width)
  const sum = new Float64Array(width)
  const count = new Uint32Array(width)
  for (let r = 0; r < rows; r++) {
    sum.fill(0)
    count.fill(0)
    for (let rr = r * k; rr < Math.min(img.rows, (r + 1) * k); rr++)
      for (let c = 0; c < width; c++) {
        const v = img.values[rr * width + c]
        if (Number.isFinite(v)) {
          sum[c] += v
          count[c]++
        }
      }
    for (let c = 0; c < width; c++) values[r * width + c] = count[c] > 0 ? sum[c] / count[c] : NaN
  }
  return { ...img, rows, rowStep: img.rowStep * k, values }
}
