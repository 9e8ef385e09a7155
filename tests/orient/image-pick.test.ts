import { describe, expect, it } from 'vitest'
import { coreToPlane, highSideFromNorth, imagePickToPlane } from '../../orient'
import { expectAngle } from './expect-angle'

describe('imagePickToPlane()', () => {
  it('imagePickToPlane() vertical hole, D = H = 96 mm, trough 090 → 45 / 090 [derived]', () => {
    const plane = imagePickToPlane(
      { amplitude: 96, diameter: 96, troughAzimuth: 90, reference: 'north' },
      { trend: 0, plunge: 90 },
    )
    expectAngle(plane?.dip, 45, 1e-9)
    expectAngle(plane?.dipDirection, 90, 1e-9)
  })

  it('imagePickToPlane() hole 000/60 high-side image, H/D = tan 30°, trough 180 → 60 / 180 [derived]', () => {
    const plane = imagePickToPlane(
      { amplitude: Math.tan(Math.PI / 6), diameter: 1, troughAzimuth: 180, reference: 'highside' },
      { trend: 0, plunge: 60 },
    )
    expectAngle(plane?.dip, 60, 1e-9)
    expectAngle(plane?.dipDirection, 180, 1e-9)
  })

  it('imagePickToPlane() high side: same plane as core alpha = 90 - atan(H/D), beta = trough - 180', () => {
    const hole = { trend: 135, plunge: 45 }
    const plane = imagePickToPlane(
      { amplitude: 40, diameter: 96, troughAzimuth: 250, reference: 'highside' },
      hole,
    )
    const alpha = 90 - (Math.atan2(40, 96) * 180) / Math.PI
    const core = coreToPlane({ alpha, beta: 70 }, hole)
    expectAngle(plane?.dip, core!.dip, 1e-9)
    expectAngle(plane?.dipDirection, core!.dipDirection, 1e-9)
  })

  it('highSideFromNorth() hole 045/70: high side is 46.78° clockwise from projected north [derived]', () => {
    expectAngle(highSideFromNorth({ trend: 45, plunge: 70 }), 46.78, 0.005)
  })

  it('imagePickToPlane() north reference uses the vector transform, not the hole azimuth as offset', () => {
    const hole = { trend: 45, plunge: 70 }
    const offset = highSideFromNorth(hole)!
    const north = imagePickToPlane(
      { amplitude: 30, diameter: 96, troughAzimuth: 100, reference: 'north' },
      hole,
    )
    const high = imagePickToPlane(
      { amplitude: 30, diameter: 96, troughAzimuth: 100 - offset, reference: 'highside' },
      hole,
    )
    const naive = imagePickToPlane(
      { amplitude: 30, diameter: 96, troughAzimuth: 100 - 45, reference: 'highside' },
      hole,
    )
    expectAngle(north?.dipDirection, high!.dipDirection, 1e-9)
    expectAngle(north?.dip, high!.dip, 1e-9)
    expect(Math.abs(north!.dipDirection - naive!.dipDirection)).toBeGreaterThan(0.1)
  })

  it('imagePickToPlane() zero amplitude: plane perpendicular to the hole', () => {
    const plane = imagePickToPlane(
      { amplitude: 0, diameter: 96, troughAzimuth: 0, reference: 'highside' },
      { trend: 270, plunge: 60 },
    )
    expectAngle(plane?.dip, 30, 1e-9)
    expectAngle(plane?.dipDirection, 90, 1e-9)
  })

  it('imagePickToPlane() undefined for no diameter, negative amplitude, NaN, or north reference along a horizontal N–S hole', () => {
    const hole = { trend: 0, plunge: 60 }
    expect(
      imagePickToPlane({ amplitude: 10, diameter: 0, troughAzimuth: 0, reference: 'north' }, hole),
    ).toBeUndefined()
    expect(
      imagePickToPlane({ amplitude: -1, diameter: 96, troughAzimuth: 0, reference: 'north' }, hole),
    ).toBeUndefined()
    expect(
      imagePickToPlane(
        { amplitude: 10, diameter: 96, troughAzimuth: NaN, reference: 'north' },
        hole,
      ),
    ).toBeUndefined()
    expect(
      imagePickToPlane(
        { amplitude: 10, diameter: 96, troughAzimuth: 0, reference: 'north' },
        { trend: 180, plunge: 0 },
      ),
    ).toBeUndefined()
    expect(highSideFromNorth({ trend: 0, plunge: 0 })).toBeUndefined()
  })
})
