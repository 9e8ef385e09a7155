import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { APIRequestContext, Browser, Page } from 'playwright-core'
import { artifactPath, launchBrowser } from './browser'

// GSQ-BH05 of the demo: its image log sits 0.35 m deeper than the core and run 93–96 m was marked
// on the wrong line (the image sees its betas 25° further round). An engineer reads the estimates,
// records the shift and that run's rotation, sees the run agree, then undoes both (the demo is
// left as it was for the other browser tests).
describe('core ↔ image reconciliation of GSQ-BH05 in the browser', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page
  let api: APIRequestContext
  let holePath = ''
  let badRun = 0

  const structuresOf = async () => {
    const res = await api.get(new URL(`/api${holePath}/structures`, baseUrl).href)
    expect(res.status()).toBe(200)
    return (
      (await res.json()) as {
        data: { source: string; depth: number; betaRotationApplied: number | null }[]
      }
    ).data
  }

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1024, height: 768 } })
  })
  afterAll(async () => {
    await browser?.close()
  })

  it('signs in as the engineer and opens the Core ↔ image tab of GSQ-BH05', async () => {
    await page.goto(new URL('/projects', baseUrl).href)
    await page.getByLabel('Email').fill('engineer@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.getByTestId('project-link-GSQ').click()
    await page.getByTestId('hole-link-GSQ-BH05').click()
    await page.getByTestId('tab-reconcile').click()
    const match = /\/projects\/(\d+)\/holes\/(\d+)/.exec(new URL(page.url()).pathname)!
    holePath = `/projects/${match[1]}/holes/${match[2]}`
    api = page.context().request
    await page.getByTestId('reconcile-shift').waitFor()
    expect(await page.getByTestId('reconcile-shift').innerText()).toContain('0.35')
    const wrong = page.locator('[data-testid^="reconcile-run-"][data-run]').filter({
      has: page.locator('[data-verdict="wrong"]'),
    })
    expect(await wrong.count()).toBe(1)
    expect(await wrong.locator('[data-field="rotation"]').innerText()).toMatch(/\+2[4-7]\./)
    badRun = Number(await wrong.getAttribute('data-run'))
    await page.screenshot({ path: await artifactPath('reconcile-1024.png'), fullPage: true })
  })

  it('records the shift and the run rotation; the run then agrees and logged betas are kept', async () => {
    await page.getByTestId(`reconcile-run-pick-${badRun}`).click()
    await page.getByTestId('reconcile-apply-shift').click()
    await page.getByTestId('reconcile-apply').click()
    const lines = await page.getByTestId('reconcile-apply-lines').innerText()
    expect(lines).toContain('0.35')
    expect(lines).toMatch(/93/)
    await page.getByTestId('reconcile-apply-reason').fill('wireline depth; run 93–96 m mark')
    await page.getByTestId('reconcile-apply-confirm').click()
    const refused = page.getByTestId('reconcile-apply-error')
    await Promise.race([
      page.locator('[data-testid^="adjustment-undo-"]').nth(1).waitFor(),
      refused.first().waitFor(),
    ])
    expect(await refused.count(), await refused.allInnerTexts().then((t) => t.join(' '))).toBe(0)
    const row = page.getByTestId(`reconcile-run-${badRun}`)
    await row.locator('[data-verdict="ok"]').waitFor()
    const turned = (await structuresOf()).filter(
      (s) => s.source === 'core' && s.depth >= 93 && s.depth < 96,
    )
    expect(turned.length).toBeGreaterThan(3)
    for (const s of turned) expect(Math.abs(s.betaRotationApplied! - 25)).toBeLessThan(2)
  })

  it('undoes both adjustments from the history', async () => {
    const res = await api.get(new URL(`/api${holePath}/reconciliation`, baseUrl).href)
    const active = (
      (await res.json()) as { data: { adjustments: { id: number; active: boolean }[] } }
    ).data.adjustments.filter((a) => a.active)
    expect(active).toHaveLength(2)
    for (const { id } of active) {
      await page.getByTestId(`adjustment-undo-${id}`).click()
      await page.getByTestId('reconcile-undo-confirm').click()
      await page.getByTestId(`adjustment-${id}`).locator('[data-state="undone"]').waitFor()
    }
    expect(await page.getByTestId('reconcile-undo-result').innerText()).toMatch(
      /Undone; \d+ structures recomputed/,
    )
    await expect
      .poll(async () => (await structuresOf()).filter((s) => (s.betaRotationApplied ?? 0) !== 0))
      .toEqual([])
    await page.getByTestId(`reconcile-run-${badRun}`).locator('[data-verdict="wrong"]').waitFor()
  })
})
