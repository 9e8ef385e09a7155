import { describe, expect, it } from 'vitest'
import { runMetrics, runMetricsOf } from '../../orient'

describe('runMetricsOf()', () => {
  it('runMetricsOf() a logged run 10–13 m: TCR 95, SCR 80, RQD 70 %, 3 per metre, fair (Deere 1964 classes)', () => {
    // Percentages of the 3 m run: 2.85, 2.4 and 2.1 m; 9 fractures / 3 m. Class bounds after
    // Deere (1964), as in ASTM D6032: 50–75 fair.
    const run = {
      fromDepth: 10,
      toDepth: 13,
      recovered: 2.85,
      solid: 2.4,
      rqdLength: 2.1,
      fractureCount: 9,
    }
    const m = runMetricsOf(run)!
    expect(m.tcr).toBeCloseTo(95, 9)
    expect(m.scr).toBeCloseTo(80, 9)
    expect(m.rqd).toBeCloseTo(70, 9)
    expect(m.frequency).toBeCloseTo(3, 12)
    expect(m.rqdClass).toBe('fair')
    expect(m).toEqual(
      runMetrics({ from: 10, to: 13, recovered: 2.85, solid: 2.4, rqdLength: 2.1, fractures: 9 }),
    )
  })

  it('runMetricsOf() an inverted run → undefined, as runMetrics', () => {
    const run = { fromDepth: 6, toDepth: 5, recovered: 1, solid: 1, rqdLength: 1, fractureCount: 0 }
    expect(runMetricsOf(run)).toBeUndefined()
  })
})
