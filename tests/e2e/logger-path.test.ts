import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { artifactPath, launchBrowser } from './browser'

const CAUTION =
  'Results are aids to professional judgement: they must be checked by a competent person, and local codes, standards and licensed practice govern design.'
const holeNames = ['GSQ-BH01', 'GSQ-BH02', 'GSQ-BH03', 'GSQ-BH04', 'GSQ-BH05', 'GSQ-BH06']

describe('logger path: sign in → GSQ → GSQ-BH01 survey', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
  })

  afterAll(async () => {
    await browser?.close()
  })

  it('signs in as the logger and lands on Projects', async () => {
    await page.goto(new URL('/projects', baseUrl).href)
    await page.waitForURL(/\/sign-in\?redirect=/)
    await page.getByLabel('Email').fill('logger@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.waitForURL(/\/projects$/)
    await expect(page.getByTestId('signed-in-as').textContent()).resolves.toBeTruthy()
    expect((await page.getByTestId('caution').innerText()).trim()).toBe(CAUTION)
  })

  it('opens GSQ and lists the six holes', async () => {
    await page.getByTestId('project-link-GSQ').click()
    await page.waitForURL(/\/projects\/\d+$/)
    await page.getByTestId('hole-link-GSQ-BH06').waitFor()
    const names = await page.locator('[data-testid^="hole-link-"]').allInnerTexts()
    expect(names.map((n) => n.trim())).toEqual(holeNames)
    expect(await page.getByTestId('project-code').innerText()).toBe('GSQ')
    for (const name of holeNames) {
      expect(await page.getByTestId(`collar-${name}`).count()).toBe(1)
    }
    await page.screenshot({ path: await artifactPath('logger-path-project.png'), fullPage: true })
  })

  it('opens GSQ-BH01 and shows its survey stations', async () => {
    await page.getByTestId('hole-link-GSQ-BH01').click()
    await page.waitForURL(/\/projects\/\d+\/holes\/\d+$/)
    await page.getByTestId('survey-row-0').waitFor()
    expect(await page.getByTestId('hole-name').innerText()).toBe('GSQ-BH01')
    const rows = page.locator('[data-testid^="survey-row-"]')
    expect(await rows.count()).toBeGreaterThan(1)
    // A logger edits the survey: the first station's depth is an input holding a number.
    const firstDepth = await rows.first().locator('input[data-field="depth"]').inputValue()
    expect(Number.isFinite(Number(firstDepth))).toBe(true)
    const trueAzimuth = await rows.first().locator('[data-field="trueAzimuth"]').innerText()
    expect(trueAzimuth).toMatch(/^\d{3}\.\d{2}°$/)
    await page.screenshot({ path: await artifactPath('logger-path-hole.png'), fullPage: true })
  })
})
