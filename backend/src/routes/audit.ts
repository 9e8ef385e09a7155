import { Router } from 'express'
import { and, desc, eq, gte, lt, lte } from 'drizzle-orm'
import { AuditQuery, auditEvents, users } from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'

/**
 * /api/projects/:projectId/audit: who changed what and when, newest first, with before/after;
 * filter by entity, action, user and time; page with `before` (an event id). Engineers and leads.
 */
export function auditRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.get('/', requireRole('engineer'), validate({ query: AuditQuery }), async (_req, res) => {
    const { query: q } = inputOf(res, { query: AuditQuery })
    const rows = await db
      .select({
        id: auditEvents.id,
        at: auditEvents.at,
        entity: auditEvents.entity,
        entityId: auditEvents.entityId,
        action: auditEvents.action,
        before: auditEvents.before,
        after: auditEvents.after,
        userId: auditEvents.userId,
        userName: users.name,
      })
      .from(auditEvents)
      .leftJoin(users, eq(users.id, auditEvents.userId))
      .where(
        and(
          eq(auditEvents.projectId, projectLocals(res).project.id),
          q.entity ? eq(auditEvents.entity, q.entity) : undefined,
          q.action ? eq(auditEvents.action, q.action) : undefined,
          q.userId ? eq(auditEvents.userId, q.userId) : undefined,
          q.from ? gte(auditEvents.at, new Date(q.from)) : undefined,
          q.to ? lte(auditEvents.at, new Date(q.to)) : undefined,
          q.before ? lt(auditEvents.id, q.before) : undefined,
        ),
      )
      .orderBy(desc(auditEvents.id))
      .limit(q.limit)
    res.json({
      data: rows,
      meta: { next: rows.length === q.limit ? rows[rows.length - 1].id : null },
    })
  })
  return router
}
