import { describe, expect, it } from 'vitest'
import { fitSinusoid, sinusoidDepthAt } from '../../orient/index'
import * as td from '../../frontend/src/logic/image-picking/trace-draft'
import { sampleTrace, SAMPLES_PER_TURN } from '../../frontend/src/logic/image-picking/sample-trace'
import { expectAngle } from '../orient/expect-angle'

// A trace planted by hand: d(θ) = d₀ + (H/2)·cos(θ − θt) (the trace of a plane on the unrolled
// wall, common practice; REFERENCES "Sinusoid fitting on unrolled images").
const planted = { depth: 41.25, height: 0.084, troughAzimuth: 137 }
const on = (azimuth: number) => ({ depth: sinusoidDepthAt(planted, azimuth), azimuth })

describe('trace draft', () => {
  it('addPoint() appends, wraps the azimuth into [0, 360) and leaves the draft it came from alone', () => {
    const empty = td.emptyDraft()
    const one = td.addPoint(empty, { depth: 41.2, azimuth: -30 })
    expect(empty.points).toEqual([])
    expect(one.points).toEqual([{ depth: 41.2, azimuth: 330 }])
    expect(td.addPoint(one, { depth: 41.3, azimuth: 370 }).points[1]).toEqual({
      depth: 41.3,
      azimuth: 10,
    })
  })

  it('addPoint() refuses non-finite points and stops at the API maximum of 200', () => {
    const d = td.addPoint(td.emptyDraft(), { depth: Number.NaN, azimuth: 10 })
    expect(d.points).toHaveLength(0)
    let full = td.emptyDraft()
    for (let i = 0; i < 205; i++) full = td.addPoint(full, on(i * 1.7))
    expect(full.points).toHaveLength(td.MAX_TRACE_POINTS)
  })

  it('draftFit() is undefined until three points in three directions, then the planted trace', () => {
    let d = td.addPoint(td.emptyDraft(), on(20))
    d = td.addPoint(d, on(140))
    expect(td.draftFit(d)).toBeUndefined()
    expect(td.canAccept(d)).toBe(false)
    // Same azimuth twice: still only two directions.
    const twice = td.addPoint(d, { depth: 41.3, azimuth: 140 })
    expect(td.draftFit(twice)).toBeUndefined()
    d = td.addPoint(d, on(260))
    const fit = td.draftFit(d)!
    expect(td.canAccept(d)).toBe(true)
    expect(fit.depth).toBeCloseTo(planted.depth, 9)
    expect(fit.height).toBeCloseTo(planted.height, 9)
    expectAngle(fit.troughAzimuth, planted.troughAzimuth, 1e-6)
    expect(fit.rms).toBeLessThan(1e-9)
  })

  it('movePoint() refits live: moving one point off the trace leaves a residual RMS', () => {
    let d = td.emptyDraft()
    for (const a of [0, 90, 180, 270]) d = td.addPoint(d, on(a))
    expect(td.draftFit(d)!.rms).toBeLessThan(1e-9)
    const moved = td.movePoint(d, 1, { depth: on(90).depth + 0.004, azimuth: 90 })
    // Four points at 90° steps: a 4 mm slip of one leaves residuals ±1 mm each (derived by hand:
    // the fit moves d₀ by 1 mm and a by 2 mm, so each residual is 1 mm; RMS 1 mm).
    expect(td.draftFit(moved)!.rms * 1000).toBeCloseTo(1, 6)
    expect(td.movePoint(d, 9, on(10))).toBe(d)
  })

  it('removeLastPoint() takes the last point off; an emptied suggestion is a plain draft again', () => {
    let d: td.TraceDraft = { points: [on(0), on(120)], editing: null, suggested: true }
    d = td.removeLastPoint(d)
    expect(d.points).toEqual([on(0)])
    expect(d.suggested).toBe(true)
    d = td.removeLastPoint(d)
    expect(d).toEqual(td.emptyDraft())
  })

  it('shiftPoints() moves every point along the hole, azimuths unchanged', () => {
    expect(td.shiftPoints([on(0), on(180)], -0.05)).toEqual([
      { depth: on(0).depth - 0.05, azimuth: 0 },
      { depth: on(180).depth - 0.05, azimuth: 180 },
    ])
  })
})

describe('sampleTrace(): the points sent for an accepted suggestion', () => {
  const cases = [
    planted,
    { depth: 12.004, height: 0.31, troughAzimuth: 359.5 },
    { depth: 3.5, height: 0.0004, troughAzimuth: 2 },
    { depth: 88.8, height: 0, troughAzimuth: 0 },
  ]
  it.each(cases)('fitSinusoid(sampleTrace(s)) gives s back: %o', (s) => {
    const points = sampleTrace(s)
    expect(points).toHaveLength(SAMPLES_PER_TURN)
    const fit = fitSinusoid(points)!
    expect(fit.depth).toBeCloseTo(s.depth, 9)
    expect(fit.height).toBeCloseTo(s.height, 9)
    if (s.height > 0) expectAngle(fit.troughAzimuth, s.troughAzimuth, 1e-6)
    expect(fit.rms).toBeLessThan(1e-9)
  })

  it('sampleTrace() spaces points evenly from the start azimuth, at least three', () => {
    expect(sampleTrace(planted, 4, 10).map((p) => p.azimuth)).toEqual([10, 100, 190, 280])
    expect(sampleTrace(planted, 1)).toHaveLength(3)
  })
})
