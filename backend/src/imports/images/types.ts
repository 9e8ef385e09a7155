import type {
  ImageAzimuthReference,
  ImageKind,
  ImageNorthReference,
  ImageSource,
} from '../../../../schema/vocabulary'

/** Samples of a whole level: rows × width × channels, row-major, channels interleaved. */
export type LevelSamples = Uint8Array | Uint16Array

/** An image decoded to its level-0 samples. */
export interface DecodedImage {
  width: number
  rows: number
  channels: 1 | 3
  samples: LevelSamples
  /** LAS arrays: 0 is "no value" and is left out of every mean. */
  zeroIsNoValue: boolean
}

/** What an upload will store as one images row (besides the hole, file and status columns). */
export interface ImagePlan {
  kind: ImageKind
  source: ImageSource
  name: string
  topDepth: number
  bottomDepth: number
  width: number
  height: number
  channels: 1 | 3
  sampleBits: 8 | 16
  valueMin: number | null
  valueMax: number | null
  valueUnit: string | null
  leftAzimuth: number
  azimuthReference: ImageAzimuthReference
  northReference: ImageNorthReference | null
  diameterMm: number
  diameterSource: 'entered' | 'caliper' | 'bit-size' | 'hole'
  notes: string[]
}
