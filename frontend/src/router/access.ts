import type { LocationQuery, RouteLocationNormalized, RouteLocationRaw } from 'vue-router'
import type { ProjectRole } from '../api/types'

/** Project roles, or 'admin' for routes outside any project that only global admins may open. */
export type RouteRole = ProjectRole | 'admin'

/** The parts of a route location the decision reads (normalized or merely resolved). */
export type AccessTarget = Pick<
  RouteLocationNormalized,
  'path' | 'fullPath' | 'params' | 'query' | 'hash' | 'meta'
> & { name?: RouteLocationNormalized['name'] | null }

export interface AccessSubject {
  signedIn: boolean
  isAdmin: boolean
  roleIn(projectId: string): ProjectRole | null
}

/** Same page for "does not exist" and "not yours", so a URL never reveals that a project exists. */
export function notFoundLocation(to: AccessTarget): RouteLocationRaw {
  return {
    name: 'not-found',
    params: { pathMatch: to.path.slice(1).split('/') },
    query: to.query,
    hash: to.hash,
  }
}

/** Only same-app paths are followed after sign-in. */
export function safeRedirect(query: LocationQuery): string | null {
  const target = query.redirect
  return typeof target === 'string' && target.startsWith('/') && !target.startsWith('//')
    ? target
    : null
}

/** The router guard's decision: true to proceed, or where to go instead. */
export function decideAccess(to: AccessTarget, subject: AccessSubject): true | RouteLocationRaw {
  if (to.meta.public) {
    if (to.name === 'sign-in' && subject.signedIn) {
      return safeRedirect(to.query) ?? { name: 'projects' }
    }
    return true
  }
  if (!subject.signedIn) {
    return { name: 'sign-in', query: to.fullPath === '/' ? {} : { redirect: to.fullPath } }
  }
  const roles = to.meta.roles
  if (!roles || subject.isAdmin) return true
  const projectId = to.params.projectId
  const role = typeof projectId === 'string' ? subject.roleIn(projectId) : null
  return role && roles.includes(role) ? true : notFoundLocation(to)
}
