import { Router, type Request, type Response } from 'express'
import {
  HoleCreateBody,
  HoleUpdateBody,
  IdParam,
  StationInput,
  StationUpdateBody,
  SurveyReplaceBody,
} from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireAdmin, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { notFound } from '../http/errors'
import { logsRouter } from './logs'
import { runsRouter } from './runs'
import { importsRouter, type ImportDeps } from './imports'
import { intervalsRouter } from './intervals'
import { structuresRouter } from './structures'
import { createHole, getHole, listHoles, updateHole } from '../services/holes'
import { deleteHole, listDeletedHoles, purgeHole, restoreHole } from '../services/hole-bin'
import {
  addStation,
  deleteStation,
  listStations,
  replaceSurvey,
  updateStation,
} from '../services/survey'

const HoleParams = IdParam('holeId')
const StationParams = HoleParams.extend({ stationId: IdParam('stationId').shape.stationId })

/** The hole named by :holeId in the loaded project, or 404. */
export async function holeOf(db: Db, req: Request, res: Response) {
  const id = HoleParams.safeParse(req.params)
  if (!id.success) throw notFound('Hole')
  return getHole(db, projectLocals(res).project.id, id.data.holeId)
}

/** /api/projects/:projectId/holes and each hole's survey. */
export function holesRouter(deps: ImportDeps): Router {
  const { db } = deps
  const router = Router({ mergeParams: true })
  router.use('/:holeId/logs', logsRouter(db, deps.uploadLimitMb))
  router.use('/:holeId/runs', runsRouter(db))
  router.use('/:holeId/structures', structuresRouter(db))
  router.use('/:holeId/imports', importsRouter(deps))
  router.use('/:holeId/intervals', intervalsRouter(db))

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
  router.get('/:holeId', async (req, res) => {
    res.json({ data: await holeOf(db, req, res) })
  })
  router.patch(
    '/:holeId',
    requireRole('logger'),
    validate({ body: HoleUpdateBody }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { body } = inputOf(res, { body: HoleUpdateBody })
      res.json({ data: await updateHole(db, req.user!.id, hole, body) })
    },
  )
  router.delete('/:holeId', requireRole('lead'), async (req, res) => {
    await deleteHole(db, req.user!.id, await holeOf(db, req, res))
    res.status(204).end()
  })

  router.get('/:holeId/survey', async (req, res) => {
    const hole = await holeOf(db, req, res)
    res.json({ data: await listStations(db, hole.id) })
  })
  router.put(
    '/:holeId/survey',
    requireRole('logger'),
    validate({ body: SurveyReplaceBody }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { body } = inputOf(res, { body: SurveyReplaceBody })
      res.json({
        data: await replaceSurvey(
          db,
          req.user!.id,
          projectLocals(res).project,
          hole,
          body.stations,
        ),
      })
    },
  )
  router.post(
    '/:holeId/survey',
    requireRole('logger'),
    validate({ body: StationInput }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { body } = inputOf(res, { body: StationInput })
      res
        .status(201)
        .json({ data: await addStation(db, req.user!.id, projectLocals(res).project, hole, body) })
    },
  )
  router.patch(
    '/:holeId/survey/:stationId',
    requireRole('logger'),
    validate({ params: StationParams, body: StationUpdateBody }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params, body } = inputOf(res, { params: StationParams, body: StationUpdateBody })
      const row = await updateStation(
        db,
        req.user!.id,
        projectLocals(res).project,
        hole,
        params.stationId,
        body,
      )
      res.json({ data: row })
    },
  )
  router.delete(
    '/:holeId/survey/:stationId',
    requireRole('logger'),
    validate({ params: StationParams }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params } = inputOf(res, { params: StationParams })
      await deleteStation(db, req.user!.id, projectLocals(res).project, hole, params.stationId)
      res.status(204).end()
    },
  )
  return router
}
