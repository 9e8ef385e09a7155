import { deflateSync, inflateSync } from 'node:zlib'
import { and, asc, between, eq } from 'drizzle-orm'
import { images, imageTiles, type Image } from '../../../schema/index'
import { notFound } from '../http/errors'
import type { Executor } from '../db/client'

/** Samples of one tile: uint8 (8-bit rasters, RGB) or uint16 (16-bit rasters, LAS arrays). */
export type TileSamples = Uint8Array | Uint16Array

/**
 * A tile as stored and as served: the raw samples (uint16 little-endian), zlib-deflated — the
 * browser inflates them itself (Content-Encoding: deflate is the zlib format, RFC 9110 §8.4.1.2).
 */
export function encodeTile(samples: TileSamples): Buffer {
  const bytes =
    samples instanceof Uint16Array
      ? littleEndian(samples)
      : Buffer.from(samples.buffer, samples.byteOffset, samples.byteLength)
  return deflateSync(bytes, { level: 6 })
}

export function decodeTile(bytes: Buffer, sampleBits: number): TileSamples {
  const raw = inflateSync(bytes)
  if (sampleBits === 8) return new Uint8Array(raw.buffer, raw.byteOffset, raw.byteLength)
  const out = new Uint16Array(raw.byteLength / 2)
  for (let i = 0; i < out.length; i++) out[i] = raw[2 * i] | (raw[2 * i + 1] << 8)
  return out
}

function littleEndian(samples: Uint16Array): Buffer {
  const out = Buffer.alloc(samples.length * 2)
  for (let i = 0; i < samples.length; i++) out.writeUInt16LE(samples[i], 2 * i)
  return out
}

/** Rows of an image as one grey value per sample: NaN where there is no value. */
export interface GreyRows {
  readonly width: number
  readonly rows: number
  /** First row's index at this level. */
  readonly firstRow: number
  readonly values: Float32Array
}

/**
 * Reads rows [fromRow, toRow) of one pyramid level as grey values: RGB by luma (ITU-R BT.601
 * weights 0.299, 0.587, 0.114), LAS arrays back to the file's values (0 = no value).
 */
export async function readRows(
  db: Executor,
  image: Pick<
    Image,
    'id' | 'width' | 'channels' | 'sampleBits' | 'tileRows' | 'valueMin' | 'valueMax' | 'source'
  >,
  level: number,
  fromRow: number,
  toRow: number,
): Promise<GreyRows> {
  const { width, channels, tileRows } = image
  const rows = Math.max(0, toRow - fromRow)
  const values = new Float32Array(rows * width).fill(Number.NaN)
  if (rows === 0) return { width, rows, firstRow: fromRow, values }
  const tiles = await db
    .select()
    .from(imageTiles)
    .where(
      and(
        eq(imageTiles.imageId, image.id),
        eq(imageTiles.level, level),
        between(
          imageTiles.tile,
          Math.floor(fromRow / tileRows),
          Math.floor((toRow - 1) / tileRows),
        ),
      ),
    )
    .orderBy(asc(imageTiles.tile))
  const scaled = image.source === 'las' && image.valueMin !== null && image.valueMax !== null
  const lo = image.valueMin ?? 0
  const span = ((image.valueMax ?? 0) - lo) / 65534
  for (const t of tiles) {
    const samples = decodeTile(t.bytes, image.sampleBits)
    const start = t.tile * tileRows
    for (let r = Math.max(start, fromRow); r < Math.min(start + t.rows, toRow); r++) {
      const src = (r - start) * width * channels
      const dst = (r - fromRow) * width
      for (let c = 0; c < width; c++) {
        const i = src + c * channels
        let v: number
        if (channels === 3) v = 0.299 * samples[i] + 0.587 * samples[i + 1] + 0.114 * samples[i + 2]
        else if (scaled) v = samples[i] === 0 ? Number.NaN : lo + (samples[i] - 1) * span
        else v = samples[i]
        values[dst + c] = v
      }
    }
  }
  return { width, rows, firstRow: fromRow, values }
}

/** The image of this hole, or 404: an image id from another hole is not found. */
export async function findImage(db: Executor, holeId: number, imageId: number): Promise<Image> {
  const [row] = await db
    .select()
    .from(images)
    .where(and(eq(images.id, imageId), eq(images.holeId, holeId)))
  if (!row) throw notFound('Image')
  return row
}
