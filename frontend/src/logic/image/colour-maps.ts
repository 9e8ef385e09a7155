// Downdip's colour maps for televiewer images, our own: each runs dark → light with lightness
// rising steadily (so a darker pixel always means a lower value), and none is a copy of another
// program's palette.
//
// - kiln  (acoustic amplitude): soot black → burnt umber → fired orange → straw → bone white.
//   Low amplitude (open fractures, soft or broken rock) reads dark, hard clean wall bright.
// - fathom (travel time): deep navy → sea blue → teal → sea-foam → pale sand. A long travel time
//   (the wall further away: breakouts, washouts, open fractures) reads dark, short bright.
// - grey: black → white, for any image, and the neutral choice when colour would distract.
// Optical images keep their own RGB: no map, contrast stretches each channel.

export const colourMapNames = ['kiln', 'fathom', 'grey'] as const
export type ColourMapName = (typeof colourMapNames)[number]

export const colourMapLabels: Record<ColourMapName, string> = {
  kiln: 'Kiln (amplitude)',
  fathom: 'Fathom (travel time)',
  grey: 'Grey',
}

/** Stops at even spacing from value 0 to 1, as sRGB hex. */
const STOPS: Record<ColourMapName, readonly string[]> = {
  kiln: ['#120b07', '#3d1f0f', '#7a3a14', '#b8621c', '#dc9538', '#efc374', '#fbe9c0', '#fffaf0'],
  fathom: ['#07122b', '#0f2f5a', '#17557f', '#1f7c8d', '#4aa39a', '#8ec6ad', '#cfe3c4', '#f6f2de'],
  grey: ['#000000', '#ffffff'],
}

/** Entries in a lookup table: one per 8-bit level. */
export const LUT_SIZE = 256

const hex = (s: string) => [1, 3, 5].map((i) => parseInt(s.slice(i, i + 2), 16))

const cache = new Map<ColourMapName, Uint32Array>()

/**
 * The map as LUT_SIZE packed RGBA pixels (little-endian byte order, as a Uint32Array view over
 * ImageData reads them: red in the low byte, alpha 255 in the high byte), interpolated linearly
 * between the stops.
 */
export function colourLut(name: ColourMapName): Uint32Array {
  const hit = cache.get(name)
  if (hit) return hit
  const stops = STOPS[name].map(hex)
  const lut = new Uint32Array(LUT_SIZE)
  for (let i = 0; i < LUT_SIZE; i++) {
    const t = (i / (LUT_SIZE - 1)) * (stops.length - 1)
    const k = Math.min(stops.length - 2, Math.floor(t))
    const f = t - k
    const [r, g, b] = [0, 1, 2].map((c) =>
      Math.round(stops[k][c] + (stops[k + 1][c] - stops[k][c]) * f),
    )
    lut[i] = ((255 << 24) | (b << 16) | (g << 8) | r) >>> 0
  }
  cache.set(name, lut)
  return lut
}

/** One LUT entry back as [r, g, b] (for tests, legends and swatches). */
export function lutRgb(lut: Uint32Array, i: number): [number, number, number] {
  const v = lut[i]
  return [v & 255, (v >>> 8) & 255, (v >>> 16) & 255]
}

/** CSS linear-gradient of a map, for a legend swatch. */
export const colourMapGradient = (name: ColourMapName) =>
  `linear-gradient(to right, ${STOPS[name].join(', ')})`
