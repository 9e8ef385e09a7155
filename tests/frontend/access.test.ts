import { describe, expect, it } from 'vitest'
import { createMemoryHistory, createRouter } from 'vue-router'
import { decideAccess, safeRedirect, type AccessSubject } from '../../frontend/src/router/access'
import { routes } from '../../frontend/src/router/index'
import { roleAtLeast, effectiveRole } from '../../frontend/src/api/roles'
import type { ProjectRole } from '../../frontend/src/api/types'

const router = createRouter({ history: createMemoryHistory(), routes })

function subject(
  roles: Record<string, ProjectRole>,
  isAdmin = false,
  signedIn = true,
): AccessSubject {
  return { signedIn, isAdmin, roleIn: (id) => effectiveRole(isAdmin, roles[id] ?? null) }
}

const to = (path: string) => router.resolve(path)

describe('decideAccess()', () => {
  it('sends a signed-out visitor to sign-in with the target to return to', () => {
    expect(decideAccess(to('/projects/7'), subject({}, false, false))).toEqual({
      name: 'sign-in',
      query: { redirect: '/projects/7' },
    })
  })

  it('lets anyone open sign-in, and sends a signed-in user on to the redirect target', () => {
    expect(decideAccess(to('/sign-in'), subject({}, false, false))).toBe(true)
    expect(decideAccess(to('/sign-in?redirect=/projects/7'), subject({ 7: 'viewer' }))).toBe(
      '/projects/7',
    )
    expect(decideAccess(to('/sign-in'), subject({}))).toEqual({ name: 'projects' })
  })

  it('opens a project for any member and shows not-found to others at the same URL', () => {
    expect(decideAccess(to('/projects/7/holes/3'), subject({ 7: 'viewer' }))).toBe(true)
    expect(decideAccess(to('/projects/8'), subject({ 7: 'lead' }))).toEqual({
      name: 'not-found',
      params: { pathMatch: ['projects', '8'] },
      query: {},
      hash: '',
    })
  })

  it('keeps user administration to global admins', () => {
    expect(decideAccess(to('/admin/users'), subject({ 7: 'lead' }))).toMatchObject({
      name: 'not-found',
    })
    expect(decideAccess(to('/admin/users'), subject({}, true))).toBe(true)
    expect(decideAccess(to('/projects/99'), subject({}, true))).toBe(true)
  })
})

describe('safeRedirect()', () => {
  it('follows only same-app paths', () => {
    expect(safeRedirect({ redirect: '/projects/2' })).toBe('/projects/2')
    expect(safeRedirect({ redirect: '//elsewhere.example/x' })).toBeNull()
    expect(safeRedirect({ redirect: 'https://elsewhere.example' })).toBeNull()
    expect(safeRedirect({})).toBeNull()
  })
})

describe('roleAtLeast()', () => {
  it('orders viewer < logger < engineer < lead', () => {
    expect(roleAtLeast('logger', 'logger')).toBe(true)
    expect(roleAtLeast('viewer', 'logger')).toBe(false)
    expect(roleAtLeast('engineer', 'logger')).toBe(true)
    expect(roleAtLeast('engineer', 'lead')).toBe(false)
    expect(roleAtLeast(null, 'viewer')).toBe(false)
    expect(roleAtLeast(effectiveRole(true, null), 'lead')).toBe(true)
  })
})
