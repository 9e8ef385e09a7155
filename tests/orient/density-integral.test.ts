import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { densityGrid } from '../../orient'
import type { Line } from '../../orient'

/** Σ counts × nodeArea / kernelArea: the weighted pole count the grid integrates to. */
function integral(
  lines: Line[],
  method: 'kamb' | 'exponential',
  weights?: number[],
  nodes = 2000,
): { got: number; n: number } {
  const g = densityGrid(lines, { method, weights, nodes })!
  let sum = 0
  g.counts.forEach((c, i) => (sum += c * g.nodeArea![i]))
  return { got: sum / g.kernelArea, n: g.n }
}

describe('densityGrid() integral', () => {
  const line = fc.record({
    trend: fc.double({ min: 0, max: 360, noNaN: true }),
    plunge: fc.double({ min: -90, max: 90, noNaN: true }),
  })
  const sets = fc.oneof(
    fc.array(line, { minLength: 1, maxLength: 200 }),
    fc
      .tuple(line, fc.integer({ min: 1, max: 200 }))
      .map(([l, n]) => Array.from({ length: n }, () => l)),
  )

  it('densityGrid() exponential integrates to N: Σ counts × nodeArea / kernelArea ≈ N within 0.2 %', () => {
    fc.assert(
      fc.property(sets, (lines) => {
        const { got, n } = integral(lines, 'exponential')
        expect(Math.abs(got / n - 1)).toBeLessThan(0.002)
      }),
      { numRuns: 40, seed: 20250101 },
    )
  })

  it('densityGrid() Kamb integrates to N within 2 % when nodes resolve the cap (N ≤ 100: cap ≥ 23°, 5,000 nodes), weighted too', () => {
    // The cap's sharp edge falls between nodes: the error scales with node spacing / cap radius.
    const small = sets.map((lines) => lines.slice(0, 100))
    fc.assert(
      fc.property(small, fc.double({ min: 0.2, max: 1, noNaN: true }), (lines, w) => {
        const weights = lines.map((_, i) => (i % 2 ? w : 1))
        const { got, n } = integral(lines, 'kamb', weights, 5000)
        expect(n).toBeCloseTo(
          weights.reduce((a, b) => a + b),
          9,
        )
        expect(Math.abs(got / n - 1)).toBeLessThan(0.02)
      }),
      // A fixed seed: a tolerance test must not turn flaky.
      { numRuns: 60, seed: 20250101 },
    )
  })

  it('densityGrid() node areas cover the hemisphere: Σ nodeArea = 2π', () => {
    const g = densityGrid([{ trend: 0, plunge: 10 }], { method: 'kamb' })!
    expect(g.nodeArea!.reduce((a, b) => a + b)).toBeCloseTo(2 * Math.PI, 3)
  })
})
