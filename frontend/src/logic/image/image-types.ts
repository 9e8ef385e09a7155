// What ImageCanvas draws, as plain data: the display settings and the sinusoids on the wall. The
// picking view and the depth view's image track both build these.
import type { ImageKind } from '../../../../schema/vocabulary'
import type { ImageMeta } from '../../api/images'
import type { ColourMapName } from './colour-maps'

export type { ColourMapName } from './colour-maps'
export type { TracePoint } from '../../api/images'

/**
 * How samples become colours. `static`: one linear stretch between the `low` and `high`
 * percentiles of the histogram of the samples in view (per channel for optical images).
 * `window`: each row scaled by the mean and spread of the rows within ±windowM/2 of it, so thin
 * features stand out whatever the background does down the hole.
 */
export interface ImageDisplay {
  colourMap: ColourMapName
  contrast: 'static' | 'window'
  /** Percentile (0–100) drawn at the dark end of the map in static contrast. */
  low: number
  /** Percentile (0–100) drawn at the bright end; above `low`. */
  high: number
  /** Length of the moving window (m) in window contrast. */
  windowM: number
}

export type SinusoidRole = 'pick' | 'predicted' | 'suggestion' | 'draft'

/** A trace on the wall: depth(θ) = depth + (height/2)·cos(θ − troughAzimuth), θ in the image reference. */
export interface DrawnSinusoid {
  key: string
  /** Centre depth (m). */
  depth: number
  /** Peak to trough (m). */
  height: number
  /** Degrees, the image's own reference. */
  troughAzimuth: number
  role: SinusoidRole
  selected?: boolean
  /** Stroke colour; by role when left out. */
  colour?: string
  /** Written beside the trace (a suggestion's score, a pick's type). */
  label?: string
}

/** The default colour map for each kind of image: optical images are drawn in their own colours. */
export const defaultColourMap = (kind: ImageKind): ColourMapName =>
  kind === 'traveltime' ? 'fathom' : kind === 'amplitude' ? 'kiln' : 'grey'

export function defaultDisplay(kind: ImageKind): ImageDisplay {
  return { colourMap: defaultColourMap(kind), contrast: 'static', low: 1, high: 99, windowM: 1 }
}

/** Display settings as one string: a tile coloured under one key is reused until the key changes. */
export const displayKey = (d: ImageDisplay) =>
  d.contrast === 'window'
    ? `${d.colourMap}|window|${d.windowM}`
    : `${d.colourMap}|static|${d.low}|${d.high}`

/** What the depth view hands its image track. */
export interface ImageTrackData {
  projectId: string | number
  holeId: string | number
  title: string
  images: ImageMeta[]
  display: ImageDisplay
  sinusoids: DrawnSinusoid[]
}
