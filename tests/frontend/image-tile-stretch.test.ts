import { describe, expect, it } from 'vitest'
import { stretchFor, type LoadedTile } from '../../frontend/src/logic/image/tile-stretch'
import { rowStats, windowMoments } from '../../frontend/src/logic/image/contrast'
import { viewCuts, sameCuts } from '../../frontend/src/logic/image/view-cuts'
import { defaultDisplay } from '../../frontend/src/logic/image/image-types'
import { TileLru } from '../../frontend/src/logic/image/tile-lru'

// A small strip: 40 rows of 4 samples in tiles of 16 rows (tiles 0, 1, 2 with 16, 16, 8 rows),
// 1 cm rows from 100 m.
const image = {
  id: 1,
  topDepth: 100,
  bottomDepth: 100.4,
  height: 40,
  width: 4,
  tileRows: 16,
  levels: 2,
  channels: 1 as const,
  sampleBits: 8 as const,
  source: 'raster' as const,
}
const all = Uint8Array.from({ length: 40 * 4 }, (_, i) => (i * 53 + Math.floor(i / 4) * 29) % 256)
const tile = (t: number): LoadedTile => {
  const rows = Math.min(16, 40 - t * 16)
  return { rows, samples: all.slice(t * 64, t * 64 + rows * 4) }
}
const fmt = { channels: 1, sampleBits: 8 as const, nullZero: false }

describe('stretchFor() moving window across tiles', () => {
  // 0.1 m window over 1 cm rows: ±5 rows.
  const display = { ...defaultDisplay('amplitude'), contrast: 'window' as const, windowM: 0.1 }

  it('uses the neighbours’ rows, so a tile edge is scaled as if the strip were one piece', () => {
    const tiles = [tile(0), tile(1), tile(2)]
    const s = stretchFor(image, 0, 1, tiles[1], display, undefined, (u) => tiles[u])!
    const made = s.make()
    if (made.kind !== 'window') throw new Error('window stretch expected')
    const whole = windowMoments(rowStats(all, 4, 40, fmt), 0, 1, 16, 32, 5)
    expect([...made.moments]).toEqual([...whole])
    expect(s.key.endsWith('|111')).toBe(true)
  })

  it('changes its key when a neighbour arrives, so the tile is coloured again', () => {
    const alone = stretchFor(image, 0, 1, tile(1), display, undefined, () => undefined)!
    const t0 = tile(0)
    const withAbove = stretchFor(image, 0, 1, tile(1), display, undefined, (u) =>
      u === 0 ? t0 : undefined,
    )!
    expect(alone.key).not.toBe(withAbove.key)
    // Without its neighbours the first row's window holds rows 16…21 only.
    const m = alone.make()
    if (m.kind !== 'window') throw new Error('window stretch expected')
    const own = windowMoments(rowStats(all, 4, 40, fmt).subarray(16 * 3, 32 * 3), 16, 1, 16, 17, 5)
    expect(m.moments[0]).toBeCloseTo(own[0], 5)
  })

  it('static contrast waits for cuts, and its key follows them', () => {
    const d = defaultDisplay('amplitude')
    expect(stretchFor(image, 0, 0, tile(0), d, undefined, () => undefined)).toBeUndefined()
    const a = stretchFor(image, 0, 0, tile(0), d, [[10, 200]], () => undefined)!
    const b = stretchFor(image, 0, 0, tile(0), d, [[12, 200]], () => undefined)!
    expect(a.key).not.toBe(b.key)
  })
})

describe('viewCuts()', () => {
  it('takes the histogram of the rows in view only', () => {
    const tiles = [tile(0), tile(1), tile(2)]
    // 100.16–100.20 m: rows 16…19 of tile 1.
    const cuts = viewCuts(image, 0, [100.16, 100.2], { low: 0, high: 100 }, (l, t) =>
      l === 0 ? tiles[t] : undefined,
    )!
    const shown = [...all.slice(16 * 4, 20 * 4)]
    expect(cuts).toEqual([[Math.min(...shown), Math.max(...shown)]])
  })

  it('falls back to a coarser level while the drawn one loads; undefined with nothing loaded', () => {
    const coarse: LoadedTile = {
      rows: 20,
      samples: Uint8Array.from({ length: 80 }, (_, i) => 50 + (i % 100)),
    }
    const cuts = viewCuts(image, 0, [100, 100.4], { low: 0, high: 100 }, (l) =>
      l === 1 ? coarse : undefined,
    )
    expect(cuts).toEqual([[50, 129]])
    expect(viewCuts(image, 0, [100, 100.4], { low: 1, high: 99 }, () => undefined)).toBeUndefined()
  })

  it('sameCuts() ignores changes under 1/256 of the range', () => {
    expect(sameCuts([[10, 200]], [[10.5, 200]], 8)).toBe(true)
    expect(sameCuts([[10, 200]], [[12, 200]], 8)).toBe(false)
  })
})

describe('TileLru', () => {
  it('keeps the total within its byte budget, dropping the least recently used first', () => {
    const dropped: string[] = []
    const lru = new TileLru<{ bytes: number }>(100, (k) => dropped.push(k))
    lru.set('a', { bytes: 40 })
    lru.set('b', { bytes: 40 })
    lru.get('a') // a is now the most recent
    lru.set('c', { bytes: 40 })
    expect(dropped).toEqual(['b'])
    expect(lru.bytes).toBe(80)
    lru.resize('a', 70) // a bitmap added to a: c goes
    expect(dropped).toEqual(['b', 'c'])
    expect(lru.has('a')).toBe(true)
    // An entry larger than the whole budget still stays (alone).
    lru.set('big', { bytes: 500 })
    expect(lru.size).toBe(1)
    expect(lru.peek('big')?.bytes).toBe(500)
  })
})
