import { describe, expect, it } from 'vitest'
import { coreToPlaneBatch } from '../../orient'
import { expectAngle } from './expect-angle'

const columns = (rows: number[][]) => ({
  alpha: Float64Array.from(rows, (r) => r[0]),
  beta: Float64Array.from(rows, (r) => r[1]),
  holeTrend: Float64Array.from(rows, (r) => r[2]),
  holePlunge: Float64Array.from(rows, (r) => r[3]),
})

describe('coreToPlaneBatch()', () => {
  it('coreToPlaneBatch() reproduces the core-angle check table [derived]', () => {
    const out = coreToPlaneBatch(
      columns([
        [60, 90, 0, 60],
        [40, 300, 135, 45],
        [35, 210, 45, 70],
        [50, 20, 90, -30],
      ]),
    )
    const expected = [
      [41.41, 229.11],
      [79.42, 272.55],
      [38.59, 86.04],
      [25.03, 121.31],
    ]
    expected.forEach(([dip, dd], i) => {
      expectAngle(out.dip[i], dip, 0.006)
      expectAngle(out.dipDirection[i], dd, 0.006)
    })
  })

  it('coreToPlaneBatch() writes into given arrays, flags invalid items as NaN and counts them', () => {
    const output = { dipDirection: new Float64Array(5), dip: new Float64Array(5) }
    const result = coreToPlaneBatch(
      columns([
        [60, 0, 0, 60],
        [NaN, 0, 0, 60],
        [91, 0, 0, 60],
        [60, Infinity, 0, 60],
        [-1, 0, 0, 60],
      ]),
      output,
    )
    expect(result.dip).toBe(output.dip)
    expect(result.invalid).toBe(4)
    expectAngle(output.dip[0], 60, 1e-9)
    expectAngle(output.dipDirection[0], 180, 1e-9)
    for (let i = 1; i < 5; i++)
      expect(Number.isNaN(output.dip[i]) && Number.isNaN(output.dipDirection[i])).toBe(true)
  })

  it('coreToPlaneBatch() top reference and alpha 0 / 90 at the ends of the range', () => {
    const out = coreToPlaneBatch(
      columns([
        [40, 120, 135, 45],
        [90, 10, 270, 60],
        [0, 0, 0, 90],
      ]),
      undefined,
      { reference: 'top' },
    )
    expectAngle(out.dip[0], 79.42, 0.006)
    expectAngle(out.dipDirection[0], 272.55, 0.006)
    expectAngle(out.dip[1], 30, 1e-9)
    expectAngle(out.dipDirection[1], 90, 1e-9)
    expectAngle(out.dip[2], 90, 1e-9)
  })

  it('coreToPlaneBatch() empty input gives empty output; short arrays are a RangeError', () => {
    const empty = coreToPlaneBatch(columns([]))
    expect(empty.dip.length).toBe(0)
    expect(empty.invalid).toBe(0)
    const bad = { ...columns([[60, 0, 0, 60]]), beta: new Float64Array(0) }
    expect(() => coreToPlaneBatch(bad)).toThrow(RangeError)
  })
})
