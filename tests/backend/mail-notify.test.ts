import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { createDb } from '../../backend/src/db/client'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { notifyProject } from '../../backend/src/services/notify'
import { capturedMails, users } from '../../schema/index'
import { createFixture, type Fixture } from './fixture'

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

const recipients = async () =>
  (await fx.db.select({ to: capturedMails.to }).from(capturedMails)).map((m) => m.to).sort()

describe('notifyProject()', () => {
  it('notifyProject() mails each member with a role once, plus member userIds; skips outsiders', async () => {
    const sent = await notifyProject(fx.db, fx.mail, {
      projectId: fx.projectId,
      roles: ['engineer', 'lead'],
      userIds: [fx.userIds.lead, fx.userIds.viewer, fx.userIds.outsider],
      subject: 'Checked: TST-01 Domain A',
      text: 'engineer marked TST-01 Domain A as checked.',
      link: `/projects/${fx.projectId}/holes/${fx.holeId}/intervals/7`,
    })
    expect(sent).toBe(3)
    expect(await recipients()).toEqual([
      'engineer@test.example',
      'lead@test.example',
      'viewer@test.example',
    ])
    const [mail] = await fx.db
      .select()
      .from(capturedMails)
      .where(eq(capturedMails.to, 'lead@test.example'))
    expect(mail.subject).toBe('[Test project] Checked: TST-01 Domain A')
    expect(mail.text).toContain('engineer marked TST-01 Domain A as checked.')
    expect(mail.text).toContain(
      `http://127.0.0.1:3000/projects/${fx.projectId}/holes/${fx.holeId}/intervals/7`,
    )
    expect(mail.text).toContain('checked by a competent person')
  })

  it('notifyProject() skips disabled users and sends nothing without roles or userIds', async () => {
    await fx.db.delete(capturedMails)
    await fx.db.update(users).set({ disabled: true }).where(eq(users.id, fx.userIds.engineer))
    const sent = await notifyProject(fx.db, fx.mail, {
      projectId: fx.projectId,
      roles: ['engineer'],
      subject: 'Ready for checking',
      text: 'x',
    })
    expect(sent).toBe(0)
    expect(
      await notifyProject(fx.db, fx.mail, {
        projectId: fx.projectId,
        subject: 'Nobody',
        text: 'x',
      }),
    ).toBe(0)
    expect(await recipients()).toEqual([])
  })

  it('notifyProject() resolves to 0 and does not throw when the SMTP server is down', async () => {
    const spare = await startFakeSmtp({ port: 0, db: fx.db })
    await spare.stop()
    const down = createMailer(
      {
        SMTP_URL: `smtp://127.0.0.1:${spare.port}`,
        MAIL_FROM: 'Downdip <no-reply@downdip.test>',
        APP_URL: 'http://127.0.0.1:3000',
      },
      createLogger('silent'),
    )
    const sent = await notifyProject(fx.db, down, {
      projectId: fx.projectId,
      roles: ['lead', 'viewer'],
      subject: 'Approved',
      text: 'x',
    })
    expect(sent).toBe(0)
  })
})
