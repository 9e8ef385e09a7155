// Where the pyramid's rows lie in depth, and which level and tiles a view needs. Row i of level L
// covers level-0 rows i·2^L … (i+1)·2^L − 1, so its top is at topDepth + i·2^L·rowStep and its step
// is 2^L·rowStep; tile t of any level holds its rows t·tileRows … (see schema/images.ts).
import type { ImageMeta } from '../../api/images'

export type PyramidImage = Pick<
  ImageMeta,
  'topDepth' | 'bottomDepth' | 'height' | 'tileRows' | 'levels'
>

/** Depth step of one level-0 row (m). */
export const rowStep = (image: PyramidImage) => (image.bottomDepth - image.topDepth) / image.height

/** Depth step of one row of level L (m). */
export const levelStep = (image: PyramidImage, level: number) => rowStep(image) * 2 ** level

export const levelRows = (image: PyramidImage, level: number) =>
  Math.ceil(image.height / 2 ** level)

export const tileCount = (image: PyramidImage, level: number) =>
  Math.ceil(levelRows(image, level) / image.tileRows)

/**
 * The level to draw at `metresPerPixel` (m of hole per device pixel): the coarsest whose row step
 * is still no more than one device pixel, so no detail the screen could show is thrown away —
 * never finer than 0, never past the last level stored.
 */
export function chooseLevel(image: PyramidImage, metresPerPixel: number): number {
  const top = Math.max(0, image.levels - 1)
  if (!(metresPerPixel > 0) || !Number.isFinite(metresPerPixel)) return 0
  // A hair of slack so a step of exactly one pixel counts as "no more than one".
  const level = Math.floor(Math.log2(metresPerPixel / rowStep(image)) + 1e-9)
  return Math.max(0, Math.min(top, level))
}

/** Depth span of tile t at level L as stored: the last row may run past bottomDepth (clip there). */
export function tileSpan(image: PyramidImage, level: number, tile: number): [number, number] {
  const step = levelStep(image, level)
  const first = tile * image.tileRows
  const rows = Math.min(image.tileRows, levelRows(image, level) - first)
  return [image.topDepth + first * step, image.topDepth + (first + rows) * step]
}

/** Tiles of level L that meet the depths [from, to], widened by `margin` tiles; null when none. */
export function tilesInView(
  image: PyramidImage,
  level: number,
  [from, to]: readonly [number, number],
  margin = 0,
): { first: number; last: number } | null {
  if (to <= image.topDepth || from >= image.bottomDepth) return null
  const rowsPerTile = image.tileRows * levelStep(image, level)
  const count = tileCount(image, level)
  const first = Math.floor((Math.max(from, image.topDepth) - image.topDepth) / rowsPerTile)
  // A tile that only touches the bottom of the view is not in it.
  const last = Math.max(
    first,
    Math.ceil((Math.min(to, image.bottomDepth) - image.topDepth) / rowsPerTile) - 1,
  )
  return {
    first: Math.max(0, first - margin),
    last: Math.min(count - 1, last + margin),
  }
}

/** The tile of level L + up that holds tile t of level L (tiles nest: 2 rows become 1). */
export const parentTile = (tile: number, up: number) => Math.floor(tile / 2 ** up)

/** Metres of hole per device pixel for a view of `span` m drawn over `cssHeight` CSS px. */
export const metresPerDevicePixel = (span: number, cssHeight: number, dpr: number) =>
  span / Math.max(1, cssHeight * dpr)
