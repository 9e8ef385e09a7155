import { createHash } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createDb } from '../../backend/src/db/client'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { auditEvents, authTokens, capturedMails, memberships } from '../../schema/index'
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

const tokenIn = (text: string) => text.match(/token=([A-Za-z0-9_-]{43})/)?.[1] ?? ''
const mailsTo = (to: string) => fx.db.select().from(capturedMails).where(eq(capturedMails.to, to))

describe('POST /api/invitations → mail → accept', () => {
  let token = ''

  it('POST /api/invitations → 201 from the lead, mails a single-use link, stores only its hash', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const res = await lead.post('/api/invitations', {
      email: 'Ada.Kerr@Greyscar.test',
      projectId: fx.projectId,
      role: 'engineer',
    })
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({
      email: 'ada.kerr@greyscar.test',
      projectId: fx.projectId,
      role: 'engineer',
      mailed: true,
    })
    const hours = (Date.parse(res.body.data.expiresAt) - Date.now()) / 3600_000
    expect(hours).toBeGreaterThan(71.9)
    expect(hours).toBeLessThanOrEqual(72)
    const [mail] = await mailsTo('ada.kerr@greyscar.test')
    expect(mail.subject).toBe('Join Test project on Downdip')
    expect(mail.from).toBe('Downdip <no-reply@downdip.test>')
    expect(mail.text).toContain(
      'lead has invited you to join the project "Test project" as engineer',
    )
    expect(mail.text).toContain('http://127.0.0.1:3000/invitations/accept?token=')
    expect(mail.text).not.toContain('competent person')
    expect(mail.html).toContain('<a href="http://127.0.0.1:3000/invitations/accept?token=')
    token = tokenIn(mail.text)
    expect(token).toHaveLength(43)
    const [row] = await fx.db.select().from(authTokens).where(eq(authTokens.id, res.body.data.id))
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'))
    expect(row.createdBy).toBe(fx.userIds.lead)
    const events = await fx.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.entity, 'invitation'))
    expect(events.map((e) => e.action)).toEqual(['create'])
    expect(JSON.stringify(events[0].after)).not.toContain(token)
  })

  it('GET /api/invitations/:token → what the accept page shows', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.get(`/api/invitations/${token}`)
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({
      email: 'ada.kerr@greyscar.test',
      projectName: 'Test project',
      role: 'engineer',
      existingAccount: false,
    })
  })

  it('POST /api/invitations/accept → 200, account made and signed in with the role', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.post('/api/invitations/accept', {
      token,
      name: 'Ada Kerr',
      password: 'quarry-wall-2026',
    })
    expect(res.status).toBe(200)
    expect(res.body.data.user).toMatchObject({ email: 'ada.kerr@greyscar.test', name: 'Ada Kerr' })
    expect(res.body.data.memberships).toEqual([
      {
        projectId: fx.projectId,
        projectCode: 'TST',
        projectName: 'Test project',
        role: 'engineer',
      },
    ])
    expect(res.body.data.csrfToken).not.toBe(anonymous.csrf)
    const me = await anonymous.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.data.user.email).toBe('ada.kerr@greyscar.test')
    const [row] = await fx.db
      .select()
      .from(authTokens)
      .where(eq(authTokens.email, 'ada.kerr@greyscar.test'))
    expect(row.usedAt).toBeInstanceOf(Date)
  })

  it('POST /api/invitations/accept → 410 token_used the second time, nothing created', async () => {
    const users = await countRows(fx.db, 'users')
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.post('/api/invitations/accept', {
      token,
      name: 'Someone Else',
      password: 'another-password-1',
    })
    expect(res.status).toBe(410)
    expect(res.body.error.code).toBe('token_used')
    expect(await countRows(fx.db, 'users')).toBe(users)
    expect((await anonymous.get(`/api/invitations/${token}`)).status).toBe(410)
  })

  it('POST /api/invitations/accept → 410 token_expired once past expiresAt', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const made = await lead.post('/api/invitations', {
      email: 'late@greyscar.test',
      projectId: fx.projectId,
    })
    expect(made.body.data.role).toBe('viewer')
    const late = tokenIn((await mailsTo('late@greyscar.test'))[0].text)
    await fx.db
      .update(authTokens)
      .set({ expiresAt: new Date(Date.now() - 1000) })
      .where(eq(authTokens.id, made.body.data.id))
    const anonymous = await clientFor(fx.app, 'anonymous')
    const get = await anonymous.get(`/api/invitations/${late}`)
    expect(get.status).toBe(410)
    expect(get.body.error.code).toBe('token_expired')
    const res = await anonymous.post('/api/invitations/accept', {
      token: late,
      name: 'Late',
      password: 'late-password-1',
    })
    expect(res.status).toBe(410)
    expect(res.body.error.code).toBe('token_expired')
  })

  it('POST /api/invitations/accept → 400 invalid_token for a token never issued; 404 on GET', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    const wrong = 'A'.repeat(43)
    const res = await anonymous.post('/api/invitations/accept', {
      token: wrong,
      name: 'X',
      password: 'long-enough-1',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('invalid_token')
    expect((await anonymous.get(`/api/invitations/${wrong}`)).status).toBe(404)
    const bad = await anonymous.post('/api/invitations/accept', {
      token: 'short',
      password: 'short',
    })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toEqual([
      'body.token',
      'body.password',
    ])
  })

  it('POST /api/invitations/accept → an existing account joins with its own password', async () => {
    const admin = await clientFor(fx.app, 'admin')
    const made = await admin.post('/api/invitations', {
      email: 'logger@test.example',
      projectId: fx.otherProjectId,
      role: 'logger',
    })
    expect(made.status).toBe(201)
    const t = tokenIn((await mailsTo('logger@test.example'))[0].text)
    const anonymous = await clientFor(fx.app, 'anonymous')
    expect((await anonymous.get(`/api/invitations/${t}`)).body.data.existingAccount).toBe(true)
    const wrong = await anonymous.post('/api/invitations/accept', {
      token: t,
      password: 'not-my-password',
    })
    expect(wrong.status).toBe(401)
    const res = await anonymous.post('/api/invitations/accept', { token: t, password: PASSWORD })
    expect(res.status).toBe(200)
    const [m] = await fx.db
      .select()
      .from(memberships)
      .where(
        and(
          eq(memberships.userId, fx.userIds.logger),
          eq(memberships.projectId, fx.otherProjectId),
        ),
      )
    expect(m.role).toBe('logger')
  })
})
