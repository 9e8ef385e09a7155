// Lines on the drawn net: orient's unit net scaled to the primitive radius R, with y flipped for
// the screen (north up = −y). Everything the net layers draw goes through these functions.
import { greatCircle, project, smallCircle, unproject } from '../../../../orient/index'
import type { Line, NetProjection, Plane } from '../../../../orient/index'

export type { Line, NetProjection, Plane }

export interface ScreenPoint {
  x: number
  y: number
}

/** Primitive radius and label margin of the net's square viewBox (its user units). */
export const NET_RADIUS = 200
export const NET_MARGIN = 36

export function netViewBox(radius = NET_RADIUS, margin = NET_MARGIN): string {
  const half = radius + margin
  return `${-half} ${-half} ${2 * half} ${2 * half}`
}

/** Screen position of a line on a net of radius R; undefined for an invalid line. */
export function toScreen(line: Line, projection: NetProjection, radius: number) {
  const p = project(line, projection)
  return p ? { x: p.x * radius, y: -p.y * radius } : undefined
}

/** The line under a screen point of the net, or undefined outside the primitive. */
export function fromScreen(point: ScreenPoint, projection: NetProjection, radius: number) {
  return unproject({ x: point.x / radius, y: -point.y / radius }, projection)
}

const f = (v: number) => (Math.round(v * 1000) / 1000).toString()

/** One SVG polyline through lines on the net. */
export function linesPath(lines: readonly Line[], projection: NetProjection, radius: number) {
  let d = ''
  for (const line of lines) {
    const p = toScreen(line, projection, radius)
    if (!p) continue
    d += `${d ? 'L' : 'M'}${f(p.x)},${f(p.y)}`
  }
  return d
}

/** A cone about an axis (a set cone, a confidence cone, the blind zone's edge) as one path. */
export function smallCirclePath(
  axis: Line,
  angle: number,
  projection: NetProjection,
  radius: number,
  steps = 120,
): string {
  const parts = smallCircle(axis, angle, steps) ?? []
  return parts.map((part) => linesPath(part, projection, radius)).join('')
}

export function greatCirclePath(
  plane: Plane,
  projection: NetProjection,
  radius: number,
  steps = 60,
): string {
  return linesPath(greatCircle(plane, steps) ?? [], projection, radius)
}

/**
 * A point mark as a zero-length sub-path, drawn as a dot by a round line cap (SVG 2, "zero-length
 * sub-paths"): `M x,y` names the point, and 20,000 of them stay a short path that paints fast.
 */
export function pointPath(p: ScreenPoint): string {
  return `M${f(p.x)},${f(p.y)}h0`
}

/** A round marker of radius r whose sub-path starts at its centre: `M x,y` names the point. */
export function dotPath(p: ScreenPoint, r: number): string {
  return `M${f(p.x)},${f(p.y)}m${-r},0a${r},${r} 0 1,0 ${2 * r},0a${r},${r} 0 1,0 ${-2 * r},0`
}

/** Azimuth ticks on the primitive: every `step` degrees, longer every 30°. */
export function primitiveTicks(radius: number, step = 10) {
  const ticks: { azimuth: number; x1: number; y1: number; x2: number; y2: number }[] = []
  for (let a = 0; a < 360; a += step) {
    const t = (a * Math.PI) / 180
    const len = a % 30 === 0 ? 9 : 5
    const [s, c] = [Math.sin(t), -Math.cos(t)]
    ticks.push({
      azimuth: a,
      x1: s * radius,
      y1: c * radius,
      x2: s * (radius + len),
      y2: c * (radius + len),
    })
  }
  return ticks
}
