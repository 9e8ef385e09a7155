import { Router } from 'express'
import { z } from 'zod'
import { IdParam, StructureInput, StructureUpdateBody } from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import { idempotencyOf } from '../http/idempotency-key'
import type { ProjectDeps } from './deps'
import {
  createStructure,
  deleteStructure,
  getStructure,
  listStructures,
  updateStructure,
} from '../services/structures'

const StructureParams = IdParam('structureId')
const DeleteQuery = z.object({ version: z.coerce.number().int().positive() })

/** /api/projects/:projectId/holes/:holeId/structures */
export function structuresRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  const actorOf = (req: { user?: Express.User }, res: { locals: Record<string, unknown> }) => ({
    id: req.user!.id,
    role: projectLocals(res).role,
  })

  router.get('/', async (_req, res) => {
    const hole = holeLocals(res)
    const rows = await listStructures(db, hole.id)
    res.json({ data: rows, meta: { count: rows.length, surveyRevision: hole.surveyRevision } })
  })
  router.post('/', requireRole('logger'), validate({ body: StructureInput }), async (req, res) => {
    const { body } = inputOf(res, { body: StructureInput })
    const key = idempotencyOf(req, body)
    const answer = await createStructure(
      db,
      mail,
      actorOf(req, res),
      projectLocals(res).project,
      holeLocals(res),
      body,
      key,
    )
    if (answer.replayed) res.set('Idempotent-Replayed', 'true')
    res.status(answer.status).json(answer.body)
  })
  router.get('/:structureId', validate({ params: StructureParams }), async (_req, res) => {
    const { params } = inputOf(res, { params: StructureParams })
    res.json({ data: await getStructure(db, holeLocals(res).id, params.structureId) })
  })
  router.patch(
    '/:structureId',
    requireRole('logger'),
    validate({ params: StructureParams, body: StructureUpdateBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: StructureParams, body: StructureUpdateBody })
      const row = await updateStructure(
        db,
        mail,
        actorOf(req, res),
        projectLocals(res).project,
        holeLocals(res),
        params.structureId,
        body,
      )
      res.json({ data: row })
    },
  )
  router.delete(
    '/:structureId',
    requireRole('logger'),
    validate({ params: StructureParams, query: DeleteQuery }),
    async (req, res) => {
      const { params, query } = inputOf(res, { params: StructureParams, query: DeleteQuery })
      await deleteStructure(
        db,
        mail,
        actorOf(req, res),
        projectLocals(res).project,
        holeLocals(res),
        params.structureId,
        query.version,
      )
      res.status(204).end()
    },
  )
  return router
}
