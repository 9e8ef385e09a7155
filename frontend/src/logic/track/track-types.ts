// Plain data the tracks draw: the depth view turns API rows into these, tests pass them directly.
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

/** Height of every track's header (title, unit, value scale), in pixels. */
export const TRACK_HEADER = 48
