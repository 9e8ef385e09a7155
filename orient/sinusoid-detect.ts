import { DEG2RAD, finite } from './math'
import { edgeMap } from './sinusoid-detect-edges'
import { houghPeaks } from './sinusoid-detect-hough'
import { refineTrace, repolish } from './sinusoid-detect-refine'
import { binRows } from './sinusoid-detect-rows'
import { claimTrace, ownEvidence, traceContext, traceScore } from './sinusoid-detect-trace'
import { sinusoidDepthAt, type Sinusoid } from './sinusoid-fit'

/** A window of an unrolled wall image (the geometry of the image tiles, see the image contract). */
export interface ImageRows {
  /** Samples per turn. */
  readonly width: number
  readonly rows: number
  /** Depth (m) of the top edge of row 0. */
  readonly topDepth: number
  /** m per row. */
  readonly rowStep: number
  /** Azimuth (degrees, image reference) of column 0's left edge. */
  readonly leftAzimuth: number
  /** rows × width, row-major, grey; NaN = no value. */
  readonly values: Float32Array
}

export interface DetectOptions {
  /** Borehole diameter (mm): with maxRelativeDip it bounds the trace heights searched. */
  readonly diameter: number
  /** Steepest dip relative to the hole searched (degrees, default 80). */
  readonly maxRelativeDip?: number
  /** At most this many candidates (default 40). */
  readonly maxCandidates?: number
  /** Lowest score returned, 0..1 (default DEFAULT_MIN_SCORE). */
  readonly minScore?: number
}

export interface SinusoidCandidate {
  /** Centre depth d₀ (m). */
  depth: number
  /** Peak-to-trough height (m). */
  height: number
  /** Azimuth of the deepest point (degrees, image reference). */
  troughAzimuth: number
  /** Edge evidence along the trace above the texture's beside it, 0..1 (traceScore): higher is surer. */
  score: number
}

/**
 * Default lowest score: about a trace with clear edges over a third of the turn, or a faint one
 * all round. On our synthetic walls texture and clutter alone stayed below 0.25 and planted traces
 * of contrast 0.3 and more scored above 0.5; to be tuned against real logs.
 */
export const DEFAULT_MIN_SCORE = 0.3
/** Two accepted traces closer than this everywhere round the turn are one trace. */
const SAME_TRACE_M = 0.01
/** A refined trace may come out this much taller than the search bound before it is dropped. */
const HEIGHT_SLACK = 1.02

/**
 * Sinusoids on an unrolled borehole-wall image, best first. Edge evidence from the depth
 * gradient (sinusoid-detect-edges), a Hough-style accumulator over (d₀, H, θt) with non-maximum
 * suppression (Hough 1962; Duda & Hart 1972 — methods; parameters ours), each peak refined by
 * least squares on the edge points near its trace. Peaks are then taken best first and each
 * accepted trace claims its pixels, so a strong trace's echoes (sinusoids sharing part of it) lose
 * their support and fall below minScore. Rows finer than 1.5 mm are binned to about 2 mm first.
 * Never throws: a blank, constant or unreadable image gives []. Cost: linear in pixels, plus the
 * accumulator (bounded, see houghPeaks), plus at most max(200, 8 × maxCandidates) refinements.
 */
export function detectSinusoids(img: ImageRows, options: DetectOptions): SinusoidCandidate[] {
  const { width, rows, topDepth, rowStep, leftAzimuth } = img
  const { diameter } = options
  if (!finite(width, rows, topDepth, rowStep, leftAzimuth, diameter)) return []
  if (!(width >= 8 && rows >= 8 && rowStep > 0 && diameter > 0)) return []
  if (!Number.isInteger(width) || !Number.isInteger(rows)) return []
  if (!(img.values instanceof Float32Array) || img.values.length < width * rows) return []
  const maxDip = Math.min(89, Math.max(0, options.maxRelativeDip ?? 80))
  const maxCandidates = Math.max(0, Math.floor(options.maxCandidates ?? 40))
  const minScore = Math.min(1, Math.max(0, options.minScore ?? DEFAULT_MIN_SCORE))
  if (maxCandidates === 0) return []
  const maxHeight = (diameter / 1000) * Math.tan(maxDip * DEG2RAD)
  return detectOn(binRows(img), maxHeight, maxCandidates, minScore)
}

/** Edges, accumulator peaks, refinement, then greedy acceptance with claims (see above). */
function detectOn(
  img: ImageRows,
  maxHeight: number,
  maxCandidates: number,
  minScore: number,
): SinusoidCandidate[] {
  const edges = edgeMap(img)
  if (!edges) return []
  const { peaks, cellRows } = houghPeaks(img, edges, maxHeight, Math.max(200, 8 * maxCandidates))
  const ctx = traceContext(img, edges)
  const refined: { s: Sinusoid; score: number }[] = []
  const cell = cellRows * img.rowStep
  for (const peak of peaks) {
    // A peak lying along a trace already refined is one of its echoes: it would refine to it.
    if (refined.some((r) => sameTrace(r.s, peak, cell))) continue
    const s = refineTrace(
      ctx,
      peak,
      cellRows,
      (first) =>
        ownEvidence(ctx, first) >= minScore / 2 &&
        !refined.some((r) => sameTrace(r.s, first, SAME_TRACE_M)),
    )
    if (!s || s.height > maxHeight * HEIGHT_SLACK) continue
    const score = traceScore(ctx, s, minScore)
    if (score >= minScore) refined.push({ s, score })
  }
  refined.sort((a, b) => b.score - a.score)
  const accepted: SinusoidCandidate[] = []
  for (const first of refined) {
    // Fitted and scored again without the pixels earlier (stronger) traces took: a faint trace
    // that touches a strong one must not borrow its edges.
    const s = repolish(ctx, first.s)
    if (!s || accepted.some((a) => sameTrace(a, s, SAME_TRACE_M))) continue
    const score = traceScore(ctx, s)
    if (score < minScore) continue
    claimTrace(ctx, s)
    accepted.push({ depth: s.depth, height: s.height, troughAzimuth: s.troughAzimuth, score })
    if (accepted.length >= maxCandidates) break
  }
  return accepted.sort((a, b) => b.score - a.score)
}

/** True when two traces are within `tolerance` (m) of each other all round the turn. */
function sameTrace(a: Sinusoid, b: Sinusoid, tolerance: number): boolean {
  if (Math.abs(a.depth - b.depth) > tolerance) return false
  for (let az = 0; az < 360; az += 10)
    if (Math.abs(sinusoidDepthAt(a, az) - sinusoidDepthAt(b, az)) > tolerance) return false
  return true
}
