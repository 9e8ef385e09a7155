import { describe, expect, it } from 'vitest'
import {
  renderImages,
  type WallImage,
  type WallTiles,
} from '../../frontend/src/logic/image/wall-render'
import type { LoadedTile } from '../../frontend/src/logic/image/tile-stretch'
import { defaultDisplay } from '../../frontend/src/logic/image/image-types'

// 10 m of 1 cm rows (1000 rows × 8 samples), 100-row tiles, 5 levels (1000, 500, 250, 125, 63
// rows: the last fits one tile).
const image: WallImage = {
  id: 9,
  topDepth: 100,
  bottomDepth: 110,
  height: 1000,
  width: 8,
  tileRows: 100,
  levels: 5,
  channels: 1,
  sampleBits: 8,
  source: 'raster',
  leftAzimuth: 0,
}

interface Draw {
  sy: number
  sh: number
  dx: number
  dy: number
  dw: number
  dh: number
  src: string
}

function fakeContext() {
  const draws: Draw[] = []
  const ctx = {
    setTransform() {},
    fillRect() {},
    imageSmoothingEnabled: true,
    fillStyle: '',
    drawImage(
      src: { id: string },
      _sx: number,
      sy: number,
      _sw: number,
      sh: number,
      dx: number,
      dy: number,
      dw: number,
      dh: number,
    ) {
      draws.push({ sy, sh, dx, dy, dw, dh, src: src.id })
    },
  }
  return { ctx: ctx as unknown as CanvasRenderingContext2D, draws }
}

/** Tiles that are "loaded" where `have(level, tile)` says so; bitmaps named level/tile. */
function source(have: (level: number, tile: number) => boolean): WallTiles {
  const tile = (level: number, t: number): LoadedTile | undefined =>
    have(level, t) ? { rows: 100, samples: new Uint8Array(800).fill(100) } : undefined
  return {
    get: (_i, l, t) => tile(l, t),
    peek: (_i, l, t) => tile(l, t),
    bitmap: (_i, l, t) => ({ id: `${l}/${t}` }) as unknown as CanvasImageSource,
  }
}

const frame = (domain: [number, number], extra: Partial<WallImage> = {}, height = 500) => ({
  dpr: 1,
  width: 240,
  height,
  domain,
  images: [{ ...image, ...extra }],
  display: defaultDisplay('amplitude'),
  cuts: new Map([[9, [[0, 255]] as const]]),
})

describe('renderImages()', () => {
  it('draws the tiles of the chosen level edge to edge, whole device pixels, no seam', () => {
    // 2 m over 500 px: 4 mm per device px, finer than the 1 cm rows → level 0.
    const { ctx, draws } = fakeContext()
    renderImages(
      ctx,
      frame([102, 104]),
      source(() => true),
    )
    expect(draws.map((d) => d.src)).toEqual(['0/2', '0/3'])
    expect(draws[0].dy).toBe(0)
    expect(draws[0].dy + draws[0].dh).toBe(draws[1].dy)
    expect(draws[1].dy + draws[1].dh).toBe(500)
    for (const d of draws) expect(Number.isInteger(d.dy) && Number.isInteger(d.dh)).toBe(true)
  })

  it('shifts the turn by the left-edge azimuth and wraps the rest round the seam', () => {
    const { ctx, draws } = fakeContext()
    renderImages(
      ctx,
      frame([102, 103], { leftAzimuth: 90 }),
      source(() => true),
    )
    // Column 0 starts at 090: x = 60 of 240, and the turn drawn again one width to the left.
    expect(draws.map((d) => [d.dx, d.dw])).toEqual([
      [60, 240],
      [-180, 240],
    ])
  })

  it('draws a coarser loaded tile’s rows where a tile is still coming', () => {
    const { ctx, draws } = fakeContext()
    // Level 0 tile 3 missing; level 1 tile 1 (level-0 rows 200–399) stands in for it.
    renderImages(
      ctx,
      frame([102, 104]),
      source((l, t) => (l === 0 ? t === 2 : l === 1)),
    )
    const standIn = draws.find((d) => d.src === '1/1')!
    // Level-0 tile 3 is level-1 rows 150–199, i.e. rows 50–100 of level-1 tile 1.
    expect(standIn.sy).toBeCloseTo(50, 9)
    expect(standIn.sh).toBeCloseTo(50, 9)
    expect(standIn.dy).toBe(250)
    expect(standIn.dh).toBe(250)
  })

  it('clips a last row running past the bottom of the image', () => {
    const { ctx, draws } = fakeContext()
    // The whole strip on 60 px: 16.7 cm per px → level 4 (16 cm rows), 63 rows reaching 110.08 m.
    const one = { rows: 63, samples: new Uint8Array(63 * 8) }
    renderImages(ctx, frame([100, 110], {}, 60), {
      ...source(() => true),
      get: (_i, l) => (l === 4 ? one : undefined),
      peek: (_i, l) => (l === 4 ? one : undefined),
    })
    expect(draws).toHaveLength(1)
    expect(draws[0].dy).toBe(0)
    expect(draws[0].dh).toBe(60)
    // 10 m of the 10.08 m the rows span: 62.5 of the 63 rows, the last cut at the bottom.
    expect(draws[0].sh).toBeCloseTo(62.5, 6)
  })

  it('asks for the tiles in view nearest first, one either side, and the one-tile level first of all', () => {
    const { ctx } = fakeContext()
    const { wants } = renderImages(
      ctx,
      frame([102, 104]),
      source(() => false),
    )
    const order = [...wants]
      .sort((a, b) => a.priority - b.priority)
      .map((w) => `${w.level}/${w.tile}`)
    expect(order).toEqual(['4/0', '0/2', '0/3', '0/1', '0/4'])
  })
})
