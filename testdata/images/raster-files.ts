/**
 * Raster test images (invented, Greyscar Quarry): a wall pattern with a planted sinusoid, written
 * by sharp, plus a baseline TIFF and hostile files written byte by byte. Used by make-images.ts.
 */
import { deflateSync } from 'node:zlib'
import sharp from 'sharp'

/** A grey wall 0..1: banding, grain, and one dark sinusoid d = d0 + (H/2)·cos(θ − θt). */
export function wall(width: number, rows: number, r: number, c: number): number {
  const theta = ((c + 0.5) / width) * 2 * Math.PI
  const trough = rows * 0.5 + rows * 0.15 * Math.cos(theta - (120 * Math.PI) / 180)
  const band = Math.abs(r - trough) < 2 ? -0.35 : 0
  const grain = (((r * 7919 + c * 104729) >>> 0) % 97) / 97 - 0.5
  return Math.min(1, Math.max(0, 0.55 + 0.1 * Math.sin(r / 9) + 0.12 * grain + band))
}

export function grey8(width: number, rows: number): Uint8Array {
  const out = new Uint8Array(width * rows)
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < width; c++) out[r * width + c] = Math.round(255 * wall(width, rows, r, c))
  return out
}

export function grey16(width: number, rows: number): Uint16Array {
  const out = new Uint16Array(width * rows)
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < width; c++)
      out[r * width + c] = Math.round(65535 * wall(width, rows, r, c)) ^ (c & 7)
  return out
}

/** An optical-looking wall: brownish rock, the trace darker. */
export function rgb8(width: number, rows: number): Uint8Array {
  const out = new Uint8Array(width * rows * 3)
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < width; c++) {
      const v = wall(width, rows, r, c)
      out.set([190 * v + 30, 150 * v + 20, 110 * v + 10], 3 * (r * width + c))
    }
  return out
}

const raw = (width: number, height: number, channels: 1 | 2 | 3 | 4) => ({
  raw: { width, height, channels },
})

export const png8 = (w: number, h: number) =>
  sharp(grey8(w, h), raw(w, h, 1)).toColourspace('b-w').png().toBuffer()
export const png16 = (w: number, h: number) =>
  sharp(grey16(w, h), raw(w, h, 1)).toColourspace('grey16').png().toBuffer()
export const pngRgb16 = (w: number, h: number) =>
  sharp(Uint16Array.from(rgb8(w, h), (v) => v * 257), raw(w, h, 3))
    .toColourspace('rgb16')
    .png()
    .toBuffer()
export const pngPaletteGrey = (w: number, h: number) =>
  sharp(Uint8Array.from(grey8(w, h), (v) => v & 0xf0), raw(w, h, 1))
    .toColourspace('b-w')
    .png({ palette: true, colours: 16, dither: 0 })
    .toBuffer()
export function pngGreyAlpha(w: number, h: number) {
  const g = grey8(w, h)
  const ga = new Uint8Array(w * h * 2)
  for (let i = 0; i < w * h; i++) ga.set([g[i], i % 5 === 0 ? 0 : 255], 2 * i)
  return sharp(ga, raw(w, h, 2)).toColourspace('b-w').png().toBuffer()
}
export const jpegGrey = (w: number, h: number) =>
  sharp(grey8(w, h), raw(w, h, 1)).toColourspace('b-w').jpeg({ quality: 90 }).toBuffer()
export const jpegRgb = (w: number, h: number) =>
  sharp(rgb8(w, h), raw(w, h, 3)).jpeg({ quality: 90 }).toBuffer()
export const tiffGrey8 = (w: number, h: number) =>
  sharp(grey8(w, h), raw(w, h, 1)).toColourspace('b-w').tiff({ compression: 'lzw' }).toBuffer()
export const tiffRgb = (w: number, h: number) =>
  sharp(rgb8(w, h), raw(w, h, 3)).tiff({ compression: 'deflate' }).toBuffer()

/**
 * A baseline TIFF 6.0 file, little-endian, uncompressed grey (BlackIsZero), `rowsPerStrip` rows a
 * strip: sharp writes 16-bit grey TIFFs as 8-bit, so this one is written by hand. `cut` bytes are
 * left off the end (the strips then lie past it: a cut-off transfer).
 */
export function baselineTiff(w: number, h: number, samples: Uint16Array, rowsPerStrip: number, cut = 0) {
  const strips = Math.ceil(h / rowsPerStrip)
  const entries = 10
  const ifdSize = 2 + entries * 12 + 4
  const arrays = 8 + ifdSize
  const data = arrays + strips * 8
  const stripBytes = (s: number) => Math.min(rowsPerStrip, h - s * rowsPerStrip) * w * 2
  const b = Buffer.alloc(data + w * h * 2)
  b.write('II', 0, 'latin1')
  b.writeUInt16LE(42, 2)
  b.writeUInt32LE(8, 4)
  b.writeUInt16LE(entries, 8)
  const tags: [number, number, number, number][] = [
    [256, 4, 1, w],
    [257, 4, 1, h],
    [258, 3, 1, 16],
    [259, 3, 1, 1],
    [262, 3, 1, 1],
    [273, 4, strips, strips === 1 ? data : arrays],
    [277, 3, 1, 1],
    [278, 4, 1, rowsPerStrip],
    [279, 4, strips, strips === 1 ? stripBytes(0) : arrays + strips * 4],
    [284, 3, 1, 1],
  ]
  tags.forEach(([tag, type, count, value], i) => {
    const at = 10 + i * 12
    b.writeUInt16LE(tag, at)
    b.writeUInt16LE(type, at + 2)
    b.writeUInt32LE(count, at + 4)
    if (type === 3 && count === 1) b.writeUInt16LE(value, at + 8)
    else b.writeUInt32LE(value, at + 8)
  })
  for (let s = 0; s < strips; s++) {
    b.writeUInt32LE(data + s * rowsPerStrip * w * 2, arrays + s * 4)
    b.writeUInt32LE(stripBytes(s), arrays + strips * 4 + s * 4)
  }
  for (let i = 0; i < samples.length; i++) b.writeUInt16LE(samples[i], data + 2 * i)
  return b.subarray(0, b.length - cut)
}

/** A PNG of `height` rows of zeros at `bitDepth` grey, honestly deflated: a decompression bomb. */
export function zeroPng(width: number, height: number, bitDepth: 1 | 8) {
  const rowBytes = 1 + Math.ceil((width * bitDepth) / 8)
  const body = deflateSync(Buffer.alloc(rowBytes * height), { level: 9 })
  const ihdr = Buffer.alloc(13)
  ihdr.writeUInt32BE(width, 0)
  ihdr.writeUInt32BE(height, 4)
  ihdr.set([bitDepth, 0, 0, 0, 0], 8)
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', body),
    chunk('IEND', Buffer.alloc(0)),
  ])
}

function chunk(type: string, data: Buffer) {
  const out = Buffer.alloc(12 + data.length)
  out.writeUInt32BE(data.length, 0)
  out.write(type, 4, 'latin1')
  data.copy(out, 8)
  out.writeUInt32BE(crc32(out.subarray(4, 8 + data.length)), 8 + data.length)
  return out
}

function crc32(data: Uint8Array): number {
  let c = 0xffffffff
  for (let i = 0; i < data.length; i++) {
    c ^= data[i]
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1
  }
  return (c ^ 0xffffffff) >>> 0
}
