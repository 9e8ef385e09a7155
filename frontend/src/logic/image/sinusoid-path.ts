// Sinusoids and points on the unrolled wall in screen terms: x across the turn (image azimuth 0 at
// the left edge, 360 at the right, clockwise looking down-hole), y down the shared depth scale.
import type { TracePoint } from '../../api/images'
import type { DrawnSinusoid } from './image-types'

const DEG = Math.PI / 180

/** The wall's screen scales: `width` px per turn, depth → y through the view's domain. */
export interface WallScale {
  width: number
  height: number
  domain: readonly [number, number]
}

export const wrapAzimuth = (a: number) => ((a % 360) + 360) % 360

export const depthToY = (s: WallScale, depth: number) =>
  ((depth - s.domain[0]) / (s.domain[1] - s.domain[0])) * s.height

export const yToDepth = (s: WallScale, y: number) =>
  s.domain[0] + (y / s.height) * (s.domain[1] - s.domain[0])

export const azimuthToX = (s: WallScale, azimuth: number) => (wrapAzimuth(azimuth) / 360) * s.width

export const xToAzimuth = (s: WallScale, x: number) => wrapAzimuth((x / s.width) * 360)

/** Depth of the trace at image azimuth θ: d + (H/2)·cos(θ − θtrough) (STANDARDS.md, unrolled image). */
export const traceDepth = (
  s: Pick<DrawnSinusoid, 'depth' | 'height' | 'troughAzimuth'>,
  az: number,
) => s.depth + (s.height / 2) * Math.cos((az - s.troughAzimuth) * DEG)

/** Whether any of the trace lies within the view's depths. */
export const inView = (sc: WallScale, s: DrawnSinusoid) =>
  s.depth + Math.abs(s.height) / 2 >= sc.domain[0] &&
  s.depth - Math.abs(s.height) / 2 <= sc.domain[1]

/**
 * Screen points along the trace from x = 0 to x = width, every `stepPx` px: one unbroken line
 * across the turn, as the cosine is periodic the ends meet at the 0/360 seam at the same depth.
 */
export function sinusoidPoints(sc: WallScale, s: DrawnSinusoid, stepPx = 3): Float32Array {
  const n = Math.max(8, Math.ceil(sc.width / stepPx))
  const out = new Float32Array((n + 1) * 2)
  // depthToY(traceDepth(…)) with its constants taken out of the loop (a hot path while scrolling).
  const perMetre = sc.height / (sc.domain[1] - sc.domain[0])
  const y0 = (s.depth - sc.domain[0]) * perMetre
  const amp = (s.height / 2) * perMetre
  for (let i = 0; i <= n; i++) {
    out[2 * i] = (i / n) * sc.width
    out[2 * i + 1] = y0 + amp * Math.cos(((i / n) * 360 - s.troughAzimuth) * DEG)
  }
  return out
}

/** The same points as an SVG path (for exports and tests). */
export function sinusoidPath(sc: WallScale, s: DrawnSinusoid, stepPx = 3): string {
  const p = sinusoidPoints(sc, s, stepPx)
  let d = ''
  for (let i = 0; i < p.length; i += 2)
    d += `${i ? 'L' : 'M'}${p[i].toFixed(1)},${p[i + 1].toFixed(1)}`
  return d
}

/** Where the trace is shallowest on screen (the peak), for its label. */
export function peakOf(sc: WallScale, s: DrawnSinusoid): { x: number; y: number } {
  const az = wrapAzimuth(s.troughAzimuth + (s.height >= 0 ? 180 : 0))
  return { x: azimuthToX(sc, az), y: depthToY(sc, s.depth - Math.abs(s.height) / 2) }
}

/**
 * Screen distance from (x, y) to the trace: the nearest of its points within `tolerance` px
 * across (x wraps, the trace is periodic); Infinity when none is that close.
 */
export function distanceToSinusoid(
  sc: WallScale,
  s: DrawnSinusoid,
  x: number,
  y: number,
  tolerance: number,
): number {
  let best = Infinity
  for (let dx = -tolerance; dx <= tolerance; dx += 0.5) {
    const ty = depthToY(sc, traceDepth(s, ((x + dx) / sc.width) * 360))
    best = Math.min(best, Math.hypot(dx, ty - y))
  }
  return best <= tolerance ? best : Infinity
}

/** Key of the trace nearest (x, y) within `tolerance` px, selected ones first on a tie. */
export function hitSinusoid(
  sc: WallScale,
  list: readonly DrawnSinusoid[],
  x: number,
  y: number,
  tolerance = 6,
): string | null {
  let best: { key: string; d: number } | null = null
  for (const s of list) {
    if (!inView(sc, s)) continue
    const d = distanceToSinusoid(sc, s, x, y, tolerance) - (s.selected ? 0.5 : 0)
    if (d < (best?.d ?? Infinity)) best = { key: s.key, d }
  }
  return best?.key ?? null
}

/** Index of the point handle under (x, y) within `tolerance` px (across the seam too), or -1. */
export function hitPoint(
  sc: WallScale,
  points: readonly TracePoint[],
  x: number,
  y: number,
  tolerance = 7,
): number {
  let best = -1
  let bestD = tolerance
  points.forEach((p, i) => {
    const dx = Math.abs(azimuthToX(sc, p.azimuth) - x)
    const d = Math.hypot(Math.min(dx, sc.width - dx), depthToY(sc, p.depth) - y)
    if (d <= bestD) {
      best = i
      bestD = d
    }
  })
  return best
}
