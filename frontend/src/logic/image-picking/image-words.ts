// The words the Images tab shows for image metadata.
import type { ImageKind } from '../../../../schema/vocabulary'
import type { ImageMeta } from '../../api/images'

export const imageKindWords: Record<ImageKind, string> = {
  amplitude: 'Acoustic amplitude',
  traveltime: 'Acoustic travel time',
  optical: 'Optical',
}

/** What azimuth 0 of the image is: "Magnetic north", "True north" or "High side". */
export function referenceWords(i: Pick<ImageMeta, 'azimuthReference' | 'northReference'>) {
  if (i.azimuthReference === 'highside') return 'High side'
  return i.northReference === 'true' ? 'True north' : 'Magnetic north'
}

export const confidenceWords: Record<string, string> = {
  high: 'High',
  medium: 'Medium',
  low: 'Low',
}
