import { DEG2RAD, RAD2DEG, wrap360 } from './math'
import type { EdgeMap } from './sinusoid-detect-edges'
import type { ImageRows } from './sinusoid-detect'
import type { Sinusoid } from './sinusoid-fit'

/** A peak of the coarse accumulator: a sinusoid to refine, with its vote (mean evidence). */
export interface CoarsePeak extends Sinusoid {
  readonly vote: number
}

/** Coarse cell along depth (m): thin bands still light a cell, and the search stays small. */
const COARSE_M = 0.016
/** Columns of the coarse grid (5° each at most): enough to follow a steep trace. */
const COARSE_COLUMNS = 72
/** Additions the accumulator may cost (pairs × coarse rows × coarse columns). */
const BUDGET = 2.5e8

/**
 * Hough-style accumulator over (d₀, a, b) with depth(θ) = d₀ + a·sin θ + b·cos θ (Hough 1962;
 * Duda & Hart 1972 — the method; grid and cell sizes are ours). The evidence image is pooled
 * into coarse cells (COARSE_M along depth × COARSE_COLUMNS round the turn); (a, b) run on a square
 * grid of one coarse cell inside the disc a² + b² ≤ (Hmax/2)², which bounds every trace's depth
 * error by √2/2 of a cell whatever its height or trough azimuth — the (H, θt) grid with phase
 * steps that shrink as H grows (a = (H/2)·sin θt, b = (H/2)·cos θt). Each (a, b) adds the shifted
 * columns into one accumulator row, so the cost is pairs × coarse rows × columns, kept under
 * BUDGET by coarsening the cell for long windows or wide holes. Local maxima over the 3-D
 * neighbourhood, best `limit` first.
 */
export function houghPeaks(
  img: ImageRows,
  edges: EdgeMap,
  maxHeight: number,
  limit: number,
): { peaks: CoarsePeak[]; cellRows: number } {
  const { width, rows } = edges
  const nc = Math.min(width, COARSE_COLUMNS)
  // A trace taller than the window cannot be seen whole: no need to search for it.
  const half = Math.min(maxHeight / 2, rows * img.rowStep)
  let fr = Math.max(1, Math.round(COARSE_M / img.rowStep))
  const cost = (f: number) => Math.PI * (half / (f * img.rowStep) + 1) ** 2 * (rows / f) * nc
  while (cost(fr) > BUDGET && fr < rows) fr++
  const cell = fr * img.rowStep
  const rc = Math.ceil(rows / fr)
  const pooled = pool(edges, fr, nc, rc)
  const radius = half / cell
  const span = Math.floor(radius)
  const side = 2 * span + 1
  const gridIndex = new Int32Array(side * side).fill(-1)
  const pairs: [number, number][] = []
  for (let ia = -span; ia <= span; ia++)
    for (let ib = -span; ib <= span; ib++)
      if (ia * ia + ib * ib <= radius * radius + 1e-9) {
        gridIndex[(ia + span) * side + (ib + span)] = pairs.length
        pairs.push([ia, ib])
      }
  const theta = Array.from({ length: nc }, (_, j) => {
    const mid = (Math.floor((j * width) / nc) + Math.floor(((j + 1) * width) / nc) - 1) / 2
    return (img.leftAzimuth + ((mid + 0.5) * 360) / width) * DEG2RAD
  })
  const acc = new Float32Array(pairs.length * rc)
  for (let p = 0; p < pairs.length; p++) {
    const [ia, ib] = pairs[p]
    const base = p * rc
    for (let j = 0; j < nc; j++) {
      const off = Math.round(ia * Math.sin(theta[j]) + ib * Math.cos(theta[j]))
      const col = j * rc
      const k0 = Math.max(0, -off)
      const k1 = Math.min(rc, rc - off)
      for (let k = k0; k < k1; k++) acc[base + k] += pooled[col + k + off]
    }
  }
  for (let i = 0; i < acc.length; i++) acc[i] /= nc
  const found = localMaxima(acc, rc, pairs, gridIndex, span, side)
  const peaks = found.slice(0, limit).map(({ p, k, vote }) => {
    const [ia, ib] = pairs[p]
    return {
      depth: img.topDepth + (k + 0.5) * cell,
      height: 2 * cell * Math.hypot(ia, ib),
      troughAzimuth: ia === 0 && ib === 0 ? 0 : wrap360(Math.atan2(ia, ib) * RAD2DEG),
      vote,
    }
  })
  return { peaks, cellRows: fr }
}

/** Mean evidence of the observable pixels of each coarse cell (column-major), then [1 2 1]/4 down. */
function pool(edges: EdgeMap, fr: number, nc: number, rc: number): Float32Array {
  const { width, rows, w, observable } = edges
  const sum = new Float64Array(nc * rc)
  const count = new Float64Array(nc * rc)
  for (let r = 0; r < rows; r++) {
    const k = Math.floor(r / fr)
    for (let c = 0; c < width; c++) {
      const i = r * width + c
      if (!observable[i]) continue
      const cellIndex = Math.floor((c * nc) / width) * rc + k
      sum[cellIndex] += w[i]
      count[cellIndex] += 1
    }
  }
  const out = new Float32Array(nc * rc)
  for (let j = 0; j < nc; j++)
    for (let k = 0; k < rc; k++) {
      const at = (kk: number) => {
        const i = j * rc + Math.min(rc - 1, Math.max(0, kk))
        return count[i] > 0 ? sum[i] / count[i] : 0
      }
      out[j * rc + k] = 0.25 * at(k - 1) + 0.5 * at(k) + 0.25 * at(k + 1)
    }
  return out
}

/**
 * Cells at least as high as their 26 neighbours in (a, b, d₀) and the cells two rows up and down
 * (ties go to the earlier cell), above mean + 1 sd of the accumulator; highest first.
 */
function localMaxima(
  acc: Float32Array,
  rc: number,
  pairs: [number, number][],
  gridIndex: Int32Array,
  span: number,
  side: number,
): { p: number; k: number; vote: number }[] {
  let mean = 0
  let sq = 0
  for (let i = 0; i < acc.length; i++) {
    mean += acc[i]
    sq += acc[i] * acc[i]
  }
  mean /= acc.length
  const threshold = mean + Math.sqrt(Math.max(0, sq / acc.length - mean * mean))
  // The up-to-eight (a, b) neighbours of each pair, −1 where off the disc.
  const around = new Int32Array(pairs.length * 8).fill(-1)
  pairs.forEach(([ia, ib], p) => {
    let n = 0
    for (let da = -1; da <= 1; da++)
      for (let db = -1; db <= 1; db++) {
        if (da === 0 && db === 0) continue
        const [a, b] = [ia + da, ib + db]
        if (a >= -span && a <= span && b >= -span && b <= span)
          around[p * 8 + n] = gridIndex[(a + span) * side + (b + span)]
        n++
      }
  })
  // Beaten by another cell: higher, or as high and earlier.
  const beaten = (v: number, self: number, other: number) =>
    acc[other] > v || (acc[other] === v && other < self)
  const out: { p: number; k: number; vote: number }[] = []
  for (let p = 0; p < pairs.length; p++)
    for (let k = 0; k < rc; k++) {
      const self = p * rc + k
      const v = acc[self]
      if (!(v > threshold)) continue
      let peak = true
      for (let dk = -2; dk <= 2 && peak; dk++)
        if (dk !== 0 && k + dk >= 0 && k + dk < rc && beaten(v, self, self + dk)) peak = false
      for (let n = 0; n < 8 && peak; n++) {
        const q = around[p * 8 + n]
        if (q < 0) continue
        for (let dk = -1; dk <= 1 && peak; dk++)
          if (k + dk >= 0 && k + dk < rc && beaten(v, self, q * rc + k + dk)) peak = false
      }
      if (peak) out.push({ p, k, vote: v })
    }
  return out.sort((x, y) => y.vote - x.vote)
}
