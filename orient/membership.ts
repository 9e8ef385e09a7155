import { DEG2RAD, finite } from './math'
import { lineToVec } from './vector'
import type { Line } from './types'

/** A set defined by its mean and a cone half-angle (degrees). */
export interface SetCone {
  readonly mean: Line
  readonly angle: number
}

/**
 * Index of the cone each line falls in, as axes (angle to the mean = acos|x·m| ≤ cone angle); a
 * line inside two cones goes to the nearer mean; −1 for none (and for invalid lines). Invalid cones
 * contain nothing.
 */
export function setMembership(lines: readonly Line[], cones: readonly SetCone[]): number[] {
  const axes = cones.map((c) =>
    finite(c.mean.trend, c.mean.plunge, c.angle)
      ? { m: lineToVec(c.mean), cos: Math.cos(c.angle * DEG2RAD) }
      : undefined,
  )
  return lines.map((line) => {
    if (!finite(line.trend, line.plunge)) return -1
    const v = lineToVec(line)
    let best = -1
    let bestDot = -Infinity
    axes.forEach((a, i) => {
      if (!a) return
      const d = Math.abs(v[0] * a.m[0] + v[1] * a.m[1] + v[2] * a.m[2])
      if (d >= a.cos - 1e-12 && d > bestDot) {
        best = i
        bestDot = d
      }
    })
    return best
  })
}
