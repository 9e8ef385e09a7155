// Which contrast stretch a tile is coloured with, and the key that says when it must be coloured
// again: static cuts change when the view settles elsewhere, a moving window when a neighbouring
// tile arrives whose rows fall inside the window (so tile seams do not show).
import type { ImageMeta } from '../../api/images'
import { rowStats, windowHalfRows, windowMoments, type SampleFormat } from './contrast'
import type { ImageDisplay } from './image-types'
import { displayKey } from './image-types'
import type { Stretch } from './tile-colour'
import { levelRows, levelStep } from './tile-levels'

export type StretchImage = Pick<
  ImageMeta,
  | 'id'
  | 'topDepth'
  | 'bottomDepth'
  | 'height'
  | 'width'
  | 'tileRows'
  | 'levels'
  | 'channels'
  | 'sampleBits'
  | 'source'
>

/** A loaded tile as the stretch needs it; `stats` is filled in on first need and kept. */
export interface LoadedTile {
  rows: number
  samples: Uint8Array | Uint16Array
  stats?: Float64Array
}

export const formatOf = (image: Pick<StretchImage, 'channels' | 'sampleBits' | 'source'>) =>
  ({
    channels: image.channels,
    sampleBits: image.sampleBits,
    nullZero: image.source === 'las',
  }) satisfies SampleFormat

export function statsOf(image: StretchImage, t: LoadedTile): Float64Array {
  t.stats ??= rowStats(t.samples, image.width, t.rows, formatOf(image))
  return t.stats
}

/**
 * The stretch for tile `tile` of `level` and its key. `cuts` are the image's static cuts (per
 * channel) for static contrast; `peek` finds other loaded tiles of the same level for the window.
 * Undefined in static contrast until the image has cuts.
 */
export function stretchFor(
  image: StretchImage,
  level: number,
  tile: number,
  self: LoadedTile,
  display: ImageDisplay,
  cuts: readonly (readonly [number, number])[] | undefined,
  peek: (tile: number) => LoadedTile | undefined,
): { key: string; make: () => Stretch } | undefined {
  if (display.contrast === 'static') {
    if (!cuts) return undefined
    return {
      key: `${displayKey(display)}|${cuts.map((c) => c.join(':')).join('/')}`,
      make: () => ({ kind: 'static', cuts }),
    }
  }
  const ch = image.channels
  const half = windowHalfRows(display.windowM, levelStep(image, level))
  const first = tile * image.tileRows
  const extFirst = Math.max(0, first - half)
  const extEnd = Math.min(levelRows(image, level), first + self.rows + half)
  const firstTile = Math.floor(extFirst / image.tileRows)
  const lastTile = Math.floor((extEnd - 1) / image.tileRows)
  const present: LoadedTile[] = []
  let mask = ''
  for (let u = firstTile; u <= lastTile; u++) {
    const t = u === tile ? self : peek(u)
    if (t) present[u - firstTile] = t
    mask += t ? '1' : '0'
  }
  return {
    key: `${displayKey(display)}|${mask}`,
    make: () => {
      const stats = new Float64Array((extEnd - extFirst) * ch * 3)
      for (let u = firstTile; u <= lastTile; u++) {
        const t = present[u - firstTile]
        if (!t) continue
        const s = statsOf(image, t)
        const start = u * image.tileRows
        const a = Math.max(start, extFirst)
        const b = Math.min(start + t.rows, extEnd)
        if (b > a)
          stats.set(s.subarray((a - start) * ch * 3, (b - start) * ch * 3), (a - extFirst) * ch * 3)
      }
      return {
        kind: 'window',
        moments: windowMoments(stats, extFirst, ch, first, first + self.rows, half),
      }
    },
  }
}
