import { eq } from 'drizzle-orm'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { auditEvents, authTokens, capturedMails, users } from '../../schema/index'
import { clientFor, countRows, createFixture, PASSWORD, type Fixture } from './fixture'

let fx: Fixture
let fake: FakeSmtp
let closeFakeDb: () => Promise<void>
beforeAll(async () => {
  const { db, pool } = createDb(inject('databaseUrl'), 2)
  closeFakeDb = () => pool.end()
  fake = await startFakeSmtp({ port: 0, db })
  fx = await createFixture({ SMTP_URL: `smtp://127.0.0.1:${fake.port}` })
})
afterAll(async () => {
  await fake.stop()
  await closeFakeDb()
  await fx.close()
})

/** The reset mail is sent after the answer (same timing either way): wait for it to land. */
async function mailFor(to: string) {
  for (let i = 0; i < 50; i++) {
    const [mail] = await fx.db.select().from(capturedMails).where(eq(capturedMails.to, to))
    if (mail) return mail
    await new Promise((r) => setTimeout(r, 100))
  }
  throw new Error(`no mail for ${to}`)
}
const tokenIn = (text: string) => text.match(/token=([A-Za-z0-9_-]{43})/)?.[1] ?? ''

async function signIn(email: string, password: string) {
  const agent = request.agent(fx.app)
  const csrf = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
  const res = await agent
    .post('/api/auth/login')
    .set('X-CSRF-Token', csrf)
    .send({ email, password })
  return { agent, status: res.status }
}

describe('POST /api/auth/reset-request and /api/auth/reset', () => {
  let token = ''

  it('POST /api/auth/reset-request → the same 200 for an unknown e-mail, and no mail', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    const timed = async (email: string) => {
      const started = Date.now()
      const res = await anonymous.post('/api/auth/reset-request', { email })
      return { res, ms: Date.now() - started }
    }
    const { res: unknown, ms: unknownMs } = await timed('nobody@greyscar.test')
    const { res: known, ms: knownMs } = await timed('Engineer@Test.example')
    // Both answers wait for the same floor (250 ms), whether or not the account exists.
    expect(unknownMs).toBeGreaterThanOrEqual(245)
    expect(knownMs).toBeGreaterThanOrEqual(245)
    expect(unknown.status).toBe(200)
    expect(known.status).toBe(200)
    expect(unknown.body).toEqual(known.body)
    const mail = await mailFor('engineer@test.example')
    expect(mail.subject).toBe('Choose a new Downdip password')
    expect(mail.text).toContain('http://127.0.0.1:3000/reset-password?token=')
    token = tokenIn(mail.text)
    expect(await countRows(fx.db, 'captured_mails')).toBe(1)
    expect(await countRows(fx.db, 'auth_tokens')).toBe(1)
    const [row] = await fx.db.select().from(authTokens)
    expect(row).toMatchObject({ purpose: 'reset', userId: fx.userIds.engineer })
    const minutes = (row.expiresAt.getTime() - Date.now()) / 60_000
    expect(minutes).toBeGreaterThan(59)
    expect(minutes).toBeLessThanOrEqual(60)
  })

  it('POST /api/auth/reset → 200: new password works, old does not, other sessions end', async () => {
    const before = await signIn('engineer@test.example', PASSWORD)
    expect(before.status).toBe(200)
    expect((await before.agent.get('/api/auth/me')).status).toBe(200)
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.post('/api/auth/reset', { token, password: 'north-wall-2026' })
    expect(res.status).toBe(200)
    expect((await before.agent.get('/api/auth/me')).status).toBe(401)
    expect((await signIn('engineer@test.example', PASSWORD)).status).toBe(401)
    expect((await signIn('engineer@test.example', 'north-wall-2026')).status).toBe(200)
    // Other users keep their sessions.
    const lead = await clientFor(fx.app, 'lead')
    expect((await lead.get('/api/auth/me')).status).toBe(200)
    const [u] = await fx.db.select().from(users).where(eq(users.id, fx.userIds.engineer))
    expect(u.version).toBe(2)
    const events = await fx.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, 'password_reset'))
    expect(events).toHaveLength(1)
    expect(events[0].entityId).toBe(String(fx.userIds.engineer))
  })

  it('POST /api/auth/reset → 410 token_used the second time, password unchanged', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.post('/api/auth/reset', { token, password: 'third-password-1' })
    expect(res.status).toBe(410)
    expect(res.body.error.code).toBe('token_used')
    expect((await signIn('engineer@test.example', 'north-wall-2026')).status).toBe(200)
  })

  it('POST /api/auth/reset → 410 token_expired, 400 invalid_token, 400 naming the field', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    await anonymous.post('/api/auth/reset-request', { email: 'viewer@test.example' })
    const expiring = tokenIn((await mailFor('viewer@test.example')).text)
    await fx.db
      .update(authTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(authTokens.userId, fx.userIds.viewer))
    const expired = await anonymous.post('/api/auth/reset', {
      token: expiring,
      password: 'viewer-new-pass',
    })
    expect(expired.status).toBe(410)
    expect(expired.body.error.code).toBe('token_expired')
    expect((await signIn('viewer@test.example', PASSWORD)).status).toBe(200)
    const wrong = await anonymous.post('/api/auth/reset', {
      token: 'B'.repeat(43),
      password: 'viewer-new-pass',
    })
    expect(wrong.status).toBe(400)
    expect(wrong.body.error.code).toBe('invalid_token')
    const short = await anonymous.post('/api/auth/reset', { token: expiring, password: 'short' })
    expect(short.status).toBe(400)
    expect(short.body.error.details[0].path).toBe('body.password')
    const badEmail = await anonymous.post('/api/auth/reset-request', { email: 'nope' })
    expect(badEmail.status).toBe(400)
    expect(badEmail.body.error.details[0].path).toBe('body.email')
  })

  it('POST /api/auth/reset-request → no token and no mail for a disabled account', async () => {
    await fx.db.update(users).set({ disabled: true }).where(eq(users.id, fx.userIds.logger))
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.post('/api/auth/reset-request', { email: 'logger@test.example' })
    expect(res.status).toBe(200)
    await new Promise((r) => setTimeout(r, 300))
    const tokens = await fx.db
      .select()
      .from(authTokens)
      .where(eq(authTokens.email, 'logger@test.example'))
    expect(tokens).toHaveLength(0)
  })

  it('POST /api/auth/reset-request → 429 past the limit, like sign-in', async () => {
    const { db, pool } = createDb(inject('databaseUrl'), 2)
    const env = loadEnv({
      ...process.env,
      NODE_ENV: 'test',
      LOG_LEVEL: 'silent',
      LOGIN_ATTEMPTS_PER_WINDOW: '2',
    })
    const log = createLogger('silent')
    const mailEnv = { ...env, SMTP_URL: `smtp://127.0.0.1:${fake.port}` }
    const app = createApp({
      db,
      pool,
      env: mailEnv,
      logger: log,
      mail: createMailer(mailEnv, log),
    })
    const agent = request.agent(app)
    const csrf = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
    const statuses: number[] = []
    for (let i = 0; i < 3; i++) {
      const res = await agent
        .post('/api/auth/reset-request')
        .set('X-CSRF-Token', csrf)
        .send({ email: 'x@greyscar.test' })
      statuses.push(res.status)
    }
    expect(statuses).toEqual([200, 200, 429])
    await pool.end()
  })
})
