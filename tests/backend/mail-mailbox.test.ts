import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { createMailer } from '../../backend/src/mail/transport'
import { capturedMails } from '../../schema/index'
import { clientFor, countRows, createFixture, type Fixture } from './fixture'

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

describe('fake SMTP server', () => {
  it('startFakeSmtp() stores subject, text and HTML decoded (non-ASCII, long lines)', async () => {
    const long = `Dip 72° toward 191° — ${'limestone '.repeat(20)}`
    await fx.mail.send({
      to: 'ines.moreau@greyscar.test',
      subject: 'Écart de pendage – BH03',
      text: `${long}\nhttp://127.0.0.1:3000/x?token=${'z'.repeat(43)}\n`,
      html: `<p>${long}</p>`,
    })
    const [mail] = await fx.db.select().from(capturedMails)
    expect(mail.to).toBe('ines.moreau@greyscar.test')
    expect(mail.from).toBe('Downdip <no-reply@downdip.test>')
    expect(mail.subject).toBe('Écart de pendage – BH03')
    expect(mail.text).toBe(`${long}\nhttp://127.0.0.1:3000/x?token=${'z'.repeat(43)}\n`)
    expect(mail.html).toBe(`<p>${long}</p>`)
  })
})

describe('GET and DELETE /api/dev/mailbox', () => {
  it('GET /api/dev/mailbox → 200 for an admin, newest first', async () => {
    await fx.mail.send({
      to: 'second@greyscar.test',
      subject: 'Second',
      text: 'two',
      html: '<p>two</p>',
    })
    const admin = await clientFor(fx.app, 'admin')
    const res = await admin.get('/api/dev/mailbox')
    expect(res.status).toBe(200)
    expect(res.body.data.map((m: { subject: string }) => m.subject)).toEqual([
      'Second',
      'Écart de pendage – BH03',
    ])
    expect(res.body.data[0]).toMatchObject({ to: 'second@greyscar.test', text: 'two' })
  })

  it('GET /api/dev/mailbox → 403 for a lead, 401 signed out', async () => {
    const lead = await clientFor(fx.app, 'lead')
    expect((await lead.get('/api/dev/mailbox')).status).toBe(403)
    expect((await lead.delete('/api/dev/mailbox')).status).toBe(403)
    const anonymous = await clientFor(fx.app, 'anonymous')
    expect((await anonymous.get('/api/dev/mailbox')).status).toBe(401)
    expect(await countRows(fx.db, 'captured_mails')).toBe(2)
  })

  it('DELETE /api/dev/mailbox → 200 for an admin, empties it', async () => {
    const admin = await clientFor(fx.app, 'admin')
    const res = await admin.delete('/api/dev/mailbox')
    expect(res.status).toBe(200)
    expect(res.body.data).toEqual({ removed: 2 })
    expect(await countRows(fx.db, 'captured_mails')).toBe(0)
  })

  it('GET /api/dev/mailbox → 404 even for an admin when FAKE_SMTP=0', async () => {
    const { db, pool } = createDb(inject('databaseUrl'), 2)
    const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', FAKE_SMTP: '0' })
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
    await agent
      .post('/api/auth/login')
      .set('X-CSRF-Token', csrf)
      .send({ email: 'admin@test.example', password: 'test-password-1' })
    expect((await agent.get('/api/dev/mailbox')).status).toBe(404)
    await pool.end()
  })
})
