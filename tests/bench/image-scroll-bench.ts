/**
 * Scrolling and zooming the depth view of a hole with a 300 m televiewer image (150,000 rows ×
 * 360 samples), in Chromium, through the real app and API against PostgreSQL: the depth ruler is
 * dragged (pan) and wheeled (zoom) as a hand would, and the frames in which the image canvas
 * was drawn anew are counted (requestAnimationFrame ticks with a changed canvas). Baseline, same
 * run: the same page and gestures with the image track left out (the images list answered empty),
 * counting the frames in which the tracks moved. Target ≥ 30 fps. Prints figures, exits 0.
 * Needs BENCH_DATABASE_URL (npm run bench makes a throwaway one). Run: npx tsx tests/bench/image-scroll-bench.ts
 */
import { mkdtemp, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { AddressInfo } from 'node:net'
import express from 'express'
import { build } from 'vite'
import type { CDPSession, Page } from 'playwright-core'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { runMigrations } from '../../backend/src/db/migrate'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { launchBrowser } from '../e2e/browser'
import { BENCH_USER, dropBenchData, seedBenchHole } from './image-scroll-fixture'

const url = process.env.BENCH_DATABASE_URL
if (!url) throw new Error('BENCH_DATABASE_URL is not set: run through `npm run bench`.')
const { db, pool } = createDb(url, 6)
await runMigrations(db)
const t0 = performance.now()
const ids = await seedBenchHole(db)
const seeded = (performance.now() - t0) / 1000

// The app as built for production, served from a folder of its own so no other build is touched.
const outDir = await mkdtemp(join(tmpdir(), 'downdip-image-bench-'))
await build({
  configFile: fileURLToPath(new URL('../../frontend/vite.config.ts', import.meta.url)),
  logLevel: 'warn',
  build: { outDir, emptyOutDir: true },
})
const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: url })
const log = createLogger('silent')
const outer = express()
outer.use(express.static(outDir, { index: false }))
outer.get(/^(?!\/api\/).*/, (_req, res) => res.sendFile('index.html', { root: outDir }))
outer.use(createApp({ db, pool, env, logger: log, mail: createMailer(env, log) }))
const server = outer.listen(0, '127.0.0.1')
await new Promise<void>((resolve) => server.once('listening', resolve))
const origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`

/**
 * Counts, per animation frame, whether the image canvas was drawn or the ruler moved. Plain JS
 * in a string: the page runs it as written (a compiled function would carry tsx's helpers).
 */
const instrument = `
(() => {
  const b = { draws: 0, seen: 0, ruler: '', running: false, ticks: [], drawn: [], moved: [] }
  window.__bench = b
  const clear = CanvasRenderingContext2D.prototype.clearRect
  // Every ImageCanvas frame starts by clearing the whole canvas.
  CanvasRenderingContext2D.prototype.clearRect = function (...args) {
    if (this.canvas instanceof HTMLCanvasElement && this.canvas.closest('[data-track="image-wall"]')) b.draws++
    return clear.apply(this, args)
  }
  let chain = 0
  const tick = (t, own) => {
    // One chain of ticks at a time: a new start ends the one before.
    if (!b.running || own !== chain) return
    b.ticks.push(t)
    if (b.draws !== b.seen) {
      b.drawn.push(t)
      b.seen = b.draws
    }
    const label = document.querySelector('[data-testid="track-depth-axis"] text.label')
    const key = (label && label.textContent) + '@' + (label && label.getAttribute('y'))
    if (key !== b.ruler) {
      b.moved.push(t)
      b.ruler = key
    }
    requestAnimationFrame((next) => tick(next, own))
  }
  b.start = () => {
    Object.assign(b, { ticks: [], drawn: [], moved: [], running: true })
    const own = ++chain
    requestAnimationFrame((t) => tick(t, own))
  }
})()
`

interface Phase {
  seconds: number
  /** Share of the phase the page's main thread was busy, and of that in script (CDP metrics). */
  busy: number
  script: number
  ticksPerSecond: number
  drawnPerSecond: number
  movedPerSecond: number
  p95: number
}

async function metrics(cdp: CDPSession) {
  const { metrics: list } = (await cdp.send('Performance.getMetrics')) as {
    metrics: { name: string; value: number }[]
  }
  const get = (name: string) => list.find((m) => m.name === name)?.value ?? 0
  return { task: get('TaskDuration'), script: get('ScriptDuration') }
}

async function measure(page: Page, cdp: CDPSession, gesture: () => Promise<void>): Promise<Phase> {
  const m0 = await metrics(cdp)
  await page.evaluate(() => (window as unknown as { __bench: { start(): void } }).__bench.start())
  const from = performance.now()
  await gesture()
  await page.waitForTimeout(50)
  const seconds = (performance.now() - from) / 1000
  const m1 = await metrics(cdp)
  const b = await page.evaluate(() => {
    const s = (
      window as unknown as {
        __bench: { running: boolean; ticks: number[]; drawn: number[]; moved: number[] }
      }
    ).__bench
    s.running = false
    return { ticks: s.ticks, drawn: s.drawn, moved: s.moved }
  })
  const gaps = b.ticks
    .slice(1)
    .map((t, i) => t - b.ticks[i])
    .sort((x, y) => x - y)
  return {
    seconds,
    busy: (m1.task - m0.task) / seconds,
    script: (m1.script - m0.script) / seconds,
    ticksPerSecond: b.ticks.length / seconds,
    drawnPerSecond: b.drawn.length / seconds,
    movedPerSecond: b.moved.length / seconds,
    p95: gaps[Math.floor(gaps.length * 0.95)] ?? 0,
  }
}

async function session(withImage: boolean) {
  const page = await browser.newPage({ viewport: { width: 1366, height: 900 } })
  await page.addInitScript({ content: instrument })
  const cdp = await page.context().newCDPSession(page)
  await cdp.send('Performance.enable')
  page.on('pageerror', (e) => console.error(`page error: ${e.message}`))
  let tiles = 0
  let tileBytes = 0
  page.on('response', (r) => {
    if (!r.url().includes('/tiles/')) return
    tiles++
    void r
      .body()
      .then((b) => (tileBytes += b.length))
      .catch(() => {})
  })
  if (!withImage)
    await page.route(/\/images$/, (route) =>
      route.fulfill({
        status: 200,
        contentType: 'application/json',
        body: '{"data":[],"meta":{"count":0}}',
      }),
    )
  await page.goto(`${origin}/projects`)
  await page.getByLabel('Email').fill(BENCH_USER.email)
  await page.locator('#sign-in-password').fill(BENCH_USER.password)
  await page.getByTestId('sign-in-submit').click()
  await page.getByTestId('project-link-IMB').waitFor()
  await page.goto(`${origin}/projects/${ids.project}/holes/${ids.hole}/depth`)
  const ruler = page.getByTestId('track-depth-axis')
  await ruler.waitFor().catch(async (err: unknown) => {
    await page.screenshot({ path: join(tmpdir(), 'downdip-image-bench-failed.png') })
    throw err
  })
  if (withImage) await page.locator('[data-track="image-wall"] canvas').waitFor()
  await ruler.scrollIntoViewIfNeeded()
  const box = (await ruler.boundingBox())!
  const x = box.x + box.width / 2
  const plotTop = box.y + 48
  const plotHeight = box.height - 48
  // Zoom to about 20 m at 20 m depth, the scale a log is read at, and let the first tiles land.
  await page.mouse.move(x, plotTop + (20 / 320) * plotHeight)
  for (let i = 0; i < 3; i++) {
    await page.mouse.wheel(0, -600)
    await page.waitForTimeout(100)
  }
  await page.waitForTimeout(1500)
  const drag = async (dy: number) => {
    const y0 = dy < 0 ? plotTop + plotHeight - 20 : plotTop + 20
    await page.mouse.move(x, y0)
    await page.mouse.down()
    // A move every 8 ms, not awaited one by one: Chromium merges those within a frame, as it
    // does for a real mouse.
    const moves: Promise<void>[] = []
    for (let i = 1; i <= 190; i++) {
      moves.push(page.mouse.move(x, y0 + (dy * i) / 190))
      await new Promise((resolve) => setTimeout(resolve, 8))
    }
    await Promise.all(moves)
    await page.mouse.up()
  }
  // Cold: down the hole onto depths never drawn; warm: back up over the same depths.
  const cold = await measure(page, cdp, () => drag(-(plotHeight - 40)))
  const warm = await measure(page, cdp, () => drag(plotHeight - 40))
  const zoom = await measure(page, cdp, async () => {
    await page.mouse.move(x, plotTop + plotHeight / 2)
    const wheels: Promise<void>[] = []
    for (let i = 0; i < 180; i++) {
      wheels.push(page.mouse.wheel(0, i < 90 ? 25 : -25))
      await new Promise((resolve) => setTimeout(resolve, 16))
    }
    await Promise.all(wheels)
  })
  await page.close()
  return { cold, warm, zoom, tiles, tileBytes }
}

const browser = await launchBrowser()
const f1 = (v: number) => v.toFixed(1)
try {
  // Two rounds, alternating, so a busy moment of the machine falls on both sides alike; the
  // figures are the means of the two.
  const rounds = [
    await session(true),
    await session(false),
    await session(true),
    await session(false),
  ]
  const mean = (a: Awaited<ReturnType<typeof session>>, b: Awaited<ReturnType<typeof session>>) => {
    const avg = (p: Phase, q: Phase): Phase => ({
      seconds: (p.seconds + q.seconds) / 2,
      busy: (p.busy + q.busy) / 2,
      script: (p.script + q.script) / 2,
      ticksPerSecond: (p.ticksPerSecond + q.ticksPerSecond) / 2,
      drawnPerSecond: (p.drawnPerSecond + q.drawnPerSecond) / 2,
      movedPerSecond: (p.movedPerSecond + q.movedPerSecond) / 2,
      p95: Math.max(p.p95, q.p95),
    })
    return {
      cold: avg(a.cold, b.cold),
      warm: avg(a.warm, b.warm),
      zoom: avg(a.zoom, b.zoom),
      tiles: (a.tiles + b.tiles) / 2,
      tileBytes: (a.tileBytes + b.tileBytes) / 2,
    }
  }
  const image = mean(rounds[0], rounds[2])
  const base = mean(rounds[1], rounds[3])
  console.log(
    `\nDepth view of a 320 m hole with a 300 m image (150,000 rows × 360, ${ids.levels} levels)`,
  )
  console.log(`  seeded (render, pyramid, tiles into PostgreSQL) in ${f1(seeded)} s`)
  console.log(
    `  tiles fetched per session ${image.tiles} (${f1(image.tileBytes / 1e6)} MB deflated); means of 2 rounds, 95th pct gap the worse`,
  )
  for (const [name, key] of [
    ['pan down, tiles cold', 'cold'],
    ['pan back up, tiles warm', 'warm'],
    ['zoom out 15× and back', 'zoom'],
  ] as const) {
    const a = image[key]
    const b = base[key]
    console.log(`  ${name} (${f1(a.seconds)} s)`)
    console.log(
      `    image track drawn        ${f1(a.drawnPerSecond)} fps   (target ≥ 30; tracks moved ${f1(a.movedPerSecond)}/s, page frames ${f1(a.ticksPerSecond)}/s, 95th pct gap ${f1(a.p95)} ms)`,
    )
    console.log(
      `    baseline, no image track ${f1(b.movedPerSecond)} fps   (tracks moved; page frames ${f1(b.ticksPerSecond)}/s, 95th pct gap ${f1(b.p95)} ms)`,
    )
    console.log(`    ratio image / baseline   ${(a.drawnPerSecond / b.movedPerSecond).toFixed(2)}`)
    const pct = (v: number) => `${Math.round(v * 100)} %`
    console.log(
      `    main thread busy         ${pct(a.busy)} with the image (script ${pct(a.script)}), ${pct(b.busy)} without (script ${pct(b.script)})`,
    )
  }
} finally {
  await browser.close()
  server.close()
  await dropBenchData(db)
  await pool.end()
  await rm(outDir, { recursive: true, force: true })
}
