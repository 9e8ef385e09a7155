import * as geomagnetismModule from 'geomagnetism'
import { finite, wrap360 } from './math'

// geomagnetism is CommonJS: under Node's ESM loader its functions sit on the default export, under
// bundlers on the namespace itself.
const geomagnetism =
  (geomagnetismModule as unknown as { default?: typeof geomagnetismModule }).default ??
  geomagnetismModule

export interface DeclinationQuery {
  /** Geodetic latitude and longitude, degrees (east positive). */
  readonly latitude: number
  readonly longitude: number
  readonly date: Date
  /** Height above mean sea level, km (default 0). */
  readonly heightKm?: number
}

/**
 * Magnetic declination D (degrees, east positive) from the World Magnetic Model via the npm package
 * geomagnetism (WMM2025 for 2025.0–2030.0, earlier models before). Dates outside every model use
 * the nearest model (allowOutOfBoundsModel), whose error grows with the distance in time. Undefined
 * for non-finite input, an invalid date, or latitude outside ±90.
 */
export function magneticDeclination(query: DeclinationQuery): number | undefined {
  const { latitude, longitude, date } = query
  const height = query.heightKm ?? 0
  if (!finite(latitude, longitude, height) || Math.abs(latitude) > 90) return undefined
  if (!(date instanceof Date) || !finite(date.getTime())) return undefined
  const model = geomagnetism.model(date, { allowOutOfBoundsModel: true })
  const d = model.point([latitude, longitude, height]).decl
  return finite(d) ? d : undefined
}

/**
 * True azimuth from a magnetic one: true = magnetic + D, with D east positive (east declination:
 * magnetic north lies east of true north). Wrapped into [0, 360).
 */
export function toTrueAzimuth(magnetic: number, declination: number): number | undefined {
  return finite(magnetic, declination)
    ? wrap360(wrap360(magnetic) + wrap360(declination))
    : undefined
}

/**
 * Grid azimuth from a true one: grid = true − convergence, with the convergence positive when grid
 * north lies east of true north (as east of a projection's central meridian in the northern
 * hemisphere). Wrapped into [0, 360).
 */
export function toGridAzimuth(trueAzimuth: number, convergence: number): number | undefined {
  return finite(trueAzimuth, convergence)
    ? wrap360(wrap360(trueAzimuth) - wrap360(convergence))
    : undefined
}
