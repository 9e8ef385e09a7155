import { readFileSync } from 'node:fs'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { artifactPath, launchBrowser } from './browser'

const file = (name: string) => ({
  name: name.split('/').pop()!,
  mimeType: 'text/plain',
  buffer: readFileSync(new URL(`../../testdata/ags4/${name}`, import.meta.url)),
})
// Our own test subset of the AGS 4.1.1 standard dictionary, in the AGS4 dictionary format.
const dictionaryFile = 'dictionary/gsq-test-dictionary-4-1-1.ags'

describe('AGS4 file check: any signed-in user checks a file; an administrator loads the dictionary', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let viewer: Page
  let admin: Page

  async function signIn(email: string): Promise<Page> {
    const page = await (
      await browser.newContext({ viewport: { width: 1366, height: 900 } })
    ).newPage()
    await page.goto(new URL('/projects', baseUrl).href)
    await page.getByLabel('Email').fill(email)
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.getByTestId('nav-ags-check').click()
    await page.getByRole('heading', { name: 'AGS4 file check' }).waitFor()
    return page
  }
  const verdictOf = async (page: Page) => {
    const v = page.getByTestId('ags-verdict')
    await v.waitFor()
    return { verdict: await v.getAttribute('data-verdict'), text: await v.innerText() }
  }

  beforeAll(async () => {
    browser = await launchBrowser()
    admin = await signIn('admin@greyscar.test')
    // A dictionary left by an earlier run of this file would change what the viewer sees first.
    const { csrfToken } = (await (await admin.request.get(`${baseUrl}/api/auth/csrf`)).json()).data
    await admin.request.delete(`${baseUrl}/api/ags/dictionaries/4.1.1`, {
      headers: { 'X-CSRF-Token': csrfToken },
    })
    viewer = await signIn('viewer@greyscar.test')
  })
  afterAll(async () => {
    await browser?.close()
  })

  it('a viewer checks a file of other groups with no dictionary loaded: no error, the groups beyond ours listed as not checked', async () => {
    await viewer.getByTestId('ags-file').setInputFiles(file('gsq-laboratory.ags'))
    expect(await verdictOf(viewer)).toEqual({
      verdict: 'partial',
      text: expect.stringContaining('gsq-laboratory.ags passes every rule checked.'),
    })
    expect(await viewer.getByTestId('ags-dictionary-used').getAttribute('data-source')).toBe(
      'built-in',
    )
    const groups = viewer.locator('[data-testid="ags-unchecked"] tbody tr')
    expect(
      await groups.evaluateAll((rows) => rows.map((r) => r.getAttribute('data-group'))),
    ).toEqual(['DICT', 'SAMP', 'SAMP', 'GRAG', 'GRAT', 'LLPL', 'RPLT', 'RUCS', 'GSQC', 'GSQC'])
    expect(await groups.nth(1).innerText()).toContain(
      'group SAMP is not in the groups Downdip knows and the 4.1.1 standard dictionary is not loaded: ask an administrator to load it.',
    )
    await viewer.getByTestId('ags-dictionaries-none').waitFor()
    expect(await viewer.getByTestId('ags-dictionary-load').count()).toBe(0)
  })

  it('an administrator loads the 4.1.1 dictionary file on the same screen', async () => {
    await admin.getByTestId('ags-dictionary-file').setInputFiles(file(dictionaryFile))
    await admin.getByTestId('ags-dictionary-done').waitFor()
    expect(await admin.getByTestId('ags-dictionary-done').innerText()).toBe(
      'AGS 4.1.1 dictionary loaded from gsq-test-dictionary-4-1-1.ags (28 groups, 220 headings).',
    )
    const row = admin.locator('[data-testid="ags-dictionaries"] tbody tr[data-edition="4.1.1"]')
    expect(await row.innerText()).toContain('Ada Admin')
  })

  it('with it loaded the file passes in full, and a broken file lists its findings by rule and line', async () => {
    await viewer.getByTestId('ags-file').setInputFiles(file('gsq-laboratory.ags'))
    await viewer.locator('[data-testid="ags-dictionary-used"][data-source="loaded"]').waitFor()
    expect((await verdictOf(viewer)).verdict).toBe('passes')
    expect(await viewer.getByTestId('ags-unchecked').count()).toBe(0)
    // the viewer's list of loaded dictionaries follows, without a remove control
    await viewer.locator('[data-testid="ags-dictionaries"] tr[data-edition="4.1.1"]').waitFor()
    expect(await viewer.getByTestId('ags-dictionary-remove-4.1.1').count()).toBe(0)

    await viewer.getByTestId('ags-file').setInputFiles(file('broken/gsq-site-three-faults.ags'))
    await viewer.locator('[data-testid="ags-verdict"][data-verdict="fails"]').waitFor()
    expect((await verdictOf(viewer)).text).toContain(
      'gsq-site-three-faults.ags: 3 errors, 0 warnings.',
    )
    const rows = viewer.locator('[data-testid="ags-findings"] tbody tr')
    expect(await rows.allInnerTexts()).toEqual([
      '11\t10b\tREQUIRED field TRAN_RECV is empty',
      '53\t7\tLOCA_GREF comes after LOCA_GL; the dictionary order is LOCA_ID, LOCA_TYPE, LOCA_NATE, LOCA_NATN, LOCA_GREF, LOCA_GL, LOCA_FDEP, FILE_FSET',
      '73\t10c\tno LOCA row has LOCA_ID "GSQ-BH09"',
    ])
    await viewer.getByTestId('ags-rule-7').click()
    await expect.poll(() => rows.count()).toBe(1)
    expect(await rows.first().getAttribute('data-rule')).toBe('7')
    expect(await viewer.getByTestId('ags-notes').innerText()).toContain('Rule 20')
    await viewer.screenshot({ path: await artifactPath('ags-check-findings.png'), fullPage: true })
  })

  it('the administrator removes it: the file shown is checked again against the built-in groups', async () => {
    await admin.getByTestId('ags-file').setInputFiles(file('gsq-site-investigation.ags'))
    await admin.locator('[data-testid="ags-dictionary-used"][data-source="loaded"]').waitFor()
    await admin.getByTestId('ags-dictionary-remove-4.1.1').click()
    await admin.getByRole('button', { name: 'Remove', exact: true }).last().click()
    await admin.locator('[data-testid="ags-dictionary-used"][data-source="built-in"]').waitFor()
    expect((await verdictOf(admin)).verdict).toBe('partial')
    await admin.getByTestId('ags-dictionaries-none').waitFor()
    await admin.screenshot({
      path: await artifactPath('ags-check-dictionaries.png'),
      fullPage: true,
    })
  })
})
