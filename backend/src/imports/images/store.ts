import { endianness } from 'node:os'
import { promisify } from 'node:util'
import { deflate } from 'node:zlib'
import { asc, eq } from 'drizzle-orm'
import { imageFiles, imageTiles } from '../../../../schema/index'
import type { Executor } from '../../db/client'
import { pyramidLevels, tileOf } from './pyramid'
import type { DecodedImage, LevelSamples } from './types'

/** The uploaded file is kept in 4 MB chunks: one bytea value stays far below PostgreSQL's 1 GB. */
export const FILE_CHUNK_BYTES = 4 * 1024 * 1024
/** Tiles go in one INSERT until it carries this many bytes or tiles (memory; progress steps). */
const INSERT_BYTES = 8 * 1024 * 1024
const INSERT_TILES = 16
/** Tiles deflating at once on libuv's thread pool (4 threads unless UV_THREADPOOL_SIZE says). */
const IN_FLIGHT = 8

const deflateAsync = promisify(deflate)
const littleEndianHost = endianness() === 'LE'

/**
 * encodeTile's bytes exactly (services/image-rows.ts: raw samples, uint16 little-endian, zlib
 * level 6), deflated off the event loop: a 300 m strip is ~100 MB to deflate, seconds of CPU
 * that would otherwise stall every other request, and tiles deflate in parallel.
 */
export function encodeTileAsync(samples: LevelSamples): Promise<Buffer> {
  let bytes: Buffer
  if (samples instanceof Uint8Array || littleEndianHost)
    bytes = Buffer.from(samples.buffer, samples.byteOffset, samples.byteLength)
  else {
    bytes = Buffer.alloc(samples.byteLength)
    for (let i = 0; i < samples.length; i++) bytes.writeUInt16LE(samples[i], 2 * i)
  }
  return deflateAsync(bytes, { level: 6 })
}

export async function writeFileChunks(tx: Executor, imageId: number, bytes: Buffer) {
  for (let seq = 0; seq * FILE_CHUNK_BYTES < bytes.length; seq++) {
    const chunk = bytes.subarray(seq * FILE_CHUNK_BYTES, (seq + 1) * FILE_CHUNK_BYTES)
    await tx.insert(imageFiles).values({ imageId, seq, bytes: chunk })
  }
}

/** The file back in one buffer, for a decoder that needs it whole. */
export async function readFileBytes(db: Executor, imageId: number): Promise<Buffer> {
  const rows = await db
    .select({ bytes: imageFiles.bytes })
    .from(imageFiles)
    .where(eq(imageFiles.imageId, imageId))
    .orderBy(asc(imageFiles.seq))
  return Buffer.concat(rows.map((r) => r.bytes))
}

/**
 * Builds the pyramid level by level and writes every tile (deflated, see encodeTile) through
 * `tx`, calling `onTile` after each batch with the tiles written so far. Returns the levels.
 */
export async function writePyramid(
  tx: Executor,
  imageId: number,
  image: DecodedImage,
  tileRows: number,
  onTile: (written: number) => Promise<void> | void = () => {},
): Promise<number> {
  const rowLength = image.width * image.channels
  type Row = typeof imageTiles.$inferInsert
  let batch: Row[] = []
  let bytes = 0
  let written = 0
  const flush = async () => {
    if (batch.length === 0) return
    await tx.insert(imageTiles).values(batch)
    written += batch.length
    batch = []
    bytes = 0
    await onTile(written)
  }
  // deflates run ahead of the inserts, at most IN_FLIGHT at a time, and land in tile order
  const pending: Promise<Row>[] = []
  const land = async () => {
    const row = await pending.shift()!
    batch.push(row)
    bytes += row.bytes.length
    if (bytes >= INSERT_BYTES || batch.length >= INSERT_TILES) await flush()
  }
  let levels = 0
  for (const level of pyramidLevels(image, tileRows)) {
    levels++
    for (let t = 0; t * tileRows < level.rows; t++) {
      const tile = tileOf(level, t, tileRows, rowLength)
      pending.push(
        encodeTileAsync(tile.samples).then((encoded) => ({
          imageId,
          level: level.level,
          tile: t,
          rows: tile.rows,
          bytes: encoded,
        })),
      )
      if (pending.length >= IN_FLIGHT) await land()
    }
  }
  while (pending.length > 0) await land()
  await flush()
  return levels
}
