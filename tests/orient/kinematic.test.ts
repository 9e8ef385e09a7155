import { describe, expect, it } from 'vitest'
import { kinematicChecks } from '../../orient'
import { expectAngle } from './expect-angle'

// Face and friction of a design check; the rules after Markland (1972), Hoek & Bray (1981),
// Wyllie & Mah (2004, §2.6) and Goodman & Bray (1976).
const face = { dip: 70, dipDirection: 180 }

describe('kinematicChecks() planar', () => {
  it('kinematicChecks() planar: within ±20° of the face dip direction, daylights, steeper than friction', () => {
    const planes = [
      { dip: 45, dipDirection: 195 },
      { dip: 45, dipDirection: 210 },
      { dip: 75, dipDirection: 180 },
      { dip: 25, dipDirection: 180 },
    ]
    const r = kinematicChecks({ face, friction: 30 }, planes)!
    expect(r.planar.map((v) => v.possible)).toEqual([true, false, false, false])
    expect(r.planar[1].reason).toMatch(/30\.0° from the face/)
    expect(r.planar[2].reason).toMatch(/does not daylight/)
    expect(r.planar[3].reason).toMatch(/friction/)
    expect(r.percent.planar).toBe(25)
    const wide = kinematicChecks({ face, friction: 30, lateralLimit: 30 }, planes)!
    expect(wide.planar[1].possible).toBe(true)
  })

  it('kinematicChecks() planar: dip direction 359 vs face 001 is 2° apart (azimuth wrap)', () => {
    const r = kinematicChecks({ face: { dip: 60, dipDirection: 1 }, friction: 30 }, [
      { dip: 40, dipDirection: 359 },
    ])!
    expect(r.planar[0].possible).toBe(true)
  })
})

describe('kinematicChecks() toppling', () => {
  it('kinematicChecks() flexural toppling: dips into the face and (90 − dip) + friction < face dip', () => {
    const planes = [
      { dip: 80, dipDirection: 10 },
      { dip: 50, dipDirection: 0 },
      { dip: 80, dipDirection: 60 },
      { dip: 80, dipDirection: 20 },
    ]
    const r = kinematicChecks({ face, friction: 30 }, planes)!
    expect(r.toppling.map((v) => v.possible)).toEqual([true, false, false, true])
    expect(r.toppling[1].reason).toMatch(/not below the face dip/)
    expect(r.toppling[2].reason).toMatch(/not dipping into the face/)
    // Goodman & Bray (1976) used ±10°: the 20° case drops out.
    const strict = kinematicChecks({ face, friction: 30, topplingLimit: 10 }, planes)!
    expect(strict.toppling[3].possible).toBe(false)
    expect(r.percent.toppling).toBe(50)
  })
})

describe('kinematicChecks() wedge', () => {
  it('kinematicChecks() wedge on the Hoek & Bray planes 45/105 and 70/235: intersection 31.2 → 157.7 slides along it', () => {
    // [pub, from memory] Hoek & Bray (1981) wedge example planes; 157.7 ± 0.2 / 31.2.
    const planes = [
      { dip: 45, dipDirection: 105 },
      { dip: 70, dipDirection: 235 },
    ]
    const r = kinematicChecks({ face: { dip: 70, dipDirection: 160 }, friction: 30 }, planes)!
    expect(r.wedge).toHaveLength(1)
    const w = r.wedge[0]
    expectAngle(w.line?.trend, 157.7, 0.2)
    expectAngle(w.line?.plunge, 31.2, 0.05)
    expect(w.possible).toBe(true)
    expect(w.slidesOn).toBe('intersection')
    const rough = kinematicChecks({ face: { dip: 70, dipDirection: 160 }, friction: 35 }, planes)!
    expect(rough.wedge[0].possible).toBe(false)
    expect(rough.wedge[0].reason).toMatch(/friction/)
  })

  it('kinematicChecks() wedge: a plane whose dip direction lies between the intersection and the face slides alone (Wyllie & Mah 2004, §2.6)', () => {
    const planes = [
      { dip: 50, dipDirection: 175 },
      { dip: 70, dipDirection: 235 },
    ]
    const r = kinematicChecks({ face, friction: 30 }, planes)!
    expectAngle(r.wedge[0].line?.trend, 170.63, 0.01)
    expect(r.wedge[0].possible).toBe(true)
    expect(r.wedge[0].slidesOn).toBe('a')
    expect(r.wedge[0].reason).toMatch(/50\.0\/175\.0 plane alone/)
  })

  it('kinematicChecks() wedge: intersection plunging away from the face, steeper than the face, or parallel planes', () => {
    const r = kinematicChecks({ face, friction: 30 }, [
      { dip: 50, dipDirection: 340 },
      { dip: 50, dipDirection: 20 },
      { dip: 85, dipDirection: 150 },
      { dip: 85, dipDirection: 210 },
      { dip: 50, dipDirection: 340 },
    ])!
    const pair = (a: number, b: number) => r.wedge.find((w) => w.a === a && w.b === b)!
    expect(pair(0, 1).reason).toMatch(/from the face dip direction/)
    expect(pair(2, 3).reason).toMatch(/not below the apparent face dip/)
    expect(pair(0, 4).reason).toMatch(/parallel/)
    expect(r.wedge).toHaveLength(10)
  })

  it('kinematicChecks() explicit pairs and percentages per mode', () => {
    const planes = [
      { dip: 45, dipDirection: 105 },
      { dip: 70, dipDirection: 235 },
      { dip: 20, dipDirection: 0 },
    ]
    const r = kinematicChecks({ face: { dip: 70, dipDirection: 160 }, friction: 30 }, planes, [
      [0, 1],
      [1, 2],
    ])!
    expect(r.wedge.map((w) => [w.a, w.b])).toEqual([
      [0, 1],
      [1, 2],
    ])
    expect(r.percent.wedge).toBe(50)
  })

  it('kinematicChecks() invalid face or friction → undefined; invalid planes and pairs are reported, not thrown', () => {
    expect(
      kinematicChecks({ face: { dip: NaN, dipDirection: 0 }, friction: 30 }, []),
    ).toBeUndefined()
    expect(kinematicChecks({ face, friction: 95 }, [])).toBeUndefined()
    expect(kinematicChecks({ face, friction: 30, lateralLimit: NaN }, [])).toBeUndefined()
    const r = kinematicChecks(
      { face, friction: 30 },
      [
        { dip: NaN, dipDirection: 3 },
        { dip: 40, dipDirection: 180 },
      ],
      [
        [0, 1],
        [1, 7],
      ],
    )!
    expect(r.planar[0].reason).toBe('invalid orientation')
    expect(r.wedge.every((w) => !w.possible)).toBe(true)
    expect(kinematicChecks({ face, friction: 30 }, [])!.percent).toEqual({
      planar: 0,
      wedge: 0,
      toppling: 0,
    })
  })
})
