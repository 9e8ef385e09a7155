import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import request from 'supertest'
import { clientFor, countRows, createFixture, PASSWORD, type Fixture } from './fixture'

let fx: Fixture
beforeAll(async () => {
  fx = await createFixture({ LOGIN_ATTEMPTS_PER_WINDOW: '5' })
})
afterAll(() => fx.close())

async function anonymousWithToken() {
  const agent = request.agent(fx.app)
  const csrf = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
  return { agent, csrf }
}

describe('POST /api/auth/login', () => {
  it('POST /api/auth/login → 200 with user, memberships and a fresh CSRF token', async () => {
    const { agent, csrf } = await anonymousWithToken()
    const res = await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrf)
      .send({ email: 'Logger@Test.example', password: PASSWORD })
    expect(res.status).toBe(200)
    expect(res.body.data.user).toEqual({
      id: fx.userIds.logger,
      email: 'logger@test.example',
      name: 'logger',
      isAdmin: false,
    })
    expect(res.body.data.memberships).toEqual([
      { projectId: fx.projectId, projectCode: 'TST', projectName: 'Test project', role: 'logger' },
    ])
    expect(res.body.data.csrfToken).not.toBe(csrf)
    const cookie = String(res.headers['set-cookie'])
    expect(cookie).toMatch(/HttpOnly/)
    expect(cookie).toMatch(/SameSite=Lax/)
    expect((await agent.get('/api/auth/me')).status).toBe(200)
  })

  it('POST /api/auth/login → 401 for a wrong password, same answer for an unknown e-mail', async () => {
    const { agent, csrf } = await anonymousWithToken()
    const wrong = await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrf)
      .send({ email: 'viewer@test.example', password: 'nope-nope-nope' })
    const unknown = await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrf)
      .send({ email: 'nobody@test.example', password: 'nope-nope-nope' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body).toEqual(unknown.body)
  })

  it('POST /api/auth/login → 403 without the CSRF header', async () => {
    const res = await request(fx.app)
      .post('/api/auth/login')
      .send({ email: 'viewer@test.example', password: PASSWORD })
    expect(res.status).toBe(403)
    expect(res.body.error.code).toBe('csrf_token')
  })

  it('POST /api/auth/login → 400 naming the fields', async () => {
    const { agent, csrf } = await anonymousWithToken()
    const res = await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrf)
      .send({ email: 'not-an-email' })
    expect(res.status).toBe(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
      'body.email',
      'body.password',
    ])
  })
})

describe('CSRF and body parsing', () => {
  it('PATCH /api/projects/:projectId → 403 without X-CSRF-Token, and nothing changes', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const before = await countRows(fx.db, 'audit_events')
    const res = await lead.get(`/api/projects/${fx.projectId}`)
    const sent = await request(fx.app)
      .patch(`/api/projects/${fx.projectId}`)
      .send({ version: res.body.data.version, name: 'Hacked' })
    expect(sent.status).toBe(403)
    expect((await lead.get(`/api/projects/${fx.projectId}`)).body.data.name).toBe('Test project')
    expect(await countRows(fx.db, 'audit_events')).toBe(before)
  })

  it('POST /api/projects/:projectId/holes → 400 malformed_json for broken JSON', async () => {
    const logger = await clientFor(fx.app, 'logger')
    const res = await logger
      .post(`/api/projects/${fx.projectId}/holes`)
      .set('Content-Type', 'application/json')
      .send('{"name": "TST-02", ')
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('malformed_json')
  })

  it('POST /api/auth/logout → 200, then /me → 401', async () => {
    const viewer = await clientFor(fx.app, 'viewer')
    expect((await viewer.post('/api/auth/logout')).status).toBe(200)
    expect((await viewer.get('/api/auth/me')).status).toBe(401)
  })

  it('GET /api/nothing-here → 404 in the error shape', async () => {
    const res = await request(fx.app).get('/api/nothing-here')
    expect(res.status).toBe(404)
    expect(res.body.error).toMatchObject({ code: 'not_found' })
  })

  it('GET /api/health → ok and database up', async () => {
    const res = await request(fx.app).get('/api/health')
    expect(res.body).toEqual({ data: { ok: true, database: true } })
  })
})

describe('disabled users', () => {
  it('PATCH /api/users/:userId disabled → the user loses the session and cannot sign in', async () => {
    const admin = await clientFor(fx.app, 'admin')
    const engineer = await clientFor(fx.app, 'engineer')
    const list = await admin.get('/api/users')
    const row = list.body.data.find((u: { id: number }) => u.id === fx.userIds.engineer)
    expect(
      (await admin.patch(`/api/users/${row.id}`, { version: row.version, disabled: true })).status,
    ).toBe(200)
    expect((await engineer.get('/api/auth/me')).status).toBe(401)
    await expect(clientFor(fx.app, 'engineer')).rejects.toThrow(/401/)
  })
})

// Last: it spends this app's sign-in allowance.
describe('sign-in throttling', () => {
  it('POST /api/auth/login → 429 after repeated failures', async () => {
    const { agent, csrf } = await anonymousWithToken()
    const statuses: number[] = []
    for (let i = 0; i < 7; i++) {
      const res = await agent
        .post('/api/auth/login')
        .set('X-CSRF-Token', csrf)
        .send({ email: 'lead@test.example', password: `wrong-${i}` })
      statuses.push(res.status)
    }
    // 5 failures allowed per window in this fixture (earlier failures in this file count too)
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThanOrEqual(2)
    expect(statuses.at(-1)).toBe(429)
  })
})
