import { and, asc, eq, sql } from 'drizzle-orm'
import { imageFiles, images, imageTiles, type Hole, type Image } from '../../../schema/index'
import type { Db, Executor } from '../db/client'
import { ApiError, notFound } from '../http/errors'
import { audit } from './audit'

/** An image as the API sends it (frontend/src/api/images.ts ImageMeta): no lease, no hash. */
export type ImageMeta = Omit<Image, 'attempt' | 'leaseUntil' | 'sha256' | 'notes'> & {
  notes: string[]
  pickCount: number
}

export function imageMeta(row: Image, pickCount: number): ImageMeta {
  const { attempt: _a, leaseUntil: _l, sha256: _s, notes, ...rest } = row
  return { ...rest, notes: Array.isArray(notes) ? (notes as string[]) : [], pickCount }
}

const pickCount = sql<number>`(select count(*)::int from image_picks p where p.image_id = ${images.id})`

/** The hole's images, shallowest first (then oldest first), each with its pick count. */
export async function listImages(db: Executor, holeId: number): Promise<ImageMeta[]> {
  const rows = await db
    .select({ image: images, pickCount })
    .from(images)
    .where(eq(images.holeId, holeId))
    .orderBy(asc(images.topDepth), asc(images.id))
  return rows.map((r) => imageMeta(r.image, r.pickCount))
}

/** One image of the hole, or 404 (an image of another hole is not found). */
export async function getImageMeta(db: Executor, holeId: number, imageId: number) {
  const [row] = await db
    .select({ image: images, pickCount })
    .from(images)
    .where(and(eq(images.id, imageId), eq(images.holeId, holeId)))
  if (!row) throw notFound('Image')
  return imageMeta(row.image, row.pickCount)
}

/**
 * Deletes an image, its file and its tiles in one transaction, audited with what it was. Picks
 * made on it stay as structures: image_picks.image_id becomes null (the foreign key's rule).
 */
export async function deleteImage(db: Db, actorId: number, hole: Hole, imageId: number) {
  await db.transaction(async (tx) => {
    const [row] = await tx
      .select({ image: images, pickCount })
      .from(images)
      .where(and(eq(images.id, imageId), eq(images.holeId, hole.id)))
      .for('update', { of: images })
    if (!row) throw notFound('Image')
    await tx.delete(images).where(eq(images.id, imageId))
    const { id, kind, source, name, fileName, sha256, topDepth, bottomDepth, status } = row.image
    await audit(tx, {
      projectId: hole.projectId,
      userId: actorId,
      entity: 'image',
      entityId: id,
      action: 'delete',
      before: {
        holeId: hole.id,
        kind,
        source,
        name,
        fileName,
        sha256,
        topDepth,
        bottomDepth,
        status,
        pickCount: row.pickCount,
      },
    })
  })
}

/** 409 unless the image is ready: its tiles are written in one go when it is. */
function assertReady(image: Pick<Image, 'status' | 'progress' | 'message'>) {
  if (image.status === 'processing')
    throw new ApiError(
      409,
      'image_processing',
      `This image is still being tiled (${image.progress} %): try again shortly.`,
    )
  if (image.status === 'failed')
    throw new ApiError(409, 'image_failed', `This image could not be read: ${image.message}`)
}

/**
 * One stored tile as it is (deflated samples, see encodeTile), in one query with its image. The
 * ETag names the image, level and tile and the file's hash, so a new upload never matches.
 */
export async function getTile(
  db: Executor,
  holeId: number,
  imageId: number,
  level: number,
  tile: number,
) {
  const [row] = await db
    .select({
      status: images.status,
      progress: images.progress,
      message: images.message,
      sha256: images.sha256,
      rows: imageTiles.rows,
      bytes: imageTiles.bytes,
    })
    .from(images)
    .leftJoin(
      imageTiles,
      and(
        eq(imageTiles.imageId, images.id),
        eq(imageTiles.level, level),
        eq(imageTiles.tile, tile),
      ),
    )
    .where(and(eq(images.id, imageId), eq(images.holeId, holeId)))
  if (!row) throw notFound('Image')
  assertReady(row)
  if (!row.bytes || row.rows === null) throw notFound(`Tile ${level}/${tile}`)
  const etag = `"${imageId}-${level}-${tile}-${row.sha256.slice(0, 16)}"`
  return { bytes: row.bytes, rows: row.rows, etag }
}

/** The uploaded file, chunk by chunk (one 4 MB chunk in memory at a time), with its name. */
export async function imageFile(db: Executor, holeId: number, imageId: number) {
  const [image] = await db
    .select({
      fileName: images.fileName,
      mediaType: images.mediaType,
      fileSize: images.fileSize,
      chunks: sql<number>`(select count(*)::int from image_files f where f.image_id = ${images.id})`,
    })
    .from(images)
    .where(and(eq(images.id, imageId), eq(images.holeId, holeId)))
  if (!image) throw notFound('Image')
  async function* chunks() {
    for (let seq = 0; seq < image.chunks; seq++) {
      const [chunk] = await db
        .select({ bytes: imageFiles.bytes })
        .from(imageFiles)
        .where(and(eq(imageFiles.imageId, imageId), eq(imageFiles.seq, seq)))
      if (chunk) yield chunk.bytes
    }
  }
  return { ...image, chunks: chunks() }
}
