import { fitSinusoid, type Sinusoid, type TracePoint } from './sinusoid-fit'
import { middle } from './sinusoid-detect-scale'
import { traceRows, type TraceContext } from './sinusoid-detect-trace'

/** How far (m) the other edge of a band is looked for: bands up to about this thick. */
const PAIR_M = 0.025
/** Points further than this many robust standard deviations from a fit are dropped (refit). */
const OUTLIER_SIGMA = 3
/** A trace needs points in this fraction of the columns (partial traces pass, specks do not). */
const MIN_COLUMN_FRACTION = 0.15
/** A point whose edge is under this fraction of the median edge of the trace's points is dropped. */
const WEAK_EDGE = 0.5
/** Half-width (rows) of the last refinement window. */
const FINAL_HALF_ROWS = 3

/**
 * Least-squares refinement of a coarse peak on the edge points near its trace, in a window that
 * shrinks from the coarse cell (`coarseRows`) to a few rows; each fit drops outliers and fits again
 * (fitSinusoid). Undefined when too few columns hold evidence, or when `keep` turns down the
 * first fit (the caller's cheap test, so texture peaks cost one pass, not three).
 */
export function refineTrace(
  ctx: TraceContext,
  start: Sinusoid,
  coarseRows: number,
  keep: (first: Sinusoid) => boolean = () => true,
): Sinusoid | undefined {
  const first = robustFit(ctx, points(ctx, start, 1.2 * coarseRows + 2, false))
  if (!first || !keep(first)) return undefined
  return refineIn(ctx, first, [Math.max(3, 0.5 * coarseRows), FINAL_HALF_ROWS])
}

/** A refined trace fitted again in the final window, without the pixels other traces took. */
export function repolish(ctx: TraceContext, s: Sinusoid): Sinusoid | undefined {
  return refineIn(ctx, s, [FINAL_HALF_ROWS + 1, FINAL_HALF_ROWS])
}

function refineIn(ctx: TraceContext, start: Sinusoid, halves: number[]): Sinusoid | undefined {
  let s: Sinusoid | undefined = start
  for (const half of halves) {
    s = robustFit(ctx, points(ctx, s, half, true))
    if (!s) return undefined
  }
  return s
}

/**
 * One point a column: the strongest unclaimed edge within ±half rows of the trace, and (with
 * `pair`), when an edge of the other sign at least half as strong lies within PAIR_M, the
 * midpoint of the two — the centre of a band, whichever edge happened to be stronger in that
 * column. A lone edge (a contact between two rocks) is its own trace. The first, coarse pass
 * skips the pairing: its fit only has to bring the trace within a band's width. Edges much
 * weaker than the trace's typical one (WEAK_EDGE) are texture found in its gaps, and dropped.
 */
function points(ctx: TraceContext, s: Sinusoid, half: number, pair: boolean): TracePoint[] {
  const { img, edges } = ctx
  const { width, z } = edges
  const reach = Math.max(2, Math.round(PAIR_M / img.rowStep))
  const out: TracePoint[] = []
  const strength: number[] = []
  const rows = traceRows(ctx, s)
  for (let n = 0; n < ctx.columns.length; n++) {
    const c = ctx.columns[n]
    const best = strongest(ctx, c, Math.ceil(rows[n] - half), Math.floor(rows[n] + half), 0, 0)
    if (best < 0) continue
    const zb = z[best * width + c]
    let row = subRow(z, width, c, best)
    const other = pair
      ? strongest(ctx, c, best - reach, best + reach, -Math.sign(zb), Math.abs(zb) / 2)
      : -1
    if (other >= 0) row = (row + subRow(z, width, c, other)) / 2
    out.push({ depth: img.topDepth + (row + 0.5) * img.rowStep, azimuth: ctx.azimuths[n] })
    strength.push(Math.abs(zb))
  }
  const floor = WEAK_EDGE * middle(Float64Array.from(strength))
  return out.filter((_, i) => strength[i] >= floor)
}

/**
 * Row of the largest unclaimed |z| with evidence in rows [from, to] of column c, of the given sign
 * (0: either) and stronger than `least`; −1 if none.
 */
function strongest(
  ctx: TraceContext,
  c: number,
  from: number,
  to: number,
  sign: number,
  least: number,
): number {
  const { edges, claimed, img } = ctx
  let best = -1
  let bestZ = least
  for (let r = Math.max(1, from); r <= Math.min(img.rows - 2, to); r++) {
    const i = r * edges.width + c
    const v = edges.z[i]
    if (claimed[i] || edges.w[i] === 0 || (sign !== 0 && v * sign <= 0)) continue
    if (Math.abs(v) > bestZ) [best, bestZ] = [r, Math.abs(v)]
  }
  return best
}

/** Parabola through a peak of |z| and its two neighbours: the edge's sub-row position. */
function subRow(z: Float32Array, width: number, c: number, r: number): number {
  const a = Math.abs(z[(r - 1) * width + c])
  const y = Math.abs(z[r * width + c])
  const b = Math.abs(z[(r + 1) * width + c])
  const curve = a - 2 * y + b
  return curve < 0 ? r + Math.max(-0.5, Math.min(0.5, (a - b) / (2 * curve))) : r
}

/**
 * fitSinusoid, then twice: drop the points further from the fit than OUTLIER_SIGMA robust standard
 * deviations (1.4826 × median |residual|, the normal-consistent median absolute deviation [common
 * practice]) or one row, whichever is wider, and fit again. The median keeps a partial trace's
 * own points in charge of the cut, where an rms would be widened by stray edges in its gaps.
 */
function robustFit(ctx: TraceContext, pts: TracePoint[]): Sinusoid | undefined {
  const need = Math.max(6, MIN_COLUMN_FRACTION * ctx.columns.length)
  if (pts.length < need) return undefined
  let fit = fitSinusoid(pts)
  let kept = pts
  for (let round = 0; round < 2 && fit; round++) {
    const res = fit.residuals
    const sigma = 1.4826 * middle(Float64Array.from(res, Math.abs))
    const cut = Math.max(OUTLIER_SIGMA * sigma, ctx.img.rowStep)
    const next = kept.filter((_, i) => Math.abs(res[i]) <= cut)
    if (next.length === kept.length || next.length < need) break
    kept = next
    fit = fitSinusoid(kept)
  }
  return fit
}
