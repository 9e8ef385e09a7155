// Where the hole's core structures would cut the imaged wall: each true plane turned back into a
// sinusoid on the image, so core and image can be compared side by side.
import { planeToImageSinusoid, referNorth } from '../../../../orient/index'
import type { DepthStructure } from '../../api/interval-types'
import type { ImageMeta } from '../../api/images'
import { symbolOf } from '../track/structure-symbols'
import type { DrawnSinusoid } from './image-types'

/** A structure as the depth view has it, with the declination its conversion applied. */
export type PredictableStructure = Pick<
  DepthStructure,
  | 'id'
  | 'depth'
  | 'type'
  | 'source'
  | 'dip'
  | 'dipDirection'
  | 'holeTrend'
  | 'holePlunge'
  | 'declinationApplied'
>

export type ImageFrameOf = Pick<ImageMeta, 'azimuthReference' | 'northReference' | 'diameterMm'>

/**
 * Core (and other non-image) structures with a true plane and a hole axis, between `from` and
 * `to` m, as predicted sinusoids on an image: planeToImageSinusoid(plane, hole, {reference,
 * diameter}) with the image's diameter, height in metres. On a magnetic-north image the trough is
 * referred back to magnetic with the declination the structure was converted with (referNorth,
 * toMagnetic); a structure whose declination is not known is left out there rather than drawn
 * off by the declination. Planes containing the hole axis (no finite trace) are left out.
 */
export function predictedSinusoids(
  structures: readonly PredictableStructure[],
  image: ImageFrameOf,
  from: number,
  to: number,
): DrawnSinusoid[] {
  const magnetic = image.azimuthReference === 'north' && image.northReference === 'magnetic'
  return structures.flatMap((s) => {
    if (s.source === 'image') return []
    const { dip, dipDirection, holeTrend, holePlunge } = s
    if (dip === null || dipDirection === null || holeTrend === null || holePlunge === null)
      return []
    const hole = { trend: holeTrend, plunge: holePlunge }
    const trace = planeToImageSinusoid({ dip, dipDirection }, hole, {
      reference: image.azimuthReference,
      diameter: image.diameterMm / 1000,
    })
    if (!trace || !Number.isFinite(trace.height)) return []
    if (s.depth + trace.height / 2 < from || s.depth - trace.height / 2 > to) return []
    let trough: number | undefined = trace.troughAzimuth
    if (magnetic) {
      const declination = s.declinationApplied
      if (declination === null || declination === undefined) return []
      trough = referNorth(trace.troughAzimuth, hole, declination, true)
    }
    if (trough === undefined) return []
    const symbol = symbolOf(s.type)
    return [
      {
        key: `predicted:${s.id}`,
        depth: s.depth,
        height: trace.height,
        troughAzimuth: trough,
        role: 'predicted' as const,
        colour: symbol.colour,
        label: `core ${symbol.label.toLowerCase()}`,
      },
    ]
  })
}
