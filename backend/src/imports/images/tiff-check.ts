import { refuseFile } from './limits'

/** TIFF 6.0 tags that say where the pixel data lies (§§ 8, 15). */
const STRIP_OFFSETS = 273
const STRIP_BYTE_COUNTS = 279
const TILE_OFFSETS = 324
const TILE_BYTE_COUNTS = 325
/** Field types holding offsets and counts: SHORT (2 bytes) and LONG (4 bytes). */
const TYPE_SIZE: Record<number, number> = { 3: 2, 4: 4 }

/**
 * Reads the first IFD of a TIFF (TIFF 6.0 §2: header, 12-byte entries, values of 4 bytes or
 * fewer held in the entry) and refuses a file whose strips or tiles lie past its end — a cut-off
 * transfer — before the decoder sees it. Only page 1 is read, so only its IFD is checked.
 */
export function checkTiff(b: Buffer): void {
  const le = b[0] === 0x49
  const u16 = (at: number) => (le ? b.readUInt16LE(at) : b.readUInt16BE(at))
  const u32 = (at: number) => (le ? b.readUInt32LE(at) : b.readUInt32BE(at))
  if (b.length < 8) throw damaged('TIFF shorter than its 8-byte header: the file is cut short.')
  const ifd = u32(4)
  if (ifd < 8 || ifd + 2 > b.length)
    throw damaged(
      `TIFF directory at byte ${ifd} lies past the end of the file (${b.length} bytes).`,
    )
  const count = u16(ifd)
  if (ifd + 2 + count * 12 > b.length)
    throw damaged(`TIFF directory at byte ${ifd} (${count} entries) runs past the end of the file.`)
  const arrays = new Map<number, number[]>()
  for (let e = 0; e < count; e++) {
    const at = ifd + 2 + e * 12
    const tag = u16(at)
    if (![STRIP_OFFSETS, STRIP_BYTE_COUNTS, TILE_OFFSETS, TILE_BYTE_COUNTS].includes(tag)) continue
    const size = TYPE_SIZE[u16(at + 2)]
    const n = u32(at + 4)
    if (!size) throw damaged(`TIFF tag ${tag} has field type ${u16(at + 2)}, not SHORT or LONG.`)
    const where = n * size <= 4 ? at + 8 : u32(at + 8)
    if (where + n * size > b.length)
      throw damaged(`TIFF tag ${tag} (${n} values) lies past the end of the file.`)
    const values: number[] = []
    for (let i = 0; i < n; i++) values.push(size === 2 ? u16(where + 2 * i) : u32(where + 4 * i))
    arrays.set(tag, values)
  }
  checkPieces('strip', arrays.get(STRIP_OFFSETS), arrays.get(STRIP_BYTE_COUNTS), b.length)
  checkPieces('tile', arrays.get(TILE_OFFSETS), arrays.get(TILE_BYTE_COUNTS), b.length)
  if (!arrays.has(STRIP_OFFSETS) && !arrays.has(TILE_OFFSETS))
    throw damaged('TIFF names no strips or tiles: it holds no pixel data.')
}

function checkPieces(what: string, offsets?: number[], counts?: number[], length = 0) {
  if (!offsets) return
  if (!counts || counts.length !== offsets.length)
    throw damaged(`TIFF gives ${offsets.length} ${what} offsets but no matching byte counts.`)
  for (let i = 0; i < offsets.length; i++) {
    const end = offsets[i] + counts[i]
    if (end > length)
      throw damaged(
        `TIFF ${what} ${i + 1} (bytes ${offsets[i]}–${end}) lies past the end of the file (${length} bytes): the file is cut short.`,
      )
  }
}

const damaged = (message: string) => refuseFile('damaged_file', message)
