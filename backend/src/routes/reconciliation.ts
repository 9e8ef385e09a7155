import { Router } from 'express'
import { IdParam, ReconciliationApplyBody, ReconciliationQuery } from '../../../schema/index'
import { projectLocals, requireRole } from '../auth/guards'
import { holeLocals } from '../auth/load-hole'
import { inputOf, validate } from '../http/validate'
import type { ProjectDeps } from './deps'
import { reconciliationOf } from '../services/reconciliation'
import { applyReconciliation, undoAdjustment } from '../services/reconciliation-apply'

const AdjustmentParams = IdParam('adjustmentId')

/**
 * /api/projects/:projectId/holes/:holeId/reconciliation: core-to-image matches and estimates (any
 * member), accepting a depth shift or run rotations and undoing one (engineer and lead).
 */
export function reconciliationRouter({ db, mail }: Pick<ProjectDeps, 'db' | 'mail'>): Router {
  const router = Router({ mergeParams: true })
  router.get('/', validate({ query: ReconciliationQuery }), async (_req, res) => {
    const { query } = inputOf(res, { query: ReconciliationQuery })
    const { project } = projectLocals(res)
    res.json({ data: await reconciliationOf(db, project, holeLocals(res), query) })
  })
  router.post(
    '/apply',
    requireRole('engineer'),
    validate({ body: ReconciliationApplyBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: ReconciliationApplyBody })
      const { project } = projectLocals(res)
      const answer = await applyReconciliation(
        db,
        mail,
        req.user!.id,
        project,
        holeLocals(res),
        body,
      )
      res.status(201).json({ data: answer })
    },
  )
  router.delete(
    '/adjustments/:adjustmentId',
    requireRole('engineer'),
    validate({ params: AdjustmentParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: AdjustmentParams })
      const { project } = projectLocals(res)
      const answer = await undoAdjustment(
        db,
        mail,
        req.user!.id,
        project,
        holeLocals(res),
        params.adjustmentId,
      )
      res.json({ data: answer })
    },
  )
  return router
}
