import { describe, expect, it } from 'vitest'
import { greatCircle, smallCircle } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, vec } from './sample'

describe('greatCircle()', () => {
  it('greatCircle() points lie in the plane, in the lower hemisphere, strike to strike through the dip line', () => {
    const plane = { dip: 35, dipDirection: 120 }
    const pts = greatCircle(plane, 90)!
    expect(pts).toHaveLength(91)
    const pole = vec({ trend: 300, plunge: 55 })
    for (const p of pts) {
      expect(Math.abs(dot(vec(p), pole))).toBeLessThan(1e-12)
      expect(p.plunge).toBeGreaterThanOrEqual(0)
    }
    expectAngle(pts[0].plunge, 0, 1e-9)
    expectAngle(2 * pts[0].trend, 2 * 30, 1e-9)
    expectAngle(pts[45].trend, 120, 1e-9)
    expectAngle(pts[45].plunge, 35, 1e-9)
  })

  it('greatCircle() horizontal plane: the whole primitive', () => {
    const pts = greatCircle({ dip: 0, dipDirection: 0 }, 36)!
    expect(pts).toHaveLength(73)
    expect(pts.every((p) => Math.abs(p.plunge) < 1e-9)).toBe(true)
    expectAngle(pts[36].trend, pts[0].trend + 180, 1e-9)
  })
})

describe('smallCircle()', () => {
  it('smallCircle() about a steep axis: one closed polyline at the cone angle', () => {
    const axis = { trend: 200, plunge: 70 }
    const rings = smallCircle(axis, 15, 72)!
    expect(rings).toHaveLength(1)
    const ring = rings[0]
    expect(ring).toHaveLength(73)
    expect(ring[0]).toEqual(ring[72])
    for (const p of ring) expectAngle((Math.acos(dot(vec(p), vec(axis))) * 180) / Math.PI, 15, 1e-9)
  })

  it('smallCircle() crossing the primitive: split into polylines ending on the primitive, all at the cone angle as axes', () => {
    const axis = { trend: 90, plunge: 10 }
    const rings = smallCircle(axis, 30, 90)!
    expect(rings.length).toBe(2)
    for (const ring of rings) {
      expectAngle(ring[0].plunge, 0, 1e-9)
      expectAngle(ring[ring.length - 1].plunge, 0, 1e-9)
      for (const p of ring) {
        expect(p.plunge).toBeGreaterThanOrEqual(0)
        expectAngle((Math.acos(Math.abs(dot(vec(p), vec(axis)))) * 180) / Math.PI, 30, 1e-9)
      }
    }
  })

  it('smallCircle() angle 0 collapses onto the axis; invalid input → undefined', () => {
    const [ring] = smallCircle({ trend: 10, plunge: 45 }, 0, 12)!
    expect(ring.every((p) => Math.abs(p.plunge - 45) < 1e-9)).toBe(true)
    expect(smallCircle({ trend: NaN, plunge: 45 }, 10)).toBeUndefined()
  })
})
