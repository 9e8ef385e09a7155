/**
 * Drawing speed of the engineer's screens in Chromium: (a) an interval net of 20,000 structures with
 * density contours, timed from handing the data to the component until the frame is painted
 * (target < 100 ms); (b) brushing the depth view of a hole with thousands of structures, in frames
 * per second while the brush is dragged and the linked net follows (target > 30 fps). Prints
 * figures, exits 0. The components are mounted on a bench page built here by Vite from a virtual
 * entry (nothing is written into the repository). Run: npx tsx tests/bench/browser-bench.ts
 */
import { createServer } from 'node:http'
import { mkdtemp, readFile, rm } from 'node:fs/promises'
import { tmpdir } from 'node:os'
import { extname, join } from 'node:path'
import { fileURLToPath } from 'node:url'
import type { AddressInfo } from 'node:net'
import { build, type Plugin } from 'vite'
import vue from '@vitejs/plugin-vue'
import { launchBrowser } from '../e2e/browser'

const frontend = fileURLToPath(new URL('../../frontend/', import.meta.url))
const NET_SIZE = 20_000
const HOLE_SIZES = [5_000, 20_000]

/**
 * The bench page (plain JS, compiled by Vite with the app's own components): seeded structures in
 * four Fisher-scattered sets, an interval net, and a depth view harness (tracks + linked net,
 * wired as DepthView wires them).
 */
const benchEntry = `
import { createApp, defineComponent, h, markRaw, nextTick, reactive, ref, shallowRef, watch } from 'vue'
import PrimeVue from 'primevue/config'
import ToastService from 'primevue/toastservice'
import '@fontsource/fira-sans/400.css'
import '@fontsource/fira-sans/500.css'
import '@fontsource/fira-sans/600.css'
import './src/assets/base.css'
import { DowndipPreset } from './src/assets/preset'
import { densityGrid } from '../orient/index'
import NetPlot from './src/components/net/NetPlot.vue'
import NetBrushPanel from './src/components/net/NetBrushPanel.vue'
import TrackPanel from './src/components/track/TrackPanel.vue'
import { useDepthAxis } from './src/composables/use-depth-axis'
import { useDepthFilters } from './src/composables/use-depth-filters'
import { useDepthFollow } from './src/composables/use-depth-follow'

function seeded(seed) {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = Math.imul(a ^ (a >>> 15), a | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}
const D = Math.PI / 180
const SETS = [
  { type: 'bedding', dd: 165, dip: 12, kappa: 80 },
  { type: 'joint', dd: 195, dip: 48, kappa: 35 },
  { type: 'joint', dd: 110, dip: 82, kappa: 30 },
  { type: 'fault', dd: 290, dip: 71, kappa: 20 },
]
/** A pole drawn from a Fisher distribution about the set's pole (Fisher et al. 1987, 3.6). */
function draw(random) {
  const s = SETS[Math.floor(random() * SETS.length)]
  const t = (s.dd + 180) * D
  const p = (90 - s.dip) * D
  const m = [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), -Math.sin(p)]
  const a = [Math.cos(t), -Math.sin(t), 0]
  const b = [m[1] * a[2] - m[2] * a[1], m[2] * a[0] - m[0] * a[2], m[0] * a[1] - m[1] * a[0]]
  const u = random()
  const w = 1 + Math.log(u + (1 - u) * Math.exp(-2 * s.kappa)) / s.kappa
  const th = Math.acos(Math.max(-1, Math.min(1, w)))
  const ph = 2 * Math.PI * random()
  let v = [0, 1, 2].map((k) => Math.cos(th) * m[k] + Math.sin(th) * (Math.cos(ph) * a[k] + Math.sin(ph) * b[k]))
  if (v[2] > 0) v = v.map((x) => -x)
  const plunge = Math.asin(-v[2]) / D
  const trend = ((Math.atan2(v[0], v[1]) / D) % 360 + 360) % 360
  return { type: s.type, trend, plunge, dip: 90 - plunge, dipDirection: (trend + 180) % 360 }
}
function makePoles(n, seed) {
  const random = seeded(seed)
  return Array.from({ length: n }, (_, i) => {
    const d = draw(random)
    return { id: i + 1, trend: d.trend, plunge: d.plunge, dip: d.dip, dipDirection: d.dipDirection,
      group: SETS.findIndex((s) => s.type === d.type), flagged: random() < 0.04, weight: 1 + random() * 2 }
  })
}
function makeStructures(n, length) {
  const random = seeded(42)
  return Array.from({ length: n }, (_, i) => {
    const d = draw(random)
    const oriented = random() > 0.03
    return { id: i + 1, depth: (i + random()) * (length / n), type: d.type, source: random() < 0.3 ? 'image' : 'core',
      alpha: 40, beta: oriented ? 100 : null, dip: oriented ? d.dip : null, dipDirection: oriented ? d.dipDirection : null,
      poleTrend: oriented ? d.trend : null, polePlunge: oriented ? d.plunge : null, holeTrend: 10, holePlunge: 60,
      terzaghiWeight: 1 + random() * 2, flags: random() < 0.05 ? ['beta-jump'] : [], confidence: 'high', comment: null }
  })
}
const frame = () => new Promise((r) => requestAnimationFrame(() => setTimeout(r, 0)))
const HOLE = { trend: 10, plunge: 60 }
const CONTOURS = { method: 'kamb', step: 'auto', weighted: true }
const mode = new URLSearchParams(location.search).get('mode')
const n = Number(new URLSearchParams(location.search).get('n') ?? 5000)
const net = reactive({ poles: markRaw([]), projection: 'equal-area' })
const setMarks = SETS.map((s, i) => ({ id: i + 1, name: 'S' + (i + 1), colour: ['#d0602c', '#2f79b5', '#8e58b3', '#3a965b'][i],
  centre: { trend: (s.dd + 180) % 360, plunge: 90 - s.dip }, coneAngle: 20, meanPole: { trend: (s.dd + 180) % 360, plunge: 90 - s.dip }, alpha95: 1.5 }))

const NetHost = defineComponent({
  setup: () => () => h('div', { style: 'width: 560px' }, [h(NetPlot, { poles: net.poles, projection: net.projection,
    contours: CONTOURS, hole: HOLE, sets: setMarks })]),
})

const DepthHost = defineComponent({
  setup() {
    const structures = shallowRef(makeStructures(n, 250))
    const runs = Array.from({ length: 84 }, (_, i) => ({ id: i + 1, fromDepth: i * 3, toDepth: i * 3 + 3, markConfidence: 'good',
      metrics: { tcr: 95, scr: 85, rqd: 60 + (i % 30), frequency: 2 + (i % 7), rqdClass: 'fair' } }))
    const brush = ref(null)
    const live = ref(false)
    const axis = useDepthAxis(() => [0, 250])
    axis.reset()
    const filters = useDepthFilters(structures, useDepthFollow(brush))
    watch(brush, () => updates.push(performance.now()), { flush: 'post' })
    watch(() => filters.poles.value, () => netUpdates.push(performance.now()), { flush: 'post' })
    return () => h('div', { style: 'display: flex; gap: 12px; padding: 12px' }, [
      h(TrackPanel, { domain: axis.domain.value, height: 640, core: filters.coreTrack.value, image: filters.imageTrack.value,
        showImage: filters.hasImage.value, depths: filters.depths.value, runs, curves: [], intervals: [], brush: brush.value,
        selectedId: null, marker: null, onBrush: (r, final) => { live.value = !final; brush.value = r }, onZoom: axis.zoomAt, onPan: axis.panBy }),
      h('div', { style: 'width: 380px; flex: none' }, [h(NetBrushPanel, { poles: filters.poles.value, projection: 'equal-area',
        weighted: true, hole: HOLE, rangeLabel: '', unoriented: filters.unoriented.value, highlight: null, fileName: 'bench', live: live.value })]),
    ])
  },
})

let ticks = []
let updates = []
let netUpdates = []
let running = false
function tick(t) {
  if (!running) return
  ticks.push(t)
  requestAnimationFrame(tick)
}
window.bench = {
  async drawNet(count, seed, projection) {
    const poles = makePoles(count, seed)
    await frame()
    const t0 = performance.now()
    net.poles = markRaw(poles)
    net.projection = projection
    await nextTick()
    await frame()
    return performance.now() - t0
  },
  densityOnly(count) {
    const poles = makePoles(count, 99)
    const t0 = performance.now()
    densityGrid(poles, { method: 'kamb', weights: poles.map((p) => p.weight) })
    return performance.now() - t0
  },
  startFrames() {
    ticks = []
    updates = []
    netUpdates = []
    running = true
    requestAnimationFrame(tick)
  },
  stopFrames() {
    running = false
    const first = updates[0] ?? ticks[0]
    const last = updates[updates.length - 1] ?? ticks[ticks.length - 1]
    const inside = ticks.filter((t) => t >= first && t <= last)
    const gaps = inside.slice(1).map((t, i) => t - inside[i]).sort((a, b) => a - b)
    const seconds = (last - first) / 1000
    return {
      seconds,
      fps: (inside.length - 1) / seconds,
      updatesPerSecond: updates.length / seconds,
      netPerSecond: netUpdates.filter((t) => t <= last + 100).length / seconds,
      medianFrame: gaps[Math.floor(gaps.length / 2)] ?? 0,
      p95Frame: gaps[Math.floor(gaps.length * 0.95)] ?? 0,
      lastCount: Number(document.querySelector('[data-testid="net-count"]')?.textContent ?? 0),
    }
  },
}
const app = createApp(mode === 'depth' ? DepthHost : NetHost)
app.use(PrimeVue, { theme: { preset: DowndipPreset, options: { darkModeSelector: '.app-dark', cssLayer: false } } })
app.use(ToastService)
app.mount('#app')
`

/** The bench page's entry as a virtual module, resolved from frontend/ like the app's own code. */
function virtualEntry(): Plugin {
  const id = 'virtual:browser-bench'
  return {
    name: 'browser-bench-entry',
    resolveId: (source) => (source === id ? join(frontend, '__browser-bench.js') : undefined),
    load: (path) => (path === join(frontend, '__browser-bench.js') ? benchEntry : undefined),
  }
}

const outDir = await mkdtemp(join(tmpdir(), 'downdip-browser-bench-'))
await build({
  configFile: false,
  root: frontend,
  logLevel: 'warn',
  plugins: [vue(), virtualEntry()],
  build: {
    outDir,
    emptyOutDir: true,
    cssCodeSplit: false,
    rollupOptions: {
      input: 'virtual:browser-bench',
      output: { entryFileNames: 'bench.js', assetFileNames: '[name]-[hash][extname]' },
    },
  },
})

const types: Record<string, string> = {
  '.js': 'text/javascript',
  '.css': 'text/css',
  '.woff2': 'font/woff2',
  '.woff': 'font/woff',
}
const { readdir } = await import('node:fs/promises')
const css = (await readdir(outDir)).filter((f) => f.endsWith('.css'))
const html = `<!doctype html><html><head><meta charset="utf-8">${css
  .map((f) => `<link rel="stylesheet" href="/${f}">`)
  .join(
    '',
  )}</head><body><div id="app"></div><script type="module" src="/bench.js"></script></body></html>`
const server = createServer(async (req, res) => {
  const path = (req.url ?? '/').split('?')[0]
  if (path === '/') {
    res.writeHead(200, { 'Content-Type': 'text/html' }).end(html)
    return
  }
  try {
    const body = await readFile(join(outDir, path.slice(1)))
    res.writeHead(200, { 'Content-Type': types[extname(path)] ?? 'application/octet-stream' })
    res.end(body)
  } catch {
    res.writeHead(404).end()
  }
})
await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve))
const origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`

const browser = await launchBrowser()
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]
const f1 = (x: number) => x.toFixed(1)

try {
  // (a) The interval net: 20,000 poles, Kamb contours (Terzaghi-weighted), blind zone, set marks.
  const page = await browser.newPage({ viewport: { width: 1200, height: 900 } })
  await page.goto(`${origin}/?mode=net`)
  await page.waitForFunction(() => 'bench' in window)
  const runs: number[] = []
  for (let i = 0; i < 12; i++) {
    const projection = i % 2 ? 'equal-angle' : 'equal-area'
    runs.push(
      await page.evaluate(
        ([n, seed, p]) => window.bench.drawNet(n as number, seed as number, p as string),
        [NET_SIZE, i + 1, projection],
      ),
    )
  }
  const density = await page.evaluate((n) => window.bench.densityOnly(n), NET_SIZE)
  const drawn = await page.evaluate(() => document.querySelectorAll('svg.net-plot path').length)
  await page.close()

  console.log(`\nInterval net of ${NET_SIZE.toLocaleString('en')} structures with contours`)
  console.log(`  first draw (cold)                   ${f1(runs[0])} ms`)
  console.log(
    `  median of the next ${runs.length - 1} draws          ${f1(median(runs.slice(1)))} ms   (target < 100 ms)`,
  )
  console.log(
    `  range                               ${f1(Math.min(...runs.slice(1)))}–${f1(Math.max(...runs.slice(1)))} ms`,
  )
  console.log(
    `  of which orient densityGrid         ${f1(density)} ms   (${drawn} SVG paths on the net)`,
  )

  // (b) Brushing the depth view: tracks + linked net (Kamb, Terzaghi-weighted) on one page.
  for (const n of HOLE_SIZES) {
    const depth = await browser.newPage({ viewport: { width: 1300, height: 900 } })
    await depth.goto(`${origin}/?mode=depth&n=${n}`)
    await depth.waitForFunction(() => 'bench' in window)
    await depth.locator('[data-track="core"] svg').waitFor()
    const box = (await depth.locator('[data-track="core"] svg').boundingBox())!
    const x = box.x + box.width * 0.6
    const top = box.y + 48 + 20
    await depth.evaluate(() => window.bench.startFrames())
    await depth.mouse.move(x, top)
    await depth.mouse.down()
    // Moves every 8 ms as a hand would make them, without waiting for each to be handled:
    // Chromium merges the moves that arrive within a frame, as it does for a real mouse.
    const steps = 150
    const moves: Promise<void>[] = []
    for (let i = 1; i <= steps; i++) {
      moves.push(depth.mouse.move(x, top + i * 3))
      await new Promise((resolve) => setTimeout(resolve, 8))
    }
    await Promise.all(moves)
    await depth.mouse.up()
    const r = await depth.evaluate(() => window.bench.stopFrames())
    await depth.close()
    console.log(`\nBrushing the depth view of a hole with ${n.toLocaleString('en')} structures`)
    console.log(
      `  drag of ${steps} pointer moves over ${f1(r.seconds)} s, brush growing to ${r.lastCount} structures on the net`,
    )
    console.log(`  frames painted per second           ${f1(r.fps)} fps   (target > 30 fps)`)
    console.log(`  brush positions shown per second    ${f1(r.updatesPerSecond)}`)
    console.log(`  linked net redraws per second       ${f1(r.netPerSecond)}`)
    console.log(`  frame interval median / 95th pct    ${f1(r.medianFrame)} / ${f1(r.p95Frame)} ms`)
  }
} finally {
  await browser.close()
  server.close()
  await rm(outDir, { recursive: true, force: true })
}

declare global {
  interface Window {
    bench: {
      drawNet: (n: number, seed: number, projection: string) => Promise<number>
      densityOnly: (n: number) => number
      startFrames: () => void
      stopFrames: () => {
        seconds: number
        fps: number
        updatesPerSecond: number
        netPerSecond: number
        medianFrame: number
        p95Frame: number
        lastCount: number
      }
    }
  }
}
