/** The files an image upload takes, told by their first bytes (never by the file name). */
export type ImageFormat = 'png' | 'jpeg' | 'tiff' | 'las'

export const MEDIA_TYPES: Record<ImageFormat, string> = {
  png: 'image/png',
  jpeg: 'image/jpeg',
  tiff: 'image/tiff',
  las: 'text/plain',
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]

const startsWith = (b: Uint8Array, bytes: readonly number[], at = 0) =>
  b.length >= at + bytes.length && bytes.every((x, i) => b[at + i] === x)

/**
 * PNG signature (ISO/IEC 15948 §5.2), JPEG SOI + marker (ITU-T T.81 B.1.1.2), TIFF byte order +
 * 42 or BigTIFF 43 (TIFF 6.0 §2), and LAS: text whose first non-blank characters are `~V` (CWLS
 * LAS: the version section comes first), in UTF-8 (a BOM allowed) or UTF-16 either way round.
 */
export function sniffFormat(b: Uint8Array): ImageFormat | 'bigtiff' | undefined {
  if (startsWith(b, PNG_SIGNATURE)) return 'png'
  if (startsWith(b, [0xff, 0xd8, 0xff])) return 'jpeg'
  if (startsWith(b, [0x49, 0x49, 0x2a, 0x00]) || startsWith(b, [0x4d, 0x4d, 0x00, 0x2a]))
    return 'tiff'
  if (startsWith(b, [0x49, 0x49, 0x2b, 0x00]) || startsWith(b, [0x4d, 0x4d, 0x00, 0x2b]))
    return 'bigtiff'
  return looksLikeLas(b) ? 'las' : undefined
}

function looksLikeLas(b: Uint8Array): boolean {
  let i = startsWith(b, [0xef, 0xbb, 0xbf]) ? 3 : 0
  // UTF-16: every other byte is NUL in ASCII text; the BOM (FF FE / FE FF) may be there or not
  const le = startsWith(b, [0xff, 0xfe]) || (b.length > 1 && b[0] !== 0 && b[1] === 0)
  const be = startsWith(b, [0xfe, 0xff]) || (b.length > 1 && b[0] === 0 && b[1] !== 0)
  const stride = le || be ? 2 : 1
  if (stride === 2) i = startsWith(b, [0xff, 0xfe]) || startsWith(b, [0xfe, 0xff]) ? 2 : 0
  const at = (k: number) => (stride === 1 ? b[k] : le ? b[k] : b[k + 1])
  for (let n = 0; i < b.length - stride && n < 4096; i += stride, n++) {
    const c = at(i)
    if (c === 0x20 || c === 0x09 || c === 0x0a || c === 0x0d) continue
    return c === 0x7e && (at(i + stride) | 0x20) === 0x76
  }
  return false
}

/** The first bytes in hex, for a refusal that says what the file looked like. */
export function firstBytes(b: Uint8Array, n = 8): string {
  return Array.from(b.subarray(0, n), (x) => x.toString(16).padStart(2, '0')).join(' ')
}
