import { Router } from 'express'
import { DomainBody, IdParam } from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { createDomain, listDomains, updateDomain } from '../services/domains'

const DomainParams = IdParam('domainId')
const DomainPatch = DomainBody.partial()

/** /api/projects/:projectId/domains: structural/geotechnical domains gathering intervals. */
export function domainsRouter(db: Db): Router {
  const router = Router({ mergeParams: true })
  router.get('/', async (_req, res) => {
    res.json({ data: await listDomains(db, projectLocals(res).project.id) })
  })
  router.post('/', requireRole('engineer'), validate({ body: DomainBody }), async (req, res) => {
    const { body } = inputOf(res, { body: DomainBody })
    const projectId = projectLocals(res).project.id
    res.status(201).json({ data: await createDomain(db, req.user!.id, projectId, body) })
  })
  router.patch(
    '/:domainId',
    requireRole('engineer'),
    validate({ params: DomainParams, body: DomainPatch }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: DomainParams, body: DomainPatch })
      const projectId = projectLocals(res).project.id
      const row = await updateDomain(db, req.user!.id, projectId, params.domainId, body)
      res.json({ data: row })
    },
  )
  return router
}
