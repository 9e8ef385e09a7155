// One frame of the wall: for each image (oldest first, so the newest wins where strips overlap)
// the tiles of the level the view needs, coarser or finer loaded tiles standing in for any still
// on their way, then the sinusoids and points on top. Drawing is drawImage of tiles coloured once.
import type { ImageMeta } from '../../api/images'
import { colourLut } from './colour-maps'
import type { ImageDisplay } from './image-types'
import { colourTile } from './tile-colour'
import {
  chooseLevel,
  levelStep,
  metresPerDevicePixel,
  parentTile,
  tileCount,
  tileSpan,
  tilesInView,
} from './tile-levels'
import { formatOf, stretchFor, type LoadedTile } from './tile-stretch'
import { viewCuts, type Cuts } from './view-cuts'

export type WallImage = Pick<
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
  | 'leftAzimuth'
>

/** The tile store as the renderer sees it (use-image-tiles.ts implements it). */
export interface WallTiles {
  /** A loaded tile, counted as used. */
  get(image: WallImage, level: number, tile: number): LoadedTile | undefined
  /** A loaded tile, not counted as used. */
  peek(image: WallImage, level: number, tile: number): LoadedTile | undefined
  /**
   * The tile coloured under `key`: kept from before, or coloured now with `make` while the
   * frame's colouring budget lasts; undefined once it is spent (drawn next frame).
   */
  bitmap(
    image: WallImage,
    level: number,
    tile: number,
    key: string,
    make: () => Uint32Array<ArrayBuffer>,
  ): CanvasImageSource | undefined
}

export interface TileWant {
  image: WallImage
  level: number
  tile: number
  /** Lower first. */
  priority: number
}

export interface WallFrame {
  /** Device pixels per CSS pixel. */
  dpr: number
  width: number
  height: number
  domain: readonly [number, number]
  images: readonly WallImage[]
  display: ImageDisplay
  /** Static cuts per image id; filled in here for an image that has none yet. */
  cuts: Map<number, Cuts>
}

/** Draws the images; returns the tiles the view wants and whether anything was left for later. */
export function renderImages(
  ctx: CanvasRenderingContext2D,
  frame: WallFrame,
  tiles: WallTiles,
): { wants: TileWant[]; incomplete: boolean } {
  const { dpr, width, height, domain, display } = frame
  const W = Math.round(width * dpr)
  const H = Math.round(height * dpr)
  const span = domain[1] - domain[0]
  const yAt = (d: number) => ((d - domain[0]) / span) * H
  const wants: TileWant[] = []
  let incomplete = false
  ctx.setTransform(1, 0, 0, 1, 0, 0)
  ctx.imageSmoothingEnabled = true
  for (const image of frame.images) {
    const top = Math.max(0, Math.round(yAt(image.topDepth)))
    const bottom = Math.min(H, Math.round(yAt(image.bottomDepth)))
    if (bottom <= top) continue
    // Under the samples: a flat tone where tiles are still coming, a hatch where a LAS array has
    // no value (its transparent pixels), so a gap in the data never passes for a dark sample.
    ctx.fillStyle = image.source === 'las' ? hatch(ctx) : BASE
    ctx.fillRect(0, top, W, bottom - top)
    const level = chooseLevel(image, metresPerDevicePixel(span, height, dpr))
    const peekAt = (l: number, t: number) => tiles.peek(image, l, t)
    if (display.contrast === 'static' && !frame.cuts.has(image.id)) {
      const c = viewCuts(image, level, domain, display, peekAt)
      if (c) frame.cuts.set(image.id, c)
    }
    const lut = colourLut(display.colourMap)
    const fmt = formatOf(image)
    const x0 = ((((image.leftAzimuth % 360) + 360) % 360) / 360) * W
    /** Draws depths [d0, d1] of tile t at level l; false when it is not loaded or not coloured. */
    const draw = (l: number, t: number, d0: number, d1: number) => {
      const tile = tiles.get(image, l, t)
      if (!tile) return false
      const stretch = stretchFor(image, l, t, tile, display, frame.cuts.get(image.id), (u) =>
        peekAt(l, u),
      )
      if (!stretch) return false
      const bmp = tiles.bitmap(image, l, t, stretch.key, () =>
        colourTile(
          { samples: tile.samples, width: image.width, rows: tile.rows },
          fmt,
          stretch.make(),
          lut,
        ),
      )
      if (!bmp) {
        incomplete = true
        return false
      }
      const [a] = tileSpan(image, l, t)
      const step = levelStep(image, l)
      const r0 = Math.max(0, (d0 - a) / step)
      const r1 = Math.min(tile.rows, (d1 - a) / step)
      const f0 = yAt(a + r0 * step)
      const f1 = yAt(a + r1 * step)
      // Whole device pixels at both ends, so neighbouring tiles meet without a seam; the source
      // rows follow the rounding and the clip at the image's ends.
      const y0 = Math.max(top, Math.round(f0))
      const y1 = Math.min(bottom, Math.round(f1))
      if (r1 <= r0 || y1 <= y0) return true
      const rowsPerPx = (r1 - r0) / (f1 - f0)
      const s0 = r0 + (y0 - f0) * rowsPerPx
      const s1 = r0 + (y1 - f0) * rowsPerPx
      // The turn is drawn twice, one width apart, so the left edge's azimuth lands where it
      // belongs and the rest wraps round the 0/360 seam.
      if (x0 < W) ctx.drawImage(bmp, 0, s0, image.width, s1 - s0, x0, y0, W, y1 - y0)
      if (x0 > 0) ctx.drawImage(bmp, 0, s0, image.width, s1 - s0, x0 - W, y0, W, y1 - y0)
      return true
    }
    const range = tilesInView(image, level, domain)
    if (range) {
      const centre = (range.first + range.last) / 2
      const end = Math.min(tileCount(image, level) - 1, range.last + 1)
      // The tiles in view, nearest the middle first, then one either side for the next scroll.
      for (let t = Math.max(0, range.first - 1); t <= end; t++) {
        const outside = t < range.first || t > range.last
        wants.push({ image, level, tile: t, priority: Math.abs(t - centre) + (outside ? 100 : 0) })
      }
      for (let t = range.first; t <= range.last; t++) {
        const [a, b] = tileSpan(image, level, t)
        if (draw(level, t, a, b)) continue
        // Stand-ins while it loads: the nearest coarser tile holding these rows, then any finer
        // tiles already loaded on top (after zooming out), so nothing flashes blank.
        for (let up = 1; level + up < image.levels; up++)
          if (draw(level + up, parentTile(t, up), a, b)) break
        if (level > 0) for (const c of [2 * t, 2 * t + 1]) draw(level - 1, c, a, b)
      }
    }
    // The last level is one tile: asked for first, it stands in anywhere until the rest arrive.
    const last = image.levels - 1
    if (last > level) wants.push({ image, level: last, tile: 0, priority: -1 })
  }
  return { wants, incomplete }
}

/** Flat tone under tiles not yet loaded. */
const BASE = '#8b9096'

const hatches = new WeakMap<CanvasRenderingContext2D, CanvasPattern | string>()

/** Neutral diagonal hatch (8 device px), made once per context. */
function hatch(ctx: CanvasRenderingContext2D): CanvasPattern | string {
  const hit = hatches.get(ctx)
  if (hit) return hit
  const tile = document.createElement('canvas')
  tile.width = 8
  tile.height = 8
  const t = tile.getContext('2d')
  let pattern: CanvasPattern | string = BASE
  if (t) {
    t.fillStyle = '#c9cdd2'
    t.fillRect(0, 0, 8, 8)
    t.strokeStyle = '#8b9096'
    t.lineWidth = 1.5
    t.beginPath()
    t.moveTo(-2, 10)
    t.lineTo(10, -2)
    t.moveTo(-2, 2)
    t.lineTo(2, -2)
    t.moveTo(6, 10)
    t.lineTo(10, 6)
    t.stroke()
    pattern = ctx.createPattern(tile, 'repeat') ?? BASE
  }
  hatches.set(ctx, pattern)
  return pattern
}
