// Where a place on the unrolled wall is drawn: azimuth 0 of the image's reference at the left
// edge, increasing to the right; depth increasing downward across the window in view.
import { wrap360 } from '../../../../orient/index'
import type { DepthWindow } from './view-window'

export const wallX = (azimuth: number, width: number) => (wrap360(azimuth) / 360) * width

export const wallY = (depth: number, w: DepthWindow, height: number) =>
  ((depth - w[0]) / (w[1] - w[0])) * height

/** The place under a screen position (px from the wall's top left). */
export const wallAt = (x: number, y: number, w: DepthWindow, width: number, height: number) => ({
  depth: w[0] + (y / height) * (w[1] - w[0]),
  azimuth: wrap360((x / width) * 360),
})
