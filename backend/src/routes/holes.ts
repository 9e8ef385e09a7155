import { Router } from 'express'
import { HoleCreateBody, HoleUpdateBody, IdParam } from '../../../schema/index'
import { projectLocals, requireAdmin, requireRole } from '../auth/guards'
import { holeLocals, loadHole } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import type { ProjectDeps } from './deps'
import { logsRouter } from './logs'
import { runsRouter } from './runs'
import { importsRouter } from './imports'
import { imagePicksRouter } from './image-picks'
import { imagesRouter } from './images'
import { intervalsRouter } from './intervals'
import { structuresRouter } from './structures'
import { surveyRouter } from './survey'
import { reconciliationRouter } from './reconciliation'
import { createHole, listHoles, updateHole } from '../services/holes'
import { deleteHole, listDeletedHoles, purgeHole, restoreHole } from '../services/hole-bin'

const HoleParams = IdParam('holeId')

/** /api/projects/:projectId/holes, each hole (after loadHole) and everything below it. */
export function holesRouter(deps: ProjectDeps): Router {
  const { db } = deps
  const router = Router({ mergeParams: true })

  router.get('/', async (_req, res) => {
    res.json({ data: await listHoles(db, projectLocals(res).project.id) })
  })
  router.post('/', requireRole('logger'), validate({ body: HoleCreateBody }), async (req, res) => {
    const { body } = inputOf(res, { body: HoleCreateBody })
    res
      .status(201)
      .json({ data: await createHole(db, req.user!.id, projectLocals(res).project.id, body) })
  })
  // Deleted holes (the bin): leads see and restore them for 30 days, administrators purge them.
  // These address holes that loadHole does not find, so they come before it.
  router.get('/deleted', requireRole('lead'), async (_req, res) => {
    res.json({ data: await listDeletedHoles(db, projectLocals(res).project.id) })
  })
  router.post(
    '/:holeId/restore',
    requireRole('lead'),
    validate({ params: HoleParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: HoleParams })
      const projectId = projectLocals(res).project.id
      res.json({ data: await restoreHole(db, req.user!.id, projectId, params.holeId) })
    },
  )
  router.delete(
    '/:holeId/purge',
    requireAdmin,
    validate({ params: HoleParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: HoleParams })
      await purgeHole(db, req.user!.id, projectLocals(res).project.id, params.holeId)
      res.status(204).end()
    },
  )

  router.use('/:holeId', loadHole(db))
  router.use('/:holeId/logs', logsRouter(db, deps.uploadLimitMb))
  router.use('/:holeId/runs', runsRouter(deps))
  router.use('/:holeId/structures', structuresRouter(deps))
  router.use('/:holeId/imports', importsRouter(deps))
  router.use('/:holeId/intervals', intervalsRouter(deps))
  router.use('/:holeId/survey', surveyRouter(deps))
  router.use('/:holeId/images', imagesRouter(deps))
  router.use('/:holeId/images/:imageId', imagePicksRouter(deps))
  router.use('/:holeId/reconciliation', reconciliationRouter(deps))

  router.get('/:holeId', (_req, res) => {
    res.json({ data: holeLocals(res) })
  })
  router.patch(
    '/:holeId',
    requireRole('logger'),
    validate({ body: HoleUpdateBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: HoleUpdateBody })
      res.json({ data: await updateHole(db, req.user!.id, holeLocals(res), body) })
    },
  )
  router.delete('/:holeId', requireRole('lead'), async (req, res) => {
    await deleteHole(db, req.user!.id, holeLocals(res))
    res.status(204).end()
  })
  return router
}
