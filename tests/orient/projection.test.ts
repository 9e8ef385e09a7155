import { geoAzimuthalEqualArea, geoStereographic } from 'd3'
import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { project, unproject } from '../../orient'
import { expectAngle } from './expect-angle'

const line = fc.record({
  trend: fc.double({ min: 0, max: 360, noNaN: true }),
  plunge: fc.double({ min: 0, max: 90, noNaN: true }),
})

describe('project()', () => {
  it('project() 045/30 on a net of radius 100: equal-area (50, 50), equal-angle (40.825, 40.825) north up [derived]', () => {
    // [derived] r = R√2 sin(c/2) and R tan(c/2), c = 90 − plunge (Lambert / stereographic).
    const ea = project({ trend: 45, plunge: 30 }, 'equal-area')!
    const eq = project({ trend: 45, plunge: 30 }, 'equal-angle')!
    expect(100 * ea.x).toBeCloseTo(50, 9)
    expect(100 * ea.y).toBeCloseTo(50, 9)
    expect(100 * eq.x).toBeCloseTo(40.825, 3)
    expect(100 * eq.y).toBeCloseTo(40.825, 3)
  })

  it('project() agrees with d3-geo (screen y down: 045/30 → (50, −50) and (40.825, −40.825) at R = 100) [derived]', () => {
    const ea = geoAzimuthalEqualArea()
      .rotate([0, 90])
      .scale(100 / Math.SQRT2)
      .clipAngle(90)
      .translate([0, 0])
    const st = geoStereographic().rotate([0, 90]).scale(100).clipAngle(90).translate([0, 0])
    const [ex, ey] = ea([45, -30])!
    const [sx, sy] = st([45, -30])!
    expect(ex).toBeCloseTo(50, 6)
    expect(ey).toBeCloseTo(-50, 6)
    expect(sx).toBeCloseTo(40.825, 3)
    expect(sy).toBeCloseTo(-40.825, 3)
    const ours = project({ trend: 45, plunge: 30 })!
    expect(100 * ours.y).toBeCloseTo(-ey, 6)
  })

  it('project() centre for vertical, primitive for horizontal lines, upward lines by their antipode', () => {
    expect(project({ trend: 123, plunge: 90 })).toEqual({ x: 0, y: 0 })
    const h = project({ trend: 90, plunge: 0 }, 'equal-angle')!
    expect(h.x).toBeCloseTo(1, 12)
    const up = project({ trend: 45, plunge: -30 })!
    const down = project({ trend: 225, plunge: 30 })!
    expect(up.x).toBeCloseTo(down.x, 12)
    expect(up.y).toBeCloseTo(down.y, 12)
  })

  it('unproject(project(x)) ≈ x on both nets', () => {
    for (const projection of ['equal-area', 'equal-angle'] as const) {
      fc.assert(
        fc.property(
          line.filter((l) => l.plunge < 89.9999),
          (l) => {
            const back = unproject(project(l, projection)!, projection)!
            expectAngle(back.plunge, l.plunge, 1e-7)
            expectAngle(back.trend, l.trend, 1e-6)
          },
        ),
      )
    }
  })

  it('unproject() outside the primitive → undefined; the centre is vertical', () => {
    expect(unproject({ x: 0.8, y: 0.8 })).toBeUndefined()
    expect(unproject({ x: NaN, y: 0 })).toBeUndefined()
    expectAngle(unproject({ x: 0, y: 0 })?.plunge, 90, 1e-12)
    expectAngle(unproject({ x: 0, y: 1 })?.plunge, 0, 1e-9)
  })
})
