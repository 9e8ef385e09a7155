import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { artifactPath, launchBrowser } from './browser'

/** A file of its own per run (the comment), so reruns on the same database start clean. */
const stamp = Date.now().toString(36)
const file = {
  name: `bh04-undo-${stamp}.csv`,
  mimeType: 'text/csv',
  buffer: Buffer.from(
    `depth,type,alpha,beta,comment\n21.4,joint,40,120,${stamp}\n22.1,joint,55,300,\n23.7,vein,62,80,\n`,
  ),
}

describe('imports: the same file twice is warned of, and a committed import is undone', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page
  /** The history row of the committed import (later previews of the same file list above it). */
  let rowId = ''
  const row = () => page.getByTestId(rowId)

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
  })
  afterAll(async () => {
    await browser?.close()
  })

  it('commits a structures file into GSQ-BH04 from the Imports tab', async () => {
    await page.goto(new URL('/projects', baseUrl).href)
    await page.getByLabel('Email').fill('logger@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.getByTestId('project-link-GSQ').click()
    await page.getByTestId('hole-link-GSQ-BH04').click()
    await page.getByTestId('tab-imports').click()
    await page.getByTestId('import-file').setInputFiles(file)
    await page.getByTestId('import-preview').waitFor()
    expect(await page.getByTestId('import-duplicate').count()).toBe(0)
    await page.getByTestId('import-commit').click()
    await page.locator('[data-testid="import-progress"][data-status="committed"]').waitFor()
    const committed = page
      .locator('[data-testid="import-history"] tr[data-status="committed"]')
      .filter({ hasText: file.name })
    await committed.waitFor()
    rowId = (await committed.getAttribute('data-testid'))!
  })

  it('warns that the same file is already in the hole and commits it only after the tick', async () => {
    await page.getByTestId('import-file').setInputFiles(file)
    await page.getByTestId('import-duplicate').waitFor()
    expect(await page.getByTestId('import-duplicate').innerText()).toContain(file.name)
    expect(await page.getByTestId('import-commit').isDisabled()).toBe(true)
    await page.locator('#import-confirm-duplicate').check()
    expect(await page.getByTestId('import-commit').isDisabled()).toBe(false)
    await page.screenshot({ path: await artifactPath('import-duplicate-warning.png') })
  })

  it('undoes the committed import after a dialog that states the row count', async () => {
    await row().getByRole('button', { name: 'Undo' }).click()
    const effect = page.getByTestId('import-undo-effect')
    await effect.waitFor()
    expect(await effect.innerText()).toBe(`Undoing ${file.name} removes the 3 structures it added.`)
    await page.screenshot({ path: await artifactPath('import-undo-dialog.png') })
    await page.getByTestId('import-undo-confirm').click()
    await expect.poll(() => row().getAttribute('data-status')).toBe('undone')
    // Undone, the file is no duplicate any more.
    await page.getByTestId('import-file').setInputFiles(file)
    await page.getByTestId('import-preview').waitFor()
    await expect.poll(() => page.getByTestId('import-duplicate').count()).toBe(0)
  })
})
