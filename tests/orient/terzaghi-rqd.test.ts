import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { inBlindZone, rqdClass, rqdFromFrequency, runMetrics, terzaghiWeight } from '../../orient'

describe('terzaghiWeight()', () => {
  it('terzaghiWeight() borehole 136/55: 2.066, 2.338, 3.645, 1.866, 1.340, 1.183 (Harrison & Hudson 2000, Q/A 7.10)', () => {
    // [pub] Harrison & Hudson (2000), Engineering Rock Mechanics part 2, Q/A 7.10.
    const hole = { trend: 136, plunge: 55 }
    const planes = [
      [39, 201],
      [50, 213],
      [63, 215],
      [52, 230],
      [42, 247],
      [28, 253],
    ].map(([dip, dipDirection]) => ({ dip, dipDirection }))
    const cosDelta = [0.484, 0.428, 0.274, 0.536, 0.746, 0.846]
    const published = [2.066, 2.338, 3.645, 1.866, 1.34, 1.183]
    planes.forEach((p, i) => {
      const w = terzaghiWeight(p, hole)!
      // cos(delta) is printed to 3 decimals; the weights were computed from unrounded values.
      expect(1 / w).toBeCloseTo(cosDelta[i], 3)
      expect(w).toBeCloseTo(published[i], 3)
    })
  })

  it('terzaghiWeight() caps at 10 in the blind zone (after Priest 1993, from memory); w = 1 across the hole', () => {
    // [memory] Cap of 10 (|cos delta| ≥ 0.1) after Priest (1993), Discontinuity Analysis for
    // Rock Engineering.
    const hole = { trend: 0, plunge: 90 }
    expect(terzaghiWeight({ dip: 0, dipDirection: 0 }, hole)).toBeCloseTo(1, 12)
    expect(terzaghiWeight({ dip: 89, dipDirection: 0 }, hole)).toBe(10)
    expect(terzaghiWeight({ dip: 89, dipDirection: 0 }, hole, 100)).toBeCloseTo(
      1 / Math.cos((89 * Math.PI) / 180),
      9,
    )
    expect(inBlindZone({ dip: 88, dipDirection: 0 }, hole)).toBe(true)
    expect(inBlindZone({ dip: 60, dipDirection: 0 }, hole)).toBe(false)
    expect(terzaghiWeight({ dip: NaN, dipDirection: 0 }, hole)).toBeUndefined()
  })
})

describe('rqdFromFrequency()', () => {
  it('rqdFromFrequency() λ = 1, 5, 10, 20 → 99.53, 90.98, 73.58, 40.60 (Priest & Hudson 1976, IJRMMS 13:135)', () => {
    // [pub] Priest & Hudson (1976), IJRMMS 13:135, RQD = 100 e^(−0.1λ)(0.1λ + 1).
    expect(rqdFromFrequency(1)).toBeCloseTo(99.53, 2)
    expect(rqdFromFrequency(5)).toBeCloseTo(90.98, 2)
    expect(rqdFromFrequency(10)).toBeCloseTo(73.58, 2)
    expect(rqdFromFrequency(20)).toBeCloseTo(40.6, 2)
  })

  it('rqdFromFrequency() falls as frequency rises, from 100 at λ = 0', () => {
    expect(rqdFromFrequency(0)).toBe(100)
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 200, noNaN: true }),
        fc.double({ min: 0.01, max: 50, noNaN: true }),
        (lambda, step) => {
          expect(rqdFromFrequency(lambda + step)!).toBeLessThan(rqdFromFrequency(lambda)! + 1e-12)
        },
      ),
    )
  })

  it('rqdFromFrequency() general threshold t: 100 e^(−λt)(λt + 1); negative or NaN → undefined', () => {
    expect(rqdFromFrequency(5, 0.2)).toBeCloseTo(100 * Math.exp(-1) * 2, 12)
    expect(rqdFromFrequency(-1)).toBeUndefined()
    expect(rqdFromFrequency(NaN)).toBeUndefined()
  })
})

describe('rqdClass()', () => {
  it('rqdClass() Deere (1964) / ASTM D6032: 0–25 very poor, 25–50 poor, 50–75 fair, 75–90 good, 90–100 excellent', () => {
    // Deere (1964) classes as given in ASTM D6032.
    expect(rqdClass(0)).toBe('very poor')
    expect(rqdClass(24.9)).toBe('very poor')
    expect(rqdClass(25)).toBe('poor')
    expect(rqdClass(60)).toBe('fair')
    expect(rqdClass(75)).toBe('good')
    expect(rqdClass(90)).toBe('excellent')
    expect(rqdClass(100)).toBe('excellent')
    expect(rqdClass(NaN)).toBeUndefined()
  })
})

describe('runMetrics()', () => {
  it('runMetrics() TCR, SCR, RQD in percent of run length, frequency per metre', () => {
    const m = runMetrics({
      from: 10,
      to: 13,
      recovered: 2.85,
      solid: 2.4,
      rqdLength: 2.1,
      fractures: 9,
    })!
    expect(m.tcr).toBeCloseTo(95, 9)
    expect(m.scr).toBeCloseTo(80, 9)
    expect(m.rqd).toBeCloseTo(70, 9)
    expect(m.frequency).toBeCloseTo(3, 12)
    expect(m.rqdClass).toBe('fair')
    expect(m.flags).toEqual([])
  })

  it('runMetrics() recovered > run length: TCR above 100, flagged, nothing clipped', () => {
    const m = runMetrics({
      from: 0,
      to: 1.5,
      recovered: 1.6,
      solid: 1.6,
      rqdLength: 1.55,
      fractures: 0,
    })!
    expect(m.tcr).toBeCloseTo(106.667, 3)
    expect(m.rqd).toBeGreaterThan(100)
    expect(m.rqdClass).toBe('excellent')
    expect(m.flags).toContain('over-recovery')
  })

  it('runMetrics() zero-length, inverted, negative or NaN runs → undefined', () => {
    expect(
      runMetrics({ from: 5, to: 5, recovered: 0, solid: 0, rqdLength: 0, fractures: 0 }),
    ).toBeUndefined()
    expect(
      runMetrics({ from: 6, to: 5, recovered: 1, solid: 1, rqdLength: 1, fractures: 0 }),
    ).toBeUndefined()
    expect(
      runMetrics({ from: 0, to: 3, recovered: -1, solid: 0, rqdLength: 0, fractures: 0 }),
    ).toBeUndefined()
    expect(
      runMetrics({ from: 0, to: 3, recovered: NaN, solid: 0, rqdLength: 0, fractures: 0 }),
    ).toBeUndefined()
  })
})
