import { describe, expect, it } from 'vitest'
import { reconcileCoreImage } from '../../orient'
import { syntheticHole } from './reconcile-synthetic'

// 100 planes over 100 m (10 runs of 10 m, 10 planes each) in the synthetic hole of
// reconcile-synthetic.ts; depths and orientations written by us.
const long = { runCount: 10, runLength: 10, perRun: 10 }

describe('reconcileCoreImage() depth shift', () => {
  it('reconcileCoreImage() shift 0.2 + 0.01·(d − 100) over 100 m → trend reported, slope within 20 %', () => {
    const slopes: string[] = []
    for (const seed of [11, 12, 13]) {
      const shiftAt = (d: number) => 0.2 + 0.01 * (d - 100)
      const hole = syntheticHole({ seed, ...long, shiftAt })
      const result = reconcileCoreImage(hole.core, hole.image, hole.runs)
      const trend = result.depthTrend
      expect(trend, `seed ${seed}`).not.toBeNull()
      expect(Math.abs(trend!.slope - 0.01)).toBeLessThan(0.002)
      // Least squares [derived]: the intercept is the fitted shift at the mean core depth.
      expect(Math.abs(trend!.intercept - shiftAt(trend!.referenceDepth))).toBeLessThan(0.02)
      expect(trend!.slopeError).toBeGreaterThan(0)
      expect(Math.abs(trend!.slope)).toBeGreaterThan(3 * trend!.slopeError)
      // The constant summary is still given: the median difference, with its (large) spread.
      expect(Math.abs(result.depthShift! - 0.7)).toBeLessThan(0.1)
      expect(result.depthShiftSpread!).toBeGreaterThan(0.2)
      expect(result.matches.length).toBeGreaterThanOrEqual(95)
      slopes.push(`${trend!.slope.toFixed(5)} ± ${trend!.slopeError.toFixed(5)}`)
    }
    console.info(`trend slopes (true 0.01): ${slopes.join(', ')}`)
  })

  it('reconcileCoreImage() constant shift over 100 m → depthTrend null', () => {
    for (const seed of [11, 12, 13, 14, 15]) {
      const hole = syntheticHole({ seed, ...long })
      const result = reconcileCoreImage(hole.core, hole.image, hole.runs)
      expect(result.depthTrend, `seed ${seed}`).toBeNull()
      expect(Math.abs(result.depthShift! - 0.35)).toBeLessThan(0.02)
      // 1σ of the differences: two 2 cm depth noises → about 2.8 cm [derived: √2 · 2 cm].
      expect(result.depthShiftSpread!).toBeGreaterThan(0.015)
      expect(result.depthShiftSpread!).toBeLessThan(0.05)
    }
  })

  it('reconcileCoreImage() sloping shift over 9 m (below the 10 m span) → depthTrend null', () => {
    const shiftAt = (d: number) => 0.2 + 0.01 * (d - 100)
    const short = syntheticHole({ seed: 3, runCount: 3, shiftAt })
    expect(reconcileCoreImage(short.core, short.image, short.runs).depthTrend).toBeNull()
    // The same slope over 18 m passes the test and is reported.
    const longer = syntheticHole({ seed: 3, shiftAt })
    const trend = reconcileCoreImage(longer.core, longer.image, longer.runs).depthTrend
    expect(Math.abs(trend!.slope - 0.01)).toBeLessThan(0.002)
  })

  it('reconcileCoreImage() finds shifts across the ±3 m search: −2.4 m and +2.6 m', () => {
    for (const shift of [-2.4, 2.6]) {
      const hole = syntheticHole({ seed: 21, shiftAt: () => shift })
      const result = reconcileCoreImage(hole.core, hole.image, hole.runs)
      expect(Math.abs(result.depthShift! - shift)).toBeLessThan(0.05)
      expect(result.matches.length).toBeGreaterThanOrEqual(55)
    }
  })

  it('reconcileCoreImage() depthWindow 0.1 m keeps only pairs within 10 cm of the shift', () => {
    const hole = syntheticHole({ seed: 4, depthNoise: 0.05 })
    const result = reconcileCoreImage(hole.core, hole.image, hole.runs, { depthWindow: 0.1 })
    expect(result.options.depthWindow).toBe(0.1)
    for (const m of result.matches)
      expect(Math.abs(m.depthDifference - result.depthShift!)).toBeLessThanOrEqual(0.1 + 1e-9)
  })
})
