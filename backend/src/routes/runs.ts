import { Router } from 'express'
import { IdParam, RunInput, RunUpdateBody, RunsReplaceBody } from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import { idempotencyOf } from '../http/idempotency-key'
import type { ProjectDeps } from './deps'
import {
  addRun,
  checkRunSequence,
  deleteRun,
  listRuns,
  replaceRuns,
  updateRun,
} from '../services/runs'

const RunParams = IdParam('runId')

/** /api/projects/:projectId/holes/:holeId/runs: core runs with TCR, SCR, RQD and frequency. */
export function runsRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  router.get('/', async (_req, res) => {
    const runs = await listRuns(db, holeLocals(res).id)
    res.json({ data: runs, meta: { gaps: checkRunSequence(runs).gaps } })
  })
  router.put('/', requireRole('logger'), validate({ body: RunsReplaceBody }), async (req, res) => {
    const { body } = inputOf(res, { body: RunsReplaceBody })
    const { project } = projectLocals(res)
    const { runs, gaps } = await replaceRuns(
      db,
      mail,
      req.user!.id,
      project,
      holeLocals(res),
      body.runs,
    )
    res.json({ data: runs, meta: { gaps } })
  })
  router.post('/', requireRole('logger'), validate({ body: RunInput }), async (req, res) => {
    const { body } = inputOf(res, { body: RunInput })
    const key = idempotencyOf(req, body)
    const { project } = projectLocals(res)
    const answer = await addRun(db, mail, req.user!.id, project, holeLocals(res), body, key)
    if (answer.replayed) res.set('Idempotent-Replayed', 'true')
    res.status(answer.status).json(answer.body)
  })
  router.patch(
    '/:runId',
    requireRole('logger'),
    validate({ params: RunParams, body: RunUpdateBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: RunParams, body: RunUpdateBody })
      const { project } = projectLocals(res)
      res.json({
        data: await updateRun(db, mail, req.user!.id, project, holeLocals(res), params.runId, body),
      })
    },
  )
  router.delete(
    '/:runId',
    requireRole('logger'),
    validate({ params: RunParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: RunParams })
      const { project } = projectLocals(res)
      await deleteRun(db, mail, req.user!.id, project, holeLocals(res), params.runId)
      res.status(204).end()
    },
  )
  return router
}
