import { describe, expect, it } from 'vitest'
import {
  azimuthToX,
  depthToY,
  distanceToSinusoid,
  hitPoint,
  hitSinusoid,
  peakOf,
  sinusoidPath,
  sinusoidPoints,
  traceDepth,
  xToAzimuth,
} from '../../frontend/src/logic/image/sinusoid-path'
import type { DrawnSinusoid } from '../../frontend/src/logic/image/image-types'

// 360 px per turn (1 px per degree), 100 m → 101 m on 1000 px (1 mm per px).
const sc = { width: 360, height: 1000, domain: [100, 101] as [number, number] }
const s = (extra: Partial<DrawnSinusoid> = {}): DrawnSinusoid => ({
  key: 'a',
  depth: 100.5,
  height: 0.2,
  troughAzimuth: 90,
  role: 'pick',
  ...extra,
})

describe('sinusoid paths', () => {
  it('traceDepth() = d + (H/2)·cos(θ − θt): deepest at the trough, shallowest opposite (STANDARDS.md)', () => {
    expect(traceDepth(s(), 90)).toBeCloseTo(100.6, 12)
    expect(traceDepth(s(), 270)).toBeCloseTo(100.4, 12)
    expect(traceDepth(s(), 0)).toBeCloseTo(100.5, 12)
    expect(traceDepth(s(), 180)).toBeCloseTo(100.5, 12)
  })

  it('sinusoidPoints() runs 0 → width and meets itself at the 0/360 seam', () => {
    const p = sinusoidPoints(sc, s({ troughAzimuth: 10 }), 3)
    expect(p[0]).toBe(0)
    expect(p[p.length - 2]).toBeCloseTo(360, 6)
    // Same depth at both edges: one unbroken trace round the wall.
    expect(p[1]).toBeCloseTo(p[p.length - 1], 4)
    // The trough near the left edge (10°): the deepest point lies at x ≈ 10 px.
    let deepest = 0
    for (let i = 0; i < p.length; i += 2) if (p[i + 1] > p[deepest + 1]) deepest = i
    expect(p[deepest]).toBeGreaterThan(5)
    expect(p[deepest]).toBeLessThan(15)
    expect(p[deepest + 1]).toBeCloseTo(depthToY(sc, 100.6), 0)
  })

  it('sinusoidPath() a trough across the seam (350°) is deep at both edges', () => {
    const d = sinusoidPath(sc, s({ troughAzimuth: 350 }), 30)
    const ys = [...d.matchAll(/[ML]([\d.]+),([\d.]+)/g)].map((m) => Number(m[2]))
    const deep = depthToY(sc, traceDepth(s({ troughAzimuth: 350 }), 0))
    expect(ys[0]).toBeCloseTo(deep, 0)
    expect(ys.at(-1)).toBeCloseTo(deep, 0)
    expect(Math.min(...ys)).toBeCloseTo(depthToY(sc, 100.4), -1)
  })

  it('azimuthToX() / xToAzimuth() wrap into 0…360', () => {
    expect(azimuthToX(sc, 370)).toBeCloseTo(10, 9)
    expect(azimuthToX(sc, -90)).toBeCloseTo(270, 9)
    expect(xToAzimuth(sc, 180)).toBeCloseTo(180, 9)
  })

  it('peakOf() is opposite the trough, H/2 above the centre', () => {
    const p = peakOf(sc, s())
    expect(p.x).toBeCloseTo(270, 9)
    expect(p.y).toBeCloseTo(400, 6)
  })

  it('distanceToSinusoid() and hitSinusoid(): near the line hits, further off does not', () => {
    const on = depthToY(sc, traceDepth(s(), 45))
    expect(distanceToSinusoid(sc, s(), 45, on + 3, 6)).toBeLessThanOrEqual(3)
    expect(distanceToSinusoid(sc, s(), 45, on + 20, 6)).toBe(Infinity)
    const list = [s(), s({ key: 'b', depth: 100.52 })]
    expect(hitSinusoid(sc, list, 0, depthToY(sc, 100.521))).toBe('b')
    expect(hitSinusoid(sc, list, 0, depthToY(sc, 100.9))).toBeNull()
  })

  it('hitSinusoid() finds a trace across the seam: x = 359 next to a point at x = 0', () => {
    const t = s({ troughAzimuth: 0 })
    expect(hitSinusoid(sc, [t], 359.5, depthToY(sc, 100.6))).toBe('a')
  })

  it('hitPoint() measures across the seam too', () => {
    const pts = [
      { depth: 100.3, azimuth: 2 },
      { depth: 100.5, azimuth: 180 },
    ]
    expect(hitPoint(sc, pts, 358, depthToY(sc, 100.3))).toBe(0)
    expect(hitPoint(sc, pts, 181, depthToY(sc, 100.501))).toBe(1)
    expect(hitPoint(sc, pts, 90, depthToY(sc, 100.5))).toBe(-1)
  })
})
