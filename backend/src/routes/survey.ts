import { Router } from 'express'
import { IdParam, StationInput, StationUpdateBody, SurveyReplaceBody } from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import type { ProjectDeps } from './deps'
import {
  addStation,
  deleteStation,
  listStations,
  replaceSurvey,
  updateStation,
} from '../services/survey'

const StationParams = IdParam('stationId')

/** /api/projects/:projectId/holes/:holeId/survey (after loadHole): the hole's survey stations. */
export function surveyRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  const logger = requireRole('logger')

  router.get('/', async (_req, res) => {
    res.json({ data: await listStations(db, holeLocals(res).id) })
  })
  router.put('/', logger, validate({ body: SurveyReplaceBody }), async (req, res) => {
    const { body } = inputOf(res, { body: SurveyReplaceBody })
    const { project } = projectLocals(res)
    res.json({
      data: await replaceSurvey(db, mail, req.user!.id, project, holeLocals(res), body.stations),
    })
  })
  router.post('/', logger, validate({ body: StationInput }), async (req, res) => {
    const { body } = inputOf(res, { body: StationInput })
    const { project } = projectLocals(res)
    res
      .status(201)
      .json({ data: await addStation(db, mail, req.user!.id, project, holeLocals(res), body) })
  })
  router.patch(
    '/:stationId',
    logger,
    validate({ params: StationParams, body: StationUpdateBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: StationParams, body: StationUpdateBody })
      const { project } = projectLocals(res)
      const hole = holeLocals(res)
      const row = await updateStation(db, mail, req.user!.id, project, hole, params.stationId, body)
      res.json({ data: row })
    },
  )
  router.delete('/:stationId', logger, validate({ params: StationParams }), async (req, res) => {
    const { params } = inputOf(res, { params: StationParams })
    const { project } = projectLocals(res)
    await deleteStation(db, mail, req.user!.id, project, holeLocals(res), params.stationId)
    res.status(204).end()
  })
  return router
}
