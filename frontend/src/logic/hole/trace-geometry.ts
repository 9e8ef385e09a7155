// The desurveyed trace in the two views of the Survey tab: plan (east, north) and a vertical section
// along the hole's mean azimuth. Geometry from orient (minimum curvature), the same as the server.
import { scaleLinear, type ScaleLinear } from 'd3'
import { desurvey, doglegs, prepareSurvey, type Dogleg } from '../../../../orient/index'

export interface TraceStation {
  depth: number
  /** True-north azimuth and plunge (positive down), as stored. */
  azimuth: number
  plunge: number
}

export interface TracePoint {
  depth: number
  east: number
  north: number
  /** Metres below the collar. */
  down: number
}

export interface Trace {
  /** The path, sampled along the minimum-curvature arcs between stations, from the collar. */
  path: TracePoint[]
  /** One point per valid station. */
  stations: TracePoint[]
  /** Azimuth of the vertical section: the mean of the station directions in plan. */
  sectionAzimuth: number
}

const SAMPLES = 240

/** Mean azimuth of the stations as unit vectors in plan, weighted by their horizontal part. */
export function meanAzimuth(stations: readonly TraceStation[]): number {
  let e = 0
  let n = 0
  for (const s of stations) {
    const h = Math.cos((s.plunge * Math.PI) / 180)
    e += h * Math.sin((s.azimuth * Math.PI) / 180)
    n += h * Math.cos((s.azimuth * Math.PI) / 180)
  }
  if (Math.hypot(e, n) < 1e-9) return 0
  return ((Math.atan2(e, n) * 180) / Math.PI + 360) % 360
}

export function buildTrace(stations: readonly TraceStation[]): Trace {
  const points = desurvey(stations)
  if (points.length === 0) return { path: [], stations: [], sectionAzimuth: 0 }
  const survey = prepareSurvey(stations)
  const last = points[points.length - 1]!.depth
  const path: TracePoint[] = [{ depth: 0, east: 0, north: 0, down: 0 }]
  for (let i = 1; i <= SAMPLES; i++) {
    const depth = (last * i) / SAMPLES
    const at = survey.positionAt(depth)
    if (at) path.push({ depth, ...at })
  }
  return { path, stations: points, sectionAzimuth: meanAzimuth(stations) }
}

/** Horizontal distance of a point along the section azimuth (m from the collar). */
export function alongSection(p: { east: number; north: number }, azimuth: number): number {
  const a = (azimuth * Math.PI) / 180
  return p.east * Math.sin(a) + p.north * Math.cos(a)
}

/** Dogleg severity (°/30 m) above which a segment is flagged in the table. */
export const DOGLEG_LIMIT = 3

export interface DoglegRow extends Dogleg {
  unusual: boolean
}

export function doglegRows(stations: readonly TraceStation[]): DoglegRow[] {
  return doglegs(stations).map((d) => ({ ...d, unusual: d.severity > DOGLEG_LIMIT }))
}

export interface Frame {
  x: ScaleLinear<number, number>
  y: ScaleLinear<number, number>
}

/**
 * Scales with the same metres per pixel on both axes (an inclined hole must look inclined), the
 * data centred in the plot area; y grows upward on screen.
 */
export function equalFrame(
  xs: readonly number[],
  ys: readonly number[],
  size: { width: number; height: number; margin: number },
): Frame {
  const pad = (lo: number, hi: number) => {
    const span = Math.max(hi - lo, 10)
    const mid = (lo + hi) / 2
    return [mid - span * 0.55, mid + span * 0.55] as const
  }
  const [x0, x1] = pad(Math.min(...xs), Math.max(...xs))
  const [y0, y1] = pad(Math.min(...ys), Math.max(...ys))
  const w = size.width - 2 * size.margin
  const h = size.height - 2 * size.margin
  const perPixel = Math.max((x1 - x0) / w, (y1 - y0) / h)
  const cx = (x0 + x1) / 2
  const cy = (y0 + y1) / 2
  const halfW = (w * perPixel) / 2
  const halfH = (h * perPixel) / 2
  return {
    x: scaleLinear()
      .domain([cx - halfW, cx + halfW])
      .range([size.margin, size.width - size.margin]),
    y: scaleLinear()
      .domain([cy - halfH, cy + halfH])
      .range([size.height - size.margin, size.margin]),
  }
}
