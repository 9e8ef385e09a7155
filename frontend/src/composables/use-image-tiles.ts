import { onScopeDispose, ref } from 'vue'
import { fetchTile } from '../api/images'
import type { IdParam } from '../api/types'
import { TileLru } from '../logic/image/tile-lru'
import type { LoadedTile } from '../logic/image/tile-stretch'
import type { TileWant, WallImage, WallTiles } from '../logic/image/wall-render'

/** Memory for tiles and their coloured bitmaps (bytes): about 300 m of a 360-wide 8-bit image. */
export const TILE_BUDGET = 256 * 1024 * 1024
/** Requests in flight at once (Chromium's per-host limit for HTTP/1.1). */
const PARALLEL = 6
/** Tiles coloured per frame at most: the rest wait a frame behind a stand-in. */
const COLOURS_PER_FRAME = 4
/** A tile that failed is not asked for again for this long (ms). */
const RETRY_MS = 5000

interface Entry extends LoadedTile {
  bytes: number
  sampleBytes: number
  bitmap?: CanvasImageSource
  bitmapKey?: string
}

const keyOf = (image: WallImage, level: number, tile: number) => `${image.id}/${level}/${tile}`

/**
 * The tiles of one canvas: fetched as the view asks for them (the nearest first, a few at a time,
 * requests for tiles scrolled away aborted), kept in an LRU bounded by bytes with their coloured
 * bitmaps, and coloured at most a few per frame.
 */
export function useImageTiles(
  projectId: () => IdParam,
  holeId: () => IdParam,
  onLoad: () => void,
  budget = TILE_BUDGET,
) {
  // An evicted tile's bitmap is released at once rather than left to the collector.
  const cache = new TileLru<Entry>(budget, (_key, entry) => release(entry))
  const inFlight = new Map<string, AbortController>()
  const failedAt = new Map<string, number>()
  let queue: TileWant[] = []
  let coloured = 0
  const failures = ref(0)

  function pump() {
    while (inFlight.size < PARALLEL && queue.length) {
      const w = queue.shift()!
      const key = keyOf(w.image, w.level, w.tile)
      if (cache.has(key) || inFlight.has(key)) continue
      const controller = new AbortController()
      inFlight.set(key, controller)
      fetchTile(projectId(), holeId(), w.image, w.level, w.tile, controller.signal)
        .then(({ rows, samples }) => {
          const sampleBytes = samples.byteLength
          cache.set(key, { rows, samples, sampleBytes, bytes: sampleBytes })
          failedAt.delete(key)
          onLoad()
        })
        .catch((err: unknown) => {
          if (controller.signal.aborted) return
          failedAt.set(key, Date.now())
          failures.value++
          console.warn(`Image tile ${key} could not be loaded.`, err)
        })
        .finally(() => {
          if (inFlight.get(key) === controller) inFlight.delete(key)
          pump()
        })
    }
  }

  /** The tiles the view wants now, in order: the rest of the queue and stale requests go. */
  function want(wants: readonly TileWant[]) {
    const now = Date.now()
    const sorted = [...wants].sort((a, b) => a.priority - b.priority)
    const keys = new Set(sorted.map((w) => keyOf(w.image, w.level, w.tile)))
    for (const [key, controller] of inFlight)
      if (!keys.has(key)) {
        controller.abort()
        inFlight.delete(key)
      }
    queue = sorted.filter((w) => {
      const key = keyOf(w.image, w.level, w.tile)
      return (
        !cache.has(key) && !inFlight.has(key) && now - (failedAt.get(key) ?? -Infinity) > RETRY_MS
      )
    })
    pump()
  }

  /** A new frame: its colouring budget starts again. */
  function beginFrame() {
    coloured = 0
  }

  const tiles: WallTiles = {
    get: (image, level, tile) => cache.get(keyOf(image, level, tile)),
    peek: (image, level, tile) => cache.peek(keyOf(image, level, tile)),
    bitmap(image, level, tile, key, make) {
      const k = keyOf(image, level, tile)
      const entry = cache.peek(k)
      if (!entry) return undefined
      if (entry.bitmap && entry.bitmapKey === key) return entry.bitmap
      if (coloured >= COLOURS_PER_FRAME) return undefined
      coloured++
      const bitmap = toBitmap(make(), image.width, entry.rows)
      if (!bitmap) return undefined
      release(entry)
      entry.bitmap = bitmap
      entry.bitmapKey = key
      cache.resize(k, entry.sampleBytes + image.width * entry.rows * 4)
      return bitmap
    },
  }

  function clear() {
    for (const controller of inFlight.values()) controller.abort()
    inFlight.clear()
    queue = []
    cache.clear()
  }
  onScopeDispose(clear)

  return { tiles, want, beginFrame, clear, failures, cache }
}

function release(entry: Entry) {
  if (typeof ImageBitmap !== 'undefined' && entry.bitmap instanceof ImageBitmap)
    entry.bitmap.close()
  entry.bitmap = undefined
}

/**
 * Packed RGBA pixels as an ImageBitmap (an OffscreenCanvas handed over at once, no waiting for
 * createImageBitmap): drawn from again and again, a bitmap is a fixed snapshot, cheap to copy.
 * A plain canvas where OffscreenCanvas is missing.
 */
function toBitmap(
  pixels: Uint32Array<ArrayBuffer>,
  width: number,
  rows: number,
): CanvasImageSource | undefined {
  const data = new ImageData(new Uint8ClampedArray(pixels.buffer), width, rows)
  if (typeof OffscreenCanvas !== 'undefined') {
    const canvas = new OffscreenCanvas(width, rows)
    const ctx = canvas.getContext('2d')
    if (!ctx) return undefined
    ctx.putImageData(data, 0, 0)
    return canvas.transferToImageBitmap()
  }
  const canvas = document.createElement('canvas')
  canvas.width = width
  canvas.height = rows
  const ctx = canvas.getContext('2d')
  if (!ctx) return undefined
  ctx.putImageData(data, 0, 0)
  return canvas
}
