/** A plane by dip direction (azimuth of steepest descent, 0–360) and dip (0–90), degrees. */
export interface Plane {
  readonly dipDirection: number
  readonly dip: number
}

/** A line by trend (azimuth, 0–360) and plunge (degrees below horizontal, positive down). */
export interface Line {
  readonly trend: number
  readonly plunge: number
}

/** A point or offset in the world frame: east, north and down (metres). */
export interface Offset {
  readonly east: number
  readonly north: number
  readonly down: number
}

/** Oriented-core angles of a planar structure (degrees). */
export interface CoreAngles {
  /** Acute angle between core axis and the ellipse long axis, 0–90 (90 = perpendicular). */
  readonly alpha: number
  /** Angle from the reference line to the down-hole ellipse apex, clockwise looking down-hole. */
  readonly beta: number
}

/** Core angles of a lineation lying on a planar structure (degrees). */
export interface CoreLineAngles extends CoreAngles {
  /** Angle within the plane from the ellipse long axis to the lineation (see coreToLine). */
  readonly gamma: number
}

/** Which line on the core the beta angle is measured from. */
export type CoreReference = 'bottom' | 'top'

export interface CoreOptions {
  /** Reference line of beta: bottom of hole (default) or top of hole. */
  readonly reference?: CoreReference
}

/** Unit vector in the world frame x = east, y = north, z = up. */
export type Vec3 = readonly [number, number, number]
