import { describe, expect, it } from 'vitest'
import {
  DEFAULT_ERROR_MODEL,
  combinedCone95,
  orientationUncertainty,
  setMeanSystematic95,
} from '../../orient'
import { columnsOf, onlyErrors } from './uncertainty-fixture'
import type { Item } from './uncertainty-fixture'
import { seeded } from './sample'

/** n core members of one joint set logged along a hole 040/55 (alpha 40–50, beta 100–140). */
function members(n: number, seed: number): Item[] {
  const random = seeded(seed)
  return Array.from({ length: n }, () => ({
    source: 'core',
    alpha: 40 + 10 * random(),
    beta: 100 + 40 * random(),
    hole: [40 + random(), 55 + random()],
    azimuthSd: 1.5,
  }))
}

const surveyOnly = onlyErrors({ surveyInclinationSd: 0.2 })

describe('setMeanSystematic95()', () => {
  it('setMeanSystematic95() one hole, 50 members: about one structure’s survey-only cone, not shrinking', () => {
    // A survey error turns every member of the hole together, so the mean turns with them and
    // averaging does not help [derived].
    const set = members(50, 3)
    const value = setMeanSystematic95(columnsOf(set), new Int32Array(50), undefined, surveyOnly)!
    const typical = orientationUncertainty(
      columnsOf([{ source: 'core', alpha: 45, beta: 120, hole: [40.5, 55.5], azimuthSd: 1.5 }]),
      surveyOnly,
    ).cone95[0]
    expect(value / typical).toBeGreaterThan(0.85)
    expect(value / typical).toBeLessThan(1.15)
    const fewer = setMeanSystematic95(
      columnsOf(set.slice(0, 10)),
      new Int32Array(10),
      undefined,
      surveyOnly,
    )!
    expect(Math.abs(value / fewer - 1)).toBeLessThan(0.1)
  })

  it('setMeanSystematic95() two holes with independent surveys: smaller, about 1/√2 [derived]', () => {
    const set = members(50, 4)
    const one = setMeanSystematic95(columnsOf(set), new Int32Array(50), undefined, surveyOnly)!
    const holes = Int32Array.from({ length: 50 }, (_, i) => (i < 25 ? 17 : 42))
    const two = setMeanSystematic95(columnsOf(set), holes, undefined, surveyOnly)!
    expect(two).toBeLessThan(0.85 * one)
    expect(two).toBeGreaterThan(0.55 * one)
  })

  it('setMeanSystematic95() true-source members: 0 (no survey error applies)', () => {
    const set: Item[] = Array.from({ length: 20 }, (_, i) => ({
      source: 'true',
      dip: 60 + i,
      dipDirection: 100 + 2 * i,
    }))
    expect(
      setMeanSystematic95(columnsOf(set), new Int32Array(20), undefined, DEFAULT_ERROR_MODEL),
    ).toBe(0)
  })

  it('setMeanSystematic95() ignores reading errors: same value whatever alphaSd and betaSd', () => {
    const cols = columnsOf(members(30, 5))
    const groups = new Int32Array(30)
    const a = setMeanSystematic95(cols, groups, undefined, {
      ...DEFAULT_ERROR_MODEL,
      alphaSd: 0,
      betaSd: 0,
    })
    const b = setMeanSystematic95(cols, groups, undefined, {
      ...DEFAULT_ERROR_MODEL,
      alphaSd: 9,
      betaSd: 20,
    })
    expect(b).toBe(a)
    expect(a).toBeGreaterThan(0)
  })

  it('setMeanSystematic95() weights: zero-weight members left out; none left → undefined', () => {
    const set = members(40, 6)
    const groups = Int32Array.from({ length: 40 }, (_, i) => (i < 20 ? 0 : 1))
    const firstHole = Float64Array.from({ length: 40 }, (_, i) => (i < 20 ? 1 : 0))
    const weighted = setMeanSystematic95(columnsOf(set), groups, firstHole, surveyOnly)
    const alone = setMeanSystematic95(
      columnsOf(set.slice(0, 20)),
      new Int32Array(20),
      undefined,
      surveyOnly,
    )
    expect(weighted).toBeCloseTo(alone!, 10)
    expect(
      setMeanSystematic95(columnsOf(set), groups, new Float64Array(40), surveyOnly),
    ).toBeUndefined()
    expect(
      setMeanSystematic95(columnsOf([]), new Int32Array(0), undefined, surveyOnly),
    ).toBeUndefined()
  })

  it('setMeanSystematic95() vertical hole: the survey azimuth does not matter', () => {
    const set: Item[] = members(20, 8).map((m) => ({
      ...(m as Extract<Item, { source: 'core' }>),
      hole: [0, 90],
    }))
    const gyro = columnsOf(
      set.map((m) => ({ ...(m as Extract<Item, { source: 'core' }>), azimuthSd: 0 })),
    )
    const groups = new Int32Array(20)
    const a = setMeanSystematic95(columnsOf(set), groups, undefined, DEFAULT_ERROR_MODEL)
    expect(setMeanSystematic95(gyro, groups, undefined, DEFAULT_ERROR_MODEL)).toBe(a)
  })
})

describe('combinedCone95()', () => {
  it('combinedCone95() quadrature sum; a missing term counts as 0; null when neither', () => {
    expect(combinedCone95(3, 4)).toBeCloseTo(5, 12)
    expect(combinedCone95(null, 4)).toBe(4)
    expect(combinedCone95(3, undefined)).toBe(3)
    expect(combinedCone95(Number.NaN, 2)).toBe(2)
    expect(combinedCone95(null, undefined)).toBeNull()
  })
})
