import { describe, expect, it } from 'vitest'
import {
  DEFAULT_ERROR_MODEL,
  coreToPlane,
  imagePickToPlane,
  orientationUncertainty,
} from '../../orient'
import type { ErrorModel, Line, Plane } from '../../orient'
import { axisAngle, columnsOf, normalSource, percentile95, poleVec } from './uncertainty-fixture'
import type { Item } from './uncertainty-fixture'
import { seeded } from './sample'

// An independent Monte Carlo written plainly [derived]: per draw, perturbed inputs go through the
// product's own conversions (coreToPlane, imagePickToPlane, or the plane as entered); the angle to
// the undisturbed pole is taken as an axis, and the 95th percentile by a full sort. Errors as the
// product's physics: survey azimuth about the vertical (none in a vertical hole), inclination on
// the plunge, depth through the hole's change per metre, alpha reflected into 0–90, beta with the
// steep-hole mark error atan(σ_I / tilt) as a separate normal (uniform beta where tilt ≤ σ_I),
// pick height clamped at 0. Its own seeded generator stands in for Math.random.

const DRAWS = 4000

/** alpha folded into 0–90 by reflection at both ends. */
function reflect(alpha: number): number {
  let a = Math.abs(alpha)
  while (a > 90) a = Math.abs(180 - a)
  return a
}

function plainCone(item: Item, m: ErrorModel, seed: number): number {
  const normal = normalSource(seeded(seed))
  const seededUniform = seeded(seed + 1)
  const plane = (draw: boolean): Plane | undefined => {
    const z = () => (draw ? normal() : 0)
    if (item.source === 'true')
      return {
        dip: item.dip + m.trueDipSd * z(),
        dipDirection: item.dipDirection + m.trueDipDirectionSd * z(),
      }
    const [trend, plunge] = item.hole
    const [trendRate, plungeRate] = item.rates ?? [0, 0]
    const vertical = Math.abs(plunge) >= 89.9
    const depth = m.depthSd * z()
    const hole: Line = {
      trend: trend + (vertical ? 0 : (item.azimuthSd ?? 1.5) * z() + trendRate * depth),
      plunge: plunge + m.surveyInclinationSd * z() + plungeRate * depth,
    }
    if (item.source === 'core') {
      const tilt = 90 - Math.abs(plunge)
      const uniform = draw && m.surveyInclinationSd > 0 && tilt <= m.surveyInclinationSd
      const mark =
        m.surveyInclinationSd > 0 ? Math.atan(m.surveyInclinationSd / tilt) * (180 / Math.PI) : 0
      const beta = uniform ? 360 * seededUniform() : item.beta + m.betaSd * z() + mark * z()
      return coreToPlane({ alpha: reflect(item.alpha + m.alphaSd * z()), beta }, hole)
    }
    return imagePickToPlane(
      {
        amplitude: Math.max(0, item.amplitude + m.pickHeightSdMm * z()),
        diameter: item.diameter,
        troughAzimuth: item.trough + m.pickTroughSd * z(),
        reference: item.north ? 'north' : 'highside',
      },
      hole,
    )
  }
  const base = poleVec(plane(false)!)
  const angles: number[] = []
  for (let d = 0; d < DRAWS; d++) angles.push(axisAngle(poleVec(plane(true)!), base))
  return percentile95(angles)
}

const cases: { name: string; item: Item }[] = [
  {
    name: 'core alpha 45 in hole 060/60 with a curving survey',
    item: {
      source: 'core',
      alpha: 45,
      beta: 120,
      hole: [60, 60],
      rates: [0.3, -0.1],
      azimuthSd: 1.5,
    },
  },
  {
    name: 'core alpha 25 in steep hole 330/84, gyro survey',
    item: { source: 'core', alpha: 25, beta: 300, hole: [330, 84], azimuthSd: 0.5 },
  },
  {
    name: 'image pick, north-referenced, in hole 150/65',
    item: {
      source: 'image',
      amplitude: 140,
      diameter: 96,
      trough: 40,
      north: true,
      hole: [150, 65],
      azimuthSd: 1.5,
    },
  },
  {
    name: 'image pick, high side, in hole 250/50',
    item: {
      source: 'image',
      amplitude: 60,
      diameter: 96,
      trough: 200,
      north: false,
      hole: [250, 50],
      azimuthSd: 1.5,
    },
  },
  { name: 'true orientation 055/070', item: { source: 'true', dip: 55, dipDirection: 70 } },
]

describe('orientationUncertainty() against a plain Monte Carlo (default error model)', () => {
  for (const c of cases) {
    it(`orientationUncertainty() ${c.name}: within 10 % of the plain Monte Carlo [derived]`, () => {
      const fast = orientationUncertainty(columnsOf([c.item]), DEFAULT_ERROR_MODEL, {
        draws: DRAWS,
      })
      const plain = plainCone(c.item, DEFAULT_ERROR_MODEL, 99)
      expect(fast.cone95[0] / plain).toBeGreaterThan(0.9)
      expect(fast.cone95[0] / plain).toBeLessThan(1.1)
    })
  }
})
