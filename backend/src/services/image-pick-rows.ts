import { and, asc, eq } from 'drizzle-orm'
import {
  imagePicks,
  images,
  structures,
  type Image,
  type ImagePickRecord as ImagePickRow,
  type Structure,
} from '../../../schema/index'
import type { TracePoint } from '../../../orient/index'
import type { Executor, Tx } from '../db/client'
import { notFound } from '../http/errors'
import { findImage } from './image-rows'
import type { fitOnImage } from './image-pick-geometry'

/** A pick as the API sends it: the raw sinusoid and the structure it became. */
export type ImagePickAnswer = Omit<ImagePickRow, 'createdAt' | 'points'> & {
  points: TracePoint[]
  structure: Pick<
    Structure,
    | 'id'
    | 'depth'
    | 'type'
    | 'confidence'
    | 'comment'
    | 'dip'
    | 'dipDirection'
    | 'flags'
    | 'version'
  >
}

export function toAnswer(pick: ImagePickRow, s: Structure): ImagePickAnswer {
  const { createdAt: _created, points, ...raw } = pick
  const { id, depth, type, confidence, comment, dip, dipDirection, flags, version } = s
  return {
    ...raw,
    points: points as TracePoint[],
    structure: { id, depth, type, confidence, comment, dip, dipDirection, flags, version },
  }
}

/** The image share-locked for this write: not deleted under it, 404 from another hole. */
export async function lockImage(tx: Tx, holeId: number, imageId: number): Promise<Image> {
  const [row] = await tx
    .select()
    .from(images)
    .where(and(eq(images.id, imageId), eq(images.holeId, holeId)))
    .for('share')
  if (!row) throw notFound('Image')
  return row
}

export async function pickOf(db: Executor, holeId: number, imageId: number, structureId: number) {
  const [row] = await db
    .select({ pick: imagePicks, structure: structures })
    .from(imagePicks)
    .innerJoin(structures, eq(structures.id, imagePicks.structureId))
    .where(
      and(
        eq(imagePicks.structureId, structureId),
        eq(imagePicks.imageId, imageId),
        eq(structures.holeId, holeId),
      ),
    )
  if (!row) throw notFound('Pick')
  return row
}

/** The image's picks with their structures, shallowest first. */
export async function listImagePicks(
  db: Executor,
  holeId: number,
  imageId: number,
): Promise<ImagePickAnswer[]> {
  const image = await findImage(db, holeId, imageId)
  const rows = await db
    .select({ pick: imagePicks, structure: structures })
    .from(imagePicks)
    .innerJoin(structures, eq(structures.id, imagePicks.structureId))
    .where(eq(imagePicks.imageId, image.id))
    .orderBy(asc(structures.depth), asc(structures.id))
  return rows.map((r) => toAnswer(r.pick, r.structure))
}

/** The raw pick columns of a fit on this image. */
export function rawColumns(
  image: Image,
  points: readonly TracePoint[],
  fitted: ReturnType<typeof fitOnImage>,
) {
  return {
    points,
    centreDepth: fitted.raw.depth,
    heightMm: fitted.raw.heightMm,
    troughAzimuth: fitted.raw.troughAzimuth,
    diameterMm: image.diameterMm,
    azimuthReference: image.azimuthReference,
    northReference: image.northReference,
    rmsMm: fitted.rmsMm,
  }
}
