import { describe, expect, it } from 'vitest'
import { orientationTensor, orientationTensorBatch } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, fisherSample, seeded, vec } from './sample'

describe('orientationTensor()', () => {
  it('orientationTensor() eigenvalues sum to 1, descending; cluster K > 1, girdle K < 1 (Woodcock 1977)', () => {
    const cluster = orientationTensor(fisherSample({ trend: 50, plunge: 60 }, 40, 400, seeded(1)))!
    expect(cluster.eigenvalues.reduce((a, b) => a + b)).toBeCloseTo(1, 12)
    expect(cluster.eigenvalues[0]).toBeGreaterThanOrEqual(cluster.eigenvalues[1])
    expect(cluster.eigenvalues[1]).toBeGreaterThanOrEqual(cluster.eigenvalues[2])
    expect(cluster.shapeK!).toBeGreaterThan(1)
    expect(cluster.strengthC).toBeCloseTo(
      Math.log(cluster.eigenvalues[0] / cluster.eigenvalues[2]),
      12,
    )
    const r = seeded(2)
    const girdle = Array.from({ length: 400 }, () => ({
      trend: r() * 360,
      plunge: 3 * (r() - 0.5),
    }))
    const g = orientationTensor(girdle)!
    expect(g.shapeK!).toBeLessThan(1)
    expectAngle(g.eigenvectors[2].plunge, 90, 2)
  })

  it('orientationTensor() principal axis of a cluster is its mean; eigenvectors orthogonal', () => {
    const t = orientationTensor(fisherSample({ trend: 200, plunge: 20 }, 100, 500, seeded(4)))!
    expect(Math.abs(dot(vec(t.eigenvectors[0]), vec({ trend: 200, plunge: 20 })))).toBeGreaterThan(
      0.999,
    )
    expect(Math.abs(dot(vec(t.eigenvectors[0]), vec(t.eigenvectors[1])))).toBeLessThan(1e-12)
    expect(Math.abs(dot(vec(t.eigenvectors[1]), vec(t.eigenvectors[2])))).toBeLessThan(1e-12)
  })

  it('orientationTensor() degenerate sets: identical lines, lines in one plane, empty', () => {
    const same = orientationTensor([
      { trend: 5, plunge: 5 },
      { trend: 5, plunge: 5 },
    ])!
    expect(same.eigenvalues[0]).toBeCloseTo(1, 12)
    expect(same.shapeK).toBeUndefined()
    expect(same.strengthC).toBe(Infinity)
    const plane = orientationTensor([
      { trend: 0, plunge: 0 },
      { trend: 90, plunge: 0 },
      { trend: 45, plunge: 0 },
    ])!
    expect(plane.shapeK).toBe(0)
    expect(orientationTensor([])).toBeUndefined()
    expect(orientationTensorBatch(new Float64Array(0))).toBeUndefined()
  })
})
