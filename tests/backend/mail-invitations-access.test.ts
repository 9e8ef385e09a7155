import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createDb } from '../../backend/src/db/client'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { clientFor, countRows, createFixture, type Fixture } from './fixture'

let fx: Fixture
let fake: FakeSmtp
let closeFakeDb: () => Promise<void>
let fakeRunning = true
beforeAll(async () => {
  const { db, pool } = createDb(inject('databaseUrl'), 2)
  closeFakeDb = () => pool.end()
  fake = await startFakeSmtp({ port: 0, db })
  fx = await createFixture({ SMTP_URL: `smtp://127.0.0.1:${fake.port}` })
})
afterAll(async () => {
  if (fakeRunning) await fake.stop()
  await closeFakeDb()
  await fx.close()
})

const invite = () => ({
  email: 'new.logger@greyscar.test',
  projectId: fx.projectId,
  role: 'logger',
})

describe('POST /api/invitations (who may invite)', () => {
  for (const who of ['viewer', 'logger', 'engineer'] as const) {
    it(`POST /api/invitations → 403 for ${who}, no token, no mail`, async () => {
      const client = await clientFor(fx.app, who)
      const res = await client.post('/api/invitations', invite())
      expect(res.status).toBe(403)
      expect(res.body.error.code).toBe('forbidden')
      expect(await countRows(fx.db, 'auth_tokens')).toBe(0)
      expect(await countRows(fx.db, 'captured_mails')).toBe(0)
    })
  }

  it('POST /api/invitations → 404 for the lead of another project (not a member)', async () => {
    const outsider = await clientFor(fx.app, 'outsider')
    const res = await outsider.post('/api/invitations', invite())
    expect(res.status).toBe(404)
    expect(res.body.error.code).toBe('not_found')
    expect(await countRows(fx.db, 'auth_tokens')).toBe(0)
  })

  it('POST /api/invitations → 404 for a project that does not exist', async () => {
    const admin = await clientFor(fx.app, 'admin')
    const res = await admin.post('/api/invitations', { ...invite(), projectId: 99999 })
    expect(res.status).toBe(404)
  })

  it('POST /api/invitations → 403 for a lead without a project; 201 for an admin', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const refused = await lead.post('/api/invitations', { email: 'someone@greyscar.test' })
    expect(refused.status).toBe(403)
    const admin = await clientFor(fx.app, 'admin')
    const res = await admin.post('/api/invitations', { email: 'someone@greyscar.test' })
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({ projectId: null, role: null, mailed: true })
    expect(await countRows(fx.db, 'captured_mails')).toBe(1)
  })

  it('POST /api/invitations → 401 signed out', async () => {
    const anonymous = await clientFor(fx.app, 'anonymous')
    const res = await anonymous.post('/api/invitations', invite())
    expect(res.status).toBe(401)
    expect(res.body.error.code).toBe('unauthenticated')
  })

  it('POST /api/invitations → 400 naming the field', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const res = await lead.post('/api/invitations', { email: 'not-an-address', role: 'boss' })
    expect(res.status).toBe(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toEqual(['body.email', 'body.role'])
    const orphanRole = await lead.post('/api/invitations', {
      email: 'a@greyscar.test',
      role: 'viewer',
    })
    expect(orphanRole.status).toBe(400)
    expect(orphanRole.body.error.details[0].path).toBe('body.role')
  })

  it('POST /api/invitations → 409 already_member for someone in the project', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const res = await lead.post('/api/invitations', { ...invite(), email: 'viewer@test.example' })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('already_member')
  })

  it('POST /api/invitations → 201 mailed:false when the SMTP server is down (token kept)', async () => {
    await fake.stop()
    fakeRunning = false
    const lead = await clientFor(fx.app, 'lead')
    const res = await lead.post('/api/invitations', { ...invite(), email: 'offline@greyscar.test' })
    expect(res.status).toBe(201)
    expect(res.body.data.mailed).toBe(false)
    expect(await countRows(fx.db, 'auth_tokens')).toBe(2)
  })
})
