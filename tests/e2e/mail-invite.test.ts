import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { createDb } from '../../backend/src/db/client'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import { artifactPath, launchBrowser } from './browser'

// The app under test mails to SMTP_URL (test.sh sets it); this file runs the fake server there.
const smtpPort = Number(new URL(process.env.SMTP_URL ?? 'smtp://127.0.0.1:2525').port)
const invitee = `rowan.pike.${Date.now()}@greyscar.test`

describe('invitation path: lead invites → mail in the dev mailbox → colleague joins', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let fake: FakeSmtp
  let closeDb: () => Promise<void>
  let link = ''

  beforeAll(async () => {
    const { db, pool } = createDb(process.env.E2E_DATABASE_URL!, 2)
    closeDb = () => pool.end()
    fake = await startFakeSmtp({ port: smtpPort, db })
    browser = await launchBrowser()
  })

  afterAll(async () => {
    await browser?.close()
    await fake?.stop()
    await closeDb?.()
  })

  async function signIn(email: string): Promise<Page> {
    // A context of its own per person, so each has their own session cookie.
    const context = await browser.newContext({ viewport: { width: 1366, height: 900 } })
    const page = await context.newPage()
    await page.goto(new URL('/sign-in', baseUrl).href)
    await page.getByLabel('Email').fill(email)
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.waitForURL(/\/projects$/)
    return page
  }

  it('the GSQ lead invites a colleague as viewer from the Members tab', async () => {
    const page = await signIn('lead@greyscar.test')
    await page.getByTestId('project-link-GSQ').click()
    await page.waitForURL(/\/projects\/\d+$/)
    await page.getByRole('tab', { name: 'Members' }).click()
    await page.locator('#member-email').fill(invitee)
    await page.getByTestId('member-invite').click()
    await page.getByTestId('member-invited').waitFor()
    expect((await page.getByTestId('member-invited').innerText()).trim()).toBe(
      `Invitation mailed to ${invitee}: they join as viewer when they accept it.`,
    )
  })

  it('the admin sees the mail in the dev mailbox, with its link', async () => {
    const page = await signIn('admin@greyscar.test')
    await page.goto(new URL('/admin/mailbox', baseUrl).href)
    const mail = page.locator('article', { hasText: `to ${invitee}` })
    await mail.waitFor()
    expect(await mail.locator('.subject').innerText()).toMatch(/^Join .+ on Downdip$/)
    link = (await mail.locator('a').first().getAttribute('href')) ?? ''
    expect(link).toMatch(/\/invitations\/accept\?token=[A-Za-z0-9_-]{43}$/)
    await page.screenshot({ path: await artifactPath('mail-dev-mailbox.png'), fullPage: true })
  })

  it('the colleague opens the link, chooses a password and lands on Projects with GSQ', async () => {
    const page = await (await browser.newContext()).newPage()
    const { pathname, search } = new URL(link)
    await page.goto(new URL(pathname + search, baseUrl).href)
    await page.getByTestId('invitation-summary').waitFor()
    expect(await page.getByTestId('invitation-summary').innerText()).toContain('as Viewer')
    await page.locator('#invite-name').fill('Rowan Pike')
    await page.locator('#invite-password').fill('north-wall-2026')
    await page.locator('#invite-repeat').fill('north-wall-2026')
    await page.getByTestId('accept-submit').click()
    await page.waitForURL(/\/projects$/)
    await page.getByTestId('project-link-GSQ').waitFor()
  })
})
