import { describe, expect, it } from 'vitest'
import { mount } from '@vue/test-utils'
import { densityGrid } from '../../orient/index'
import NetPlot from '../../frontend/src/components/net/NetPlot.vue'
import { traceGrid } from '../../frontend/src/logic/net/net-contours'
import type { NetPole } from '../../frontend/src/logic/net/net-types'

// A fixed data set: two clusters of poles on a deterministic lattice of offsets (no randomness).
function fixedPoles(): NetPole[] {
  const out: NetPole[] = []
  const centres = [
    { trend: 150, plunge: 40, n: 48 },
    { trend: 260, plunge: 12, n: 30 },
  ]
  let id = 1
  for (const c of centres)
    for (let i = 0; i < c.n; i++) {
      const trend = (c.trend + ((i * 7) % 15) - 7 + 360) % 360
      const plunge = Math.max(0, Math.min(90, c.plunge + ((i * 5) % 11) - 5))
      out.push({
        id: id++,
        trend,
        plunge,
        dip: 90 - plunge,
        dipDirection: (trend + 180) % 360,
        group: -1,
        flagged: false,
        weight: 1 + (i % 4) * 0.5,
      })
    }
  return out
}

function maxInside(values: Float64Array, inside: Uint8Array) {
  let max = 0
  values.forEach((v, k) => {
    if (inside[k] && v > max) max = v
  })
  return max
}

describe('NetPlot contours', () => {
  const poles = fixedPoles()

  for (const method of ['kamb', 'exponential'] as const) {
    it(`draws the ${method} sigma levels that orient densityGrid gives`, () => {
      const grid = densityGrid(poles, { method, projection: 'equal-area' })!
      const max = maxInside(grid.values, grid.inside)
      const expected: number[] = []
      for (let v = 2; v <= max; v += 2) expected.push(v)
      expect(expected.length).toBeGreaterThan(1)

      const wrapper = mount(NetPlot, {
        props: {
          poles,
          projection: 'equal-area',
          radius: 100,
          contours: { method, step: 2, weighted: false },
        },
      })
      const bands = wrapper.findAll('path.band')
      expect(bands.map((b) => Number(b.attributes('data-level')))).toEqual(expected)
      // The outlines are d3-contour's trace of that very grid.
      const traced = traceGrid(grid.values, grid.size!, expected, 100)
      expect(bands.map((b) => b.attributes('d'))).toEqual(traced.map((t) => t.d))
      const summary = wrapper.emitted('density')!.at(-1)![0] as { max: number; n: number }
      expect(summary.max).toBeCloseTo(max, 9)
      expect(summary.n).toBe(poles.length)
    })
  }

  it('weights the count by Terzaghi when asked (N = Σw)', () => {
    const grid = densityGrid(poles, {
      method: 'kamb',
      projection: 'equal-angle',
      weights: poles.map((p) => p.weight),
    })!
    const wrapper = mount(NetPlot, {
      props: {
        poles,
        projection: 'equal-angle',
        radius: 100,
        contours: { method: 'kamb', step: 3, weighted: true },
      },
    })
    const summary = wrapper.emitted('density')!.at(-1)![0] as { max: number; n: number }
    expect(summary.n).toBeCloseTo(
      poles.reduce((s, p) => s + p.weight, 0),
      9,
    )
    expect(summary.max).toBeCloseTo(maxInside(grid.values, grid.inside), 9)
    const levels = wrapper.findAll('path.band').map((b) => Number(b.attributes('data-level')))
    expect(levels[0]).toBe(3)
    expect(levels.at(-1)).toBeLessThanOrEqual(summary.max)
    expect(levels.at(-1)! + 3).toBeGreaterThan(summary.max)
  })

  it('places the contour trace on the net: a grid of size n spans the primitive', () => {
    // A 3 × 3 grid with one high centre node: the 0.5 contour is a diamond about the centre.
    const bands = traceGrid([0, 0, 0, 0, 1, 0, 0, 0, 0], 3, [0.5], 100)
    const pts = [...bands[0].d.matchAll(/[ML](-?[\d.]+),(-?[\d.]+)/g)].map((m) => [
      Number(m[1]),
      Number(m[2]),
    ])
    for (const [x, y] of pts) expect(Math.abs(x) + Math.abs(y)).toBeCloseTo(50, 6)
  })
})
