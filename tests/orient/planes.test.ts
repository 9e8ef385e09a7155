import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  angleBetweenLines,
  angleBetweenPlanes,
  apparentDip,
  planeIntersection,
  planeOfPole,
  poleOf,
} from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, vec } from './sample'

const plane = fc.record({
  dipDirection: fc.double({ min: 0, max: 360, noNaN: true }),
  dip: fc.double({ min: 0, max: 90, noNaN: true }),
})

describe('planeIntersection()', () => {
  it('planeIntersection() 45/105 and 70/235 → 31.2 toward 157.7 ± 0.2 (Hoek & Bray 1981, wedge example, from memory)', () => {
    // [pub, from memory] Hoek & Bray (1981), Rock Slope Engineering, wedge example: 31.2 toward
    // 157.6 printed; computed 31.20 / 157.73, so 157.7 ± 0.2.
    const line = planeIntersection({ dip: 45, dipDirection: 105 }, { dip: 70, dipDirection: 235 })
    expectAngle(line?.trend, 157.7, 0.2)
    expectAngle(line?.plunge, 31.2, 0.05)
  })

  it('planeIntersection() lies in both planes (perpendicular to both poles), lower hemisphere', () => {
    fc.assert(
      fc.property(plane, plane, (a, b) => {
        const line = planeIntersection(a, b)
        if (!line) return
        expect(Math.abs(dot(vec(line), vec(poleOf(a)!)))).toBeLessThan(1e-9)
        expect(Math.abs(dot(vec(line), vec(poleOf(b)!)))).toBeLessThan(1e-9)
        expect(line.plunge).toBeGreaterThanOrEqual(0)
      }),
      { numRuns: 300 },
    )
  })

  it('planeIntersection() parallel and identical planes → undefined; opposite dip directions of vertical planes too', () => {
    expect(
      planeIntersection({ dip: 30, dipDirection: 40 }, { dip: 30, dipDirection: 40 }),
    ).toBeUndefined()
    expect(
      planeIntersection({ dip: 90, dipDirection: 40 }, { dip: 90, dipDirection: 220 }),
    ).toBeUndefined()
    expect(
      planeIntersection({ dip: 0, dipDirection: 0 }, { dip: 0, dipDirection: 123 }),
    ).toBeUndefined()
  })

  it('planeIntersection() two vertical planes meet in a vertical line', () => {
    expectAngle(
      planeIntersection({ dip: 90, dipDirection: 0 }, { dip: 90, dipDirection: 90 })?.plunge,
      90,
      1e-9,
    )
  })
})

describe('poleOf() and planeOfPole()', () => {
  it('poleOf() trend = dip direction + 180, plunge = 90 - dip', () => {
    const pole = poleOf({ dip: 30, dipDirection: 250 })
    expectAngle(pole?.trend, 70, 1e-9)
    expectAngle(pole?.plunge, 60, 1e-9)
  })

  it('planeOfPole() inverts poleOf(), also from an upward line', () => {
    fc.assert(
      fc.property(
        plane.filter((p) => p.dip > 1e-6 && p.dip < 90 - 1e-6),
        (p) => {
          const back = planeOfPole(poleOf(p)!)!
          expectAngle(back.dip, p.dip, 1e-9)
          expectAngle(back.dipDirection, p.dipDirection, 1e-7)
        },
      ),
    )
    const up = planeOfPole({ trend: 250, plunge: -60 })
    expectAngle(up?.dipDirection, 250, 1e-9)
    expectAngle(up?.dip, 30, 1e-9)
  })
})

describe('angleBetweenPlanes()', () => {
  it('angleBetweenPlanes() is acute: 0–90', () => {
    expectAngle(
      angleBetweenPlanes({ dip: 30, dipDirection: 0 }, { dip: 30, dipDirection: 180 }),
      60,
      1e-9,
    )
    expectAngle(
      angleBetweenPlanes({ dip: 80, dipDirection: 0 }, { dip: 80, dipDirection: 180 }),
      20,
      1e-9,
    )
    expectAngle(
      angleBetweenPlanes({ dip: 50, dipDirection: 10 }, { dip: 50, dipDirection: 10 }),
      0,
      1e-6,
    )
    fc.assert(
      fc.property(plane, plane, (a, b) => {
        const angle = angleBetweenPlanes(a, b)!
        expect(angle).toBeGreaterThanOrEqual(0)
        expect(angle).toBeLessThanOrEqual(90)
      }),
    )
  })

  it('angleBetweenLines() treats lines as axes', () => {
    expectAngle(angleBetweenLines({ trend: 0, plunge: 0 }, { trend: 180, plunge: 0 }), 0, 1e-9)
    // cos = sin²(10°) for two lines plunging 10° at right angles in trend.
    const expected = (Math.acos(Math.sin((10 * Math.PI) / 180) ** 2) * 180) / Math.PI
    expectAngle(
      angleBetweenLines({ trend: 0, plunge: 10 }, { trend: 90, plunge: 10 }),
      expected,
      1e-9,
    )
  })
})

describe('apparentDip()', () => {
  it('apparentDip() tan(da) = tan(dip) cos(beta) (formula from memory)', () => {
    // [memory] tan(apparent dip) = tan(dip) cos(section azimuth − dip direction).
    expectAngle(apparentDip({ dip: 40, dipDirection: 100 }, 100), 40, 1e-9)
    expectAngle(
      apparentDip({ dip: 40, dipDirection: 100 }, 160),
      (Math.atan(Math.tan((40 * Math.PI) / 180) * 0.5) * 180) / Math.PI,
      1e-9,
    )
    expectAngle(apparentDip({ dip: 40, dipDirection: 100 }, 190), 0, 1e-9)
    expectAngle(apparentDip({ dip: 40, dipDirection: 100 }, 280), -40, 1e-9)
  })

  it('apparentDip() vertical plane: 90 across strike, 0 along strike; azimuth 360 = 0', () => {
    expectAngle(apparentDip({ dip: 90, dipDirection: 0 }, 30), 90, 1e-9)
    expectAngle(apparentDip({ dip: 90, dipDirection: 0 }, 90), 0, 1e-9)
    expectAngle(apparentDip({ dip: 35, dipDirection: 0 }, 360), 35, 1e-9)
  })
})
