import { Router } from 'express'
import { AuditQuery } from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { listAudit } from '../services/audit'

/**
 * /api/projects/:projectId/audit: who changed what and when, newest first, with before/after;
 * filter by entity, action, user and time; page with `before` (an event id). Engineers and leads.
 */
export function auditRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.get('/', requireRole('engineer'), validate({ query: AuditQuery }), async (_req, res) => {
    const { query } = inputOf(res, { query: AuditQuery })
    const { rows, next } = await listAudit(db, projectLocals(res).project.id, query)
    res.json({ data: rows, meta: { next } })
  })
  return router
}
