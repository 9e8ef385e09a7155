import { Router } from 'express'
import { and, asc, eq } from 'drizzle-orm'
import { DomainBody, domains, IdParam } from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { notFound } from '../http/errors'
import { inputOf, validate } from '../http/validate'
import { audit } from '../services/audit'

const DomainParams = IdParam('domainId')

/** /api/projects/:projectId/domains: structural/geotechnical domains gathering intervals. */
export function domainsRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.get('/', async (_req, res) => {
    const rows = await db
      .select()
      .from(domains)
      .where(eq(domains.projectId, projectLocals(res).project.id))
      .orderBy(asc(domains.name))
    res.json({ data: rows })
  })
  router.post('/', requireRole('engineer'), validate({ body: DomainBody }), async (req, res) => {
    const { body } = inputOf(res, { body: DomainBody })
    const projectId = projectLocals(res).project.id
    const row = await db.transaction(async (tx) => {
      const [d] = await tx
        .insert(domains)
        .values({ ...body, projectId })
        .returning()
      await audit(tx, {
        projectId,
        userId: req.user!.id,
        entity: 'domain',
        entityId: d.id,
        action: 'create',
        after: d,
      })
      return d
    })
    res.status(201).json({ data: row })
  })
  router.patch(
    '/:domainId',
    requireRole('engineer'),
    validate({ params: DomainParams, body: DomainBody.partial() }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: DomainParams, body: DomainBody.partial() })
      const projectId = projectLocals(res).project.id
      const row = await db.transaction(async (tx) => {
        const where = and(eq(domains.id, params.domainId), eq(domains.projectId, projectId))
        const [before] = await tx.select().from(domains).where(where)
        if (!before) throw notFound('Domain')
        const [after] = await tx.update(domains).set(body).where(where).returning()
        await audit(tx, {
          projectId,
          userId: req.user!.id,
          entity: 'domain',
          entityId: after.id,
          action: 'update',
          before,
          after,
        })
        return after
      })
      res.json({ data: row })
    },
  )
  return router
}
