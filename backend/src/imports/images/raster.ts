import sharp, { type Metadata, type OutputInfo } from 'sharp'
import { checkDimensions, IMAGE_LIMITS, refuseFile } from './limits'
import { checkJpeg, checkPng } from './raster-checks'
import { checkTiff } from './tiff-check'
import type { DecodedImage } from './types'

export type RasterFormat = 'png' | 'jpeg' | 'tiff'

/** How a raster will be read: its size, how its samples are stored, what was changed on the way. */
export interface RasterProbe {
  format: RasterFormat
  width: number
  height: number
  channels: 1 | 3
  sampleBits: 8 | 16
  hasAlpha: boolean
  notes: string[]
}

/**
 * Reads a raster's header and structure only: the size (checked against the caps before any
 * decoding — a decompression bomb declares its size there), the sample layout, and the file's
 * integrity (PNG chunk CRCs and IEND, JPEG EOI, TIFF strip extents). Grey stays grey (8- or
 * 16-bit); colour becomes 8-bit RGB; a palette of greys is grey; alpha is dropped.
 */
export async function probeRaster(bytes: Buffer, format: RasterFormat): Promise<RasterProbe> {
  const label = format.toUpperCase()
  // PNG: every chunk whole first, then the size straight from IHDR (libpng's own limits would
  // otherwise answer first, in its words)
  const facts = format === 'png' ? checkPng(bytes) : { paletteGrey: false }
  if (format === 'png')
    checkDimensions(bytes.readUInt32BE(16), bytes.readUInt32BE(20), `The ${label} image`)
  let meta: Metadata
  try {
    meta = await sharp(bytes, { limitInputPixels: false }).metadata()
  } catch (err: unknown) {
    throw refuseFile('damaged_file', `The ${label} header cannot be read (${reason(err)}).`)
  }
  const { width = 0, height = 0 } = meta
  checkDimensions(width, height, `The ${label} image`)
  if (format === 'jpeg') checkJpeg(bytes)
  if (format === 'tiff') checkTiff(bytes)
  const notes: string[] = []
  const colours = (meta.channels ?? 1) - (meta.hasAlpha ? 1 : 0)
  const grey = colours === 1 || (meta.isPalette === true && facts.paletteGrey)
  const deep = meta.depth === 'ushort' || meta.depth === 'short'
  if (!deep && meta.depth !== 'uchar' && meta.depth !== 'char')
    throw refuseFile(
      'unsupported_format',
      `The ${label} holds ${meta.depth} samples: only 8- and 16-bit images are read.`,
    )
  if (meta.isPalette) notes.push(`Palette image read as ${grey ? 'grey' : 'RGB colour'}.`)
  if (!grey && deep) notes.push('16-bit colour read as 8-bit RGB.')
  if (meta.hasAlpha) notes.push('Transparency dropped (transparent samples read as black).')
  if ((meta.pages ?? 1) > 1) notes.push(`The first of ${meta.pages} pages read.`)
  if ((meta.orientation ?? 1) !== 1)
    notes.push(`EXIF orientation ${meta.orientation} ignored: rows read as stored, top first.`)
  return {
    format,
    width,
    height,
    channels: grey ? 1 : 3,
    sampleBits: grey && deep ? 16 : 8,
    hasAlpha: meta.hasAlpha === true,
    notes,
  }
}

/**
 * Decodes every pixel as the probe said. failOn 'error' makes libvips refuse a damaged or cut
 * body (a libpng/libjpeg/libtiff error) instead of returning what it read so far.
 */
export async function decodeRaster(bytes: Buffer, probe: RasterProbe): Promise<DecodedImage> {
  let img = sharp(bytes, {
    limitInputPixels: IMAGE_LIMITS.maxPixels,
    failOn: 'error',
    sequentialRead: true,
  })
  if (probe.hasAlpha) img = img.flatten({ background: '#000000' })
  if (probe.channels === 3) img = img.toColourspace('srgb').raw({ depth: 'uchar' })
  else if (probe.sampleBits === 16) img = img.toColourspace('grey16').raw({ depth: 'ushort' })
  else img = img.extractChannel(0).raw({ depth: 'uchar' })
  let out: { data: Buffer; info: OutputInfo }
  try {
    out = await img.toBuffer({ resolveWithObject: true })
  } catch (err: unknown) {
    throw refuseFile(
      'damaged_file',
      `The ${probe.format.toUpperCase()} image cannot be decoded: ${reason(err)}.`,
    )
  }
  const { data, info } = out
  if (
    info.width !== probe.width ||
    info.height !== probe.height ||
    info.channels !== probe.channels
  )
    throw refuseFile(
      'damaged_file',
      `The ${probe.format.toUpperCase()} decoded as ${info.width} × ${info.height} × ${info.channels}, not as its header says.`,
    )
  const samples =
    probe.sampleBits === 16
      ? uint16Of(data)
      : new Uint8Array(data.buffer, data.byteOffset, data.length)
  return {
    width: info.width,
    rows: info.height,
    channels: probe.channels,
    samples,
    zeroIsNoValue: false,
  }
}

/** sharp's 16-bit raw output is in the machine's byte order: view it, or copy when unaligned. */
function uint16Of(data: Buffer): Uint16Array {
  if (data.byteOffset % 2 === 0)
    return new Uint16Array(data.buffer, data.byteOffset, data.length / 2)
  return new Uint16Array(Uint8Array.from(data).buffer)
}

/** libvips messages carry the decoder's words; the first line is enough for a person. */
const reason = (err: unknown) =>
  (err instanceof Error ? err.message : String(err)).split('\n')[0].slice(0, 200)
