import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { eq } from 'drizzle-orm'
import { issueToken } from '../../backend/src/services/tokens'
import { cleanFileName } from '../../backend/src/http/upload'
import { authTokens } from '../../schema/index'
import { clientFor, createFixture, PASSWORD, type Fixture } from './fixture'

// OWASP ASVS 4.0.3 level 2: V3.3 session timeouts, V8.2.1 no caching of sensitive answers,
// V2.2.1 throttling, V2.5 credential recovery; OWASP input-validation guidance for the rest.
let fx: Fixture
beforeAll(async () => {
  fx = await createFixture({
    SESSION_IDLE_MINUTES: String(3 / 60), // 3 s (cookie dates have whole seconds)
    SESSION_MAX_HOURS: String(5 / 3600), // 5 s
    LOGIN_ATTEMPTS_PER_WINDOW: '3',
  })
})
afterAll(() => fx.close())
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms))

describe('sessions', () => {
  it('GET /api/auth/me → 401 after the idle timeout; activity within it keeps the session', async () => {
    const c = await clientFor(fx.app, 'viewer')
    await sleep(1400)
    expect((await c.get('/api/auth/me')).status).toBe(200)
    await sleep(1400)
    expect((await c.get('/api/auth/me')).status).toBe(200)
    await sleep(4200)
    expect((await c.get('/api/auth/me')).status).toBe(401)
  })

  it('GET /api/auth/me → 401 session_expired after the absolute lifetime, however active', async () => {
    const c = await clientFor(fx.app, 'logger')
    const answers: string[] = []
    for (let i = 0; i < 7; i++) {
      await sleep(900)
      const res = await c.get('/api/auth/me')
      answers.push(res.status === 200 ? '200' : `${res.status} ${res.body.error.code}`)
    }
    // 0.9 s apart, so never idle; signed in about 5 s before the sixth call
    expect(answers.slice(0, 4)).toEqual(['200', '200', '200', '200'])
    expect(answers.find((a) => a !== '200')).toBe('401 session_expired')
    expect(answers.at(-1)).toBe('401 unauthenticated')
  })

  it('every /api answer says Cache-Control: no-store', async () => {
    const c = await clientFor(fx.app, 'viewer')
    for (const url of ['/api/auth/me', `/api/projects/${fx.projectId}`, '/api/health', '/api/nope'])
      expect((await c.get(url)).headers['cache-control']).toBe('no-store')
  })
})

describe('input that the database cannot hold', () => {
  it('GET …/audit?entity=structure%00 → 400 naming query.entity (not 500)', async () => {
    const c = await clientFor(fx.app, 'engineer')
    const res = await c.get(`/api/projects/${fx.projectId}/audit?entity=structure%00`)
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([
      { path: 'query.entity', message: 'contains a NUL character' },
    ])
  })

  it('PATCH a hole with a NUL in its name → 400 naming body.name', async () => {
    const c = await clientFor(fx.app, 'logger')
    const res = await c.patch(`/api/projects/${fx.projectId}/holes/${fx.holeId}`, {
      name: 'TST\u000001',
      version: 1,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toContainEqual({
      path: 'body.name',
      message: 'contains a NUL character',
    })
  })

  it('cleanFileName() strips bidirectional overrides (U+202E and friends)', () => {
    expect(cleanFileName('report\u202Efdp.exe')).toBe('reportfdp.exe')
    expect(cleanFileName('a\u2066b\u2069c\u200F.csv')).toBe('abc.csv')
    expect(cleanFileName('C:\\x\\log\u202D.las')).toBe('log.las')
  })
})

describe('sign-in throttling: per account and per address', () => {
  const attempt = (email: string, password: string, forwardedFor?: string) => {
    const agent = request.agent(fx.app)
    return agent.get('/api/auth/csrf').then((r) => {
      const t = agent.post('/api/auth/login').set('X-CSRF-Token', r.body.data.csrfToken as string)
      if (forwardedFor) t.set('X-Forwarded-For', forwardedFor)
      return t.send({ email, password })
    })
  }

  it('POST /api/auth/login: failures on one account do not lock out another user at the same address', async () => {
    for (let i = 0; i < 4; i++) await attempt('lead@test.example', `wrong-${i}`)
    expect((await attempt('lead@test.example', PASSWORD)).status).toBe(429)
    expect((await attempt('engineer@test.example', PASSWORD)).status).toBe(200)
  })

  it('POST /api/auth/login: a forged X-Forwarded-For gives no fresh guesses at the same account (no proxy configured)', async () => {
    const statuses: number[] = []
    for (let i = 0; i < 5; i++)
      statuses.push((await attempt('viewer@test.example', `wrong-${i}`, `203.0.113.${i}`)).status)
    expect(statuses).toEqual([401, 401, 401, 429, 429])
  })
})

describe('password reset', () => {
  it('POST /api/auth/reset uses up every other outstanding reset token of the account', async () => {
    const userId = fx.userIds.engineer
    const issue = () =>
      issueToken(fx.db, {
        purpose: 'reset',
        email: 'engineer@test.example',
        userId,
        ttlMs: 60 * 60_000,
      })
    const first = await issue()
    const second = await issue()
    const anon = await clientFor(fx.app, 'anonymous')
    const done = await anon.post('/api/auth/reset', {
      token: first.token,
      password: 'a-new-password-2',
    })
    expect(done.status).toBe(200)
    const [other] = await fx.db.select().from(authTokens).where(eq(authTokens.id, second.row.id))
    expect(other.usedAt).not.toBeNull()
    const again = await anon.post('/api/auth/reset', {
      token: second.token,
      password: 'another-password-3',
    })
    expect(again.status).toBeGreaterThanOrEqual(400)
    expect(again.status).toBeLessThan(500)
  })
})

describe('TRUST_PROXY', () => {
  it('loadEnv() trusts only the proxies named; "1" means loopback; nonsense is refused', async () => {
    const { loadEnv } = await import('../../backend/src/env')
    expect(loadEnv({ TRUST_PROXY: '10.0.0.5, 10.1.0.0/16' }).TRUST_PROXY).toEqual([
      '10.0.0.5',
      '10.1.0.0/16',
    ])
    expect(loadEnv({ TRUST_PROXY: '1' }).TRUST_PROXY).toEqual(['loopback'])
    expect(loadEnv({}).TRUST_PROXY).toBe(false)
    expect(() => loadEnv({ TRUST_PROXY: 'everyone' })).toThrow(/TRUST_PROXY/)
  })
})
