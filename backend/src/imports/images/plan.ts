import type { ImageUploadFieldsT } from '../../../../schema/api-images'
import { ApiError } from '../../http/errors'
import { bitSizeMm, caliperMm, checkAzimuthStep, lasLeftAzimuth } from './las-params'
import { arrayRange, type LasImages } from './las-image'
import { checkDimensions, checkRowStep, refuseFile } from './limits'
import type { RasterProbe } from './raster'
import type { ImagePlan } from './types'

/** What a plan needs of the hole: its final depth and the nominal diameter of its core size. */
export interface HoleFacts {
  finalDepth: number
  coreSize: string
  /** holeDiameterMm(coreSize), undefined for a size without a nominal diameter. */
  nominalDiameterMm: number | undefined
}

const turn = (deg: number) => +(((deg % 360) + 360) % 360).toFixed(9)
const invalid = (path: string, message: string) =>
  new ApiError(400, 'invalid_input', `${path.replace('body.', '')}: ${message}`, [
    { path, message },
  ])

/**
 * North-referenced images say which north; when the form does not, magnetic is assumed (a
 * televiewer's magnetometer finds magnetic north, common practice) and a note says so, so a
 * person sees which north the picks were converted from.
 */
function orientation(fields: ImageUploadFieldsT, notes: string[]) {
  if (fields.azimuthReference === 'highside')
    return { azimuthReference: 'highside' as const, northReference: null }
  if (!fields.northReference)
    notes.push(
      'North reference not given: magnetic north assumed, so picks get the hole declination. Upload with northReference "true" if the image is oriented to true north.',
    )
  return { azimuthReference: 'north' as const, northReference: fields.northReference ?? 'magnetic' }
}

function diameter(
  fields: ImageUploadFieldsT,
  hole: HoleFacts,
  notes: string[],
  fromFile?: { mm: number; source: 'caliper' | 'bit-size' },
): Pick<ImagePlan, 'diameterMm' | 'diameterSource'> {
  if (fromFile) {
    if (fields.diameterMm !== undefined)
      notes.push(`diameterMm ${fields.diameterMm} entered; the file's ${fromFile.source} used.`)
    return { diameterMm: +fromFile.mm.toFixed(2), diameterSource: fromFile.source }
  }
  if (fields.diameterMm !== undefined)
    return { diameterMm: fields.diameterMm, diameterSource: 'entered' }
  if (hole.nominalDiameterMm === undefined)
    throw invalid(
      'body.diameterMm',
      `required: the hole's core size "${hole.coreSize}" has no nominal diameter`,
    )
  notes.push(`Diameter ${hole.nominalDiameterMm} mm: the nominal size of ${hole.coreSize} core.`)
  return { diameterMm: hole.nominalDiameterMm, diameterSource: 'hole' }
}

/** A raster's row: the form gives its depths (checked against the hole and the row step). */
export function planRaster(
  probe: RasterProbe,
  fields: ImageUploadFieldsT,
  hole: HoleFacts,
  fileName: string,
): ImagePlan {
  const { topDepth, bottomDepth } = fields
  if (topDepth === undefined) throw invalid('body.topDepth', 'required for an image file')
  if (bottomDepth === undefined) throw invalid('body.bottomDepth', 'required for an image file')
  if (bottomDepth > hole.finalDepth + 1e-9)
    throw invalid('body.bottomDepth', `below the hole's final depth of ${hole.finalDepth} m`)
  checkRowStep(probe.height, topDepth, bottomDepth, 'body.bottomDepth')
  const notes = [...probe.notes]
  return {
    kind: fields.kind ?? (probe.channels === 3 ? 'optical' : 'amplitude'),
    source: 'raster',
    name: fileName,
    topDepth,
    bottomDepth,
    width: probe.width,
    height: probe.height,
    channels: probe.channels,
    sampleBits: probe.sampleBits,
    valueMin: null,
    valueMax: null,
    valueUnit: null,
    leftAzimuth: turn(fields.leftAzimuth ?? 0),
    ...orientation(fields, notes),
    ...diameter(fields, hole, notes),
    notes,
  }
}

/**
 * One row per image array of a LAS file: depths from the file (checked against the hole and
 * the row step), azimuths from its items, the diameter from a caliper curve, else the bit size,
 * else the form or the hole.
 */
export function planLasArrays(
  file: LasImages,
  fields: ImageUploadFieldsT,
  hole: HoleFacts,
): ImagePlan[] {
  const { las, rows, arrays } = file
  const common = [...file.notes, ...rows.notes]
  if (fields.topDepth !== undefined || fields.bottomDepth !== undefined)
    common.push('topDepth/bottomDepth not used: the LAS file gives its depths.')
  const first = rows.topDepth + rows.step / 2
  const last = rows.bottomDepth - rows.step / 2
  if (rows.topDepth < 0)
    throw refuseFile('invalid_depths', `The log starts at ${first} m: above the collar.`)
  if (last > hole.finalDepth + 1e-9)
    throw refuseFile(
      'invalid_depths',
      `The log reaches ${+last.toFixed(4)} m, below the hole's final depth of ${hole.finalDepth} m.`,
    )
  const stepMm = checkRowStep(rows.rows, rows.topDepth, rows.bottomDepth, 'file', 422)
  common.push(
    `Samples at ${+first.toFixed(4)}–${+last.toFixed(4)} m every ${+stepMm.toFixed(3)} mm, each the centre of its row.`,
  )
  const sizeNotes: string[] = []
  const caliper = caliperMm(las, rows.source, sizeNotes)
  const bit = caliper === undefined ? bitSizeMm(las, sizeNotes) : undefined
  const fromFile =
    caliper !== undefined
      ? { mm: caliper, source: 'caliper' as const }
      : bit !== undefined
        ? { mm: bit, source: 'bit-size' as const }
        : undefined
  return arrays.map((array) => {
    const width = array.members.length
    checkDimensions(width, rows.rows, `Array ${array.stem}`)
    const notes = [...common, ...sizeNotes]
    checkAzimuthStep(las, array.stem, width, notes)
    const left = lasLeftAzimuth(las, width, notes) + (fields.leftAzimuth ?? 0)
    const given = arrays.length === 1 ? fields.kind : undefined
    const kind = given ?? array.kind ?? fields.kind ?? 'amplitude'
    if (!given && !array.kind)
      notes.push(`Array ${array.stem}: its name does not say what it holds; read as ${kind}.`)
    return {
      kind,
      source: 'las',
      name: array.stem,
      topDepth: rows.topDepth,
      bottomDepth: rows.bottomDepth,
      width,
      height: rows.rows,
      channels: 1,
      sampleBits: 16,
      ...arrayRange(array, rows),
      valueUnit: array.members[0].unit.trim() || null,
      leftAzimuth: turn(left),
      ...orientation(fields, notes),
      ...diameter(fields, hole, notes, fromFile),
      notes,
    }
  })
}
