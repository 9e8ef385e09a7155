import { describe, expect, it } from 'vitest'
import { coreToLine, coreToPlane, isSteepHole, planeToCore, poleOf } from '../../orient'
import { expectAngle } from './expect-angle'
import { dot, vec } from './sample'

// Check values [derived]: the vector method cross-checked against the stereonet construction of
// Marjoribanks (2010, Geological Methods in Mineral Exploration and Mining, 2nd ed., App. D).
const table = [
  { hole: [0, 60], alpha: 60, beta: 0, dip: 60.0, dd: 180.0 },
  { hole: [0, 60], alpha: 60, beta: 90, dip: 41.41, dd: 229.11 },
  { hole: [0, 60], alpha: 60, beta: 270, dip: 41.41, dd: 130.89 },
  { hole: [135, 45], alpha: 40, beta: 300, dip: 79.42, dd: 272.55 },
  { hole: [45, 70], alpha: 35, beta: 210, dip: 38.59, dd: 86.04 },
  // Up-hole [derived]: works unchanged with negative plunge.
  { hole: [90, -30], alpha: 50, beta: 20, dip: 25.03, dd: 121.31 },
]

describe('coreToPlane()', () => {
  for (const row of table) {
    const [trend, plunge] = row.hole
    it(`coreToPlane() hole ${trend}/${plunge}, alpha ${row.alpha}, beta ${row.beta} → ${row.dip} / ${row.dd} [derived]`, () => {
      const plane = coreToPlane({ alpha: row.alpha, beta: row.beta }, { trend, plunge })
      expectAngle(plane?.dip, row.dip, 0.006)
      expectAngle(plane?.dipDirection, row.dd, 0.006)
    })
  }

  it('coreToPlane() alpha 90 in hole 270/60: 30 / 090 for any beta [derived]', () => {
    for (const beta of [0, 45, 137, 270, 359.9]) {
      const plane = coreToPlane({ alpha: 90, beta }, { trend: 270, plunge: 60 })
      expectAngle(plane?.dip, 30, 1e-9)
      expectAngle(plane?.dipDirection, 90, 1e-9)
    }
  })

  it('coreToPlane() hole 000/60, alpha 30, beta 0: vertical plane striking east–west [derived]', () => {
    const plane = coreToPlane({ alpha: 30, beta: 0 }, { trend: 0, plunge: 60 })
    expectAngle(plane?.dip, 90, 1e-9)
    // Dip direction of a vertical plane is 000 or 180: compare as an axis (doubled angle).
    expectAngle(2 * plane!.dipDirection, 0, 2e-9)
  })

  it('coreToPlane() top reference: beta measured from top of hole = bottom-of-hole beta + 180', () => {
    const hole = { trend: 135, plunge: 45 }
    const top = coreToPlane({ alpha: 40, beta: 120 }, hole, { reference: 'top' })
    expectAngle(top?.dip, 79.42, 0.006)
    expectAngle(top?.dipDirection, 272.55, 0.006)
  })

  it('coreToPlane() vertical hole: dip = 90 - alpha, toward beta + 180 + trend (stated trend is the high side)', () => {
    const hole = { trend: 0, plunge: 90 }
    const plane = coreToPlane({ alpha: 60, beta: 0 }, hole)
    expectAngle(plane?.dip, 30, 1e-9)
    // Bottom of hole points to trend + 180 = south: the down-hole apex there means a dip south.
    expectAngle(plane?.dipDirection, 180, 1e-9)
    const east = coreToPlane({ alpha: 60, beta: 0 }, { trend: 90, plunge: 90 })
    expectAngle(east?.dipDirection, 270, 1e-9)
  })

  it('coreToPlane() vertical hole is the limit of a steepening inclined hole of the same trend', () => {
    const limit = coreToPlane({ alpha: 50, beta: 70 }, { trend: 30, plunge: 90 })
    const near = coreToPlane({ alpha: 50, beta: 70 }, { trend: 30, plunge: 89.9999 })
    expectAngle(limit?.dip, near!.dip, 1e-3)
    expectAngle(limit?.dipDirection, near!.dipDirection, 1e-3)
  })
})

describe('planeToCore()', () => {
  for (const row of table) {
    const [trend, plunge] = row.hole
    it(`planeToCore() ${row.dip} / ${row.dd} in hole ${trend}/${plunge} → alpha ${row.alpha}, beta ${row.beta} [derived]`, () => {
      const core = planeToCore({ dip: row.dip, dipDirection: row.dd }, { trend, plunge })
      expectAngle(core?.alpha, row.alpha, 0.01)
      expectAngle(core?.beta, row.beta, 0.02)
    })
  }

  it('planeToCore() plane perpendicular to the hole: alpha 90, beta 0 by convention', () => {
    const core = planeToCore({ dip: 30, dipDirection: 90 }, { trend: 270, plunge: 60 })
    expectAngle(core?.alpha, 90, 1e-9)
    expect(core?.beta).toBe(0)
  })

  it('planeToCore() top reference returns beta - 180', () => {
    const core = planeToCore(
      { dip: 79.42, dipDirection: 272.55 },
      { trend: 135, plunge: 45 },
      { reference: 'top' },
    )
    expectAngle(core?.beta, 120, 0.02)
  })
})

describe('coreToLine()', () => {
  it('coreToLine() vertical hole: gamma 0 is the dip line, gamma 90 the strike line clockwise looking down [derived]', () => {
    const hole = { trend: 0, plunge: 90 }
    const dipLine = coreToLine({ alpha: 60, beta: 0, gamma: 0 }, hole)
    expectAngle(dipLine?.trend, 180, 1e-9)
    expectAngle(dipLine?.plunge, 30, 1e-9)
    const strike = coreToLine({ alpha: 60, beta: 0, gamma: 90 }, hole)
    expectAngle(strike?.trend, 270, 1e-9)
    expectAngle(strike?.plunge, 0, 1e-9)
  })

  it('coreToLine() the lineation lies in the plane, and gamma + 180 is the same line', () => {
    const hole = { trend: 135, plunge: 45 }
    for (const gamma of [0, 25, 90, 140, 200, 333]) {
      const core = { alpha: 40, beta: 300, gamma }
      const line = coreToLine(core, hole)!
      const pole = poleOf(coreToPlane(core, hole)!)!
      expect(Math.abs(dot(vec(line), vec(pole)))).toBeLessThan(1e-12)
      const back = coreToLine({ ...core, gamma: gamma + 180 }, hole)!
      expect(Math.abs(dot(vec(back), vec(line)))).toBeCloseTo(1, 12)
    }
  })

  it('coreToLine() alpha 90: gamma turns from the beta direction in the sense of beta', () => {
    const hole = { trend: 0, plunge: 60 }
    const a = coreToLine({ alpha: 90, beta: 0, gamma: 90 }, hole)!
    const b = coreToLine({ alpha: 90, beta: 90, gamma: 0 }, hole)!
    expectAngle(a.trend, b.trend, 1e-9)
    expectAngle(a.plunge, b.plunge, 1e-9)
  })
})

describe('isSteepHole()', () => {
  it('isSteepHole() flags holes within 5° of vertical by default, up or down', () => {
    expect(isSteepHole({ trend: 0, plunge: 86 })).toBe(true)
    expect(isSteepHole({ trend: 0, plunge: -88 })).toBe(true)
    expect(isSteepHole({ trend: 0, plunge: 84.9 })).toBe(false)
    expect(isSteepHole({ trend: 0, plunge: 80 }, 75)).toBe(true)
  })
})
