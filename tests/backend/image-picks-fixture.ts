import { images, imageTiles, type Image } from '../../schema/index'
import { encodeTile } from '../../backend/src/services/image-rows'
import type { Db } from '../../backend/src/db/client'

/** What a test image is: its geometry and, optionally, a grey value per (row, column) at level 0. */
export interface TestImage {
  holeId: number
  topDepth: number
  bottomDepth: number
  width: number
  height: number
  azimuthReference?: 'north' | 'highside'
  northReference?: 'magnetic' | 'true' | null
  diameterMm?: number
  leftAzimuth?: number
  status?: 'processing' | 'ready' | 'failed'
  tileRows?: number
  /** 8-bit grey sample of level-0 row r, column c (default: mid grey). */
  sample?: (row: number, col: number) => number
}

/**
 * Stores an image as the upload would leave it, without the upload route: the images row and a
 * pyramid per the feature's geometry — level L+1 row k the mean of level-L rows 2k and 2k+1 (a
 * lone last row copied), levels until one fits in a tile, tiles of tileRows rows (the last fewer).
 */
export async function insertImage(db: Db, t: TestImage): Promise<Image> {
  const tileRows = t.tileRows ?? 256
  const { width } = t
  let level = new Uint8Array(t.width * t.height)
  for (let r = 0; r < t.height; r++)
    for (let c = 0; c < width; c++) level[r * width + c] = t.sample?.(r, c) ?? 128
  const pyramid = [level]
  while (level.length / width > tileRows) {
    const rows = level.length / width
    const next = new Uint8Array(Math.ceil(rows / 2) * width)
    for (let k = 0; k < next.length / width; k++)
      for (let c = 0; c < width; c++) {
        const a = level[2 * k * width + c]
        const b = 2 * k + 1 < rows ? level[(2 * k + 1) * width + c] : a
        next[k * width + c] = Math.round((a + b) / 2)
      }
    pyramid.push(next)
    level = next
  }
  const [row] = await db
    .insert(images)
    .values({
      holeId: t.holeId,
      kind: 'amplitude',
      source: 'raster',
      name: 'GSQ-BH01 amplitude',
      fileName: 'gsq-bh01-amp.png',
      mediaType: 'image/png',
      fileSize: t.width * t.height,
      sha256: '0'.repeat(64),
      topDepth: t.topDepth,
      bottomDepth: t.bottomDepth,
      width,
      height: t.height,
      channels: 1,
      sampleBits: 8,
      leftAzimuth: t.leftAzimuth ?? 0,
      azimuthReference: t.azimuthReference ?? 'north',
      northReference:
        (t.azimuthReference ?? 'north') === 'north' ? (t.northReference ?? 'true') : null,
      diameterMm: t.diameterMm ?? 96,
      diameterSource: 'entered',
      tileRows,
      levels: pyramid.length,
      status: t.status ?? 'ready',
      progress: t.status === 'processing' ? 0 : 100,
    })
    .returning()
  for (const [l, samples] of pyramid.entries()) {
    const rows = samples.length / width
    for (let tile = 0; tile * tileRows < rows; tile++) {
      const from = tile * tileRows
      const to = Math.min(rows, from + tileRows)
      await db.insert(imageTiles).values({
        imageId: row.id,
        level: l,
        tile,
        rows: to - from,
        bytes: encodeTile(samples.subarray(from * width, to * width)),
      })
    }
  }
  return row
}

/** Points on depth(θ) = d₀ + (H/2)·cos(θ − trough) every `step` degrees (H in mm). */
export function tracePoints(d0: number, heightMm: number, trough: number, step = 45) {
  const out: { depth: number; azimuth: number }[] = []
  for (let az = 0; az < 360; az += step)
    out.push({
      depth: d0 + (heightMm / 2000) * Math.cos(((az - trough) * Math.PI) / 180),
      azimuth: az,
    })
  return out
}

/** Acute difference of two azimuths (degrees). */
export const azimuthGap = (a: number, b: number) => {
  const d = Math.abs(a - b) % 360
  return d > 180 ? 360 - d : d
}
