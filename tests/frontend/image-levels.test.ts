import { describe, expect, it } from 'vitest'
import {
  chooseLevel,
  levelRows,
  levelStep,
  metresPerDevicePixel,
  parentTile,
  rowStep,
  tileCount,
  tileSpan,
  tilesInView,
} from '../../frontend/src/logic/image/tile-levels'

// A 300 m strip of 150 000 rows (2 mm rows), 256-row tiles: levels until one fits a tile, i.e.
// ceil(150000 / 2^L) ≤ 256 first at L = 10, so 11 levels (the contract's pyramid rule).
const strip = { topDepth: 10, bottomDepth: 310, height: 150_000, tileRows: 256, levels: 11 }

describe('tile levels', () => {
  it('rowStep() and levelStep() double per level', () => {
    expect(rowStep(strip)).toBeCloseTo(0.002, 12)
    expect(levelStep(strip, 0)).toBeCloseTo(0.002, 12)
    expect(levelStep(strip, 3)).toBeCloseTo(0.016, 12)
  })

  it('levelRows() and tileCount() follow ceil(height / 2^L) and ceil(rows / tileRows)', () => {
    expect(levelRows(strip, 0)).toBe(150_000)
    expect(levelRows(strip, 1)).toBe(75_000)
    expect(levelRows(strip, 4)).toBe(9375)
    expect(levelRows(strip, 10)).toBe(147)
    expect(tileCount(strip, 0)).toBe(586)
    expect(tileCount(strip, 10)).toBe(1)
  })

  it('chooseLevel() takes the coarsest level whose row is still ≤ one device pixel', () => {
    // 2 mm rows: 1 mm per pixel → level 0 (never finer than 0).
    expect(chooseLevel(strip, 0.001)).toBe(0)
    expect(chooseLevel(strip, 0.002)).toBe(0)
    // 3.9 mm per pixel: level 1 (4 mm) would be coarser than a pixel.
    expect(chooseLevel(strip, 0.0039)).toBe(0)
    expect(chooseLevel(strip, 0.004)).toBe(1)
    expect(chooseLevel(strip, 0.0159)).toBe(2)
    expect(chooseLevel(strip, 0.016)).toBe(3)
    // The whole 300 m on 600 CSS px at dpr 2: 0.25 m per device px → 2^L ≤ 125 → L = 6.
    expect(chooseLevel(strip, metresPerDevicePixel(300, 600, 2))).toBe(6)
    // Never past the last level stored.
    expect(chooseLevel(strip, 100)).toBe(10)
    expect(chooseLevel({ ...strip, levels: 4 }, 100)).toBe(3)
    expect(chooseLevel(strip, Number.NaN)).toBe(0)
  })

  it('tileSpan() places tile t of level L at topDepth + t·tileRows·2^L·rowStep', () => {
    const [a, b] = tileSpan(strip, 0, 0)
    expect(a).toBeCloseTo(10, 12)
    expect(b).toBeCloseTo(10 + 256 * 0.002, 12)
    const [c, d] = tileSpan(strip, 2, 3)
    expect(c).toBeCloseTo(10 + 3 * 256 * 0.008, 12)
    expect(d).toBeCloseTo(10 + 4 * 256 * 0.008, 12)
    // The last tile of level 0 holds 150000 − 585·256 = 240 rows and ends at the strip's bottom.
    const [, e] = tileSpan(strip, 0, 585)
    expect(e).toBeCloseTo(310, 9)
    // Level 10 holds 147 rows of 2.048 m: its one tile runs past the bottom (clipped when drawn).
    expect(tileSpan(strip, 10, 0)[1]).toBeCloseTo(10 + 147 * 2.048, 9)
  })

  it('tilesInView() covers the view and clips to the strip', () => {
    // 1.024 m per tile at level 1: 20–21 m is rows 10/1.024 → tiles 9 … 10.
    expect(tilesInView(strip, 1, [20, 21])).toEqual({ first: 9, last: 10 })
    expect(tilesInView(strip, 1, [20, 21], 1)).toEqual({ first: 8, last: 11 })
    expect(tilesInView(strip, 0, [0, 10.1])).toEqual({ first: 0, last: 0 })
    expect(tilesInView(strip, 0, [309.9, 400])).toEqual({ first: 585, last: 585 })
    expect(tilesInView(strip, 0, [0, 10])).toBeNull()
    expect(tilesInView(strip, 0, [310, 320])).toBeNull()
  })

  it('parentTile() nests tiles: two of level L in one of level L + 1', () => {
    expect(parentTile(9, 1)).toBe(4)
    expect(parentTile(10, 1)).toBe(5)
    expect(parentTile(585, 3)).toBe(73)
    // The parent's span holds the child's.
    const [a, b] = tileSpan(strip, 0, 585)
    const [c, d] = tileSpan(strip, 3, parentTile(585, 3))
    expect(c).toBeLessThanOrEqual(a)
    expect(d).toBeGreaterThanOrEqual(b - 1e-9)
  })
})
