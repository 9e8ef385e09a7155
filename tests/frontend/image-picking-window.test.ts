import { describe, expect, it } from 'vitest'
import * as vw from '../../frontend/src/logic/image-picking/view-window'
import { wallAt, wallX, wallY } from '../../frontend/src/logic/image-picking/wall-mapping'

// A CSS pixel is 1/96 in = 0.26458 mm (W3C CSS Values and Units, absolute lengths): a 600 px wall
// at 1:5 shows 5 × 600 × 0.26458 mm = 0.79375 m of hole.
const px = 600
const extent: vw.DepthWindow = [30, 45]

describe('the depth window', () => {
  it('scaleOf() reads 1:N from the span and the height in CSS pixels', () => {
    expect(vw.scaleOf([30, 30.79375], px)).toBeCloseTo(5, 9)
    expect(vw.scaleOf([30, 33.175], px)).toBeCloseTo(20, 9)
  })

  it('openingWindow() starts at the top at 1:20, or shows a short image whole', () => {
    const w = vw.openingWindow(extent, px)
    expect(w[0]).toBe(30)
    expect(vw.scaleOf(w, px)).toBeCloseTo(vw.OPENING_SCALE, 9)
    expect(vw.openingWindow([30, 31], px)).toEqual([30, 31])
  })

  it('zoomWindow() keeps the depth under the pointer in place and stops at 1:5', () => {
    const w: vw.DepthWindow = [32, 34]
    const z = vw.zoomWindow(w, 33.5, 0.5, extent, px)
    expect(z[1] - z[0]).toBeCloseTo(1, 9)
    // 33.5 was three quarters down the window and still is.
    expect((33.5 - z[0]) / (z[1] - z[0])).toBeCloseTo(0.75, 9)
    const closest = vw.zoomWindow(z, 33.5, 0.01, extent, px)
    expect(vw.scaleOf(closest, px)).toBeCloseTo(vw.CLOSEST_SCALE, 9)
  })

  it('zoomWindow() out never shows more than the image; panWindow() stays inside it', () => {
    expect(vw.zoomWindow([32, 34], 33, 100, extent, px)).toEqual([30, 45])
    expect(vw.panWindow([32, 34], -5, extent)).toEqual([30, 32])
    expect(vw.panWindow([32, 34], 50, extent)).toEqual([43, 45])
  })

  it('centreWindow() and followDepth() bring a depth into view', () => {
    expect(vw.centreWindow([30, 32], 40, extent)).toEqual([39, 41])
    expect(vw.followDepth([30, 32], 31, extent)).toEqual([30, 32])
    const f = vw.followDepth([30, 32], 32.5, extent)
    expect(f[1]).toBeCloseTo(32.7, 9)
  })

  it('wallX/wallY/wallAt(): azimuth 0 at the left edge, depth downward, and back', () => {
    const w: vw.DepthWindow = [32, 34]
    expect(wallX(90, 720)).toBe(180)
    expect(wallX(-90, 720)).toBe(540)
    expect(wallY(33.5, w, 800)).toBe(600)
    const back = wallAt(180, 600, w, 720, 800)
    expect(back.azimuth).toBeCloseTo(90, 9)
    expect(back.depth).toBeCloseTo(33.5, 9)
  })
})
