import { DEG2RAD } from './math'
import { mulberry32 } from './random'
import { hashU32 } from './image-synth-noise'

/** A plane's trace drawn on a synthetic wall image (depths in m, azimuths in the image reference). */
export interface PlantedTrace {
  /** Centre depth d₀ (m). */
  readonly depth: number
  /** Peak-to-trough height (m). */
  readonly height: number
  /** Azimuth of the deepest point (degrees). */
  readonly troughAzimuth: number
  /** Fraction by which the band darkens the wall, 0..1 (default 0.5). */
  readonly contrast?: number
  /** Along-hole thickness of the band (m, default 0.008). */
  readonly thickness?: number
  /** Fraction of the turn where the trace is missing, 0..1 (default 0). */
  readonly gaps?: number
}

export const DEFAULT_CONTRAST = 0.5
export const DEFAULT_THICKNESS = 0.008
/** Gap ends fade over this many degrees, as a closing fracture does. */
const GAP_FADE_DEG = 6

/** A trace made ready for one image width: its depth and visibility in every column. */
export interface PreparedTrace {
  readonly centre: Float64Array
  /** Darkening factor per column (contrast × visibility). */
  readonly dark: Float32Array
  readonly half: number
  readonly soft: number
  readonly top: number
  readonly bottom: number
}

/** The depth range a trace can darken (m): for choosing which traces a row range needs. */
export function traceExtent(t: PlantedTrace, rowStep: number): [number, number] {
  const reach = Math.abs(t.height) / 2 + halfAndSoft(t, rowStep).reach
  return [t.depth - reach, t.depth + reach]
}

function halfAndSoft(t: PlantedTrace, rowStep: number) {
  const thickness = Math.max(t.thickness ?? DEFAULT_THICKNESS, 0)
  const half = thickness / 2
  // Soft edges of about a row and a half at least: a sharp step is not what a tool records.
  const soft = Math.max(1.5 * rowStep, 0.3 * thickness)
  return { half, soft, reach: half + soft }
}

/**
 * Per-column depth and darkening of trace number `index`. The gap arcs come from mulberry32
 * seeded by (seed, index), so a trace looks the same in every row range rendered.
 */
export function prepareTrace(
  t: PlantedTrace,
  index: number,
  seed: number,
  width: number,
  leftAzimuth: number,
  rowStep: number,
): PreparedTrace {
  const centre = new Float64Array(width)
  const dark = new Float32Array(width)
  const contrast = Math.min(1, Math.max(0, t.contrast ?? DEFAULT_CONTRAST))
  const gaps = gapArcs(Math.min(1, Math.max(0, t.gaps ?? 0)), mulberry32(hashU32(seed, index, 7)))
  for (let c = 0; c < width; c++) {
    const az = leftAzimuth + ((c + 0.5) * 360) / width
    centre[c] = t.depth + (t.height / 2) * Math.cos((az - t.troughAzimuth) * DEG2RAD)
    dark[c] = contrast * visibility(az, gaps)
  }
  const { half, soft, reach } = halfAndSoft(t, rowStep)
  const [top, bottom] = [
    t.depth - Math.abs(t.height) / 2 - reach,
    t.depth + Math.abs(t.height) / 2 + reach,
  ]
  return { centre, dark, half, soft, top, bottom }
}

/** One to three missing arcs [start, length] (degrees) adding up to `fraction` of the turn. */
function gapArcs(fraction: number, random: () => number): [number, number][] {
  if (fraction <= 0) return []
  if (fraction >= 1) return [[0, 360]]
  const n = 1 + Math.floor(random() * 3)
  const parts = Array.from({ length: n }, () => 0.3 + random())
  const sum = parts.reduce((a, b) => a + b, 0)
  return parts.map((p) => [random() * 360, (p / sum) * fraction * 360])
}

function visibility(az: number, gaps: [number, number][]): number {
  let v = 1
  for (const [start, length] of gaps) {
    if (length >= 360) return 0
    const into = (((az - start) % 360) + 360) % 360
    const fromEdge = Math.min(into, length - into)
    if (into <= length) v = Math.min(v, Math.max(0, 1 - fromEdge / GAP_FADE_DEG))
  }
  return v
}

/** Darkens one row (depth `depth`, m) where the trace's band crosses it. */
export function darkenRow(row: Float64Array, depth: number, p: PreparedTrace): void {
  if (depth < p.top || depth > p.bottom) return
  const edge = p.half + p.soft
  for (let c = 0; c < p.centre.length; c++) {
    const d = Math.abs(depth - p.centre[c])
    if (d >= edge || p.dark[c] === 0) continue
    const f = d <= p.half ? 1 : 0.5 * (1 + Math.cos((Math.PI * (d - p.half)) / p.soft))
    row[c] *= 1 - p.dark[c] * f
  }
}
