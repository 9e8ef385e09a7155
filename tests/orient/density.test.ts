import { describe, expect, it } from 'vitest'
import { countingCapAngle, densityGrid, EXPONENTIAL_TRUNCATION, project } from '../../orient'
import type { Line } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, fisherSample, seeded, vec } from './sample'

function uniform(n: number, random: () => number): Line[] {
  return Array.from({ length: n }, () => ({
    trend: random() * 360,
    plunge: (Math.asin(random()) * 180) / Math.PI,
  }))
}

describe('densityGrid() Kamb', () => {
  it('densityGrid() Kamb N = 100: cap 23.45°, E 8.257, sigma 2.752 (Kamb 1959; from memory, derived)', () => {
    // [memory, derived] Kamb (1959): A = 9/(N + 9), E = NA = 3 sigma, sigma = sqrt(NA(1 − A)).
    const g = densityGrid(uniform(100, seeded(1)), { method: 'kamb' })!
    expect(g.expected).toBeCloseTo(8.257, 3)
    expect(g.sigma).toBeCloseTo(2.752, 3)
    expect(g.expected / g.sigma).toBeCloseTo(3, 12)
    expectAngle(countingCapAngle(9 / 109), 23.45, 0.005)
  })

  it('countingCapAngle() 1 % of the hemisphere: half-angle acos(0.99) = 8.11° (common practice)', () => {
    // [common practice] 1 % counting area.
    expectAngle(countingCapAngle(0.01), 8.11, 0.005)
  })

  it('densityGrid() Kamb counts equal a brute-force axial count |x·p| ≥ N/(N + 9), also across the primitive', () => {
    const r = seeded(7)
    const lines = [...uniform(6000, r), ...fisherSample({ trend: 80, plunge: 1 }, 30, 4000, r)]
    const nodes = [
      ...uniform(150, r),
      ...Array.from({ length: 50 }, (_, i) => ({ trend: i * 7.2, plunge: r() * 3 })),
    ]
    const g = densityGrid(lines, { method: 'kamb', nodes })!
    const cut = g.n / (g.n + 9)
    g.nodes.forEach((node, i) => {
      const x = vec(node)
      const brute = lines.filter((l) => Math.abs(dot(vec(l), x)) >= cut).length
      expect(g.counts[i]).toBe(brute)
      expect(g.values[i]).toBeCloseTo(brute / g.sigma, 12)
    })
  })

  it('densityGrid() uniform poles average about 3 sigma (E = 3 sigma)', () => {
    const g = densityGrid(uniform(20000, seeded(3)), { method: 'kamb' })!
    let sum = 0
    let inside = 0
    g.values.forEach((v, i) => {
      if (g.inside[i]) {
        sum += v
        inside++
      }
    })
    expect(sum / inside).toBeGreaterThan(2.9)
    expect(sum / inside).toBeLessThan(3.1)
  })
})

describe('densityGrid() exponential', () => {
  it('densityGrid() exponential kernel sums equal brute force exp(k(|x·p| − 1)), k = 2(1 + N/9) (Vollmer 1995, from memory), to the 1e-6 truncation', () => {
    // [memory] Robin & Jowett (1986); Vollmer (1995): W = exp(k(|x·p| − 1)), k = 2(1 + N/9).
    const r = seeded(8)
    const lines = [...uniform(3000, r), ...fisherSample({ trend: 200, plunge: 2 }, 50, 7000, r)]
    const nodes = [
      ...uniform(100, r),
      ...Array.from({ length: 40 }, (_, i) => ({ trend: i * 9, plunge: r() * 2 })),
    ]
    const g = densityGrid(lines, { method: 'exponential', nodes })!
    expect(g.k).toBeCloseTo(2 * (1 + 10000 / 9), 9)
    g.nodes.forEach((node, i) => {
      const x = vec(node)
      let brute = 0
      for (const l of lines) brute += Math.exp(g.k! * (Math.abs(dot(vec(l), x)) - 1))
      expect(Math.abs(g.counts[i] - brute)).toBeLessThan(EXPONENTIAL_TRUNCATION * lines.length)
    })
  })

  it('densityGrid() exponential: E ≈ 3 sigma and the peak sits on the cluster mean', () => {
    const mean = { trend: 130, plunge: 40 }
    const g = densityGrid(fisherSample(mean, 40, 2000, seeded(9)), { method: 'exponential' })!
    expect(g.expected / g.sigma).toBeCloseTo(3, 1)
    let best = 0
    g.values.forEach((v, i) => (best = v > g.values[best] ? i : best))
    expect(Math.acos(Math.abs(dot(vec(g.nodes[best]), vec(mean)))) * (180 / Math.PI)).toBeLessThan(
      3,
    )
  })
})

describe('densityGrid() nodes', () => {
  it('densityGrid() default grid: ≥ 2000 nodes inside the primitive, row-major from the north-west', () => {
    const g = densityGrid([{ trend: 0, plunge: 45 }], { method: 'kamb' })!
    const size = g.size!
    expect(g.values.length).toBe(size * size)
    expect(g.inside.reduce((a, b) => a + b, 0)).toBeGreaterThanOrEqual(2000)
    expect(g.x[0]).toBe(-1)
    expect(g.y[0]).toBe(1)
    expect(g.x[size - 1]).toBeCloseTo(1, 12)
    expect(g.y[size * (size - 1)]).toBeCloseTo(-1, 12)
  })

  it('densityGrid() inside nodes project back to their x/y; outside nodes carry the antipodal direction', () => {
    const g = densityGrid([{ trend: 0, plunge: 45 }], { method: 'exponential', nodes: 500 })!
    g.nodes.forEach((node, i) => {
      const p = project(node)!
      if (g.inside[i] && Math.hypot(g.x[i], g.y[i]) < 0.999) {
        expect(p.x).toBeCloseTo(g.x[i], 9)
        expect(p.y).toBeCloseTo(g.y[i], 9)
      } else if (!g.inside[i] && Math.hypot(g.x[i], g.y[i]) < 1.4) {
        // Beyond the primitive the net continues into the upper hemisphere: the lower axis of such
        // a node plots on the opposite side (the corners, 180° from the centre, plot at it).
        expect(p.x * g.x[i] + p.y * g.y[i]).toBeLessThan(0)
      }
    })
  })

  it('densityGrid() equal-angle grid is laid out on the stereographic net', () => {
    const g = densityGrid([{ trend: 90, plunge: 0 }], {
      method: 'kamb',
      projection: 'equal-angle',
      nodes: 300,
    })!
    expect(g.nodeArea).toBeUndefined()
    g.nodes.forEach((node, i) => {
      if (Math.hypot(g.x[i], g.y[i]) > 0.999) return
      const p = project(node, 'equal-angle')!
      expect(p.x).toBeCloseTo(g.x[i], 9)
      expect(p.y).toBeCloseTo(g.y[i], 9)
    })
  })

  it('densityGrid() degenerate input: empty, all invalid, bad weights or node count → undefined; one pole is defined', () => {
    expect(densityGrid([], { method: 'kamb' })).toBeUndefined()
    expect(densityGrid([{ trend: NaN, plunge: 4 }], { method: 'exponential' })).toBeUndefined()
    expect(
      densityGrid([{ trend: 1, plunge: 4 }], { method: 'kamb', weights: [1, 2] }),
    ).toBeUndefined()
    expect(densityGrid([{ trend: 1, plunge: 4 }], { method: 'kamb', weights: [0] })).toBeUndefined()
    expect(densityGrid([{ trend: 1, plunge: 4 }], { method: 'kamb', nodes: 0 })).toBeUndefined()
    const one = densityGrid([{ trend: 1, plunge: 4 }], { method: 'exponential' })!
    expect(one.values.every(Number.isFinite)).toBe(true)
    expect(one.n).toBe(1)
  })
})
