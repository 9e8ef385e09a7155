import { Router } from 'express'
import { z } from 'zod'
import {
  FitBody,
  IdParam,
  ImagePickBody,
  ImagePickUpdateBody,
  SuggestionsQuery,
} from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { idempotencyOf } from '../http/idempotency-key'
import { inputOf, validate } from '../http/validate'
import { findImage } from '../services/image-rows'
import { fitImagePoints } from '../services/image-pick-geometry'
import { listImagePicks } from '../services/image-pick-rows'
import { createImagePick, deleteImagePick, updateImagePick } from '../services/image-picks'
import { suggestSinusoids } from '../services/image-suggest'
import type { ProjectDeps } from './deps'

const ImageParams = IdParam('imageId')
const PickParams = ImageParams.extend(IdParam('structureId').shape)
const DeleteQuery = z.object({ version: z.coerce.number().int().positive() }).strict()

/** /api/projects/:projectId/holes/:holeId/images/:imageId: fitting, picks and suggestions. */
export function imagePicksRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  const actorOf = (req: { user?: Express.User }, res: { locals: Record<string, unknown> }) => ({
    id: req.user!.id,
    role: projectLocals(res).role,
  })

  router.post(
    '/fit',
    requireRole('logger'),
    validate({ params: ImageParams, body: FitBody }),
    async (_req, res) => {
      const { params, body } = inputOf(res, { params: ImageParams, body: FitBody })
      const hole = holeLocals(res)
      const image = await findImage(db, hole.id, params.imageId)
      res.json({
        data: await fitImagePoints(db, projectLocals(res).project, hole, image, body.points),
      })
    },
  )
  router.get('/picks', validate({ params: ImageParams }), async (_req, res) => {
    const { params } = inputOf(res, { params: ImageParams })
    const rows = await listImagePicks(db, holeLocals(res).id, params.imageId)
    res.json({ data: rows, meta: { count: rows.length } })
  })
  router.post(
    '/picks',
    requireRole('logger'),
    validate({ params: ImageParams, body: ImagePickBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: ImageParams, body: ImagePickBody })
      const answer = await createImagePick(
        db,
        mail,
        actorOf(req, res),
        projectLocals(res).project,
        holeLocals(res),
        params.imageId,
        body,
        idempotencyOf(req, body),
      )
      if (answer.replayed) res.set('Idempotent-Replayed', 'true')
      res.status(answer.status).json(answer.body)
    },
  )
  router.patch(
    '/picks/:structureId',
    requireRole('logger'),
    validate({ params: PickParams, body: ImagePickUpdateBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: PickParams, body: ImagePickUpdateBody })
      const row = await updateImagePick(
        db,
        mail,
        actorOf(req, res),
        projectLocals(res).project,
        holeLocals(res),
        params.imageId,
        params.structureId,
        body,
      )
      res.json({ data: row })
    },
  )
  router.delete(
    '/picks/:structureId',
    requireRole('logger'),
    validate({ params: PickParams, query: DeleteQuery }),
    async (req, res) => {
      const { params, query } = inputOf(res, { params: PickParams, query: DeleteQuery })
      await deleteImagePick(
        db,
        mail,
        actorOf(req, res),
        projectLocals(res).project,
        holeLocals(res),
        params.imageId,
        params.structureId,
        query.version,
      )
      res.status(204).end()
    },
  )
  router.get(
    '/suggestions',
    validate({ params: ImageParams, query: SuggestionsQuery }),
    async (_req, res) => {
      const { params, query } = inputOf(res, { params: ImageParams, query: SuggestionsQuery })
      const hole = holeLocals(res)
      const image = await findImage(db, hole.id, params.imageId)
      const rows = await suggestSinusoids(db, projectLocals(res).project, hole, image, query)
      res.json({ data: rows, meta: { count: rows.length } })
    },
  )
  return router
}
