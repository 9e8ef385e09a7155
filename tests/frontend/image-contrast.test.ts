import { describe, expect, it } from 'vitest'
import {
  addHistogram,
  binsOf,
  percentileCuts,
  rowStats,
  windowHalfRows,
  windowMoments,
  WINDOW_SPREAD,
} from '../../frontend/src/logic/image/contrast'
import { colourTile } from '../../frontend/src/logic/image/tile-colour'
import { colourLut } from '../../frontend/src/logic/image/colour-maps'

const grey8 = { channels: 1, sampleBits: 8 as const, nullZero: false }
const las16 = { channels: 1, sampleBits: 16 as const, nullZero: true }

describe('static contrast', () => {
  it('percentileCuts() on 0…99 (one each): 10 % and 90 % fall on 9 and 89', () => {
    const samples = Uint8Array.from({ length: 100 }, (_, i) => i)
    const h = new Uint32Array(binsOf(8))
    addHistogram(h, samples, 10, grey8, 0, 10)
    // The count reaches 10 % (10 samples) at value 9 and 90 % (90) at value 89: nearest-rank
    // percentiles (common practice).
    expect(percentileCuts(h, grey8, 10, 90)).toEqual([[9, 89]])
    expect(percentileCuts(h, grey8, 0, 100)).toEqual([[0, 99]])
  })

  it('addHistogram() takes only the rows asked for', () => {
    const samples = Uint8Array.from({ length: 100 }, (_, i) => i)
    const h = new Uint32Array(binsOf(8))
    addHistogram(h, samples, 10, grey8, 2, 4) // rows 2 and 3: values 20…39
    expect(h.reduce((a, b) => a + b, 0)).toBe(20)
    expect(percentileCuts(h, grey8, 0, 100)).toEqual([[20, 39]])
  })

  it('LAS arrays leave no-value (0) out of the histogram and draw it transparent', () => {
    const samples = Uint16Array.from([0, 0, 1000, 2000, 3000, 4000, 0, 65535])
    const h = new Uint32Array(binsOf(16))
    addHistogram(h, samples, 8, las16, 0, 1)
    expect(h.reduce((a, b) => a + b, 0)).toBe(5)
    // 16-bit bins are 16 levels wide: lower edge of 1000's bin (992), upper of 65535's (65535).
    const [cut] = percentileCuts(h, las16, 0, 100)
    expect(cut).toEqual([992, 65535])
    const px = colourTile(
      { samples, width: 8, rows: 1 },
      las16,
      { kind: 'static', cuts: [cut!] },
      colourLut('grey'),
    )
    expect(px[0]).toBe(0)
    expect(px[6]).toBe(0)
    expect(px[2] >>> 24).toBe(255)
  })

  it('percentileCuts() is undefined for a channel with no samples', () => {
    expect(percentileCuts(new Uint32Array(binsOf(16)), las16, 1, 99)).toEqual([undefined])
  })

  it('colourTile() static: low cut → first map entry, high cut → last, linear between', () => {
    const lut = colourLut('grey')
    const samples = Uint8Array.from([50, 100, 150, 200, 10, 250])
    const px = colourTile(
      { samples, width: 6, rows: 1 },
      grey8,
      { kind: 'static', cuts: [[50, 150]] },
      lut,
    )
    const level = (v: number) => v & 255
    expect([...px].map(level)).toEqual([0, 128, 255, 255, 0, 255])
  })

  it('colourTile() optical: each channel stretched on its own', () => {
    const rgb = { channels: 3, sampleBits: 8 as const, nullZero: false }
    const samples = Uint8Array.from([10, 100, 200, 20, 150, 250])
    const cuts = [
      [10, 20],
      [100, 150],
      [200, 250],
    ] as const
    const px = colourTile(
      { samples, width: 2, rows: 1 },
      rgb,
      { kind: 'static', cuts },
      colourLut('grey'),
    )
    const bytes = new Uint8Array(px.buffer)
    expect([...bytes]).toEqual([0, 0, 0, 255, 255, 255, 255, 255])
  })
})

describe('moving-window contrast', () => {
  it('rowStats() counts, sums and sums squares per row, leaving no-value out', () => {
    const s = rowStats(Uint16Array.from([0, 2, 4, 6, 8, 0]), 3, 2, las16)
    expect([...s]).toEqual([2, 6, 20, 2, 14, 100])
  })

  it('windowMoments() equals the mean and sd taken directly over the rows within ±half', () => {
    const width = 5
    const rows = 40
    const values = Uint8Array.from(
      { length: width * rows },
      (_, i) => (i * 37 + (i % 7) * 11) % 251,
    )
    const stats = rowStats(values, width, rows, grey8)
    const half = 3
    const m = windowMoments(stats, 0, 1, 10, 20, half)
    for (let r = 10; r < 20; r++) {
      const pool: number[] = []
      for (let k = Math.max(0, r - half); k <= Math.min(rows - 1, r + half); k++)
        for (let c = 0; c < width; c++) pool.push(values[k * width + c])
      const mean = pool.reduce((a, b) => a + b, 0) / pool.length
      const sd = Math.sqrt(pool.reduce((a, b) => a + (b - mean) ** 2, 0) / pool.length)
      expect(m[(r - 10) * 2]).toBeCloseTo(mean, 3)
      expect(m[(r - 10) * 2 + 1]).toBeCloseTo(sd, 3)
    }
  })

  it('colourTile() window: the mean draws mid-map, mean ± SPREAD·sd at the ends', () => {
    const lut = colourLut('grey')
    const samples = Uint8Array.from([60, 100, 140, 100])
    const moments = Float32Array.from([100, 20])
    const px = colourTile({ samples, width: 4, rows: 1 }, grey8, { kind: 'window', moments }, lut)
    expect(WINDOW_SPREAD).toBe(2)
    expect([...px].map((v) => v & 255)).toEqual([0, 128, 255, 128])
  })

  it('windowHalfRows() is half the window in rows of the level drawn, at least 1', () => {
    expect(windowHalfRows(1, 0.002)).toBe(250)
    expect(windowHalfRows(1, 0.256)).toBe(2)
    expect(windowHalfRows(0.01, 0.256)).toBe(1)
  })
})
