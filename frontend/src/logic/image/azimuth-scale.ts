// The azimuth scale above an image: what azimuth 0 is, in words, and the ticks across the turn.
import type { ImageAzimuthReference, ImageNorthReference } from '../../../../schema/vocabulary'

export interface AzimuthTick {
  azimuth: number
  major: boolean
  label: string
}

/**
 * Compass letters for a north-referenced image; for a high-side one HS (high side, the top of the
 * hole), R, LS (low side), L — right and left as seen looking down-hole, azimuth clockwise.
 */
const LETTERS: Record<ImageAzimuthReference, readonly string[]> = {
  north: ['N', 'E', 'S', 'W'],
  highside: ['HS', 'R', 'LS', 'L'],
}

/** Ticks every 30°, major (lettered) every 90°, from 0 to 360 (both edges: the seam). */
export function azimuthTicks(reference: ImageAzimuthReference): AzimuthTick[] {
  return Array.from({ length: 13 }, (_, i) => {
    const azimuth = i * 30
    const major = azimuth % 90 === 0
    return { azimuth, major, label: major && azimuth < 360 ? LETTERS[reference][azimuth / 90] : '' }
  })
}

/** What azimuth 0 is, in words. */
export function referenceWords(
  reference: ImageAzimuthReference,
  north: ImageNorthReference | null,
): string {
  if (reference === 'highside') return 'Azimuth from high side, clockwise looking down-hole'
  const which = north === 'true' ? 'true' : north === 'magnetic' ? 'magnetic' : 'unstated'
  return `Azimuth from ${which} north, clockwise looking down-hole`
}

/** A short form for tight headers. */
export function referenceShort(
  reference: ImageAzimuthReference,
  north: ImageNorthReference | null,
): string {
  if (reference === 'highside') return 'from high side'
  return north === 'true'
    ? 'from true north'
    : north === 'magnetic'
      ? 'from magnetic north'
      : 'from north'
}
