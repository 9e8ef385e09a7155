import { magneticDeclination, toTrueAzimuth } from '../../../orient/index'
import type { Hole, Project } from '../../../schema/index'
import { badRequest } from '../http/errors'
import { crsDefinition, gridConvergenceAt, toLatLon } from './crs'

type DeclinationSettings = Pick<Project, 'declinationMode' | 'crsEpsg'>
type ConvergenceSettings = Pick<Project, 'convergenceMode' | 'gridConvergenceDeg' | 'crsEpsg'>
type Collar = Pick<Hole, 'collarEast' | 'collarNorth'>

/** Auto declination needs a CRS we can place on the globe: refuse settings that cannot work. */
export function checkDeclinationSettings(p: Partial<DeclinationSettings>): void {
  if (p.declinationMode === 'auto' && p.crsEpsg !== undefined && !crsDefinition(p.crsEpsg)) {
    throw badRequest(
      'Automatic declination needs a CRS Downdip can convert to latitude/longitude',
      [
        {
          path: 'body.crsEpsg',
          message: `EPSG:${p.crsEpsg} is not supported for automatic declination; use WGS 84 / UTM, ETRS89 / UTM, NAD83 / UTM, GDA94 or GDA2020 / MGA, OSGB 1936 (27700), NZTM (2193), or set a manual declination`,
        },
      ],
    )
  }
}

/**
 * Magnetic declination in degrees (east positive) for a hole on a date: the project's manual
 * value, or the World Magnetic Model at the collar.
 */
export function declinationFor(
  project: Project,
  hole: Pick<Hole, 'collarEast' | 'collarNorth' | 'collarElevation'>,
  date: Date,
): number {
  if (project.declinationMode === 'manual') return project.declinationDeg
  const place = toLatLon(project.crsEpsg, hole.collarEast, hole.collarNorth)
  if (!place) return project.declinationDeg
  // Outside every model's reach (an impossible place or date): fall back to the manual value.
  return (
    magneticDeclination({ ...place, date, heightKm: hole.collarElevation / 1000 }) ??
    project.declinationDeg
  )
}

/**
 * Refuses automatic convergence with a CRS Downdip cannot project. Checked only when the request
 * sets the mode or the CRS, so a project whose CRS predates the rule can still be edited otherwise.
 */
export function checkConvergenceSettings(
  p: Partial<ConvergenceSettings>,
  sent: Partial<ConvergenceSettings>,
): void {
  if (sent.convergenceMode === undefined && sent.crsEpsg === undefined) return
  if (p.convergenceMode !== 'auto' || p.crsEpsg === undefined || crsDefinition(p.crsEpsg)) return
  throw badRequest('Automatic grid convergence needs a CRS Downdip can project', [
    {
      path: sent.crsEpsg !== undefined ? 'body.crsEpsg' : 'body.convergenceMode',
      message: `EPSG:${p.crsEpsg} is not supported for automatic grid convergence; choose a supported CRS or a manual convergence`,
    },
  ])
}

/**
 * Where a hole's convergence comes from: the CRS at the collar, the manual value, or the manual
 * value because the CRS cannot be projected (a project older than the convergence rule).
 */
export type ConvergenceSource = 'crs' | 'manual' | 'manual-fallback'

/**
 * Grid convergence γ in degrees for a hole, with grid azimuth = true azimuth − γ (so true = grid +
 * γ; γ > 0 when grid north lies east of true north): the project's manual value, or γ of the
 * project CRS at the collar (`gridConvergenceAt`, proj4).
 */
export function convergenceDetail(
  project: ConvergenceSettings,
  hole: Collar,
): { convergenceDeg: number; source: ConvergenceSource } {
  if (project.convergenceMode === 'manual')
    return { convergenceDeg: project.gridConvergenceDeg, source: 'manual' }
  const gamma = gridConvergenceAt(project.crsEpsg, hole.collarEast, hole.collarNorth)
  return gamma === undefined
    ? { convergenceDeg: project.gridConvergenceDeg, source: 'manual-fallback' }
    : { convergenceDeg: gamma, source: 'crs' }
}

/** The convergence (degrees, grid = true − γ) applied to a hole's grid-referenced azimuths. */
export const convergenceFor = (project: ConvergenceSettings, hole: Collar): number =>
  convergenceDetail(project, hole).convergenceDeg

export const normaliseAzimuth = (a: number) => ((a % 360) + 360) % 360

/**
 * A station azimuth as entered → true-north azimuth, with what was applied.
 * true = magnetic + declination; true = grid + convergence (grid = true − convergence).
 */
export function azimuthToTrue(
  entered: number,
  reference: 'magnetic' | 'true' | 'grid',
  declination: number,
  convergence: number,
) {
  if (reference === 'magnetic') {
    return {
      azimuth: toTrueAzimuth(entered, declination) ?? normaliseAzimuth(entered),
      declinationApplied: declination,
      convergenceApplied: 0,
    }
  }
  if (reference === 'grid') {
    return {
      azimuth: normaliseAzimuth(entered + convergence),
      declinationApplied: 0,
      convergenceApplied: convergence,
    }
  }
  return { azimuth: normaliseAzimuth(entered), declinationApplied: 0, convergenceApplied: 0 }
}
