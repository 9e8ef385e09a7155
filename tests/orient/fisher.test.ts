import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { fisherStats, fisherStatsBatch, linesToXyz, poleOf, terzaghiWeight } from '../../orient'
import type { Line } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, fisherSample, seeded, vec } from './sample'

// Harrison & Hudson (2000), Engineering Rock Mechanics part 2, Q/A 7.10 [pub]: hole 136/55 and six
// fractures (dip/dip direction).
const hole = { trend: 136, plunge: 55 }
const fractures = [
  [39, 201],
  [50, 213],
  [63, 215],
  [52, 230],
  [42, 247],
  [28, 253],
].map(([dip, dipDirection]) => ({ dip, dipDirection }))
const poles = fractures.map((p) => poleOf(p)!)

describe('fisherStats()', () => {
  it('fisherStats() direction-cosine sums of the poles (E, N, Down) 2.822, 2.865, 4.116 (Harrison & Hudson 2000, Q/A 7.10)', () => {
    const stats = fisherStats(poles, { axial: false })!
    const m = vec(stats.mean)
    expect(stats.resultant * m[0]).toBeCloseTo(2.822, 3)
    expect(stats.resultant * m[1]).toBeCloseTo(2.865, 3)
    expect(-stats.resultant * m[2]).toBeCloseTo(4.116, 3)
  })

  it('fisherStats() Terzaghi-weighted sums 5.787, 6.834, 7.952 and normalised mean 0.483, 0.571, 0.664 (Harrison & Hudson 2000, Q/A 7.10)', () => {
    // Their weights are uncapped; all six lie below the default cap of 10 anyway.
    const weights = fractures.map((p) => terzaghiWeight(p, hole)!)
    const stats = fisherStats(poles, { weights })!
    const m = vec(stats.mean)
    expect(stats.resultant * m[0]).toBeCloseTo(5.787, 3)
    expect(stats.resultant * m[1]).toBeCloseTo(6.834, 3)
    expect(-stats.resultant * m[2]).toBeCloseTo(7.952, 3)
    expect(m[0]).toBeCloseTo(0.483, 3)
    expect(m[1]).toBeCloseTo(0.571, 3)
    expect(-m[2]).toBeCloseTo(0.664, 3)
    expect(stats.n).toBeCloseTo(
      weights.reduce((a, b) => a + b),
      12,
    )
    expect(stats.count).toBe(6)
  })

  it('fisherStats() k = (N−1)/(N−R), cos a95 = 1 − ((N−R)/R)(20^(1/(N−1)) − 1), variance (N−R)/N (Fisher 1953)', () => {
    const stats = fisherStats(poles)!
    const n = 6
    const r = stats.resultant
    expect(stats.kappa).toBeCloseTo((n - 1) / (n - r), 9)
    const cosA95 = 1 - ((n - r) / r) * (Math.pow(20, 1 / (n - 1)) - 1)
    expectAngle(stats.alpha95, (Math.acos(cosA95) * 180) / Math.PI, 1e-9)
    expect(stats.sphericalVariance).toBeCloseTo((n - r) / n, 12)
  })

  it('fisherStats() axial: a cluster straddling the horizontal is not split by forcing the lower hemisphere', () => {
    const lines = [
      { trend: 90, plunge: 5 },
      { trend: 270, plunge: 5 },
      { trend: 88, plunge: 2 },
      { trend: 272, plunge: 3 },
    ]
    const stats = fisherStats(lines)!
    expectAngle(2 * stats.mean.trend, 2 * 90, 0.5)
    expect(stats.mean.plunge).toBeLessThan(1)
    expect(stats.resultant).toBeGreaterThan(3.9)
  })

  it('fisherStats() rotating a data set rotates its Fisher mean', () => {
    const base = fisherSample({ trend: 40, plunge: 50 }, 30, 60, seeded(3))
    const before = fisherStats(base)!
    const deg = (min: number, max: number) => fc.double({ min, max, noNaN: true })
    fc.assert(
      fc.property(deg(0, 360), deg(-90, 90), deg(0, 360), (trend, plunge, angle) => {
        const rotate = rotation(vec({ trend, plunge }), (angle * Math.PI) / 180)
        const after = fisherStats(base.map((l) => toLine(rotate(vec(l)))))!
        expect(Math.abs(dot(vec(after.mean), rotate(vec(before.mean))))).toBeCloseTo(1, 9)
        expect(after.kappa).toBeCloseTo(before.kappa, 6)
        expect(after.alpha95).toBeCloseTo(before.alpha95, 6)
      }),
      { numRuns: 50 },
    )
  })

  it('fisherStats() sample of kappa 50 recovers mean and kappa roughly', () => {
    const mean = { trend: 300, plunge: 35 }
    const stats = fisherStats(fisherSample(mean, 50, 2000, seeded(11)))!
    expect(Math.acos(Math.abs(dot(vec(stats.mean), vec(mean)))) * (180 / Math.PI)).toBeLessThan(
      stats.alpha95,
    )
    expect(stats.kappa).toBeGreaterThan(45)
    expect(stats.kappa).toBeLessThan(55)
  })

  it('fisherStats() identical lines: kappa Infinity, alpha95 0; too little data: undefined', () => {
    const same = Array.from({ length: 5 }, () => ({ trend: 10, plunge: 20 }))
    const stats = fisherStats(same)!
    expect(stats.kappa).toBe(Infinity)
    expect(stats.alpha95).toBe(0)
    expectAngle(stats.mean.trend, 10, 1e-9)
    expect(fisherStats([])).toBeUndefined()
    expect(fisherStats([{ trend: 10, plunge: 20 }])).toBeUndefined()
    expect(fisherStats(poles, { weights: [1, 2] })).toBeUndefined()
  })

  it('fisherStats() antipodal axes: axial mean is the axis, non-axial has no mean', () => {
    const lines: Line[] = [
      { trend: 0, plunge: 30 },
      { trend: 180, plunge: -30 },
    ]
    const axial = fisherStats(lines)!
    expectAngle(axial.mean.trend, 0, 1e-9)
    expectAngle(axial.mean.plunge, 30, 1e-9)
    expect(fisherStats(lines, { axial: false })).toBeUndefined()
  })

  it('fisherStatsBatch() equals fisherStats() on the same lines and skips NaN rows', () => {
    const lines = fisherSample({ trend: 120, plunge: 10 }, 20, 300, seeded(5))
    const xyz = linesToXyz([...lines, { trend: NaN, plunge: 0 }])
    const a = fisherStats(lines)!
    const b = fisherStatsBatch(xyz)!
    expect(b.count).toBe(300)
    expectAngle(b.mean.trend, a.mean.trend, 1e-12)
    expect(b.kappa).toBeCloseTo(a.kappa, 9)
  })
})

/** Rodrigues rotation about a unit axis k by angle a. */
function rotation(k: number[], a: number): (v: number[]) => number[] {
  const c = Math.cos(a)
  const s = Math.sin(a)
  return (v) => {
    const kv = dot(k, v)
    const cross = [k[1] * v[2] - k[2] * v[1], k[2] * v[0] - k[0] * v[2], k[0] * v[1] - k[1] * v[0]]
    return [0, 1, 2].map((i) => v[i] * c + cross[i] * s + k[i] * kv * (1 - c))
  }
}

function toLine(v: number[]): Line {
  return {
    trend: (Math.atan2(v[0], v[1]) * 180) / Math.PI,
    plunge: (Math.asin(Math.max(-1, Math.min(1, -v[2]))) * 180) / Math.PI,
  }
}
