// Static contrast's cuts from the histogram of what is shown: the rows of the image inside the
// view, at the level drawn (or the nearest coarser level loaded, while finer tiles arrive).
import { addHistogram, binsOf, percentileCuts } from './contrast'
import type { ImageDisplay } from './image-types'
import { formatOf, type LoadedTile, type StretchImage } from './tile-stretch'
import { chooseLevel, levelStep, metresPerDevicePixel, tilesInView } from './tile-levels'

export type Cuts = readonly (readonly [number, number])[]

/**
 * Per channel [low, high] raw values at the display's low/high percentiles of the samples within
 * `domain`. Undefined when no tile covering the view is loaded yet.
 */
export function viewCuts(
  image: StretchImage,
  level: number,
  domain: readonly [number, number],
  display: Pick<ImageDisplay, 'low' | 'high'>,
  peek: (level: number, tile: number) => LoadedTile | undefined,
): Cuts | undefined {
  const fmt = formatOf(image)
  for (let l = level; l < Math.max(1, image.levels); l++) {
    const range = tilesInView(image, l, domain)
    if (!range) return undefined
    const histogram = new Uint32Array(binsOf(fmt.sampleBits) * fmt.channels)
    const step = levelStep(image, l)
    let used = 0
    for (let t = range.first; t <= range.last; t++) {
      const tile = peek(l, t)
      if (!tile) continue
      const first = t * image.tileRows
      const from = Math.max(0, Math.floor((domain[0] - image.topDepth) / step) - first)
      const to = Math.min(tile.rows, Math.ceil((domain[1] - image.topDepth) / step) - first)
      if (to <= from) continue
      addHistogram(histogram, tile.samples, image.width, fmt, from, to)
      used++
    }
    if (used === 0) continue
    const cuts = percentileCuts(histogram, fmt, display.low, display.high)
    if (cuts.every((c) => c !== undefined)) return cuts as Cuts
    return cuts.map((c) => c ?? [0, 2 ** fmt.sampleBits - 1])
  }
  return undefined
}

/** Cuts that differ by less than this fraction of the sample range count as unchanged. */
const SAME = 1 / 256

export function sameCuts(a: Cuts | undefined, b: Cuts | undefined, bits: 8 | 16): boolean {
  if (!a || !b || a.length !== b.length) return a === b
  const tol = SAME * 2 ** bits
  return a.every((c, i) => Math.abs(c[0] - b[i][0]) < tol && Math.abs(c[1] - b[i][1]) < tol)
}

/**
 * Takes every image's cuts again from what the view shows now (at the level it is drawn at) and
 * keeps those that changed; true when any did, so the tiles are coloured again.
 */
export function recutImages<I extends StretchImage>(
  images: readonly I[],
  view: { domain: readonly [number, number]; height: number; dpr: number },
  display: Pick<ImageDisplay, 'low' | 'high'>,
  cuts: Map<number, Cuts>,
  peek: (image: I, level: number, tile: number) => LoadedTile | undefined,
): boolean {
  const domain: [number, number] = [view.domain[0], view.domain[1]]
  const mpp = metresPerDevicePixel(domain[1] - domain[0], view.height, view.dpr)
  let changed = false
  for (const image of images) {
    const level = chooseLevel(image, mpp)
    const next = viewCuts(image, level, domain, display, (l, t) => peek(image, l, t))
    if (next && !sameCuts(next, cuts.get(image.id), image.sampleBits)) {
      cuts.set(image.id, next)
      changed = true
    }
  }
  return changed
}
