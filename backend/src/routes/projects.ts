import { Router } from 'express'
import {
  ErrorModelUpdateBody,
  IdParam,
  MemberAddBody,
  MemberUpdateBody,
  ProjectCreateBody,
  ProjectUpdateBody,
} from '../../../schema/index'
import type { Db } from '../db/client'
import { projectLocals, requireAdmin, requireRole } from '../auth/guards'
import { inputOf, validate } from '../http/validate'
import { holesRouter } from './holes'
import { domainsRouter } from './domains'
import { packsRouter } from './packs'
import { commentsRouter } from './comments'
import { auditRouter } from './audit'
import type { ProjectDeps } from './deps'
import { createInvitation } from '../services/invitations'
import { errorModelAnswer, updateErrorModel } from '../services/error-model'
import {
  deleteProject,
  listDeletedProjects,
  purgeProject,
  restoreProject,
} from '../services/project-bin'
import {
  changeMember,
  collarConvergence,
  createProject,
  listMembers,
  listProjectsFor,
  updateProject,
} from '../services/projects'

/** /api/projects: list and create (admin). */
export function projectsRouter(db: Db): Router {
  const router = Router()
  router.get('/', async (req, res) => {
    res.json({ data: await listProjectsFor(db, req.user!) })
  })
  router.post('/', requireAdmin, validate({ body: ProjectCreateBody }), async (req, res) => {
    const { body } = inputOf(res, { body: ProjectCreateBody })
    res
      .status(201)
      .json({ data: { ...(await createProject(db, req.user!.id, body)), role: 'lead' } })
  })
  // Deleted projects (the bin): their leads and administrators restore them for 30 days;
  // administrators purge them. Someone else asking about one learns nothing (404).
  router.get('/bin', async (req, res) => {
    res.json({ data: await listDeletedProjects(db, req.user!) })
  })
  router.post('/bin/:projectId/restore', validate({ params: BinParams }), async (req, res) => {
    const { params } = inputOf(res, { params: BinParams })
    res.json({ data: await restoreProject(db, req.user!, params.projectId) })
  })
  router.delete(
    '/bin/:projectId',
    requireAdmin,
    validate({ params: BinParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: BinParams })
      await purgeProject(db, req.user!, params.projectId)
      res.status(204).end()
    },
  )
  return router
}

const BinParams = IdParam('projectId')

const MemberParams = IdParam('userId')

/** /api/projects/:projectId (after loadProject): settings, members, and the holes below. */
export function projectRouter(deps: ProjectDeps): Router {
  const { db, mail } = deps
  const router = Router({ mergeParams: true })
  router.use('/holes', holesRouter(deps))
  router.use('/domains', domainsRouter(db))
  router.use('/packs', packsRouter(deps))
  router.use('/comments', commentsRouter(deps))
  router.use('/audit', auditRouter(db))
  // The convergence at each collar travels with the project: settings and survey panels show it.
  router.get('/', async (_req, res) => {
    const { project, role } = projectLocals(res)
    res.json({
      data: { ...project, role, collarConvergence: await collarConvergence(db, project) },
    })
  })
  router.patch(
    '/',
    requireRole('lead'),
    validate({ body: ProjectUpdateBody }),
    async (req, res) => {
      const { project, role } = projectLocals(res)
      const { body } = inputOf(res, { body: ProjectUpdateBody })
      const after = await updateProject(db, mail, req.user!.id, project, body)
      res.json({ data: { ...after, role, collarConvergence: await collarConvergence(db, after) } })
    },
  )
  router.get('/error-model', (_req, res) => {
    res.json({ data: errorModelAnswer(projectLocals(res).project) })
  })
  router.put(
    '/error-model',
    requireRole('lead'),
    validate({ body: ErrorModelUpdateBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: ErrorModelUpdateBody })
      const { project } = projectLocals(res)
      res.json({ data: await updateErrorModel(db, mail, req.user!.id, project, body) })
    },
  )
  router.delete('/', requireAdmin, async (req, res) => {
    await deleteProject(db, req.user!.id, projectLocals(res).project)
    res.status(204).end()
  })
  router.get('/members', async (_req, res) => {
    res.json({ data: await listMembers(db, projectLocals(res).project.id) })
  })
  // Members join by invitation only: the answer is the same whether or not the address already
  // has an account, so a lead learns nothing about other people's accounts (OWASP ASVS 4.0 V2.1).
  router.post(
    '/members',
    requireRole('lead'),
    validate({ body: MemberAddBody }),
    async (req, res) => {
      const { body } = inputOf(res, { body: MemberAddBody })
      const projectId = projectLocals(res).project.id
      const invitation = await createInvitation(db, mail, req.user!, { ...body, projectId })
      const { email, role, expiresAt, mailed } = invitation
      res.status(202).json({ data: { email, role, expiresAt, mailed } })
    },
  )
  router.patch(
    '/members/:userId',
    requireRole('lead'),
    validate({ params: MemberParams, body: MemberUpdateBody }),
    async (req, res) => {
      const { params, body } = inputOf(res, { params: MemberParams, body: MemberUpdateBody })
      const row = await changeMember(
        db,
        req.user!.id,
        projectLocals(res).project.id,
        params.userId,
        body.role,
      )
      res.json({ data: row })
    },
  )
  router.delete(
    '/members/:userId',
    requireRole('lead'),
    validate({ params: MemberParams }),
    async (req, res) => {
      const { params } = inputOf(res, { params: MemberParams })
      await changeMember(db, req.user!.id, projectLocals(res).project.id, params.userId, null)
      res.status(204).end()
    },
  )
  return router
}
