import { describe, expect, it } from 'vitest'
import { imagePickToPlane } from '../../orient/index'
import {
  predictedSinusoids,
  type PredictableStructure,
} from '../../frontend/src/logic/image/predicted'
import { expectAngle } from '../orient/expect-angle'

const core = (extra: Partial<PredictableStructure>): PredictableStructure => ({
  id: 1,
  depth: 50,
  type: 'joint',
  source: 'core',
  dip: 45,
  dipDirection: 90,
  holeTrend: 0,
  holePlunge: 90,
  declinationApplied: 0,
  ...extra,
})
const trueNorth = {
  azimuthReference: 'north' as const,
  northReference: 'true' as const,
  diameterMm: 96,
}

describe('predictedSinusoids()', () => {
  it('vertical hole, plane 090/45, D 96 mm → height 96 mm, trough 090 (REFERENCES.md image-log check, derived)', () => {
    const [p] = predictedSinusoids([core({})], trueNorth, 0, 100)
    expect(p.height).toBeCloseTo(0.096, 9)
    expectAngle(p.troughAzimuth, 90, 1e-6)
    expect(p.depth).toBe(50)
    expect(p.role).toBe('predicted')
    expect(p.key).toBe('predicted:1')
  })

  it('hole 000/60, high-side image, plane 60/180 → H = D·tan 30°, trough 180 (REFERENCES.md check, derived)', () => {
    const [p] = predictedSinusoids(
      [core({ dip: 60, dipDirection: 180, holeTrend: 0, holePlunge: 60 })],
      { azimuthReference: 'highside', northReference: null, diameterMm: 96 },
      0,
      100,
    )
    expect(p.height).toBeCloseTo(0.096 * Math.tan(Math.PI / 6), 9)
    expectAngle(p.troughAzimuth, 180, 1e-6)
  })

  it('a magnetic-north image takes the trough back to magnetic: vertical hole, declination 10° E → 080 (derived)', () => {
    const [p] = predictedSinusoids(
      [core({ declinationApplied: 10 })],
      { ...trueNorth, northReference: 'magnetic' },
      0,
      100,
    )
    // True azimuth = magnetic + declination in a vertical hole, so 090 true is 080 magnetic.
    expectAngle(p.troughAzimuth, 80, 1e-6)
    expect(p.height).toBeCloseTo(0.096, 9)
  })

  it('is the inverse of imagePickToPlane in a deviated hole (round trip)', () => {
    const hole = { trend: 45, plunge: 70 }
    for (const plane of [
      { dip: 30, dipDirection: 200 },
      { dip: 75, dipDirection: 10 },
      { dip: 55, dipDirection: 310 },
    ]) {
      for (const reference of ['north', 'highside'] as const) {
        const [p] = predictedSinusoids(
          [core({ ...plane, holeTrend: hole.trend, holePlunge: hole.plunge })],
          {
            azimuthReference: reference,
            northReference: reference === 'north' ? 'true' : null,
            diameterMm: 120,
          },
          0,
          100,
        )
        const back = imagePickToPlane(
          { amplitude: p.height * 1000, diameter: 120, troughAzimuth: p.troughAzimuth, reference },
          hole,
        )!
        expect(back.dip).toBeCloseTo(plane.dip, 6)
        expectAngle(back.dipDirection, plane.dipDirection, 1e-6)
      }
    }
  })

  it('leaves out image picks, unoriented structures, structures out of the window, planes along the hole', () => {
    const list = [
      core({ id: 2, source: 'image' }),
      core({ id: 3, dip: null }),
      core({ id: 4, holeTrend: null }),
      core({ id: 5, depth: 300 }),
      core({ id: 6, dip: 90, dipDirection: 90 }), // contains the vertical hole's axis
      core({ id: 7, source: 'true' }),
    ]
    expect(predictedSinusoids(list, trueNorth, 0, 100).map((p) => p.key)).toEqual(['predicted:7'])
  })

  it('on a magnetic image leaves out a structure whose declination is not known', () => {
    const magnetic = { ...trueNorth, northReference: 'magnetic' as const }
    expect(predictedSinusoids([core({ declinationApplied: null })], magnetic, 0, 100)).toEqual([])
    expect(
      predictedSinusoids([core({ declinationApplied: null })], trueNorth, 0, 100),
    ).toHaveLength(1)
  })
})
