import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { getCsrfToken, setCsrfToken } from '../../frontend/src/api/client'
import { useAuthStore } from '../../frontend/src/stores/auth'
import { mockFetch } from './fetch-mock'

const logger = { id: 5, email: 'logger@greyscar.test', name: 'Lee Logger', isAdmin: false }
const memberships = [
  { projectId: 1, projectCode: 'GSQ', projectName: 'Greyscar Quarry', role: 'logger' },
  { projectId: 2, projectCode: 'GSX', projectName: 'Greyscar spur', role: 'viewer' },
]

beforeEach(() => {
  setActivePinia(createPinia())
  setCsrfToken(null)
})

afterEach(() => {
  vi.unstubAllGlobals()
})

describe('useAuthStore', () => {
  it('signIn() keeps the user, memberships and the token issued with the new session', async () => {
    const calls = mockFetch((call) =>
      call.url === '/api/auth/csrf'
        ? { body: { data: { csrfToken: 'pre-login' } } }
        : { body: { data: { user: logger, memberships, csrfToken: 'post-login' } } },
    )
    const auth = useAuthStore()
    await auth.signIn('logger@greyscar.test', 'downdip-demo')
    expect(calls[1]).toMatchObject({
      url: '/api/auth/login',
      method: 'POST',
      body: { email: 'logger@greyscar.test', password: 'downdip-demo' },
    })
    expect(calls[1]!.headers['X-CSRF-Token']).toBe('pre-login')
    expect(auth.user).toEqual(logger)
    expect(auth.csrfToken).toBe('post-login')
    expect(getCsrfToken()).toBe('post-login')
  })

  it('roleIn() gives the membership role, null outside, lead everywhere for admins', async () => {
    mockFetch((call) =>
      call.url === '/api/auth/me'
        ? { body: { data: { user: logger, memberships } } }
        : { body: { data: { csrfToken: 't' } } },
    )
    const auth = useAuthStore()
    await expect(auth.loadMe()).resolves.toBe(true)
    expect(auth.roleIn(1)).toBe('logger')
    expect(auth.roleIn('2')).toBe('viewer')
    expect(auth.roleIn(3)).toBeNull()
    expect(auth.can(1, 'logger')).toBe(true)
    expect(auth.can(2, 'logger')).toBe(false)
    auth.user = { ...logger, isAdmin: true }
    expect(auth.roleIn(3)).toBe('lead')
  })

  it('loadMe() answers false and clears the session on 401', async () => {
    mockFetch(() => ({ status: 401, body: { error: { code: 'unauthenticated', message: 'x' } } }))
    const auth = useAuthStore()
    await expect(auth.ensureLoaded()).resolves.toBe(false)
    expect(auth.signedIn).toBe(false)
    expect(auth.loaded).toBe(true)
  })

  it('signOut() forgets the user and picks up a fresh token', async () => {
    setCsrfToken('old')
    const calls = mockFetch((call) =>
      call.url === '/api/auth/csrf'
        ? { body: { data: { csrfToken: 'after-logout' } } }
        : { body: { data: { ok: true } } },
    )
    const auth = useAuthStore()
    auth.user = logger
    await auth.signOut()
    expect(calls.map((c) => c.url)).toEqual(['/api/auth/logout', '/api/auth/csrf'])
    expect(auth.user).toBeNull()
    expect(getCsrfToken()).toBe('after-logout')
  })
})
