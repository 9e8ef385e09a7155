import type { RequestHandler } from 'express'
import { and, eq, isNull } from 'drizzle-orm'
import { z } from 'zod'
import {
  roleAtLeast,
  memberships,
  projects,
  type Project,
  type ProjectRole,
} from '../../../schema/index'
import type { Db } from '../db/client'
import { forbidden, notFound, unauthorized } from '../http/errors'

// The ladder itself lives in schema/vocabulary.ts (services read it there too).
export { roleAtLeast, roleRank } from '../../../schema/index'

export const requireSignedIn: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthorized()
  next()
}

export const requireAdmin: RequestHandler = (req, _res, next) => {
  if (!req.user) throw unauthorized()
  if (!req.user.isAdmin) throw forbidden('Only an administrator can do that.')
  next()
}

/** What project routes find on res.locals after `loadProject`. */
export interface ProjectLocals {
  project: Project
  role: ProjectRole
}

export function projectLocals(res: { locals: Record<string, unknown> }): ProjectLocals {
  return { project: res.locals.project as Project, role: res.locals.role as ProjectRole }
}

const ProjectIdParam = z.coerce.number().int().positive()

/**
 * Finds `:projectId` and the caller's role in it. Not a member (or no such project, or a deleted
 * one) → 404, so a project's existence never leaks. A global admin acts as lead in every project.
 */
export function loadProject(db: Db): RequestHandler {
  return async (req, res, next) => {
    if (!req.user) throw unauthorized()
    const id = ProjectIdParam.safeParse(req.params.projectId)
    if (!id.success) throw notFound('Project')
    const [row] = await db
      .select({ project: projects, role: memberships.role })
      .from(projects)
      .leftJoin(
        memberships,
        and(eq(memberships.projectId, projects.id), eq(memberships.userId, req.user.id)),
      )
      .where(and(eq(projects.id, id.data), isNull(projects.deletedAt)))
    const role: ProjectRole | null = req.user.isAdmin ? 'lead' : (row?.role ?? null)
    if (!row || !role) throw notFound('Project')
    res.locals.project = row.project
    res.locals.role = role
    next()
  }
}

/** 403 unless the caller's role in the loaded project is at least `min`. */
export function requireRole(min: ProjectRole): RequestHandler {
  return (_req, res, next) => {
    const { role } = projectLocals(res)
    if (!roleAtLeast(role, min))
      throw forbidden(`This needs the ${min} role or above in the project.`)
    next()
  }
}
