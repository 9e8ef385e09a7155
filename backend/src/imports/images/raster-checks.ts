import zlib from 'node:zlib'
import { refuseFile } from './limits'

/** What the chunk walk learnt besides "whole": whether a palette holds only greys. */
export interface PngFacts {
  paletteGrey: boolean
}

/**
 * Walks every chunk of a PNG (ISO/IEC 15948 §5.3: length, type, data, CRC-32 over type and
 * data): a chunk running past the end, a CRC mismatch, no IHDR first or no IEND is refused
 * before any pixel is decoded, so a damaged file never reaches storage. Linear in the file size.
 */
export function checkPng(b: Buffer): PngFacts {
  let at = 8
  let paletteGrey = false
  let first = true
  while (at + 12 <= b.length) {
    const length = b.readUInt32BE(at)
    const type = b.toString('latin1', at + 4, at + 8)
    if (first && type !== 'IHDR') throw damaged(`PNG starts with chunk ${safe(type)}, not IHDR.`)
    first = false
    const end = at + 12 + length
    if (length > 0x7fffffff || end > b.length)
      throw damaged(
        `PNG chunk ${safe(type)} at byte ${at} runs past the end: the file is cut short.`,
      )
    const crc = crc32(b.subarray(at + 4, at + 8 + length))
    if (crc !== b.readUInt32BE(at + 8 + length))
      throw damaged(`PNG chunk ${safe(type)} at byte ${at} is damaged (its CRC does not match).`)
    if (type === 'PLTE') paletteGrey = greyPalette(b.subarray(at + 8, at + 8 + length))
    if (type === 'IEND') return { paletteGrey }
    at = end
  }
  throw damaged('PNG ends without its IEND chunk: the file is cut short.')
}

function greyPalette(entries: Buffer): boolean {
  for (let i = 0; i + 2 < entries.length; i += 3)
    if (entries[i] !== entries[i + 1] || entries[i] !== entries[i + 2]) return false
  return entries.length >= 3
}

/** Chunk types are four ASCII letters; anything else is shown escaped. */
const safe = (type: string) => JSON.stringify(type.replace(/[^A-Za-z]/g, '?'))

const damaged = (message: string) => refuseFile('damaged_file', message)

let table: Uint32Array | undefined
/** CRC-32 (ISO 3309, as PNG uses it): zlib's where Node has it (20.15+), else a table. */
function crc32(data: Uint8Array): number {
  const native = (zlib as { crc32?: (d: Uint8Array) => number }).crc32
  if (native) return native(data) >>> 0
  table ??= Uint32Array.from({ length: 256 }, (_, n) => {
    let c = n
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1
    return c >>> 0
  })
  let c = 0xffffffff
  for (let i = 0; i < data.length; i++) c = table[(c ^ data[i]) & 0xff] ^ (c >>> 8)
  return (c ^ 0xffffffff) >>> 0
}

/**
 * A JPEG must end with its EOI marker FF D9 (ITU-T T.81 B.2.1); trailing NUL padding is allowed.
 * Entropy-coded data cannot hold FF D9 (an FF there is followed by 00 or a restart marker).
 */
export function checkJpeg(b: Buffer): void {
  let end = b.length
  while (end > 2 && b[end - 1] === 0) end--
  if (end < 4 || b[end - 2] !== 0xff || b[end - 1] !== 0xd9)
    throw damaged('JPEG ends without its end-of-image marker (FF D9): the file is cut short.')
}
