// Plain data the tracks draw: the depth view turns API rows into these, tests pass them directly.

/** [top, bottom] in metres along hole. */
export type DepthRange = [number, number]

export interface TrackStructure {
  id: number
  depth: number
  type: string
  dip: number | null
  /** Null for an unoriented structure: drawn hollow in its own lane, without a tail. */
  dipDirection: number | null
  flagged: boolean
}

export interface TrackRun {
  id: number
  fromDepth: number
  toDepth: number
  value: number | null
}

export interface TrackInterval {
  id: number
  name: string
  fromDepth: number
  toDepth: number
  status: string
}

/** One LAS curve as its track draws it: values beside depths, null where the file has none. */
export interface PanelCurve {
  id: number
  mnemonic: string
  unit: string
  depths: number[]
  values: (number | null)[]
}

/** Height of every track's header (title, unit, value scale), in pixels. */
export const TRACK_HEADER = 48
