import { Router } from 'express'
import { IdParam, RunInput, RunUpdateBody, RunsReplaceBody } from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { idempotencyOf } from '../http/idempotency-key'
import { holeOf } from './holes'
import {
  addRunOnce,
  checkRunSequence,
  deleteRun,
  listRuns,
  replaceRuns,
  updateRun,
} from '../services/runs'

const RunParams = IdParam('runId')

/** /api/projects/:projectId/holes/:holeId/runs: core runs with TCR, SCR, RQD and frequency. */
export function runsRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.get('/', async (req, res) => {
    const hole = await holeOf(db, req, res)
    const runs = await listRuns(db, hole.id)
    res.json({ data: runs, meta: { gaps: checkRunSequence(runs).gaps } })
  })
  router.put('/', requireRole('logger'), validate({ body: RunsReplaceBody }), async (req, res) => {
    const hole = await holeOf(db, req, res)
    const { body } = inputOf(res, { body: RunsReplaceBody })
    const { runs, gaps } = await replaceRuns(
      db,
      req.user!.id,
      projectLocals(res).project,
      hole,
      body.runs,
    )
    res.json({ data: runs, meta: { gaps } })
  })
  router.post('/', requireRole('logger'), validate({ body: RunInput }), async (req, res) => {
    const hole = await holeOf(db, req, res)
    const { body } = inputOf(res, { body: RunInput })
    const key = idempotencyOf(req, body)
    const answer = await addRunOnce(db, req.user!.id, projectLocals(res).project, hole, body, key)
    if (answer.replayed) res.set('Idempotent-Replayed', 'true')
    res.status(answer.status).json(answer.body)
  })
  router.patch(
    '/:runId',
    requireRole('logger'),
    validate({ params: RunParams, body: RunUpdateBody }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params, body } = inputOf(res, { params: RunParams, body: RunUpdateBody })
      res.json({
        data: await updateRun(
          db,
          req.user!.id,
          projectLocals(res).project,
          hole,
          params.runId,
          body,
        ),
      })
    },
  )
  router.delete(
    '/:runId',
    requireRole('logger'),
    validate({ params: RunParams }),
    async (req, res) => {
      const hole = await holeOf(db, req, res)
      const { params } = inputOf(res, { params: RunParams })
      await deleteRun(db, req.user!.id, projectLocals(res).project, hole, params.runId)
      res.status(204).end()
    },
  )
  return router
}
