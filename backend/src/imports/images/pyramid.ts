import type { DecodedImage, LevelSamples } from './types'

/** One level of the pyramid: `rows` rows of width × channels samples. */
export interface Level {
  level: number
  rows: number
  samples: LevelSamples
}

/** ceil(height / 2^L) rows at level L, until a level fits in one tile: the levels stored (≥ 1). */
export function levelCount(height: number, tileRows: number): number {
  let levels = 1
  for (let rows = height; rows > tileRows; rows = Math.ceil(rows / 2)) levels++
  return levels
}

/** Tiles of every level together: what progress counts. */
export function tileCount(height: number, tileRows: number): number {
  let tiles = 0
  for (let l = 0, rows = height; l < levelCount(height, tileRows); l++, rows = Math.ceil(rows / 2))
    tiles += Math.ceil(rows / tileRows)
  return tiles
}

/**
 * Row k of the next level is the mean of rows 2k and 2k+1 (rounded half up), channel by channel;
 * a lone last row is copied. Where 0 means no value (LAS arrays) a no-value sample is left out
 * of the mean, and two of them stay no value.
 */
export function nextLevel(from: Level, rowLength: number, zeroIsNoValue: boolean): Level {
  const rows = Math.ceil(from.rows / 2)
  const src = from.samples
  const out =
    src instanceof Uint16Array
      ? new Uint16Array(rows * rowLength)
      : new Uint8Array(rows * rowLength)
  for (let k = 0; k < rows; k++) {
    const a = 2 * k * rowLength
    const o = k * rowLength
    if (2 * k + 1 >= from.rows) {
      out.set(src.subarray(a, a + rowLength), o)
      continue
    }
    const b = a + rowLength
    for (let i = 0; i < rowLength; i++) {
      const x = src[a + i]
      const y = src[b + i]
      out[o + i] = zeroIsNoValue && (x === 0 || y === 0) ? x + y : (x + y + 1) >> 1
    }
  }
  return { level: from.level + 1, rows, samples: out }
}

/**
 * Every level in turn, level 0 first: each is made from the one before and dropped by the caller
 * once tiled, so memory holds the decoded image and one smaller level at a time.
 */
export function* pyramidLevels(image: DecodedImage, tileRows: number): Generator<Level> {
  const rowLength = image.width * image.channels
  let level: Level = { level: 0, rows: image.rows, samples: image.samples }
  yield level
  while (level.rows > tileRows) {
    level = nextLevel(level, rowLength, image.zeroIsNoValue)
    yield level
  }
}

/** Tile t of a level: rows [t·tileRows, …) as a view (no copy). */
export function tileOf(level: Level, t: number, tileRows: number, rowLength: number) {
  const from = t * tileRows
  const rows = Math.min(tileRows, level.rows - from)
  return { rows, samples: level.samples.subarray(from * rowLength, (from + rows) * rowLength) }
}
