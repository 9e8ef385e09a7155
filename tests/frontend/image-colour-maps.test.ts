import { describe, expect, it } from 'vitest'
import {
  colourLut,
  colourMapNames,
  LUT_SIZE,
  lutRgb,
} from '../../frontend/src/logic/image/colour-maps'
import { defaultColourMap } from '../../frontend/src/logic/image/image-types'

/** Relative luminance from sRGB (WCAG 2.x definition). */
function luminance([r, g, b]: [number, number, number]) {
  const lin = (v: number) => {
    const c = v / 255
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4
  }
  return 0.2126 * lin(r) + 0.7152 * lin(g) + 0.0722 * lin(b)
}

describe('colour maps', () => {
  it.each(colourMapNames)('colourLut(%s) has 256 opaque entries, dark to light', (name) => {
    const lut = colourLut(name)
    expect(lut.length).toBe(LUT_SIZE)
    for (const v of lut) expect(v >>> 24).toBe(255)
    const lum = Array.from({ length: LUT_SIZE }, (_, i) => luminance(lutRgb(lut, i)))
    // Lightness never falls along the map: a darker pixel always means a lower value.
    for (let i = 1; i < LUT_SIZE; i++) expect(lum[i]).toBeGreaterThanOrEqual(lum[i - 1] - 1e-9)
    expect(lum[0]).toBeLessThan(0.02)
    expect(lum[LUT_SIZE - 1]).toBeGreaterThan(0.8)
  })

  it('colourLut(grey) is r = g = b = level', () => {
    const lut = colourLut('grey')
    for (const i of [0, 1, 77, 128, 254, 255]) expect(lutRgb(lut, i)).toEqual([i, i, i])
  })

  it('kiln and fathom are told apart by hue at mid-map', () => {
    const [kr, , kb] = lutRgb(colourLut('kiln'), 128)
    const [fr, , fb] = lutRgb(colourLut('fathom'), 128)
    expect(kr).toBeGreaterThan(kb) // warm
    expect(fb).toBeGreaterThan(fr) // cool
  })

  it('packs RGBA little-endian, as a Uint32Array over ImageData bytes reads it', () => {
    const lut = colourLut('kiln')
    const bytes = new Uint8Array(lut.buffer, 0, 4)
    expect([bytes[0], bytes[1], bytes[2], bytes[3]]).toEqual([...lutRgb(lut, 0), 255])
  })

  it('defaultColourMap() gives each kind its own map', () => {
    expect(defaultColourMap('amplitude')).toBe('kiln')
    expect(defaultColourMap('traveltime')).toBe('fathom')
    expect(defaultColourMap('optical')).toBe('grey')
  })
})
