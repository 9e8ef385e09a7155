import { DEG2RAD } from './math'
import type { EdgeMap } from './sinusoid-detect-edges'
import type { ImageRows } from './sinusoid-detect'
import type { Sinusoid } from './sinusoid-fit'

/** Half-width (m) of the band about a trace whose evidence counts: bands up to ~20 mm thick. */
const SCORE_HALF_M = 0.011
/** Shifts (m) of a trace that sample the texture's evidence beside it: clear of its own band. */
const BACKGROUND_SHIFTS_M = [0.03, 0.05]
/** A trace is scored over at least this fraction of the turn, however little of it is on view. */
const SEEN_FRACTION = 0.75
/** Columns a trace is followed in, at most: every 2° still fixes a sinusoid well within a row. */
const MAX_COLUMNS = 180

/** An image being searched: its edges, the columns traces are followed in, and taken pixels. */
export interface TraceContext {
  readonly img: ImageRows
  readonly edges: EdgeMap
  /** Pixels an accepted trace has taken (1): no evidence for another. */
  readonly claimed: Uint8Array
  readonly columns: readonly number[]
  /** Centre azimuth of each followed column (degrees, image reference). */
  readonly azimuths: readonly number[]
}

export function traceContext(img: ImageRows, edges: EdgeMap): TraceContext {
  const stride = Math.max(1, Math.ceil(img.width / MAX_COLUMNS))
  const columns: number[] = []
  for (let c = 0; c < img.width; c += stride) columns.push(c)
  const azimuths = columns.map((c) => img.leftAzimuth + ((c + 0.5) * 360) / img.width)
  return { img, edges, claimed: new Uint8Array(img.width * img.rows), columns, azimuths }
}

/**
 * Fractional row of the trace in each followed column (the row whose centre is at its depth):
 * written out rather than through sinusoidDepthAt, as this is the detector's innermost geometry.
 */
export function traceRows(ctx: TraceContext, s: Sinusoid): Float64Array {
  const { img } = ctx
  const out = new Float64Array(ctx.columns.length)
  const half = s.height / 2
  for (let n = 0; n < out.length; n++) {
    const depth = s.depth + half * Math.cos((ctx.azimuths[n] - s.troughAzimuth) * DEG2RAD)
    out[n] = (depth - img.topDepth) / img.rowStep - 0.5
  }
  return out
}

/**
 * Score of a trace, 0..1: its band evidence S (bandEvidence) against the evidence B the same
 * sinusoid finds shifted up and down by BACKGROUND_SHIFTS_M (the median of those four), as
 * (S − B) / (1 − B) — the texture's own edge density is taken out, so the score means much the
 * same on a quiet wall and a busy one. The score never exceeds S, so below `least` it returns 0
 * without sampling the background.
 */
export function traceScore(ctx: TraceContext, s: Sinusoid, least = 0): number {
  const rows = traceRows(ctx, s)
  const own = bandEvidence(ctx, rows, 0)
  if (own < least) return 0
  const shifted = BACKGROUND_SHIFTS_M.flatMap((m) => {
    const k = Math.round(m / ctx.img.rowStep)
    return [bandEvidence(ctx, rows, -k), bandEvidence(ctx, rows, k)]
  }).sort((a, b) => a - b)
  const background = (shifted[1] + shifted[2]) / 2
  return background >= 1 ? 0 : Math.max(0, (own - background) / (1 - background))
}

/** Band evidence S along a trace, an upper bound of its score (a cheap first test). */
export function ownEvidence(ctx: TraceContext, s: Sinusoid): number {
  return bandEvidence(ctx, traceRows(ctx, s), 0)
}

/**
 * Mean band evidence along a trace moved `shift` rows: in each column where it is on the image and
 * observable, the strongest unclaimed evidence within ±SCORE_HALF_M; averaged over those columns,
 * but over no fewer than SEEN_FRACTION of the turn, so a trace largely off the image or in missing
 * data (whose fit rests on a short arc) scores low.
 */
function bandEvidence(ctx: TraceContext, rows: Float64Array, shift: number): number {
  const { img, edges, claimed } = ctx
  const half = Math.max(2, Math.round(SCORE_HALF_M / img.rowStep))
  let sum = 0
  let counted = 0
  for (let n = 0; n < ctx.columns.length; n++) {
    const c = ctx.columns[n]
    const centre = Math.round(rows[n]) + shift
    if (centre < 1 || centre > img.rows - 2 || !edges.observable[centre * img.width + c]) continue
    counted++
    let best = 0
    for (let r = Math.max(1, centre - half); r <= Math.min(img.rows - 2, centre + half); r++) {
      const i = r * img.width + c
      if (!claimed[i] && edges.w[i] > best) best = edges.w[i]
    }
    sum += best
  }
  return sum / Math.max(counted, SEEN_FRACTION * ctx.columns.length)
}

/** Marks the pixels of every column within the scoring band of an accepted trace as taken. */
export function claimTrace(ctx: TraceContext, s: Sinusoid): void {
  const { img, claimed } = ctx
  const half = Math.max(2, Math.round(SCORE_HALF_M / img.rowStep)) + 1
  for (let c = 0; c < img.width; c++) {
    const az = img.leftAzimuth + ((c + 0.5) * 360) / img.width
    const depth = s.depth + (s.height / 2) * Math.cos((az - s.troughAzimuth) * DEG2RAD)
    const centre = Math.round((depth - img.topDepth) / img.rowStep - 0.5)
    for (let r = Math.max(0, centre - half); r <= Math.min(img.rows - 1, centre + half); r++)
      claimed[r * img.width + c] = 1
  }
}
