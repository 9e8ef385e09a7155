import proj4 from 'proj4'

/**
 * Projected site CRSs Downdip can turn into latitude/longitude (for WMM declination), as proj4
 * definitions built from their EPSG parameters. Anything else must use a manual declination.
 */
export function crsDefinition(epsg: number): string | undefined {
  const utm = (zone: number, datum: string, south = false) =>
    `+proj=utm +zone=${zone}${south ? ' +south' : ''} ${datum} +units=m +no_defs`
  if (epsg === 4326) return '+proj=longlat +datum=WGS84 +no_defs'
  if (epsg >= 32601 && epsg <= 32660) return utm(epsg - 32600, '+datum=WGS84')
  if (epsg >= 32701 && epsg <= 32760) return utm(epsg - 32700, '+datum=WGS84', true)
  if (epsg >= 25828 && epsg <= 25838) return utm(epsg - 25800, '+ellps=GRS80 +towgs84=0,0,0')
  if (epsg >= 26901 && epsg <= 26923) return utm(epsg - 26900, '+datum=NAD83')
  if (epsg >= 28348 && epsg <= 28358) return utm(epsg - 28300, '+ellps=GRS80 +towgs84=0,0,0', true)
  if (epsg >= 7846 && epsg <= 7859) return utm(epsg - 7800, '+ellps=GRS80 +towgs84=0,0,0', true)
  if (epsg === 27700) {
    return '+proj=tmerc +lat_0=49 +lon_0=-2 +k=0.9996012717 +x_0=400000 +y_0=-100000 +ellps=airy +towgs84=446.448,-125.157,542.06,0.15,0.247,0.842,-20.489 +units=m +no_defs'
  }
  if (epsg === 2193) {
    return '+proj=tmerc +lat_0=0 +lon_0=173 +k=0.9996 +x_0=1600000 +y_0=10000000 +ellps=GRS80 +towgs84=0,0,0 +units=m +no_defs'
  }
  return undefined
}

/** Collar easting/northing in the site CRS → WGS 84 latitude/longitude, or undefined if unknown. */
export function toLatLon(epsg: number, east: number, north: number) {
  const def = crsDefinition(epsg)
  if (!def) return undefined
  const [longitude, latitude] = proj4(def, 'WGS84', [east, north])
  if (!Number.isFinite(latitude) || !Number.isFinite(longitude)) return undefined
  return { latitude, longitude }
}
