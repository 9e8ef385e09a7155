import { describe, expect, it } from 'vitest'
import { desurvey, doglegs, holeAt, holeAtBatch, positionAt } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, vec } from './sample'

// Lapeyrouse, Formulas and Calculations for Drilling, Production and Workover [pub]:
// MD 3500 (I 15°, Az 20°) → 3600 (I 25°, Az 45°); plunge = 90 − inclination.
const lapeyrouse = [
  { depth: 3500, azimuth: 20, plunge: 75 },
  { depth: 3600, azimuth: 45, plunge: 65 },
]

describe('desurvey()', () => {
  it('desurvey() minimum curvature: N 27.22, E 19.45, TVD 94.01 (Lapeyrouse)', () => {
    const [a, b] = desurvey(lapeyrouse)
    expect(b.north - a.north).toBeCloseTo(27.22, 2)
    expect(b.east - a.east).toBeCloseTo(19.45, 2)
    expect(b.down - a.down).toBeCloseTo(94.01, 2)
  })

  it('desurvey() straight from the collar to the first station, sorted, duplicates and NaN dropped', () => {
    const points = desurvey([
      { depth: 100, azimuth: 90, plunge: 0 },
      { depth: 50, azimuth: 90, plunge: 0 },
      { depth: 50, azimuth: 0, plunge: 90 },
      { depth: NaN, azimuth: 0, plunge: 0 },
    ])
    expect(points.map((p) => p.depth)).toEqual([50, 100])
    expect(points[0].east).toBeCloseTo(50, 12)
    expect(points[1].east).toBeCloseTo(100, 12)
    expect(points[1].down).toBeCloseTo(0, 12)
  })

  it('desurvey() azimuth 360 and 0 give the same trace; empty input gives []', () => {
    const a = desurvey([
      { depth: 0, azimuth: 0, plunge: 60 },
      { depth: 100, azimuth: 10, plunge: 60 },
    ])
    const b = desurvey([
      { depth: 0, azimuth: 360, plunge: 60 },
      { depth: 100, azimuth: 370, plunge: 60 },
    ])
    expect(b[1].north).toBeCloseTo(a[1].north, 9)
    expect(b[1].east).toBeCloseTo(a[1].east, 9)
    expect(desurvey([])).toEqual([])
  })
})

describe('doglegs()', () => {
  it('doglegs() Lapeyrouse segment: dogleg 12.95°, severity per 30 m', () => {
    const [d] = doglegs(lapeyrouse)
    expectAngle(d.dogleg, 12.95, 0.005)
    expect(d.severity).toBeCloseTo((d.dogleg * 30) / 100, 12)
    expect(d.fromDepth).toBe(3500)
  })

  it('doglegs() straight hole: zero doglegs; one station: no segments', () => {
    expect(
      doglegs([
        { depth: 0, azimuth: 10, plunge: 60 },
        { depth: 30, azimuth: 10, plunge: 60 },
      ])[0].dogleg,
    ).toBe(0)
    expect(doglegs([{ depth: 0, azimuth: 10, plunge: 60 }])).toEqual([])
  })
})

describe('holeAt()', () => {
  it('holeAt() slerp: mid-segment direction bisects the two station directions', () => {
    const mid = holeAt(lapeyrouse, 3550)!
    const a = vec({ trend: 20, plunge: 75 })
    const b = vec({ trend: 45, plunge: 65 })
    const m = vec(mid)
    expect(dot(m, a)).toBeCloseTo(dot(m, b), 12)
    expectAngle((Math.acos(dot(m, a)) * 360) / Math.PI, 12.95, 0.005)
  })

  it('holeAt() first direction above the first station, last beyond the last, exact at stations', () => {
    expectAngle(holeAt(lapeyrouse, 10)?.trend, 20, 1e-9)
    expectAngle(holeAt(lapeyrouse, 9999)?.plunge, 65, 1e-9)
    expectAngle(holeAt(lapeyrouse, 3600)?.trend, 45, 1e-9)
    expectAngle(holeAt(lapeyrouse, 3500)?.plunge, 75, 1e-9)
  })

  it('holeAt() up-holes keep negative plunge; no stations or NaN depth give undefined', () => {
    expectAngle(holeAt([{ depth: 0, azimuth: 90, plunge: -30 }], 5)?.plunge, -30, 1e-9)
    expect(holeAt([], 5)).toBeUndefined()
    expect(holeAt(lapeyrouse, NaN)).toBeUndefined()
  })

  it('holeAtBatch() equals holeAt() per depth and marks NaN depths', () => {
    const depths = Float64Array.from([0, 3520, 3599, 4000, NaN])
    const out = holeAtBatch(lapeyrouse, depths)
    for (let i = 0; i < 4; i++) {
      const one = holeAt(lapeyrouse, depths[i])!
      expectAngle(out.trend[i], one.trend, 1e-12)
      expectAngle(out.plunge[i], one.plunge, 1e-12)
    }
    expect(Number.isNaN(out.trend[4])).toBe(true)
  })
})

describe('positionAt()', () => {
  it('positionAt() equals desurvey() at stations and is continuous inside a segment', () => {
    const stations = desurvey(lapeyrouse)
    for (const s of stations) {
      const p = positionAt(lapeyrouse, s.depth)!
      expect(p.north).toBeCloseTo(s.north, 9)
      expect(p.down).toBeCloseTo(s.down, 9)
    }
    const a = positionAt(lapeyrouse, 3550)!
    const b = positionAt(lapeyrouse, 3550.001)!
    expect(Math.hypot(b.east - a.east, b.north - a.north, b.down - a.down)).toBeCloseTo(0.001, 9)
  })

  it('positionAt() beyond the last station continues straight along the last direction', () => {
    const last = positionAt(lapeyrouse, 3600)!
    const beyond = positionAt(lapeyrouse, 3700)!
    const t = vec({ trend: 45, plunge: 65 })
    expect(beyond.east - last.east).toBeCloseTo(100 * t[0], 9)
    expect(beyond.down - last.down).toBeCloseTo(-100 * t[2], 9)
  })

  it('positionAt() vertical straight hole: down = depth; above the first station along its direction', () => {
    const p = positionAt(
      [
        { depth: 20, azimuth: 0, plunge: 90 },
        { depth: 80, azimuth: 0, plunge: 90 },
      ],
      50,
    )!
    expect(p.down).toBeCloseTo(50, 12)
    expect(Math.hypot(p.east, p.north)).toBeLessThan(1e-12)
    expect(positionAt([{ depth: 20, azimuth: 0, plunge: 90 }], 10)!.down).toBeCloseTo(10, 12)
    expect(positionAt([], 10)).toBeUndefined()
  })
})
