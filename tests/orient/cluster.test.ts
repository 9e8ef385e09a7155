import { describe, expect, it } from 'vitest'
import { clusterSets, setMembership, suggestK } from '../../orient'
import type { Line } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, fisherSample, seeded, vec } from './sample'

const means: Line[] = [
  { trend: 20, plunge: 10 },
  { trend: 135, plunge: 45 },
  { trend: 260, plunge: 80 },
]
const random = seeded(21)
// Three synthetic sets of different sizes; the first straddles the horizontal.
const data = [
  ...fisherSample(means[0], 40, 300, random),
  ...fisherSample(means[1], 40, 200, random),
  ...fisherSample(means[2], 40, 100, random),
]
const axialAngle = (a: Line, b: Line) =>
  (Math.acos(Math.min(1, Math.abs(dot(vec(a), vec(b))))) * 180) / Math.PI

describe('clusterSets()', () => {
  it('clusterSets() k = 3 recovers three Fisher sets, largest first, with Fisher statistics', () => {
    const r = clusterSets(data, { k: 3 })!
    const truth = data.map((_, i) => (i < 300 ? 0 : i < 500 ? 1 : 2))
    // Fisher tails overlap a little: a point or two may sit nearer another set's mean.
    expect(r.assignments.filter((a, i) => a === truth[i]).length).toBeGreaterThanOrEqual(597)
    r.sets.forEach((s, i) => {
      expect(Math.abs(s.count - [300, 200, 100][i])).toBeLessThanOrEqual(3)
      expect(axialAngle(s.mean, means[i])).toBeLessThan(2)
      expect(s.stats!.kappa).toBeGreaterThan(30)
      expect(s.stats!.count).toBe(s.count)
    })
  })

  it('clusterSets() is deterministic for a seed, and seeds start the sets where asked', () => {
    const a = clusterSets(data, { k: 3, seed: 5 })!
    const b = clusterSets(data, { k: 3, seed: 5 })!
    expect(a.assignments).toEqual(b.assignments)
    const seeded3 = clusterSets(data, { seeds: means })!
    expect(seeded3.k).toBe(3)
    seeded3.sets.forEach((s, i) => expectAngle(axialAngle(s.mean, means[i]), 0, 2))
  })

  it('clusterSets() k = 1 is the whole set; invalid lines get −1; k too large or < 1 → undefined', () => {
    const one = clusterSets([...data.slice(0, 10), { trend: NaN, plunge: 1 }], { k: 1 })!
    expect(one.sets[0].count).toBe(10)
    expect(one.assignments[10]).toBe(-1)
    expect(clusterSets(data.slice(0, 2), { k: 3 })).toBeUndefined()
    expect(clusterSets(data, { k: 0 })).toBeUndefined()
    expect(clusterSets(data, { k: 3, restarts: NaN, maxIterations: NaN })!.sets).toHaveLength(3)
    expect(clusterSets([], { seeds: [] })).toBeUndefined()
  })

  it('clusterSets() identical lines with k = 2: defined, one empty set without statistics', () => {
    const same = Array.from({ length: 5 }, () => ({ trend: 10, plunge: 10 }))
    const r = clusterSets(same, { k: 2 })!
    expect(r.sets.map((s) => s.count).sort()).toEqual([0, 5])
    expect(r.sets[1].stats).toBeUndefined()
  })
})

describe('suggestK()', () => {
  it('suggestK() finds three sets by silhouette (Rousseeuw 1987)', () => {
    const s = suggestK(data, 5)!
    expect(s.k).toBe(3)
    expect(s.scores.map((x) => x.k)).toEqual([2, 3, 4, 5])
  })

  it('suggestK() one cluster or diffuse scatter: no reasonable structure → 1 (Kaufman & Rousseeuw 1990); too few → undefined', () => {
    const r = seeded(4)
    const diffuse = Array.from({ length: 300 }, () => ({
      trend: r() * 360,
      plunge: (Math.asin(r()) * 180) / Math.PI,
    }))
    expect(suggestK(diffuse, 5)!.k).toBe(1)
    expect(suggestK(fisherSample({ trend: 20, plunge: 50 }, 30, 300, r), 5)!.k).toBe(1)
    expect(suggestK(data.slice(0, 2))).toBeUndefined()
  })
})

describe('setMembership()', () => {
  it('setMembership() axial cones: nearest mean wins when cones overlap, −1 outside all', () => {
    const cones = [
      { mean: { trend: 0, plunge: 0 }, angle: 20 },
      { mean: { trend: 20, plunge: 0 }, angle: 20 },
    ]
    const lines = [
      { trend: 180, plunge: 5 },
      { trend: 15, plunge: 0 },
      { trend: 90, plunge: 0 },
      { trend: NaN, plunge: 0 },
    ]
    expect(setMembership(lines, cones)).toEqual([0, 1, -1, -1])
    expect(setMembership(lines, [])).toEqual([-1, -1, -1, -1])
    expect(setMembership([], cones)).toEqual([])
  })
})
