import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import {
  angleBetweenPlanes,
  apparentDip,
  coreToLine,
  coreToPlane,
  desurvey,
  doglegs,
  fisherStats,
  greatCircle,
  holeAt,
  imagePickToPlane,
  orientationTensor,
  planeIntersection,
  planeToCore,
  poleOf,
  positionAt,
  project,
  smallCircle,
  terzaghiWeight,
} from '../../orient'
import { expectAngle } from './expect-angle'

/** True when no number anywhere inside the value is NaN. */
function noNaN(value: unknown): boolean {
  if (typeof value === 'number') return !Number.isNaN(value)
  if (Array.isArray(value)) return value.every(noNaN)
  if (value && typeof value === 'object') return Object.values(value).every(noNaN)
  return true
}

// Any double at all: NaN, ±Infinity, huge and tiny values included.
const any = fc.double()
const anyLine = fc.record({ trend: any, plunge: any })
const anyPlane = fc.record({ dipDirection: any, dip: any })

describe('degenerate input: never a throw, never a NaN in a result', () => {
  it('coreToPlane() / planeToCore() / coreToLine() on arbitrary numbers: undefined or finite', () => {
    fc.assert(
      fc.property(any, any, any, anyLine, (alpha, beta, gamma, hole) => {
        const plane = coreToPlane({ alpha, beta }, hole)
        expect(noNaN(plane)).toBe(true)
        expect(noNaN(coreToLine({ alpha, beta, gamma }, hole))).toBe(true)
        if (plane) expect(noNaN(planeToCore(plane, hole))).toBe(true)
      }),
      { numRuns: 300 },
    )
  })

  it('poleOf(), planeIntersection(), angleBetweenPlanes(), apparentDip(), project(), terzaghiWeight(), imagePickToPlane() on arbitrary numbers: undefined or finite', () => {
    fc.assert(
      fc.property(anyPlane, anyPlane, anyLine, any, (a, b, line, az) => {
        for (const r of [
          poleOf(a),
          planeIntersection(a, b),
          angleBetweenPlanes(a, b),
          apparentDip(a, az),
          project(line),
          terzaghiWeight(a, line),
          imagePickToPlane(
            { amplitude: az, diameter: 96, troughAzimuth: line.trend, reference: 'north' },
            line,
          ),
        ])
          expect(noNaN(r)).toBe(true)
      }),
      { numRuns: 300 },
    )
  })

  it('fisherStats() / orientationTensor() on arbitrary lines: undefined or finite', () => {
    fc.assert(
      fc.property(fc.array(anyLine, { maxLength: 8 }), (lines) => {
        expect(noNaN(fisherStats(lines))).toBe(true)
        expect(noNaN(fisherStats(lines, { axial: false }))).toBe(true)
        expect(noNaN(orientationTensor(lines))).toBe(true)
      }),
      { numRuns: 200 },
    )
  })

  it('desurvey() / doglegs() / holeAt() / positionAt() on arbitrary stations: finite points, directions and doglegs', () => {
    const station = fc.record({ depth: any, azimuth: any, plunge: any })
    fc.assert(
      fc.property(fc.array(station, { maxLength: 6 }), any, (stations, depth) => {
        expect(noNaN(desurvey(stations))).toBe(true)
        expect(noNaN(doglegs(stations))).toBe(true)
        expect(noNaN(holeAt(stations, depth))).toBe(true)
        expect(noNaN(positionAt(stations, depth))).toBe(true)
      }),
      { numRuns: 200 },
    )
  })
})

describe('degenerate input: defined conventions', () => {
  it('coreToPlane() alpha 0: a plane containing the core axis; alpha outside 0–90 → undefined', () => {
    const plane = coreToPlane({ alpha: 0, beta: 90 }, { trend: 0, plunge: 90 })!
    expectAngle(plane.dip, 90, 1e-9)
    expect(coreToPlane({ alpha: 90.5, beta: 0 }, { trend: 0, plunge: 60 })).toBeUndefined()
    expect(coreToPlane({ alpha: -1, beta: 0 }, { trend: 0, plunge: 60 })).toBeUndefined()
  })

  it('coreToPlane() azimuth 360 = 0 for beta and hole trend', () => {
    const a = coreToPlane({ alpha: 40, beta: 0 }, { trend: 0, plunge: 50 })!
    const b = coreToPlane({ alpha: 40, beta: 360 }, { trend: 360, plunge: 50 })!
    expectAngle(b.dipDirection, a.dipDirection, 1e-9)
    expectAngle(b.dip, a.dip, 1e-9)
  })

  it('coreToPlane() horizontal hole and vertical up-hole give defined planes', () => {
    const flat = coreToPlane({ alpha: 90, beta: 0 }, { trend: 90, plunge: 0 })!
    expectAngle(flat.dip, 90, 1e-9)
    expectAngle(2 * flat.dipDirection, 2 * 90, 1e-9)
    const up = coreToPlane({ alpha: 60, beta: 0 }, { trend: 0, plunge: -90 })!
    expectAngle(up.dip, 30, 1e-9)
  })

  it('desurvey() a reversing survey (dogleg 180°) stays finite', () => {
    const stations = [
      { depth: 0, azimuth: 0, plunge: 0 },
      { depth: 10, azimuth: 180, plunge: 0 },
    ]
    expectAngle(doglegs(stations)[0].dogleg, 180, 1e-9)
    expect(noNaN(desurvey(stations))).toBe(true)
    expect(noNaN(positionAt(stations, 5))).toBe(true)
    expect(noNaN(holeAt(stations, 5))).toBe(true)
  })

  it('greatCircle() / smallCircle() vertical plane, right-angle cone and NaN', () => {
    const vertical = greatCircle({ dip: 90, dipDirection: 45 }, 4)!
    expectAngle(vertical[2].plunge, 90, 1e-9)
    const ring = smallCircle({ trend: 0, plunge: 90 }, 90, 8)!
    expect(ring.flat().every((p) => Math.abs(p.plunge) < 1e-9)).toBe(true)
    expect(greatCircle({ dip: NaN, dipDirection: 0 })).toBeUndefined()
  })

  it('fisherStats() mixes of valid and invalid lines use the valid ones', () => {
    const stats = fisherStats([
      { trend: 10, plunge: 20 },
      { trend: NaN, plunge: 20 },
      { trend: 12, plunge: 22 },
    ])!
    expect(stats.count).toBe(2)
    expect(
      fisherStats([
        { trend: NaN, plunge: 0 },
        { trend: 0, plunge: Infinity },
      ]),
    ).toBeUndefined()
  })
})
