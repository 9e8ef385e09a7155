// Sinusoid detection and synthetic wall rendering on one core, each timing with a baseline
// measured in the same run and the ratio to it, and the detector's recall and false fraction on
// planted traces. This harness times the orient/ functions alone (no tile reads, no HTTP): the
// suggestions route adds those. Not a timed test: prints a table and exits 0.
// Run: npx tsx tests/bench/image-detect-bench.ts
import { detectSinusoids, imagePickToPlane, renderWallImage, renderWallRows } from '../../orient'
import type { ImageRows, Plane, PlantedTrace } from '../../orient'

const D2R = Math.PI / 180
const DIAMETER = 96
const HOLE = { trend: 125, plunge: 65 }
const WARMUP = 2
const REPEATS = 7

/** Seeded uniform numbers in [0, 1) (mulberry32): the same walls on every run. */
function seeded(seed: number): () => number {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6d2b79f5) >>> 0
    let t = Math.imul(a ^ (a >>> 15), a | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

/** Median wall time (ms) of fn after warm-up. */
function median(fn: () => unknown, repeats = REPEATS): number {
  for (let i = 0; i < WARMUP; i++) fn()
  const times: number[] = []
  for (let i = 0; i < repeats; i++) {
    const t0 = performance.now()
    fn()
    times.push(performance.now() - t0)
  }
  return times.sort((a, b) => a - b)[Math.floor(repeats / 2)]
}

/** Traces down a window every 0.15–0.28 m: dips to 55°, every fifth 60–72°, every third partial. */
function plant(random: () => number, top: number, bottom: number): PlantedTrace[] {
  const out: PlantedTrace[] = []
  for (let depth = top + 0.35, i = 0; depth < bottom - 0.35; depth += 0.15 + random() * 0.13, i++) {
    const dip = i % 5 === 0 ? 60 + random() * 12 : random() * 55
    out.push({
      depth,
      height: (DIAMETER / 1000) * Math.tan(dip * D2R),
      troughAzimuth: random() * 360,
      contrast: 0.3 + random() * 0.5,
      thickness: 0.004 + random() * 0.01,
      gaps: i % 3 === 0 ? 0.15 + random() * 0.25 : 0,
    })
  }
  return out
}

const planeOf = (t: { height: number; troughAzimuth: number }): Plane =>
  imagePickToPlane(
    {
      amplitude: t.height * 1000,
      diameter: DIAMETER,
      troughAzimuth: t.troughAzimuth,
      reference: 'highside',
    },
    HOLE,
  )!
const normal = (p: Plane) => [
  Math.sin(p.dip * D2R) * Math.sin(p.dipDirection * D2R),
  Math.sin(p.dip * D2R) * Math.cos(p.dipDirection * D2R),
  Math.cos(p.dip * D2R),
]
const poleAngle = (a: Plane, b: Plane) => {
  const [p, q] = [normal(a), normal(b)]
  return Math.acos(Math.min(1, Math.abs(p[0] * q[0] + p[1] * q[1] + p[2] * q[2]))) / D2R
}

// 1. Detection on a 5 m window, 2 mm rows × 360 samples (900,000 samples).
const WIDTH = 360
const ROWS = 2500
const window = (seed: number, noise = 0.03, texture = 0.12) => {
  const traces = plant(seeded(seed), 300, 305)
  const values = renderWallImage({
    width: WIDTH,
    rows: ROWS,
    topDepth: 300,
    rowStep: 0.002,
    traces,
    seed,
    noise,
    texture,
  })
  const img: ImageRows = {
    width: WIDTH,
    rows: ROWS,
    topDepth: 300,
    rowStep: 0.002,
    leftAzimuth: 0,
    values,
  }
  return { img, traces }
}
const timed = window(1)
let sink = 0
// The baseline: one plain pass forming the depth gradient of the same samples (the least any
// edge-based detector reads), summed so nothing is elided.
const gradientBase = median(() => {
  const v = timed.img.values
  let acc = 0
  for (let i = WIDTH; i < v.length - WIDTH; i++) acc += Math.abs(v[i + WIDTH] - v[i - WIDTH])
  sink += acc
}, 21)
const detectTime = median(() => detectSinusoids(timed.img, { diameter: DIAMETER }))

// 2. Recall and false fraction over seeds, on a quiet and on a rough wall.
function quality(noise: number, texture: number) {
  let planted = 0
  let hit = 0
  let found = 0
  let falses = 0
  for (const seed of [1, 2, 3, 4, 5]) {
    const { img, traces } = window(seed, noise, texture)
    const got = detectSinusoids(img, { diameter: DIAMETER })
    const matched = new Set<number>()
    for (const c of got) {
      const i = traces.findIndex(
        (t) => Math.abs(t.depth - c.depth) <= 0.05 && poleAngle(planeOf(c), planeOf(t)) <= 3,
      )
      if (i >= 0) matched.add(i)
      else falses++
    }
    planted += traces.length
    hit += matched.size
    found += got.length
  }
  return { recall: hit / planted, falseFraction: falses / Math.max(1, found), planted }
}
const quiet = quality(0.03, 0.12)
const rough = quality(0.08, 0.25)

// 3. Rendering a 300 m image (150,000 rows × 360) in 10,000-row chunks, 1,000 traces; baseline:
// the same chunks of Float32Array allocated and written once with a cheap ramp.
const long = {
  width: WIDTH,
  rows: 150_000,
  topDepth: 0,
  rowStep: 0.002,
  seed: 9,
  traces: Array.from({ length: 1000 }, (_, i) => ({
    depth: 0.3 * i + 0.2,
    height: 0.05 * (i % 6),
    troughAzimuth: (i * 53) % 360,
  })),
}
const renderBase = median(() => {
  for (let r = 0; r < long.rows; r += 10_000) {
    const out = new Float32Array(10_000 * WIDTH)
    for (let i = 0; i < out.length; i++) out[i] = (i & 255) / 255
    sink += out[7]
  }
}, 3)
const renderTime = median(() => {
  for (let r = 0; r < long.rows; r += 10_000) sink += renderWallRows(long, r, r + 10_000)[7]
}, 3)

const rows = [
  {
    what: 'detectSinusoids, 5 m × 360 at 2 mm (9e5 samples)',
    figure: `${detectTime.toFixed(0)} ms`,
    target: '< 2000 ms',
    ratio: `${(detectTime / gradientBase).toFixed(0)}× base time`,
    pass: detectTime < 2000,
  },
  {
    what: `recall / false, quiet wall (${quiet.planted} planted)`,
    figure: `${quiet.recall.toFixed(2)} / ${quiet.falseFraction.toFixed(2)}`,
    target: '≥ 0.80 / ≤ 0.20',
    ratio: '-',
    pass: quiet.recall >= 0.8 && quiet.falseFraction <= 0.2,
  },
  {
    what: `recall / false, rough wall (${rough.planted} planted)`,
    figure: `${rough.recall.toFixed(2)} / ${rough.falseFraction.toFixed(2)}`,
    target: '≥ 0.80 / ≤ 0.20',
    ratio: '-',
    pass: rough.recall >= 0.8 && rough.falseFraction <= 0.2,
  },
  {
    what: 'renderWallRows, 300 m × 360 at 2 mm, 1000 traces',
    figure: `${(renderTime / 1000).toFixed(2)} s`,
    target: '≤ 5 s',
    ratio: `${(renderTime / renderBase).toFixed(0)}× base time`,
    pass: renderTime <= 5000,
  },
]

const header = ['what', 'figure', 'target', 'ratio to baseline', 'result']
const table = rows.map((r) => [r.what, r.figure, r.target, r.ratio, r.pass ? 'pass' : 'miss'])
const widths = header.map((h, c) => Math.max(h.length, ...table.map((row) => row[c].length)))
const line = (cells: string[]) => cells.map((s, c) => s.padEnd(widths[c])).join(' | ')
console.log(
  `image detect bench: Node ${process.version}, median of ${REPEATS} after ${WARMUP} warm-ups`,
)
console.log(
  `baselines: one depth-gradient pass over the 5 m window ${gradientBase.toFixed(2)} ms; ` +
    `writing the 300 m image's samples once ${renderBase.toFixed(0)} ms. ` +
    'Quiet wall: noise 0.03, texture 0.12; rough: noise 0.08, texture 0.25 (5 seeds each).',
)
console.log(line(header))
console.log(widths.map((w) => '-'.repeat(w)).join('-|-'))
for (const row of table) console.log(line(row))
if (sink === 42) console.log('')
process.exitCode = 0
