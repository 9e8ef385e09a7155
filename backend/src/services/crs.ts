import proj4 from 'proj4'

interface CrsParts {
  /** The projection's own parameters (`+proj=…`), without the datum. */
  projection: string
  /** Ellipsoid and datum shift, shared with the CRS's own geographic frame. */
  datum: string
}

const GRS80 = '+ellps=GRS80 +towgs84=0,0,0'

/** The EPSG codes Downdip knows, as proj4 parts built from their EPSG parameters. */
function crsParts(epsg: number): CrsParts | undefined {
  const utm = (zone: number, datum: string, south = false) => ({
    projection: `+proj=utm +zone=${zone}${south ? ' +south' : ''}`,
    datum,
  })
  if (epsg === 4326) return { projection: '+proj=longlat', datum: '+datum=WGS84' }
  if (epsg >= 32601 && epsg <= 32660) return utm(epsg - 32600, '+datum=WGS84')
  if (epsg >= 32701 && epsg <= 32760) return utm(epsg - 32700, '+datum=WGS84', true)
  if (epsg >= 25828 && epsg <= 25838) return utm(epsg - 25800, GRS80)
  if (epsg >= 26901 && epsg <= 26923) return utm(epsg - 26900, '+datum=NAD83')
  if (epsg >= 28348 && epsg <= 28358) return utm(epsg - 28300, GRS80, true)
  if (epsg >= 7846 && epsg <= 7859) return utm(epsg - 7800, GRS80, true)
  if (epsg === 27700) {
    return {
      projection: '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000',
      datum: '+ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489',
    }
  }
  if (epsg === 2193) {
    return {
      projection: '+proj=tmerc +lat_0=0 +lon_0=173 +k=0.9996 +x_0=1600000 +y_0=10000000',
      datum: GRS80,
    }
  }
  return undefined
}

/**
 * Projected site CRSs Downdip can turn into latitude/longitude (for WMM declination and grid
 * convergence), as proj4 definitions. Anything else must use manual values.
 */
export function crsDefinition(epsg: number): string | undefined {
  const parts = crsParts(epsg)
  if (!parts) return undefined
  return `${parts.projection} ${parts.datum}${epsg === 4326 ? '' : ' +units=m'} +no_defs`
}

/** The CRS's own geographic frame (same ellipsoid and datum): where its meridians are true north. */
export function crsGeographic(epsg: number): string | undefined {
  const parts = crsParts(epsg)
  return parts ? `+proj=longlat ${parts.datum} +no_defs` : undefined
}

/** Collar easting/northing in the site CRS → WGS 84 latitude/longitude, or undefined if unknown. */
export function toLatLon(epsg: number, east: number, north: number) {
  const def = crsDefinition(epsg)
  if (!def) return undefined
  const [longitude, latitude] = proj4(def, 'WGS84', [east, north])
  if (!Number.isFinite(latitude) || !Number.isFinite(longitude)) return undefined
  return { latitude, longitude }
}

/** Half the latitude step of the numerical meridian, degrees (about 5 m on the ground). */
const STEP_DEG = 5e-5

/**
 * Grid convergence γ (degrees) at a point given in the site CRS: the clockwise angle from true
 * north to grid north, so that grid azimuth = true azimuth − γ. East of a transverse Mercator
 * central meridian γ > 0 in the northern hemisphere and < 0 in the southern (to first order
 * γ ≈ Δλ·sin φ). Found numerically from proj4, valid for any projection it knows: the true meridian
 * through the point (in the CRS's own datum) is projected a few metres either side, and γ is the
 * angle its image makes with grid north. A geographic CRS has no grid: 0. Undefined when the CRS
 * is not one Downdip knows or the point lies outside it.
 */
export function gridConvergenceAt(epsg: number, east: number, north: number): number | undefined {
  const def = crsDefinition(epsg)
  const geographic = crsGeographic(epsg)
  if (!def || !geographic) return undefined
  if (epsg === 4326) return 0
  const grid = proj4(geographic, def)
  const [lon, lat] = grid.inverse([east, north])
  if (!Number.isFinite(lon) || !Number.isFinite(lat) || Math.abs(lat) > 89) return undefined
  const [e1, n1] = grid.forward([lon, lat - STEP_DEG])
  const [e2, n2] = grid.forward([lon, lat + STEP_DEG])
  // The image of true north has grid azimuth −γ.
  const gamma = -Math.atan2(e2 - e1, n2 - n1) * (180 / Math.PI)
  return Number.isFinite(gamma) ? gamma : undefined
}
