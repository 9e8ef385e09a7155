// Plain data the net components draw: the view turns API rows into these, tests pass them directly.
import type { DensityMethod } from './net-contours'
import type { ZoneMode, ZoneSettings } from './net-kinematic-zones'
import type { Line } from './net-geometry'

/** A plane's pole to plot, with what colours and marks it. */
export interface NetPole {
  id: number
  trend: number
  plunge: number
  dip: number
  dipDirection: number
  /** Set index for its colour; −1 outside every set. */
  group: number
  /** Overrides the set colour (e.g. the structure type's colour on the depth view's net). */
  colour?: string
  flagged: boolean
  /** Terzaghi weight (1 when unknown). */
  weight: number
}

export interface NetSetMark {
  id: number
  name: string
  colour: string
  centre: Line
  coneAngle: number
  meanPole: Line | null
  /** Sampling cone of the mean pole (Fisher α95, degrees). */
  alpha95: number | null
  /** Sampling and survey combined (95 %, degrees): the wider cone drawn about the same mean. */
  uncertainty95: number | null
}

export interface NetIntersectionMark {
  key: string
  label: string
  trend: number
  plunge: number
}

export type NetDisplay = 'poles' | 'planes'
export type NetTool = 'inspect' | 'cone' | 'lasso'

export interface NetContourSettings {
  method: DensityMethod
  /** Contour interval in sigma, or 'auto': 2σ, wider for strong peaks (at most ten levels). */
  step: number | 'auto'
  /** Weight each pole by its Terzaghi weight. */
  weighted: boolean
  /**
   * A quick draft while something is dragged: a coarse grid (500 nodes inside the primitive, against
   * orient's default 2000) and contour lines without fills.
   */
  draft?: boolean
}

export interface NetZone extends ZoneSettings {
  mode: ZoneMode
}

/** What the contours came to, for the legend beside the net. */
export interface NetDensitySummary {
  method: DensityMethod
  /** Contour interval used (sigma). */
  step: number
  levels: number[]
  max: number
  n: number
  weighted: boolean
}
