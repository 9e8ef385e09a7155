import { and, eq } from 'drizzle-orm'
import { images, imageTiles, type Image } from '../../../schema/index'
import type { Db } from '../db/client'
import { ApiError } from '../http/errors'
import {
  arraySamples,
  decodeRaster,
  probeRaster,
  readFileBytes,
  readLasImages,
  refuseFile,
  sniffFormat,
  tileCount,
  writePyramid,
  type DecodedImage,
} from '../imports/images/index'
import { holdLease, leaseEnd, leaseFree } from './leases'

/** Takes the image for the attempt it was queued with, under a fresh lease; only one caller wins. */
async function claim(db: Db, imageId: number, attempt: string): Promise<Image | undefined> {
  const [row] = await db
    .update(images)
    .set({ leaseUntil: leaseEnd(), progress: 0 })
    .where(
      and(
        eq(images.id, imageId),
        eq(images.attempt, attempt),
        eq(images.status, 'processing'),
        leaseFree(images),
      ),
    )
    .returning()
  return row
}

/** Level 0 again from the stored file, exactly as the upload planned it (or a refusal). */
async function decodeStored(image: Image, bytes: Buffer): Promise<DecodedImage> {
  let decoded: DecodedImage
  if (image.source === 'las') {
    const file = readLasImages(bytes)
    const i = file.arrays.findIndex((a) => a.stem === image.name)
    if (i < 0) throw refuseFile('invalid_file', `The stored file has no array ${image.name}.`)
    const range = { valueMin: image.valueMin ?? 0, valueMax: image.valueMax ?? 0 }
    decoded = arraySamples(file.arrays[i], file.rows, range)
  } else {
    const format = sniffFormat(bytes)
    if (format !== 'png' && format !== 'jpeg' && format !== 'tiff')
      throw refuseFile('unsupported_format', 'The stored file is no longer an image.')
    decoded = await decodeRaster(bytes, await probeRaster(bytes, format))
  }
  if (decoded.width !== image.width || decoded.rows !== image.height)
    throw refuseFile(
      'damaged_file',
      'The stored file does not decode to the size it was stored at.',
    )
  return decoded
}

/**
 * The 'image-tiling' job: decodes a stored image and writes every tile of its pyramid, setting it
 * ready, in ONE transaction that first deletes any tiles a dead attempt left (safe to run again).
 * Progress (percent on the row) is written beside it as tiles go in. A refusal found now (a
 * damaged body) marks the image failed with the reason and stores no tiles. Returns what became
 * of it; anything else (the database away) is thrown for the queue to retry.
 */
export async function tileImage(
  db: Db,
  imageId: number,
  attempt: string,
): Promise<'ready' | 'failed' | 'skipped'> {
  const image = await claim(db, imageId, attempt)
  if (!image) return 'skipped'
  const release = holdLease(db, images, imageId, attempt)
  const mine = and(eq(images.id, imageId), eq(images.attempt, attempt))
  let shown = 0
  const progress = async (percent: number) => {
    if (percent <= shown) return
    shown = percent
    await db.update(images).set({ progress: percent }).where(mine)
  }
  try {
    const decoded = await decodeStored(image, await readFileBytes(db, imageId))
    await progress(10)
    const total = tileCount(image.height, image.tileRows)
    await db.transaction(async (tx) => {
      await tx.delete(imageTiles).where(eq(imageTiles.imageId, imageId))
      const levels = await writePyramid(tx, imageId, decoded, image.tileRows, (n) =>
        progress(10 + Math.floor((89 * n) / total)),
      )
      // Only this attempt may finish: if its lease lapsed and the sweep took the row, roll back.
      const [done] = await tx
        .update(images)
        .set({
          status: 'ready',
          progress: 100,
          levels,
          message: '',
          attempt: null,
          leaseUntil: null,
        })
        .where(and(mine, eq(images.status, 'processing')))
        .returning({ id: images.id })
      if (!done) throw new ApiError(409, 'image_interrupted', 'taken over: nothing stored')
    })
    return 'ready'
  } catch (err: unknown) {
    if (err instanceof ApiError && err.code === 'image_interrupted') return 'skipped'
    if (err instanceof ApiError) {
      await db
        .update(images)
        .set({
          status: 'failed',
          message: err.message,
          progress: 0,
          attempt: null,
          leaseUntil: null,
        })
        .where(mine)
      return 'failed'
    }
    // deleted while it was tiled (its tiles' foreign key failed): nothing left to do
    const gone = await db
      .select({ id: images.id })
      .from(images)
      .where(mine)
      .then((rows) => rows.length === 0)
      .catch(() => false)
    if (gone) return 'skipped'
    // free the lease so the queue's retry can take the image at once
    await db
      .update(images)
      .set({ leaseUntil: null })
      .where(mine)
      .catch(() => {})
    throw err
  } finally {
    release()
  }
}
