import { describe, expect, it } from 'vitest'
import { coreToPlane, imagePickToPlane, orientationUncertainty } from '../../orient'
// The trigonometric kernel is internal to orient/; it is imported directly to hold it to the
// public conversions.
import { corePoleTrig, northPickPoleTrig } from '../../orient/uncertainty-kernel'
import { columnsOf, onlyErrors, poleVec } from './uncertainty-fixture'
import type { Item, V3 } from './uncertainty-fixture'
import { seeded } from './sample'

const D = Math.PI / 180
const N = 10_000

/** Largest component difference between two axes (either sense). */
function axisGap(a: ArrayLike<number>, b: V3): number {
  const same = Math.max(...[0, 1, 2].map((k) => Math.abs(a[k] - b[k])))
  const flipped = Math.max(...[0, 1, 2].map((k) => Math.abs(a[k] + b[k])))
  return Math.min(same, flipped)
}

const trig = (deg: number) => [Math.sin(deg * D), Math.cos(deg * D)] as const

describe('uncertainty kernel', () => {
  it('corePoleTrig() equals coreToPlane to 1e-10 for 10,000 random inputs (up-holes, vertical)', () => {
    const random = seeded(11)
    const out = new Float64Array(3)
    let worst = 0
    for (let i = 0; i < N; i++) {
      const alpha = random() * 90
      const beta = random() * 360
      const trend = random() * 360
      // Every tenth hole exactly vertical, to cover holeFrame's convention there.
      const plunge = i % 10 === 0 ? 90 : random() * 180 - 90
      const [sa, ca] = trig(alpha)
      const [sb, cb] = trig(beta)
      const [sT, cT] = trig(trend)
      const [sP, cP] = trig(plunge)
      corePoleTrig(out, sa, ca, sb, cb, sT, cT, sP, cP)
      const plane = coreToPlane({ alpha, beta }, { trend, plunge })!
      worst = Math.max(worst, axisGap(out, poleVec(plane)))
    }
    expect(worst).toBeLessThan(1e-10)
  })

  it('northPickPoleTrig() and corePoleTrig(−sin θ, −cos θ) equal imagePickToPlane to 1e-10', () => {
    const random = seeded(12)
    const out = new Float64Array(3)
    let worst = 0
    for (let i = 0; i < N; i++) {
      const amplitude = random() * 600
      const diameter = 60 + random() * 100
      const troughAzimuth = random() * 360
      const north = i % 2 === 0
      const trend = random() * 360
      const plunge = i % 10 === 1 ? 90 : random() * 180 - 90
      const r = 1 / Math.hypot(amplitude, diameter)
      const [sh, ch] = trig(troughAzimuth)
      const [sT, cT] = trig(trend)
      const [sP, cP] = trig(plunge)
      const pick = { amplitude, diameter, troughAzimuth, reference: north ? 'north' : 'highside' }
      const plane = imagePickToPlane(pick as Parameters<typeof imagePickToPlane>[0], {
        trend,
        plunge,
      })!
      if (north)
        expect(northPickPoleTrig(out, diameter * r, amplitude * r, sh, ch, sT, cT, sP, cP)).toBe(
          true,
        )
      else corePoleTrig(out, diameter * r, amplitude * r, -sh, -ch, sT, cT, sP, cP)
      worst = Math.max(worst, axisGap(out, poleVec(plane)))
    }
    expect(worst).toBeLessThan(1e-10)
  })

  it('northPickPoleTrig() horizontal north–south hole: false, as imagePickToPlane is undefined', () => {
    const pick = { amplitude: 50, diameter: 96, troughAzimuth: 30, reference: 'north' as const }
    expect(imagePickToPlane(pick, { trend: 0, plunge: 0 })).toBeUndefined()
    expect(northPickPoleTrig(new Float64Array(3), 0.8, 0.6, 0.5, 0.866, 0, 1, 0, 1)).toBe(false)
  })

  it('orientationUncertainty() zero error model: every draw is the computed pole (cone < 1e-5°)', () => {
    // The loops write the kernel out for speed; with no error (azimuthSd, the caller's per-hole
    // column, 0 too) every draw must land on the pole the kernel computed, whatever the source,
    // hole or reference.
    const random = seeded(13)
    const items: Item[] = Array.from({ length: 3000 }, (_, i): Item => {
      const hole: [number, number] = [random() * 360, i % 7 === 0 ? 90 : random() * 170 - 80]
      const rates: [number, number] = [random() - 0.5, random() - 0.5]
      if (i % 3 === 0)
        return {
          source: 'core',
          alpha: random() * 90,
          beta: random() * 360,
          hole,
          rates,
          azimuthSd: 0,
        }
      if (i % 3 === 1)
        return {
          source: 'image',
          amplitude: random() * 400,
          diameter: 96,
          trough: random() * 360,
          north: i % 2 === 0,
          hole,
          rates,
          azimuthSd: 0,
        }
      return { source: 'true', dip: random() * 90, dipDirection: random() * 360 }
    })
    const result = orientationUncertainty(columnsOf(items), onlyErrors({}))
    expect(Math.max(...result.cone95)).toBeLessThan(1e-5)
  })
})
