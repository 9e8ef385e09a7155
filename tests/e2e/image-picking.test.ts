import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import sharp from 'sharp'
import type { APIRequestContext, Browser, Locator, Page } from 'playwright-core'
import { mulberry32, sinusoidDepthAt, type Sinusoid } from '../../orient/index'
import { artifactPath, launchBrowser } from './browser'

// A synthetic acoustic image of GSQ-BH02 126–129 m (between the demo's intervals 75–125 and
// 135–245 m, so no review rule is in the way): 360 samples a turn, 2 mm rows, a textured wall
// with three dark traces planted at known depths, heights and troughs.
const TOP = 126
const BOTTOM = 129
const WIDTH = 360
const ROWS = 1500
const planted: (Sinusoid & { type: string })[] = [
  { depth: 126.6, height: 0.08, troughAzimuth: 40, type: 'joint' },
  { depth: 127.5, height: 0.15, troughAzimuth: 215, type: 'bedding' },
  { depth: 128.4, height: 0.04, troughAzimuth: 300, type: 'vein' },
]
/** Where each trace is clicked: six azimuths round the hole, clear of the seam at 0°/360°. */
const clickAzimuths = [20, 80, 140, 200, 260, 320]
const stamp = Date.now().toString(36)
const fileName = `gsq-bh02-atv-${stamp}.png`

/** Grey noise and a slow banding (the wall), each planted trace 3 rows dark (an open joint). */
async function syntheticPng(seed: number): Promise<Buffer> {
  const random = mulberry32(seed)
  const samples = new Uint8Array(WIDTH * ROWS)
  const step = (BOTTOM - TOP) / ROWS
  for (let r = 0; r < ROWS; r++) {
    const band = 20 * Math.sin(r / 37)
    for (let c = 0; c < WIDTH; c++) samples[r * WIDTH + c] = 150 + band + (random() - 0.5) * 50
  }
  for (const s of planted)
    for (let c = 0; c < WIDTH; c++) {
      const row = Math.floor((sinusoidDepthAt(s, c + 0.5) - TOP) / step)
      for (let r = row - 1; r <= row + 1; r++)
        if (r >= 0 && r < ROWS) samples[r * WIDTH + c] = 25 + random() * 15
    }
  return sharp(Buffer.from(samples), { raw: { width: WIDTH, height: ROWS, channels: 1 } })
    .toColourspace('b-w')
    .png()
    .toBuffer()
}

/** Types a number into a PrimeVue InputNumber (its model follows the keystrokes). */
async function typeNumber(input: Locator, value: number) {
  await input.click()
  await input.press('Control+A')
  await input.pressSequentially(String(value))
  await input.press('Tab')
}

/** The numbers in "27.4° / 045.1°". */
const angles = (text: string) => (text.match(/-?\d+(\.\d+)?/g) ?? []).map(Number)
const angleGap = (a: number, b: number) => Math.abs(((a - b + 540) % 360) - 180)

describe('image picking: upload a televiewer image of GSQ-BH02, pick three traces by clicking', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page
  let api: APIRequestContext
  let csrf = ''
  let holePath = ''
  let imageId = 0
  let netBefore = 0

  const get = async <T>(path: string): Promise<T> => {
    const res = await api.get(new URL(`/api${holePath}${path}`, baseUrl).href)
    expect(res.status(), path).toBe(200)
    return ((await res.json()) as { data: T }).data
  }
  const netCount = async () => {
    await page.getByTestId('depth-view-link').click()
    await page.getByTestId('net-count').waitFor()
    await page.waitForLoadState('networkidle').catch(() => undefined)
    return Number(await page.getByTestId('net-count').innerText())
  }

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
  })
  afterAll(async () => {
    await browser?.close()
  })

  it('signs in as the logger, opens GSQ-BH02 and notes its net count', async () => {
    await page.goto(new URL('/projects', baseUrl).href)
    await page.getByLabel('Email').fill('logger@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.getByTestId('project-link-GSQ').click()
    await page.getByTestId('hole-link-GSQ-BH02').click()
    await page.getByTestId('tab-images').waitFor()
    const match = /\/projects\/(\d+)\/holes\/(\d+)/.exec(new URL(page.url()).pathname)!
    holePath = `/projects/${match[1]}/holes/${match[2]}`
    api = page.context().request
    const token = await api.get(new URL('/api/auth/csrf', baseUrl).href)
    csrf = ((await token.json()) as { data: { csrfToken: string } }).data.csrfToken
    netBefore = await netCount()
    await page.goBack()
  })

  it('uploads the synthetic PNG from the Images tab and opens it once ready', async () => {
    await page.getByTestId('tab-images').click()
    await page.getByTestId('image-file').setInputFiles({
      name: fileName,
      mimeType: 'image/png',
      buffer: await syntheticPng(parseInt(stamp.slice(-6), 36)),
    })
    // A picture needs its depths: refused in the browser, beside the fields, before anything is sent.
    await page.getByTestId('image-upload').click()
    await page.getByTestId('image-error-topDepth').waitFor()
    await typeNumber(page.locator('#image-top'), TOP)
    await typeNumber(page.locator('#image-bottom'), BOTTOM)
    await page.getByTestId('image-upload').click()
    const row = page.locator('[data-testid^="image-"][data-status="ready"]').filter({
      hasText: fileName,
    })
    await row.waitFor({ timeout: 20_000 })
    imageId = Number((await row.getAttribute('data-testid'))!.replace('image-', ''))
    expect(await row.innerText()).toContain('360 × 1500')
    expect(await row.innerText()).toContain('Acoustic amplitude')
    await page.getByTestId(`image-open-${imageId}`).click()
    await page.getByTestId('pick-wall').waitFor()
  })

  it('picks each planted trace by clicking six points and keeps it with a type', async () => {
    const wall = page.getByTestId('pick-wall')
    // The pointer over the wall first: whatever that changes on the page has happened before the
    // wall's place is read.
    await wall.hover()
    for (const [n, s] of planted.entries()) {
      const box = (await wall.boundingBox())!
      const top = Number(await wall.getAttribute('data-top'))
      const bottom = Number(await wall.getAttribute('data-bottom'))
      for (const azimuth of clickAzimuths) {
        const depth = sinusoidDepthAt(s, azimuth)
        expect(depth).toBeGreaterThan(top)
        expect(depth).toBeLessThan(bottom)
        await page.mouse.click(
          box.x + (azimuth / 360) * box.width,
          box.y + ((depth - top) / (bottom - top)) * box.height,
        )
      }
      const trace = page.getByTestId('pick-trace')
      expect(await trace.getAttribute('data-points')).toBe(String(clickAzimuths.length))
      // The browser's fit at once, then the server's with the true orientation.
      await page.getByTestId('pick-fit').waitFor()
      await expect
        .poll(() => page.getByTestId('pick-fit-orientation').innerText(), { timeout: 10_000 })
        .toMatch(/\d+\.\d° \/ \d{3}\.\d°/)
      if (n === 0) await page.screenshot({ path: await artifactPath('image-picking-trace.png') })
      await page.getByTestId('pick-type').fill(s.type)
      await page.getByTestId('pick-type').press('Enter')
      await expect
        .poll(() => page.locator('[data-testid="pick-table"] tr[data-status="saved"]').count(), {
          timeout: 10_000,
        })
        .toBe(n + 1)
    }
    await page.screenshot({ path: await artifactPath('image-picking-three.png'), fullPage: true })
  })

  it("lists three picks whose dip and dip direction match the API's fit of the planted traces (±0.5°)", async () => {
    const picks = await get<
      { structureId: number; centreDepth: number; heightMm: number; structure: { type: string } }[]
    >(`/images/${imageId}/picks`)
    expect(picks).toHaveLength(3)
    for (const s of planted) {
      const points = Array.from({ length: 12 }, (_, k) => ({
        depth: sinusoidDepthAt(s, k * 30),
        azimuth: k * 30,
      }))
      const res = await api.post(new URL(`/api${holePath}/images/${imageId}/fit`, baseUrl).href, {
        data: { points },
        headers: { 'X-CSRF-Token': csrf },
      })
      expect(res.status()).toBe(200)
      const fit = ((await res.json()) as { data: { dip: number; dipDirection: number } }).data
      const mine = picks.find((p) => p.structure.type === s.type)!
      // The clicks were on the planted trace: its centre and height come back to the millimetre.
      expect(Math.abs(mine.centreDepth - s.depth), `${s.type} depth`).toBeLessThan(0.002)
      expect(Math.abs(mine.heightMm - s.height * 1000), `${s.type} height`).toBeLessThan(1)
      const cell = page
        .getByTestId(`pick-row-${mine.structureId}`)
        .locator('[data-field="orientation"]')
      const [dip, dipDirection] = angles(await cell.innerText())
      expect(Math.abs(dip! - fit.dip), `${s.type} dip`).toBeLessThanOrEqual(0.5)
      expect(angleGap(dipDirection!, fit.dipDirection), `${s.type} dip dir.`).toBeLessThanOrEqual(
        0.5,
      )
    }
    expect(await page.getByTestId('pick-caution').innerText()).toMatch(/competent person/)
  })

  it('shows them as image structures in GET H/structures and in the depth view net count', async () => {
    const picks = await get<{ structureId: number }[]>(`/images/${imageId}/picks`)
    const structures =
      await get<{ id: number; source: string; dip: number | null }[]>('/structures')
    for (const p of picks) {
      const s = structures.find((x) => x.id === p.structureId)
      expect(s?.source).toBe('image')
      expect(s?.dip).not.toBeNull()
    }
    await page.goto(new URL(`${holePath}?tab=images`, baseUrl).href)
    expect(await netCount()).toBe(netBefore + 3)
  })

  it('looks for candidate traces in view on request, and keeps none by itself', async () => {
    await page.goto(new URL(`${holePath}?tab=images&image=${imageId}`, baseUrl).href)
    const saved = page.locator('[data-testid="pick-table"] tr[data-status="saved"]')
    await expect.poll(() => saved.count(), { timeout: 10_000 }).toBe(3)
    await page.getByTestId('suggest-find').click()
    await page.getByTestId('suggest-summary').waitFor({ timeout: 30_000 })
    expect(await page.getByTestId('suggest-summary').innerText()).toMatch(
      /126\.00 m to 129\.00 m: (no candidate traces found|\d+ shown, 0 rejected)/,
    )
    expect(await saved.count()).toBe(3)
  })

  it('at 1024 px wide keeps the side panel beside the image, nothing wider than the window', async () => {
    await page.setViewportSize({ width: 1024, height: 768 })
    await page.goto(new URL(`${holePath}?tab=images&image=${imageId}`, baseUrl).href)
    const wall = (await page.getByTestId('pick-wall').boundingBox())!
    const table = (await page.getByTestId('pick-table').boundingBox())!
    expect(table.x).toBeGreaterThan(wall.x + wall.width)
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
      1024,
    )
    await page.screenshot({ path: await artifactPath('image-picking-1024.png') })
  })

  it('at 800 px wide (a tablet) puts the side panel under the image', async () => {
    await page.setViewportSize({ width: 800, height: 1100 })
    await page.goto(new URL(`${holePath}?tab=images&image=${imageId}`, baseUrl).href)
    // Opened from its address after a reload: the picks are there again.
    await expect
      .poll(() => page.locator('[data-testid="pick-table"] tr[data-status="saved"]').count(), {
        timeout: 10_000,
      })
      .toBe(3)
    const wall = (await page.getByTestId('pick-wall').boundingBox())!
    const table = (await page.getByTestId('pick-table').boundingBox())!
    expect(table.y).toBeGreaterThan(wall.y + wall.height)
    expect(wall.x + wall.width).toBeLessThanOrEqual(800)
    await page.screenshot({ path: await artifactPath('image-picking-tablet.png'), fullPage: true })
  })
})
