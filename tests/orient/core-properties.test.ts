import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { coreToPlane, coreToPlaneBatch, planeToCore, poleOf } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, vec } from './sample'

const angle = (min: number, max: number) =>
  fc.double({ min, max, noNaN: true, noDefaultInfinity: true })
const hole = fc.record({ trend: angle(0, 360), plunge: angle(-89, 89) })
// Away from the exact ends, where beta (alpha 90) or the pole sense (vertical planes) is arbitrary.
const core = fc.record({ alpha: angle(0.5, 89.5), beta: angle(0, 360) })

describe('coreToPlane() properties', () => {
  it('planeToCore(coreToPlane(x)) ≈ x for random holes and angles', () => {
    fc.assert(
      fc.property(core, hole, (c, h) => {
        const back = planeToCore(coreToPlane(c, h)!, h)!
        expectAngle(back.alpha, c.alpha, 1e-7)
        expectAngle(back.beta, c.beta, 1e-6)
      }),
      { numRuns: 500 },
    )
  })

  it('coreToPlane() alpha = 90 ⇒ pole parallel to the hole', () => {
    fc.assert(
      fc.property(angle(0, 360), hole, (beta, h) => {
        const pole = poleOf(coreToPlane({ alpha: 90, beta }, h)!)!
        expect(Math.abs(dot(vec(pole), vec(h)))).toBeCloseTo(1, 12)
      }),
    )
  })

  it('coreToPlane() vertical hole ⇒ dip = 90 - alpha', () => {
    fc.assert(
      fc.property(core, angle(0, 360), (c, trend) => {
        const plane = coreToPlane(c, { trend, plunge: 90 })!
        expectAngle(plane.dip, 90 - c.alpha, 1e-9)
      }),
    )
  })

  it('coreToPlane() top reference = bottom reference with beta + 180', () => {
    fc.assert(
      fc.property(core, hole, (c, h) => {
        const top = coreToPlane(c, h, { reference: 'top' })!
        const bottom = coreToPlane({ alpha: c.alpha, beta: c.beta + 180 }, h)!
        expectAngle(top.dip, bottom.dip, 1e-9)
        expectAngle(top.dipDirection, bottom.dipDirection, 1e-9)
      }),
    )
  })

  it('coreToPlane() the pole makes the angle 90 - alpha with the core axis', () => {
    fc.assert(
      fc.property(core, hole, (c, h) => {
        const pole = poleOf(coreToPlane(c, h)!)!
        const cos = Math.abs(dot(vec(pole), vec(h)))
        expectAngle((Math.acos(Math.min(1, cos)) * 180) / Math.PI, 90 - c.alpha, 1e-6)
      }),
    )
  })
})

describe('coreToPlaneBatch() properties', () => {
  it('coreToPlaneBatch() equals coreToPlane() item by item, both references', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(core, hole), { minLength: 1, maxLength: 40 }),
        fc.boolean(),
        (items, top) => {
          const options = { reference: top ? ('top' as const) : ('bottom' as const) }
          const input = {
            alpha: Float64Array.from(items, ([c]) => c.alpha),
            beta: Float64Array.from(items, ([c]) => c.beta),
            holeTrend: Float64Array.from(items, ([, h]) => h.trend),
            holePlunge: Float64Array.from(items, ([, h]) => h.plunge),
          }
          const out = coreToPlaneBatch(input, undefined, options)
          expect(out.invalid).toBe(0)
          items.forEach(([c, h], i) => {
            const single = coreToPlane(c, h, options)!
            expectAngle(out.dip[i], single.dip, 1e-9)
            // Steep planes may flip their pole sense on rounding: compare dip directions as axes.
            const tol = single.dip > 89.999999 ? 2e-6 : 1e-8
            expectAngle(
              single.dip > 89.999999 ? 2 * out.dipDirection[i] : out.dipDirection[i],
              single.dip > 89.999999 ? 2 * single.dipDirection : single.dipDirection,
              tol,
            )
          })
        },
      ),
      { numRuns: 200 },
    )
  })
})
