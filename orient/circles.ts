import { DEG2RAD, acos, finite } from './math'
import { combine, cross, lineToVec, normalise, vecToLine } from './vector'
import type { Line, Plane, Vec3 } from './types'

/**
 * The lower-hemisphere half of a plane's great circle as steps + 1 lines, from one end of the
 * strike through the dip line to the other. A horizontal plane gives the whole primitive
 * (2·steps + 1 lines), so it draws as a closed circle. Undefined for non-finite input.
 */
export function greatCircle(plane: Plane, steps = 90): Line[] | undefined {
  if (!finite(plane.dipDirection, plane.dip, steps)) return undefined
  const n = Math.max(1, Math.floor(steps))
  const dd = plane.dipDirection * DEG2RAD
  const strike: Vec3 = [-Math.cos(dd), Math.sin(dd), 0]
  const dipLine = lineToVec({ trend: plane.dipDirection, plunge: plane.dip })
  const whole = Math.abs(plane.dip) < 1e-9 ? 2 : 1
  const out: Line[] = []
  for (let i = 0; i <= n * whole; i++) {
    const theta = (Math.PI * i) / n
    // The horizontal plane's circle is the primitive: keep it whole, without the lower() flip.
    const v = combine(strike, Math.cos(theta), dipLine, Math.sin(theta))
    out.push(vecToLine(whole === 2 ? [v[0], v[1], 0] : v))
  }
  return out
}

/**
 * Lines at a given angle from an axis (a cone, e.g. a set's confidence or variability cone) as
 * lower-hemisphere polylines. The data are axes, so the part of the circle above the horizontal is
 * drawn by its antipodes: a cone that crosses the primitive comes back as several polylines, each
 * ending exactly on the primitive (the crossing found in closed form). A circle that does not cross
 * is one closed polyline. Angles above 90 are taken as 180 − angle about the opposite axis.
 */
export function smallCircle(axis: Line, angle: number, steps = 180): Line[][] | undefined {
  if (!finite(axis.trend, axis.plunge, angle, steps)) return undefined
  const n = Math.max(3, Math.floor(steps))
  const a = lineToVec(axis)
  const u = normalise(cross(a, [0, 0, 1])) ?? ([1, 0, 0] as Vec3)
  const w = cross(a, u)
  const psi = angle * DEG2RAD
  const at = (theta: number): Vec3 =>
    combine(a, Math.cos(psi), combine(u, Math.cos(theta), w, Math.sin(theta)), Math.sin(psi))
  const thetas = Array.from({ length: n }, (_, i) => (2 * Math.PI * i) / n)
  const points = thetas.map(at)
  const lowerSide = points.map((p) => p[2] <= 0)
  const start = lowerSide.findIndex((l, i) => l !== lowerSide[(i + n - 1) % n])
  const axisOf = (p: Vec3, low: boolean): Line => vecToLine(low ? p : [-p[0], -p[1], -p[2]])
  if (start < 0) {
    const ring = points.map((p) => axisOf(p, lowerSide[0]))
    return [[...ring, ring[0]]]
  }
  // Closed-form crossing of z(theta) = A + B cos(theta) + C sin(theta) = 0 near a linear guess.
  const A = Math.cos(psi) * a[2]
  const B = Math.sin(psi) * u[2]
  const C = Math.sin(psi) * w[2]
  const crossing = (i: number): Vec3 => {
    const j = (i + 1) % n
    const guess = thetas[i] + (points[i][2] / (points[i][2] - points[j][2])) * ((2 * Math.PI) / n)
    const phi = Math.atan2(C, B)
    const delta = acos(-A / Math.hypot(B, C))
    const roots = [phi + delta, phi - delta]
    const gap = (t: number) => Math.abs(Math.atan2(Math.sin(t - guess), Math.cos(t - guess)))
    const p = at(gap(roots[0]) <= gap(roots[1]) ? roots[0] : roots[1])
    return normalise([p[0], p[1], 0]) ?? [p[0], p[1], 0]
  }
  const lines: Line[][] = []
  let low = lowerSide[start]
  let current: Line[] = [axisOf(crossing((start + n - 1) % n), low)]
  for (let k = 0; k < n; k++) {
    const i = (start + k) % n
    current.push(axisOf(points[i], low))
    const next = (i + 1) % n
    if (lowerSide[next] !== low) {
      const c = crossing(i)
      current.push(axisOf(c, low))
      lines.push(current)
      low = lowerSide[next]
      current = [axisOf(c, low)]
    }
  }
  return lines
}
