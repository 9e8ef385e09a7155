import { describe, expect, it } from 'vitest'
import { magneticDeclination, toGridAzimuth, toTrueAzimuth } from '../../orient'
import { expectAngle } from './expect-angle'

const epoch = new Date(Date.UTC(2025, 0, 1))

describe('magneticDeclination()', () => {
  it('magneticDeclination() WMM2025 test values at 2025.0, h 0 km (NOAA WMM2025 report test values)', () => {
    // [pub] NOAA/BGS, The US/UK World Magnetic Model for 2025–2030, test values (D in degrees).
    expectAngle(
      magneticDeclination({ latitude: 80, longitude: 0, date: epoch, heightKm: 0 }),
      1.28,
      0.005,
    )
    expectAngle(magneticDeclination({ latitude: 0, longitude: 120, date: epoch }), -0.16, 0.005)
    expectAngle(magneticDeclination({ latitude: -80, longitude: 240, date: epoch }), 68.78, 0.005)
  })

  it('magneticDeclination() outside the model window falls back to the nearest model; bad input → undefined', () => {
    expect(
      Number.isFinite(
        magneticDeclination({ latitude: 45, longitude: 10, date: new Date(Date.UTC(2031, 0, 1)) }),
      ),
    ).toBe(true)
    expect(magneticDeclination({ latitude: 95, longitude: 0, date: epoch })).toBeUndefined()
    expect(magneticDeclination({ latitude: NaN, longitude: 0, date: epoch })).toBeUndefined()
    expect(
      magneticDeclination({ latitude: 0, longitude: 0, date: new Date('nonsense') }),
    ).toBeUndefined()
  })
})

describe('toTrueAzimuth() and toGridAzimuth()', () => {
  it('toTrueAzimuth() true = magnetic + D (D east positive), wrapped to 0–360', () => {
    expectAngle(toTrueAzimuth(350, 12), 2, 1e-12)
    expect(toTrueAzimuth(350, 12)).toBeCloseTo(2, 12)
    expect(toTrueAzimuth(10, -15)).toBeCloseTo(355, 12)
    expect(toTrueAzimuth(NaN, 1)).toBeUndefined()
  })

  it('toGridAzimuth() grid = true − convergence; 360 comes back as 0', () => {
    expect(toGridAzimuth(100, 2.5)).toBeCloseTo(97.5, 12)
    expect(toGridAzimuth(1, 1)).toBe(0)
    expect(toGridAzimuth(361, 1)).toBe(0)
    expect(toGridAzimuth(0, Infinity)).toBeUndefined()
  })
})
