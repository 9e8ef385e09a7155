import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { fileURLToPath } from 'node:url'
import type { Browser, Locator, Page } from 'playwright-core'
import { artifactPath, launchBrowser } from './browser'

const csv200 = fileURLToPath(new URL('../../testdata/csv/structures-200.csv', import.meta.url))

/** Five structures in the run 3–6 m of GSQ-BH01 (a run with a good mark), typed key by key. */
const typed = [
  { depth: '3.15', type: 'jt', alpha: '42', beta: '118', comment: 'calcite film' },
  { depth: '3.45', type: 'bd', alpha: '68', beta: '190', comment: '' },
  // Depth left as suggested: the last depth plus the step just used (0.30 m).
  { depth: null, type: 'fa', alpha: '35', beta: '250', comment: 'slickensides' },
  { depth: '4.26', type: 'vein', alpha: '55', beta: '75', comment: '' },
] as const

const countOf = async (page: Page) =>
  Number(/^(\d+) structures/.exec(await page.getByTestId('entry-conventions').innerText())?.[1])

async function press(page: Page, ...keys: string[]) {
  for (const key of keys) await page.keyboard.press(key)
}

async function liveOrientation(row: Locator) {
  return {
    dip: (await row.locator('[data-field="dip"]').innerText()).trim(),
    dipDirection: (await row.locator('[data-field="dipDirection"]').innerText()).trim(),
  }
}

describe('logging path: GSQ-BH01 core entry by keyboard, then a structures CSV import', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page
  let before = 0

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
  })

  afterAll(async () => {
    await browser?.close()
  })

  it('signs in as the logger and opens the core entry of GSQ-BH01', async () => {
    await page.goto(new URL('/projects', baseUrl).href)
    await page.waitForURL(/\/sign-in\?redirect=/)
    await page.getByLabel('Email').fill('logger@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.waitForURL(/\/projects$/)
    await page.getByTestId('project-link-GSQ').click()
    await page.getByTestId('hole-link-GSQ-BH01').click()
    await page.waitForURL(/\/holes\/\d+$/)
    await page.getByTestId('tab-entry').click()
    await page.waitForURL(/\?tab=entry$/)
    await page.getByTestId('entry-row').waitFor()
    await expect.poll(() => countOf(page)).toBeGreaterThan(100)
    before = await countOf(page)
    // The grid takes the keyboard at once: the new row's depth cell has the focus.
    expect(await page.evaluate(() => document.activeElement?.getAttribute('data-field'))).toBe(
      'depth',
    )
  })

  it('enters five structures with the keyboard only and shows their true orientation', async () => {
    const entry = page.getByTestId('entry-row')
    const shown: { dip: string; dipDirection: string }[] = []
    for (const [i, s] of typed.entries()) {
      if (s.depth !== null) await page.keyboard.type(s.depth)
      else expect(await entry.locator('input[data-field="depth"]').inputValue()).toBe('3.75')
      await press(page, 'Enter')
      await page.keyboard.type(s.type)
      await press(page, 'Tab')
      await page.keyboard.type(s.alpha)
      await press(page, 'Enter')
      await page.keyboard.type(s.beta)
      await press(page, 'Enter', 'Enter') // gamma left blank
      await page.keyboard.type(s.comment)
      const live = await liveOrientation(entry)
      expect(live.dip).toMatch(/^\d+\.\d°$/)
      expect(live.dipDirection).toMatch(/^\d{3}\.\d°$/)
      shown.push(live)
      await press(page, 'Enter') // on Comment: save and start a new row
      await expect.poll(() => countOf(page)).toBe(before + i + 1)
    }
    // The fifth repeats the fourth one step deeper (F2; the step is the last one used, 0.51 m),
    // then saves from the depth cell.
    await press(page, 'F2')
    expect(await entry.locator('input[data-field="depth"]').inputValue()).toBe('4.77')
    expect(await entry.locator('input[data-field="type"]').inputValue()).toBe('vein')
    shown.push(await liveOrientation(entry))
    await press(page, 'Control+Enter')
    await expect.poll(() => countOf(page)).toBe(before + 5)

    // Saved rows show the server's values: the same as previewed in the browser.
    const depths = ['3.15', '3.45', '3.75', '4.26', '4.77']
    const types = ['joint', 'bedding', 'fault', 'vein', 'vein']
    for (const [i, depth] of depths.entries()) {
      const row = page
        .locator('tr.saved-row')
        .filter({ has: page.locator(`td:text-is("${depth}")`) })
        .filter({ hasText: types[i] })
      await expect(row.count()).resolves.toBe(1)
      expect(await liveOrientation(row)).toEqual(shown[i])
    }
    await page.screenshot({ path: await artifactPath('logging-path-entry.png') })
  })

  it('imports structures-200.csv through the preview and commits it', async () => {
    await page.getByTestId('tab-imports').click()
    await page.waitForURL(/\?tab=imports$/)
    await page.getByTestId('import-file').setInputFiles(csv200)
    await page.getByTestId('import-preview').waitFor()
    expect(await page.getByTestId('import-row-count').innerText()).toBe('200')
    expect(await page.locator('[data-testid="import-sample"] tbody tr').count()).toBe(20)
    const firstDip = await page
      .locator('[data-testid="import-sample"] tbody tr')
      .first()
      .locator('td')
      .nth(6)
      .innerText()
    expect(firstDip).toMatch(/^\d+\.\d°$/)
    await page.screenshot({ path: await artifactPath('logging-path-import-preview.png') })
    await page.getByTestId('import-commit').click()
    await page.locator('[data-testid="import-progress"][data-status="committed"]').waitFor()
    await page.locator('[data-testid="import-history"] tr[data-status="committed"]').waitFor()
    await page.screenshot({ path: await artifactPath('logging-path-import-done.png') })

    await page.getByTestId('tab-entry').click()
    await expect.poll(() => countOf(page)).toBe(before + 205)
  })

  it('reads the same grid in the dark theme', async () => {
    await page.getByTestId('theme-toggle').click()
    await page.waitForTimeout(200)
    await page.screenshot({ path: await artifactPath('logging-path-entry-dark.png') })
    await page.getByTestId('theme-toggle').click()
  })
})
