import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser, Page } from 'playwright-core'
import { artifactPath, launchBrowser } from './browser'

/** A fast logger: every key 50 ms after the last. */
const KEY_MS = 50
/** Each structure POST is held this long before it reaches the server. */
const SLOW_MS = 800

/**
 * Ten rows in GSQ-BH03 (final depth 180 m), 50–61 m, at uneven spacing so that no suggested depth
 * equals a typed one, and at millimetres, which the demo (centimetres) never holds.
 */
const typed = [
  { depth: '50.213', type: 'jt', alpha: '42', beta: '118' },
  { depth: '51.407', type: 'bd', alpha: '68', beta: '190' },
  { depth: '52.655', type: 'jt', alpha: '35', beta: '250' },
  { depth: '53.018', type: 'fa', alpha: '55', beta: '75' },
  { depth: '54.342', type: 'jt', alpha: '61', beta: '130' },
  { depth: '55.771', type: 'bd', alpha: '72', beta: '185' },
  { depth: '56.104', type: 'jt', alpha: '28', beta: '300' },
  { depth: '57.839', type: 'jt', alpha: '47', beta: '95' },
  { depth: '58.462', type: 'bd', alpha: '66', beta: '200' },
  { depth: '60.805', type: 'jt', alpha: '39', beta: '140' },
] as const
const words: Record<string, string> = { jt: 'joint', bd: 'bedding', fa: 'fault' }

interface StoredRow {
  id: number
  depth: number
  type: string
  alpha: number | null
  beta: number | null
}

async function press(page: Page, key: string) {
  await page.keyboard.press(key)
  await page.waitForTimeout(KEY_MS)
}

async function typeKeys(page: Page, text: string) {
  await page.keyboard.type(text, { delay: KEY_MS })
  await page.waitForTimeout(KEY_MS)
}

describe('entry typing: ten GSQ-BH03 rows typed ahead of a slow structures route', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page
  let holePath = ''
  /** When each structure POST was let through to the server, in the order sent (ms). */
  const released: number[] = []

  const api = async <T>(path: string): Promise<T> => {
    const response = await page.request.get(new URL(`/api${holePath}${path}`, baseUrl).href)
    expect(response.status()).toBe(200)
    return ((await response.json()) as { data: T }).data
  }

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
  })

  afterAll(async () => {
    await browser?.close()
  })

  it('signs in as the logger and opens the core entry of GSQ-BH03 (final depth 180 m)', async () => {
    await page.goto(new URL('/projects', baseUrl).href)
    await page.waitForURL(/\/sign-in\?redirect=/)
    await page.getByLabel('Email').fill('logger@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.waitForURL(/\/projects$/)
    await page.getByTestId('project-link-GSQ').click()
    await page.getByTestId('hole-link-GSQ-BH03').click()
    await page.waitForURL(/\/holes\/\d+$/)
    holePath = /\/projects\/\d+\/holes\/\d+/.exec(new URL(page.url()).pathname)![0]
    expect((await api<{ finalDepth: number }>('')).finalDepth).toBe(180)
    const depths = new Set((await api<StoredRow[]>('/structures')).map((s) => s.depth))
    expect(typed.filter((t) => depths.has(Number(t.depth)))).toEqual([])

    await page.route('**/api/projects/*/holes/*/structures', async (route) => {
      if (route.request().method() === 'POST') {
        await page.waitForTimeout(SLOW_MS)
        released.push(Date.now())
      }
      await route.continue()
    })
    await page.getByTestId('tab-entry').click()
    await page.waitForURL(/\?tab=entry$/)
    await page.getByTestId('entry-row').waitFor()
    await expect
      .poll(() => page.evaluate(() => document.activeElement?.getAttribute('data-field')))
      .toBe('depth')
  })

  it('types ten rows at 50 ms per key; every stored depth is the depth typed', async () => {
    const before = new Set((await api<StoredRow[]>('/structures')).map((s) => s.id))
    const pending = page.getByTestId('entry-pending')
    const begun: number[] = []
    for (const row of typed) {
      begun.push(Date.now())
      await typeKeys(page, row.depth)
      await press(page, 'Enter')
      await typeKeys(page, row.type)
      await press(page, 'Tab')
      await typeKeys(page, row.alpha)
      await press(page, 'Enter')
      await typeKeys(page, row.beta)
      await press(page, 'Control+Enter')
    }
    await page.screenshot({ path: await artifactPath('entry-typing-queue.png') })
    await expect.poll(() => pending.count(), { timeout: 20_000 }).toBe(0)
    expect(await page.locator('[data-testid^="entry-failed-"]').count()).toBe(0)
    await page.screenshot({ path: await artifactPath('entry-typing.png') })

    const added = (await api<StoredRow[]>('/structures'))
      .filter((s) => !before.has(s.id))
      .sort((a, b) => a.id - b.id)
    expect(added.map((s) => s.depth)).toEqual(typed.map((t) => Number(t.depth)))
    expect(added.map((s) => [s.type, s.alpha, s.beta])).toEqual(
      typed.map((t) => [words[t.type], Number(t.alpha), Number(t.beta)]),
    )
    // Typed ahead: every row after the first was begun before the row above reached the server.
    expect(released.length).toBe(typed.length)
    expect(begun.slice(1).filter((t, i) => t < released[i]!).length).toBe(typed.length - 1)
  })
})
