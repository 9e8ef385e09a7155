import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { ApiError, api, onUnauthorized, setCsrfToken } from '../../frontend/src/api/client'
import { listHoles, replaceSurvey } from '../../frontend/src/api/holes'
import { mockFetch } from './fetch-mock'

beforeEach(() => {
  setCsrfToken(null)
  onUnauthorized(null)
})

afterEach(() => {
  vi.unstubAllGlobals()
})

describe('api client', () => {
  it('GET unwraps { data } and sends same-origin credentials without a CSRF header', async () => {
    const calls = mockFetch(() => ({ body: { data: [{ id: 4, name: 'GSQ-BH01' }], meta: {} } }))
    await expect(listHoles(2)).resolves.toEqual([{ id: 4, name: 'GSQ-BH01' }])
    expect(calls).toHaveLength(1)
    expect(calls[0]).toMatchObject({ url: '/api/projects/2/holes', method: 'GET' })
    expect(calls[0]!.credentials).toBe('same-origin')
    expect(calls[0]!.headers['X-CSRF-Token']).toBeUndefined()
  })

  it('turns { error } into an ApiError with status, code and details', async () => {
    mockFetch(() => ({
      status: 400,
      body: {
        error: {
          code: 'validation',
          message: 'Invalid survey',
          details: [{ path: 'stations.1.depth', message: 'Duplicate depth' }],
        },
      },
    }))
    const failure = api.get('/projects/2/holes/4/survey').catch((err: unknown) => err)
    const err = await failure
    expect(err).toBeInstanceOf(ApiError)
    expect(err).toMatchObject({
      status: 400,
      code: 'validation',
      message: 'Invalid survey',
      details: [{ path: 'stations.1.depth', message: 'Duplicate depth' }],
    })
  })

  it('names a bodiless failure by its status', async () => {
    mockFetch(() => ({ status: 502 }))
    await expect(api.get('/health')).rejects.toMatchObject({ status: 502, code: 'http_502' })
  })

  it('sends X-CSRF-Token and a JSON body on mutating requests', async () => {
    setCsrfToken('tok-1')
    const calls = mockFetch(() => ({ body: { data: [] } }))
    const stations = [{ depth: 0, azimuth: 190, plunge: 60, azimuthReference: 'true' as const }]
    await replaceSurvey(2, 4, stations)
    await api.patch('/projects/2', { version: 3 })
    await api.delete('/projects/2/members/9')
    expect(calls.map((c) => [c.method, c.headers['X-CSRF-Token']])).toEqual([
      ['PUT', 'tok-1'],
      ['PATCH', 'tok-1'],
      ['DELETE', 'tok-1'],
    ])
    expect(calls[0]!.body).toEqual({ stations })
    expect(calls[0]!.headers['Content-Type']).toBe('application/json')
  })

  it('fetches a CSRF token first when it has none', async () => {
    const calls = mockFetch((call) =>
      call.url === '/api/auth/csrf'
        ? { body: { data: { csrfToken: 'fresh' } } }
        : { body: { data: { ok: true } } },
    )
    await expect(api.post('/auth/logout')).resolves.toEqual({ ok: true })
    expect(calls.map((c) => c.url)).toEqual(['/api/auth/csrf', '/api/auth/logout'])
    expect(calls[1]!.headers['X-CSRF-Token']).toBe('fresh')
  })

  it('renews a rejected CSRF token once and retries', async () => {
    setCsrfToken('stale')
    const calls = mockFetch((call) => {
      if (call.url === '/api/auth/csrf') return { body: { data: { csrfToken: 'renewed' } } }
      return call.headers['X-CSRF-Token'] === 'renewed'
        ? { body: { data: { id: 1 } } }
        : { status: 403, body: { error: { code: 'csrf_invalid', message: 'Bad token' } } }
    })
    await expect(api.post('/projects', {})).resolves.toEqual({ id: 1 })
    expect(calls.map((c) => c.url)).toEqual(['/api/projects', '/api/auth/csrf', '/api/projects'])
  })

  it('reports 401 once for parallel requests, and not when the caller expects it', async () => {
    const handler = vi.fn()
    onUnauthorized(handler)
    mockFetch(() => ({ status: 401, body: { error: { code: 'unauthenticated', message: 'x' } } }))
    await expect(api.get('/auth/me', { expect401: true })).rejects.toMatchObject({ status: 401 })
    expect(handler).not.toHaveBeenCalled()
    const results = await Promise.allSettled([api.get('/projects'), api.get('/users')])
    expect(results.map((r) => r.status)).toEqual(['rejected', 'rejected'])
    expect(handler).toHaveBeenCalledTimes(1)
  })

  it('reports a network failure as ApiError code "network"', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch')
      }),
    )
    await expect(api.get('/health')).rejects.toMatchObject({ status: 0, code: 'network' })
  })
})
