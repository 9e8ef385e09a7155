import { and, eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createDb } from '../../backend/src/db/client'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { capturedMails, memberships, users } from '../../schema/index'
import { clientFor, createFixture, type Fixture } from './fixture'

// OWASP ASVS 4.0 V2.1 / account enumeration: adding a member by e-mail answers the same whether
// the address has an account or not; both get an invitation, nobody joins until they accept.
let fx: Fixture
let fake: FakeSmtp
let closeFakeDb: () => Promise<void>
beforeAll(async () => {
  const { db, pool } = createDb(inject('databaseUrl'), 2)
  closeFakeDb = () => pool.end()
  fake = await startFakeSmtp({ port: 0, db })
  fx = await createFixture({ SMTP_URL: `smtp://127.0.0.1:${fake.port}` })
  await fx.db
    .insert(users)
    .values({ email: 'has.account@test.example', name: 'Has', passwordHash: 'x' })
})
afterAll(async () => {
  await fake.stop()
  await closeFakeDb()
  await fx.close()
})

const mailsTo = async (to: string) => {
  for (let i = 0; i < 50; i++) {
    const rows = await fx.db.select().from(capturedMails).where(eq(capturedMails.to, to))
    if (rows.length) return rows
    await new Promise((r) => setTimeout(r, 100))
  }
  return []
}

describe('POST /api/projects/:projectId/members', () => {
  it('→ 202 with the same answer for an address with an account and one without; both invited, neither a member yet', async () => {
    const lead = await clientFor(fx.app, 'lead')
    const url = `/api/projects/${fx.projectId}/members`
    const known = await lead.post(url, { email: 'Has.Account@test.example', role: 'engineer' })
    const unknown = await lead.post(url, { email: 'no.account@test.example', role: 'engineer' })
    expect(known.status).toBe(202)
    expect(unknown.status).toBe(202)
    const shape = (b: { data: Record<string, unknown> }) => ({
      keys: Object.keys(b.data).sort(),
      role: b.data.role,
      mailed: b.data.mailed,
    })
    expect(shape(known.body)).toEqual(shape(unknown.body))
    expect(shape(known.body)).toEqual({
      keys: ['email', 'expiresAt', 'mailed', 'role'],
      role: 'engineer',
      mailed: true,
    })
    expect(await mailsTo('has.account@test.example')).toHaveLength(1)
    expect(await mailsTo('no.account@test.example')).toHaveLength(1)
    const [hasUser] = await fx.db
      .select()
      .from(users)
      .where(eq(users.email, 'has.account@test.example'))
    const joined = await fx.db
      .select()
      .from(memberships)
      .where(and(eq(memberships.projectId, fx.projectId), eq(memberships.userId, hasUser.id)))
    expect(joined).toEqual([])
  })

  it('→ 403 for an engineer, 400 naming body.email for a bad address', async () => {
    const engineer = await clientFor(fx.app, 'engineer')
    const url = `/api/projects/${fx.projectId}/members`
    expect((await engineer.post(url, { email: 'x@test.example', role: 'viewer' })).status).toBe(403)
    const lead = await clientFor(fx.app, 'lead')
    const bad = await lead.post(url, { email: 'not an address', role: 'viewer' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.email')
  })
})
