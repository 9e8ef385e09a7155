import { createHash } from 'node:crypto'
import { and, eq, ne } from 'drizzle-orm'
import { holes, images, type Hole, type Image } from '../../../schema/index'
import type { ImageUploadFieldsT } from '../../../schema/api-images'
import type { Db, Executor } from '../db/client'
import { ApiError } from '../http/errors'
import type { JobQueue } from '../jobs/queue'
import {
  arraySamples,
  decodeRaster,
  firstBytes,
  INLINE_SAMPLES,
  levelCount,
  MEDIA_TYPES,
  planLasArrays,
  planRaster,
  probeRaster,
  readLasImages,
  refuseFile,
  sniffFormat,
  TILE_ROWS,
  writeFileChunks,
  writePyramid,
  type DecodedImage,
  type HoleFacts,
  type ImageFormat,
  type ImagePlan,
} from '../imports/images/index'
import { audit } from './audit'
import { imageMeta, type ImageMeta } from './images'
import { newAttempt } from './leases'
import { holeDiameterMm } from './structure-context'

export interface ImageIngestDeps {
  db: Db
  /** Without a queue (single-process tests) every image is tiled within the request. */
  jobs?: JobQueue
}

export interface ImageUploadFile {
  fileName: string
  bytes: Buffer
}

/** A plan and how to get its level-0 samples (decoded only once nothing can refuse cheaper). */
interface Prepared {
  plan: ImagePlan
  decode: () => Promise<DecodedImage>
}

/**
 * Reads an upload into one image per raster or per LAS array, or refuses it — every check that
 * needs no pixel decoded (format by its bytes, size from the header, integrity, depths) comes
 * before anything is stored.
 */
export async function prepareImages(
  upload: ImageUploadFile,
  fields: ImageUploadFieldsT,
  hole: Hole,
): Promise<{ format: ImageFormat; prepared: Prepared[] }> {
  const { bytes } = upload
  const format = sniffFormat(bytes)
  if (format === 'bigtiff')
    throw refuseFile('unsupported_format', 'BigTIFF files are not read: save the image as TIFF.')
  if (!format)
    throw refuseFile(
      'unsupported_format',
      `The file is not a PNG, JPEG, TIFF or LAS file (it starts ${firstBytes(bytes)}).`,
    )
  const facts: HoleFacts = {
    finalDepth: hole.finalDepth,
    coreSize: hole.coreSize,
    nominalDiameterMm: holeDiameterMm(hole.coreSize),
  }
  if (format !== 'las') {
    const probe = await probeRaster(bytes, format)
    const plan = planRaster(probe, fields, facts, upload.fileName)
    return { format, prepared: [{ plan, decode: () => decodeRaster(bytes, probe) }] }
  }
  const file = readLasImages(bytes)
  const plans = planLasArrays(file, fields, facts)
  const prepared = plans.map((plan, i) => ({
    plan,
    decode: async () =>
      arraySamples(file.arrays[i], file.rows, {
        valueMin: plan.valueMin ?? 0,
        valueMax: plan.valueMax ?? 0,
      }),
  }))
  return { format, prepared }
}

/** 409 `duplicate_image` for the same bytes already in this hole (not failed), unless confirmed. */
async function assertNotDuplicate(
  db: Executor,
  holeId: number,
  sha256: string,
  confirmed: boolean,
) {
  if (confirmed) return
  const [dup] = await db
    .select({ imageId: images.id, fileName: images.fileName, createdAt: images.createdAt })
    .from(images)
    .where(and(eq(images.holeId, holeId), eq(images.sha256, sha256), ne(images.status, 'failed')))
    .limit(1)
  if (!dup) return
  throw new ApiError(
    409,
    'duplicate_image',
    `The same file (${dup.fileName}, uploaded ${dup.createdAt.toISOString()}) is already an image of this hole. Send confirmDuplicate=true to store it again.`,
    [{ path: 'body.confirmDuplicate', message: `same SHA-256 as image ${dup.imageId}` }],
    { duplicateOf: dup },
  )
}

const samplesOf = (p: ImagePlan) => p.width * p.height * p.channels

/**
 * POST H/images. Small uploads are decoded and stored — rows, file, every tile — in ONE
 * transaction (201). Larger ones (over INLINE_SAMPLES) with a queue are stored as `processing`
 * with their file and handed to the 'image-tiling' job (202); without a queue they are tiled here
 * like small ones. A repeat of a file already in the hole needs confirmDuplicate.
 */
export async function ingestImages(
  { db, jobs }: ImageIngestDeps,
  actorId: number,
  hole: Hole,
  upload: ImageUploadFile,
  fields: ImageUploadFieldsT,
): Promise<{ queued: boolean; images: ImageMeta[] }> {
  const { format, prepared } = await prepareImages(upload, fields, hole)
  const sha256 = createHash('sha256').update(upload.bytes).digest('hex')
  await assertNotDuplicate(db, hole.id, sha256, fields.confirmDuplicate)
  const queued =
    jobs !== undefined && prepared.reduce((n, p) => n + samplesOf(p.plan), 0) > INLINE_SAMPLES
  const decoded = queued ? [] : await Promise.all(prepared.map((p) => p.decode()))
  const file = { ...upload, sha256, mediaType: MEDIA_TYPES[format] }
  const rows = await db.transaction(async (tx) => {
    // one upload at a time per hole, so two copies of one file cannot both pass the check
    await tx.select({ id: holes.id }).from(holes).where(eq(holes.id, hole.id)).for('update')
    await assertNotDuplicate(tx, hole.id, sha256, fields.confirmDuplicate)
    const out: Image[] = []
    for (const [i, { plan }] of prepared.entries()) {
      const [row] = await tx
        .insert(images)
        .values({
          ...plan,
          holeId: hole.id,
          fileName: file.fileName,
          mediaType: file.mediaType,
          fileSize: file.bytes.length,
          sha256,
          tileRows: TILE_ROWS,
          // none stored until the job has tiled it
          levels: queued ? 0 : levelCount(plan.height, TILE_ROWS),
          status: queued ? 'processing' : 'ready',
          progress: queued ? 0 : 100,
          attempt: queued ? newAttempt() : null,
          createdBy: actorId,
        })
        .returning()
      await writeFileChunks(tx, row.id, file.bytes)
      if (!queued) await writePyramid(tx, row.id, decoded[i], TILE_ROWS)
      await audit(tx, {
        projectId: hole.projectId,
        userId: actorId,
        entity: 'image',
        entityId: row.id,
        action: 'create',
        after: {
          holeId: hole.id,
          kind: row.kind,
          source: row.source,
          name: row.name,
          fileName: row.fileName,
          sha256,
          topDepth: row.topDepth,
          bottomDepth: row.bottomDepth,
          width: row.width,
          height: row.height,
          duplicateConfirmed: fields.confirmDuplicate,
        },
      })
      out.push(row)
    }
    return out
  })
  if (queued) await queueTiling(db, jobs, rows)
  return { queued, images: rows.map((r) => imageMeta(r, 0)) }
}

/** Hands each stored image to the job; one that cannot be queued reads failed, never stuck. */
async function queueTiling(db: Db, jobs: JobQueue, rows: Image[]) {
  for (const row of rows) {
    try {
      await jobs.send('image-tiling', { imageId: row.id, attempt: row.attempt })
    } catch (err: unknown) {
      await db
        .update(images)
        .set({ status: 'failed', message: 'could not be queued for tiling; upload it again' })
        .where(and(eq(images.id, row.id), eq(images.status, 'processing')))
      throw err
    }
  }
}
