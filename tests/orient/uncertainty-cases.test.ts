import { describe, expect, it } from 'vitest'
import {
  DEFAULT_ERROR_MODEL,
  orientationUncertainty,
  uncertaintyColumns,
  uncertaintyReasonBits,
} from '../../orient'
import type { UncertaintyResult } from '../../orient'
import { columnsOf, onlyErrors } from './uncertainty-fixture'
import type { Item } from './uncertainty-fixture'

const reasons = (r: UncertaintyResult, i: number) =>
  uncertaintyReasonBits.filter((_, b) => (r.reasons[i] >> b) & 1)
const cone = (item: Item, model = DEFAULT_ERROR_MODEL) =>
  orientationUncertainty(columnsOf([item]), model).cone95[0]
const core = (alpha: number, plunge: number, azimuthSd = 1.5): Item => ({
  source: 'core',
  alpha,
  beta: 70,
  hole: [135, plunge],
  azimuthSd,
})

describe('orientationUncertainty() cases', () => {
  it('orientationUncertainty() vertical hole: survey azimuth 1σ 0 and 10 give identical results', () => {
    // In a vertical hole the trend is a reference convention, not a measurement (holeFrame).
    const items = (azimuthSd: number): Item[] => [
      { source: 'core', alpha: 50, beta: 30, hole: [0, 90], azimuthSd, rates: [0.4, 0.1] },
      {
        source: 'image',
        amplitude: 90,
        diameter: 96,
        trough: 20,
        north: true,
        hole: [0, 90],
        azimuthSd,
      },
      {
        source: 'image',
        amplitude: 90,
        diameter: 96,
        trough: 20,
        north: false,
        hole: [0, 90],
        azimuthSd,
      },
      { source: 'core', alpha: 50, beta: 30, hole: [77, -89.95], azimuthSd },
    ]
    const a = orientationUncertainty(columnsOf(items(0)), DEFAULT_ERROR_MODEL)
    const b = orientationUncertainty(columnsOf(items(10)), DEFAULT_ERROR_MODEL)
    expect(b).toEqual(a)
    // An inclined hole does feel it.
    expect(cone(core(45, 60, 10))).toBeGreaterThan(cone(core(45, 60, 0)) + 2)
  })

  it('orientationUncertainty() steep hole (plunge 88), core: wider cone and steep-hole', () => {
    const steep = orientationUncertainty(
      columnsOf([core(45, 88), core(45, 60)]),
      DEFAULT_ERROR_MODEL,
    )
    expect(reasons(steep, 0)).toContain('steep-hole')
    expect(reasons(steep, 1)).not.toContain('steep-hole')
    // Mark 1σ atan(0.2 / 2) = 5.7° on top of beta's 5° [derived].
    expect(steep.cone95[0]).toBeGreaterThan(1.3 * steep.cone95[1])
    // Within 0.2° of vertical the mark means nothing: beta uniform, a cone near 90°.
    expect(cone(core(45, 89.85))).toBeGreaterThan(60)
  })

  it('orientationUncertainty() alpha 88: alpha-near-90, cone set by the alpha error', () => {
    const r = orientationUncertainty(columnsOf([core(88, 60), core(45, 60)]), DEFAULT_ERROR_MODEL)
    expect(reasons(r, 0)).toEqual(['alpha-near-90'])
    expect(reasons(r, 1)).toEqual([])
    // beta's lever on the pole is cos α = 0.035 at 88° [derived]: the pole is the core axis to
    // within the alpha reading, so the cone is NOT wider than at 45° (where beta's 5° moves it by
    // 3.5°).
    expect(r.cone95[0]).toBeLessThan(r.cone95[1])
    // With alpha's error alone (reflected at 90) the cone is within 1.96 σ_α = 3.9° [derived].
    expect(cone(core(88, 60), onlyErrors({ alphaSd: 2 }))).toBeLessThan(3.92)
  })

  it('orientationUncertainty() alpha 3: alpha-near-0 and a wider cone than alpha 45', () => {
    const r = orientationUncertainty(columnsOf([core(3, 60), core(45, 60)]), DEFAULT_ERROR_MODEL)
    expect(reasons(r, 0)).toEqual(['alpha-near-0'])
    // beta's full 5° moves the pole of a plane along the core axis (lever cos 3° ≈ 1) [derived].
    expect(r.cone95[0]).toBeGreaterThan(r.cone95[1])
  })

  it('orientationUncertainty() image and true sources carry no reasons; no-survey is never set here', () => {
    const items: Item[] = [
      { source: 'image', amplitude: 900, diameter: 96, trough: 20, north: false, hole: [0, 88] },
      { source: 'true', dip: 5, dipDirection: 10 },
      core(85, 85),
    ]
    const r = orientationUncertainty(columnsOf(items), DEFAULT_ERROR_MODEL)
    expect(reasons(r, 0)).toEqual([])
    expect(reasons(r, 1)).toEqual([])
    expect(reasons(r, 2)).toEqual(['steep-hole', 'alpha-near-90'])
    expect([...r.reasons].every((bits) => !((bits >> 3) & 1))).toBe(true)
  })

  it('orientationUncertainty() same seed: identical arrays; another seed: close, not equal', () => {
    const items: Item[] = [
      core(45, 60),
      core(20, 75),
      { source: 'true', dip: 30, dipDirection: 200 },
    ]
    const a = orientationUncertainty(columnsOf(items), DEFAULT_ERROR_MODEL, { seed: 7 })
    const b = orientationUncertainty(columnsOf(items), DEFAULT_ERROR_MODEL, { seed: 7 })
    const c = orientationUncertainty(columnsOf(items), DEFAULT_ERROR_MODEL, { seed: 8 })
    expect(b).toEqual(a)
    expect(c.cone95).not.toEqual(a.cone95)
    for (let i = 0; i < 3; i++) expect(Math.abs(c.cone95[i] / a.cone95[i] - 1)).toBeLessThan(0.15)
  })

  it('orientationUncertainty() draws below 500 are raised to 500 (default seed 1)', () => {
    const cols = columnsOf([core(45, 60), core(70, 30)])
    const at500 = orientationUncertainty(cols, DEFAULT_ERROR_MODEL)
    expect(orientationUncertainty(cols, DEFAULT_ERROR_MODEL, { draws: 50 })).toEqual(at500)
    expect(orientationUncertainty(cols, DEFAULT_ERROR_MODEL, { draws: 500, seed: 1 })).toEqual(
      at500,
    )
    expect(orientationUncertainty(cols, DEFAULT_ERROR_MODEL, { draws: 2000 }).cone95).not.toEqual(
      at500.cone95,
    )
  })

  it('orientationUncertainty() no pole: NaN cone and ellipse, no reasons', () => {
    const cols = columnsOf([
      { source: 'core', alpha: 45, beta: NaN, hole: [10, 60] },
      { source: 'core', alpha: 95, beta: 10, hole: [10, 60] },
      { source: 'core', alpha: 45, beta: 10, hole: [NaN, 60] },
      { source: 'image', amplitude: 50, diameter: 0, trough: 0, north: false, hole: [0, 60] },
      { source: 'image', amplitude: -1, diameter: 96, trough: 0, north: false, hole: [0, 60] },
      { source: 'image', amplitude: 50, diameter: 96, trough: 0, north: true, hole: [0, 0] },
      { source: 'true', dip: NaN, dipDirection: 10 },
    ])
    const r = orientationUncertainty(cols, DEFAULT_ERROR_MODEL)
    for (const column of [r.cone95, r.major95, r.minor95, r.axisTrend, r.axisPlunge])
      expect([...column].every(Number.isNaN)).toBe(true)
    expect([...r.reasons]).toEqual([0, 0, 0, 0, 0, 0, 0])
    expect(orientationUncertainty(uncertaintyColumns(0), DEFAULT_ERROR_MODEL).cone95.length).toBe(0)
  })

  it('orientationUncertainty() wide cones (> 30°) leave the ellipse NaN, narrow ones give major ≥ minor', () => {
    const r = orientationUncertainty(
      columnsOf([core(45, 89.85), core(45, 60)]),
      DEFAULT_ERROR_MODEL,
    )
    expect(r.cone95[0]).toBeGreaterThan(30)
    expect(r.major95[0]).toBeNaN()
    expect(r.major95[1]).toBeGreaterThanOrEqual(r.minor95[1])
    expect(r.axisPlunge[1]).toBeGreaterThanOrEqual(0)
    expect(r.axisPlunge[1]).toBeLessThanOrEqual(90)
  })

  it('orientationUncertainty() default model, hole 60° plunge, alpha 45, core: the typical figures', () => {
    const items: Item[] = [0, 90, 180, 270].map((beta) => ({
      source: 'core',
      alpha: 45,
      beta,
      hole: [135, 60],
      azimuthSd: DEFAULT_ERROR_MODEL.surveyAzimuthSdMagnetic,
    }))
    items.push({ ...(items[0] as Extract<Item, { source: 'core' }>), azimuthSd: 0.5 })
    const r = orientationUncertainty(columnsOf(items), DEFAULT_ERROR_MODEL)
    const rows = items.map((it, i) => ({
      beta: (it as Extract<Item, { source: 'core' }>).beta,
      azimuthSd: (it as Extract<Item, { source: 'core' }>).azimuthSd,
      cone95: +r.cone95[i].toFixed(2),
      major95: +r.major95[i].toFixed(2),
      minor95: +r.minor95[i].toFixed(2),
      axis: `${r.axisTrend[i].toFixed(0)}/${r.axisPlunge[i].toFixed(0)}`,
    }))
    console.info(`default model, core alpha 45 in hole 135/60:\n${JSON.stringify(rows, null, 1)}`)
    // First order: alpha 2° (unit lever), beta 5° × cos 45° = 3.5°, survey ≤ 1.5°: a 95 % cone of
    // roughly 7–10° [derived].
    for (const row of rows) {
      expect(row.cone95).toBeGreaterThan(6)
      expect(row.cone95).toBeLessThan(11)
      expect(row.minor95).toBeGreaterThan(4)
    }
  })
})
