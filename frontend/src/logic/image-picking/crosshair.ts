// The keyboard crosshair: a place on the unrolled wall that arrow keys move by one column of the
// image and one row, snapped to sample centres (see the image geometry in api/images.ts).
import { wrap360 } from '../../../../orient/index'
import type { ImageMeta, TracePoint } from '../../api/images'

type Grid = Pick<ImageMeta, 'topDepth' | 'bottomDepth' | 'height' | 'width' | 'leftAzimuth'>

export const rowStepOf = (g: Grid) => (g.bottomDepth - g.topDepth) / g.height
export const columnStepOf = (g: Grid) => 360 / g.width

/** The centre of the sample holding `p`: row centre top + (i + ½)·step, column likewise. */
export function snapToSample(g: Grid, p: TracePoint): TracePoint {
  const rowStep = rowStepOf(g)
  const colStep = columnStepOf(g)
  const row = Math.min(g.height - 1, Math.max(0, Math.floor((p.depth - g.topDepth) / rowStep)))
  const col = Math.floor(wrap360(p.azimuth - g.leftAzimuth) / colStep) % g.width
  return {
    depth: g.topDepth + (row + 0.5) * rowStep,
    azimuth: wrap360(g.leftAzimuth + (col + 0.5) * colStep),
  }
}

/**
 * Moves the crosshair `rows` rows down and `columns` columns right. A row is the image's own
 * unless a screen pixel is longer (zoomed out): then one pixel, so every press moves it visibly.
 * Depth stops at the image's ends; azimuth goes round.
 */
export function moveCrosshair(
  g: Grid,
  p: TracePoint,
  rows: number,
  columns: number,
  metresPerPixel = 0,
): TracePoint {
  const rowStep = Math.max(rowStepOf(g), metresPerPixel)
  const depth = Math.min(
    g.bottomDepth - rowStepOf(g) / 2,
    Math.max(g.topDepth + rowStepOf(g) / 2, p.depth + rows * rowStep),
  )
  const next = { depth, azimuth: p.azimuth + columns * columnStepOf(g) }
  return rowStep > rowStepOf(g)
    ? { depth, azimuth: snapToSample(g, next).azimuth }
    : snapToSample(g, next)
}
