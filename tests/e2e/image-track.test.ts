import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import sharp from 'sharp'
import type { APIRequestContext, Browser, Page } from 'playwright-core'
import { mulberry32 } from '../../orient/index'
import { artifactPath, launchBrowser } from './browser'

// A small acoustic image of GSQ-BH04 66–74 m (between the demo's intervals, so no review rule is
// in the way): 360 samples a turn, 1600 rows of 5 mm, a textured wall with a dark band planted
// at 70.00–70.10 m. Uploaded through the API as the demo logger, then seen in the depth view.
const TOP = 66
const BOTTOM = 74
const WIDTH = 360
const ROWS = 1600
const BAND = [70, 70.1] as const
/** A pick posted on it: centre 72 m, 100 mm peak to trough, deepest at 090. */
const PICK = { depth: 72, height: 0.1, trough: 90 }
const JOINT = [0x2f, 0x6f, 0xb0] // the joint colour of logic/track/structure-symbols.ts

async function wallPng(): Promise<Buffer> {
  const random = mulberry32(7)
  const samples = new Uint8Array(WIDTH * ROWS)
  const step = (BOTTOM - TOP) / ROWS
  for (let r = 0; r < ROWS; r++) {
    const depth = TOP + (r + 0.5) * step
    const dark = depth >= BAND[0] && depth < BAND[1]
    for (let c = 0; c < WIDTH; c++)
      samples[r * WIDTH + c] = dark
        ? 10 + random() * 10
        : 150 + 30 * Math.sin(c / 9) * Math.cos(r / 23) + (random() - 0.5) * 40
  }
  return sharp(Buffer.from(samples), { raw: { width: WIDTH, height: ROWS, channels: 1 } })
    .toColourspace('b-w')
    .png()
    .toBuffer()
}

/**
 * Reads the image track's canvas in the page: the depth window it shows (from its label), the mean
 * luma of the canvas row at each depth asked for, the number of distinct colours along a row, the
 * alpha at a point, and for each trace point the smallest colour distance to `colour` within a few
 * pixels of it.
 */
function readWall(
  page: Page,
  ask: { rows: number[]; textureAt: number; traces: { azimuth: number; depth: number }[] },
) {
  return page.evaluate(
    ({ rows, textureAt, traces, colour }) => {
      const canvas = document.querySelector<HTMLCanvasElement>('[data-track="image-wall"] canvas')!
      const [from, to] = (canvas.getAttribute('aria-label')?.match(/[\d.]+/g) ?? []).map(Number)
      const { width, height } = canvas
      const data = canvas.getContext('2d')!.getImageData(0, 0, width, height).data
      const yOf = (d: number) => Math.round(((d - from) / (to - from)) * height)
      const at = (x: number, y: number) => {
        const i =
          (Math.max(0, Math.min(height - 1, y)) * width + Math.max(0, Math.min(width - 1, x))) * 4
        return [data[i], data[i + 1], data[i + 2], data[i + 3]]
      }
      const luma = rows.map((d) => {
        let sum = 0
        for (let x = 0; x < width; x++) {
          const [r, g, b] = at(x, yOf(d))
          sum += 0.299 * r + 0.587 * g + 0.114 * b
        }
        return sum / width
      })
      const colours = new Set<string>()
      for (let x = 0; x < width; x += 3) colours.add(at(x, yOf(textureAt)).join(','))
      const near = traces.map((t) => {
        const x0 = Math.round((t.azimuth / 360) * width)
        let best = Infinity
        for (let dy = -3; dy <= 3; dy++)
          for (let dx = -2; dx <= 2; dx++) {
            const [r, g, b] = at(x0 + dx, yOf(t.depth) + dy)
            best = Math.min(best, Math.hypot(r - colour[0], g - colour[1], b - colour[2]))
          }
        return best
      })
      return { from, to, luma, colours: colours.size, alpha: at(10, yOf(textureAt))[3], near }
    },
    { ...ask, colour: JOINT },
  )
}

const nothing = { rows: [], textureAt: 0, traces: [] }

describe('image track: a televiewer image of GSQ-BH04 drawn in the depth view', () => {
  const baseUrl = inject('baseUrl')
  let browser: Browser
  let page: Page
  let api: APIRequestContext
  let csrf = ''
  let holePath = ''
  let imageId = 0

  beforeAll(async () => {
    browser = await launchBrowser()
    page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
    await page.goto(new URL('/projects', baseUrl).href)
    await page.getByLabel('Email').fill('logger@greyscar.test')
    await page.locator('#sign-in-password').fill('downdip-demo')
    await page.getByTestId('sign-in-submit').click()
    await page.getByTestId('project-link-GSQ').waitFor()
    api = page.context().request
    const token = await api.get(new URL('/api/auth/csrf', baseUrl).href)
    csrf = ((await token.json()) as { data: { csrfToken: string } }).data.csrfToken
    const projects = (await (await api.get(new URL('/api/projects', baseUrl).href)).json()) as {
      data: { id: number; code: string }[]
    }
    const project = projects.data.find((p) => p.code === 'GSQ')!.id
    const holes = (await (
      await api.get(new URL(`/api/projects/${project}/holes`, baseUrl).href)
    ).json()) as { data: { id: number; name: string }[] }
    holePath = `/projects/${project}/holes/${holes.data.find((h) => h.name === 'GSQ-BH04')!.id}`
  })

  afterAll(async () => {
    if (imageId)
      await api.delete(new URL(`/api${holePath}/images/${imageId}`, baseUrl).href, {
        headers: { 'X-CSRF-Token': csrf },
      })
    await browser?.close()
  })

  it('POST H/images as the logger stores the strip, tiled at once (201, ready)', async () => {
    const res = await api.post(new URL(`/api${holePath}/images`, baseUrl).href, {
      headers: { 'X-CSRF-Token': csrf },
      multipart: {
        file: {
          name: `gsq-bh04-amp-${Date.now()}.png`,
          mimeType: 'image/png',
          buffer: await wallPng(),
        },
        topDepth: String(TOP),
        bottomDepth: String(BOTTOM),
        azimuthReference: 'north',
        northReference: 'true',
        kind: 'amplitude',
        diameterMm: '96',
        confirmDuplicate: 'true',
      },
    })
    expect(res.status(), await res.text()).toBe(201)
    const image = ((await res.json()) as { data: { id: number; status: string; height: number } })
      .data
    expect(image.status).toBe('ready')
    expect(image.height).toBe(ROWS)
    imageId = image.id
    const points = [20, 80, 140, 200, 260, 320].map((az) => ({
      azimuth: az,
      depth: PICK.depth + (PICK.height / 2) * Math.cos(((az - PICK.trough) * Math.PI) / 180),
    }))
    const pick = await api.post(new URL(`/api${holePath}/images/${imageId}/picks`, baseUrl).href, {
      headers: { 'X-CSRF-Token': csrf },
      data: { points, type: 'joint' },
    })
    expect(pick.status(), await pick.text()).toBe(201)
  })

  it('the depth view shows the image track with an N E S W scale from true north', async () => {
    await page.goto(new URL(`${holePath}/depth`, baseUrl).href)
    const track = page.locator('[data-track="image-wall"]')
    await track.locator('canvas').waitFor()
    const letters = await track.getByTestId('image-azimuth-letter').allTextContents()
    expect(letters.map((l) => l.trim())).toEqual(['N', 'E', 'S', 'W'])
    expect(await track.getByTestId('image-azimuth-reference').textContent()).toBe('from true north')
    await expect(page.getByTestId('image-colour-map').isVisible()).resolves.toBe(true)
  })

  it('zoomed in at 70 m it draws the wall: textured, the planted band dark, the pick on its trace', async () => {
    const canvas = page.locator('[data-track="image-wall"] canvas')
    await canvas.scrollIntoViewIfNeeded()
    let view = await readWall(page, nothing)
    // Wheel over the image at 70 m until the view spans under 12 m.
    for (let i = 0; i < 6 && view.to - view.from > 12; i++) {
      const box = (await canvas.boundingBox())!
      const y = box.y + ((70 - view.from) / (view.to - view.from)) * box.height
      await page.mouse.move(box.x + box.width / 2, y)
      await page.mouse.wheel(0, -400)
      await page.waitForTimeout(150)
      view = await readWall(page, nothing)
    }
    expect(view.to - view.from).toBeLessThan(12)
    // Drag the depth ruler up to bring 71 m (between the band and the pick) to the middle.
    const ruler = (await page.getByTestId('track-depth-axis').boundingBox())!
    const box = (await canvas.boundingBox())!
    const metres = 71 - (view.from + view.to) / 2
    const pixels = (metres / (view.to - view.from)) * box.height
    await page.mouse.move(ruler.x + ruler.width / 2, box.y + box.height / 2)
    await page.mouse.down()
    await page.mouse.move(ruler.x + ruler.width / 2, box.y + box.height / 2 - pixels, { steps: 5 })
    await page.mouse.up()
    view = await readWall(page, nothing)
    expect(view.from).toBeLessThan(69.8)
    expect(view.to).toBeGreaterThan(72.2)
    const ask = {
      rows: [69.9, 70.05, 70.2, 71],
      textureAt: 68.3,
      // The pick's trace: deepest at 090, shallowest at 270.
      traces: [
        { azimuth: 90, depth: PICK.depth + PICK.height / 2 },
        { azimuth: 270, depth: PICK.depth - PICK.height / 2 },
      ],
    }
    // Tiles arrive, then the contrast settles on what is shown: wait until the band is drawn.
    let wall = await readWall(page, ask)
    await expect
      .poll(
        async () => {
          wall = await readWall(page, ask)
          return wall.luma[3] - wall.luma[1]
        },
        { timeout: 10_000 },
      )
      .toBeGreaterThan(60)
    await page.screenshot({ path: await artifactPath('image-track.png'), fullPage: true })
    // Not blank: the textured wall has many distinct colours, opaque inside the strip.
    expect(wall.colours).toBeGreaterThan(20)
    expect(wall.alpha).toBe(255)
    // The dark band sits at its depth on the shared scale, within a pixel or two of it.
    expect(wall.luma[1]).toBeLessThan(40)
    expect(wall.luma[0]).toBeGreaterThan(80)
    expect(wall.luma[2]).toBeGreaterThan(80)
    // The pick drawn in the joint colour along its trace.
    expect(wall.near[0]).toBeLessThan(30)
    expect(wall.near[1]).toBeLessThan(30)
  })

  it('the moving-window contrast redraws the strip, the band still dark against its window', async () => {
    const ask = { rows: [70.05, 71, 68.3, 72.6], textureAt: 68.3, traces: [] }
    const before = await readWall(page, ask)
    await page.getByTestId('image-contrast').getByText('Moving window').click()
    await expect
      .poll(
        async () => {
          const wall = await readWall(page, ask)
          const redrawn =
            Math.abs(wall.luma[2] - before.luma[2]) + Math.abs(wall.luma[3] - before.luma[3]) > 3
          return redrawn ? wall.luma[1] - wall.luma[0] : 0
        },
        { timeout: 10_000 },
      )
      .toBeGreaterThan(60)
  })

  it('on a 1024 px tablet one finger pans the image track and two fingers pinch it to zoom', async () => {
    const context = await browser.newContext({
      storageState: await page.context().storageState(),
      viewport: { width: 1024, height: 768 },
      hasTouch: true,
    })
    const tablet = await context.newPage()
    await tablet.goto(new URL(`${holePath}/depth`, baseUrl).href)
    const canvas = tablet.locator('[data-track="image-wall"] canvas')
    await canvas.waitFor()
    await canvas.scrollIntoViewIfNeeded()
    const box = (await canvas.boundingBox())!
    const cdp = await context.newCDPSession(tablet)
    const touch = (
      type: 'touchStart' | 'touchMove' | 'touchEnd',
      points: { x: number; y: number }[],
    ) =>
      cdp.send('Input.dispatchTouchEvent', {
        type,
        touchPoints: points.map((p, id) => ({ x: box.x + p.x, y: box.y + p.y, id })),
      })
    const view = async () => {
      const label = (await canvas.getAttribute('aria-label')) ?? ''
      const [from, to] = (label.match(/[\d.]+/g) ?? []).map(Number)
      return { from, to }
    }
    // Zoom in a little first (pinch out), so there is room to pan both ways.
    const before = await view()
    const cx = box.width / 2
    const cy = box.height / 2
    await touch('touchStart', [
      { x: cx, y: cy - 50 },
      { x: cx, y: cy + 50 },
    ])
    for (let i = 1; i <= 5; i++)
      await touch('touchMove', [
        { x: cx, y: cy - 50 - i * 10 },
        { x: cx, y: cy + 50 + i * 10 },
      ])
    await touch('touchEnd', [])
    const zoomed = await view()
    // Fingers 100 → 200 px apart: the span halves.
    expect((zoomed.to - zoomed.from) / (before.to - before.from)).toBeCloseTo(0.5, 1)
    // One finger up 100 px: the view moves 100 px worth deeper.
    await touch('touchStart', [{ x: cx, y: cy + 50 }])
    for (let i = 1; i <= 5; i++) await touch('touchMove', [{ x: cx, y: cy + 50 - i * 20 }])
    await touch('touchEnd', [])
    const panned = await view()
    const perPx = (zoomed.to - zoomed.from) / box.height
    expect(panned.from - zoomed.from).toBeCloseTo(100 * perPx, 1)
    expect(panned.to - panned.from).toBeCloseTo(zoomed.to - zoomed.from, 6)
    await tablet.screenshot({ path: await artifactPath('image-track-tablet.png') })
    await context.close()
  })
})
