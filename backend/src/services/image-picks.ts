import { and, eq } from 'drizzle-orm'
import {
  imagePicks,
  structures,
  type Hole,
  type ImagePickBodyT,
  type ImagePickUpdateBodyT,
  type Project,
} from '../../../schema/index'
import type { Db } from '../db/client'
import { staleVersion } from '../http/errors'
import type { Mailer } from '../mail/transport'
import { audit } from './audit'
import { writeAndNotice } from './freeze'
import { writeOnce, type Answer, type IdempotencyRequest } from './idempotency'
import { assertReady, convertSinusoid, fitOnImage, imageConversion } from './image-pick-geometry'
import { lockImage, pickOf, rawColumns, toAnswer, type ImagePickAnswer } from './image-pick-rows'
import { guardStructureWrite, recomputeStructures, type Actor } from './structures'

const at = (depth: number) => `${Number(depth.toFixed(3))} m`

/**
 * Picks a sinusoid on an image: in one transaction the structure (source image, trough referred
 * to true north) and its raw pick, the recompute of its run and the audit — under the rules of
 * every structure write (final depth, freeze, checked intervals) and at most once per key.
 */
export async function createImagePick(
  db: Db,
  mail: Mailer,
  actor: Actor,
  project: Project,
  hole: Hole,
  imageId: number,
  body: ImagePickBodyT,
  idempotency?: IdempotencyRequest,
): Promise<Answer<ImagePickAnswer>> {
  return writeAndNotice(db, mail, project.id, hole, (tx, demoted) =>
    writeOnce(tx, idempotency, 201, async () => {
      const image = await lockImage(tx, hole.id, imageId)
      assertReady(image)
      const fitted = fitOnImage(image, body.points)
      const depth = fitted.raw.depth
      const change = {
        depths: [depth],
        sent: depth,
        sentPath: 'body.points',
        what: `A pick at ${at(depth)}`,
        reason: `a structure was picked on image "${image.name}" at ${at(depth)}`,
      }
      const current = await guardStructureWrite(tx, actor, hole, change, demoted)
      const conv = await imageConversion(tx, project, current, image)
      const { inputs } = convertSinusoid(conv, fitted.raw, body.type)
      const [row] = await tx
        .insert(structures)
        .values({
          ...inputs,
          confidence: body.confidence ?? null,
          comment: body.comment ?? '',
          createdBy: actor.id,
          updatedBy: actor.id,
        })
        .returning({ id: structures.id })
      const [pick] = await tx
        .insert(imagePicks)
        .values({
          structureId: row.id,
          imageId: image.id,
          ...rawColumns(image, body.points, fitted),
          suggested: body.suggested ?? false,
        })
        .returning()
      await recomputeStructures(tx, project, current, [depth])
      const after = await pickOf(tx, hole.id, image.id, row.id)
      await audit(tx, {
        projectId: project.id,
        userId: actor.id,
        entity: 'structure',
        entityId: row.id,
        action: 'create',
        after: { ...after.structure, imagePick: pick },
      })
      return toAnswer(after.pick, after.structure)
    }),
  )
}

/**
 * Moves (new points: refit, new depth and pick columns), retypes or re-rates a pick; the version
 * is the structure's (409 stale on a miss), the freeze rules hold at the old and the new depth.
 */
export async function updateImagePick(
  db: Db,
  mail: Mailer,
  actor: Actor,
  project: Project,
  hole: Hole,
  imageId: number,
  structureId: number,
  body: ImagePickUpdateBodyT,
): Promise<ImagePickAnswer> {
  const { version, points, ...fields } = body
  return writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const image = await lockImage(tx, hole.id, imageId)
    const before = await pickOf(tx, hole.id, image.id, structureId)
    if (points) assertReady(image)
    const fitted = points ? fitOnImage(image, points) : undefined
    const depths = [before.structure.depth, fitted?.raw.depth ?? before.structure.depth]
    const moved = depths[1] !== depths[0] ? ` (moved to ${at(depths[1])})` : ''
    const change = {
      depths,
      sent: fitted ? depths[1] : undefined,
      sentPath: 'body.points',
      what: `Editing the pick at ${at(depths[0])}${moved}`,
      reason: `the pick at ${at(depths[0])} on image "${image.name}" was edited${moved}`,
    }
    const current = await guardStructureWrite(tx, actor, hole, change, demoted)
    const type = fields.type ?? before.structure.type
    const refit = fitted
      ? convertSinusoid(await imageConversion(tx, project, current, image), fitted.raw, type).inputs
      : {}
    const [updated] = await tx
      .update(structures)
      .set({
        ...refit,
        ...fields,
        updatedBy: actor.id,
        updatedAt: new Date(),
        version: version + 1,
      })
      .where(and(eq(structures.id, structureId), eq(structures.version, version)))
      .returning({ id: structures.id })
    if (!updated) throw staleVersion()
    if (fitted && points)
      await tx
        .update(imagePicks)
        .set(rawColumns(image, points, fitted))
        .where(eq(imagePicks.structureId, structureId))
    await recomputeStructures(tx, project, current, depths)
    const after = await pickOf(tx, hole.id, image.id, structureId)
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: structureId,
      action: 'update',
      before: { ...before.structure, imagePick: before.pick },
      after: { ...after.structure, imagePick: after.pick },
    })
    return toAnswer(after.pick, after.structure)
  })
}

/** Deletes a pick's structure (its raw pick goes with it), under the same rules. */
export async function deleteImagePick(
  db: Db,
  mail: Mailer,
  actor: Actor,
  project: Project,
  hole: Hole,
  imageId: number,
  structureId: number,
  version: number,
): Promise<void> {
  await writeAndNotice(db, mail, project.id, hole, async (tx, demoted) => {
    const image = await lockImage(tx, hole.id, imageId)
    const before = await pickOf(tx, hole.id, image.id, structureId)
    const depth = before.structure.depth
    const change = {
      depths: [depth],
      what: `Deleting the pick at ${at(depth)}`,
      reason: `the pick at ${at(depth)} on image "${image.name}" was deleted`,
    }
    const current = await guardStructureWrite(tx, actor, hole, change, demoted)
    const [gone] = await tx
      .delete(structures)
      .where(and(eq(structures.id, structureId), eq(structures.version, version)))
      .returning({ id: structures.id })
    if (!gone) throw staleVersion()
    await recomputeStructures(tx, project, current, [depth])
    await audit(tx, {
      projectId: project.id,
      userId: actor.id,
      entity: 'structure',
      entityId: structureId,
      action: 'delete',
      before: { ...before.structure, imagePick: before.pick },
    })
  })
}
