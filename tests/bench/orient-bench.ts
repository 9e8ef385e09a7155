// Throughput of the orient/ hot paths on one core, each with its ratio to a baseline loop measured
// in the same run, so figures from different machines can be compared. Not a timed test: prints a
// table and exits 0. Run: npx tsx tests/bench/orient-bench.ts
import {
  coreToPlaneBatch,
  densityGrid,
  fisherStatsBatch,
  linesToXyz,
  orientationTensorBatch,
} from '../../orient'
import type { Line } from '../../orient'

const D = Math.PI / 180
const WARMUP = 3
const REPEATS = 9

/** Seeded uniform numbers in [0, 1) (mulberry32): the same data on every run. */
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
function median(fn: () => unknown): number {
  for (let i = 0; i < WARMUP; i++) fn()
  const times: number[] = []
  for (let i = 0; i < REPEATS; i++) {
    const t0 = performance.now()
    fn()
    times.push(performance.now() - t0)
  }
  return times.sort((a, b) => a - b)[Math.floor(REPEATS / 2)]
}

let sink = 0

/**
 * The baseline: only the sin and cos of the same angles (degrees), summed so nothing is elided.
 * Written out per column count, as tight as the loop under test.
 */
function trigBaseline(
  a: Float64Array,
  b: Float64Array,
  c?: Float64Array,
  d?: Float64Array,
): number {
  return median(() => {
    let acc = 0
    const n = a.length
    if (c && d) {
      for (let i = 0; i < n; i++) {
        const ra = a[i] * D
        const rb = b[i] * D
        const rc = c[i] * D
        const rd = d[i] * D
        acc += Math.sin(ra) + Math.cos(ra) + Math.sin(rb) + Math.cos(rb)
        acc += Math.sin(rc) + Math.cos(rc) + Math.sin(rd) + Math.cos(rd)
      }
    } else {
      for (let i = 0; i < n; i++) {
        const ra = a[i] * D
        const rb = b[i] * D
        acc += Math.sin(ra) + Math.cos(ra) + Math.sin(rb) + Math.cos(rb)
      }
    }
    sink += acc
  })
}

const random = seeded(2025)

// 1. Core to plane: 1,000,000 measurements from 200 surveyed holes whose direction drifts with
// depth, so each measurement has its own hole direction.
const N_CORE = 1_000_000
const alpha = new Float64Array(N_CORE)
const beta = new Float64Array(N_CORE)
const holeTrend = new Float64Array(N_CORE)
const holePlunge = new Float64Array(N_CORE)
for (let i = 0; i < N_CORE; i++) {
  const hole = i % 200
  const depth = random()
  alpha[i] = random() * 90
  beta[i] = random() * 360
  holeTrend[i] = (hole * 37 + depth * 25) % 360
  holePlunge[i] = hole % 10 === 0 ? 88 + depth * 2 : 45 + (hole % 40) + depth * 5
}
const out = { dipDirection: new Float64Array(N_CORE), dip: new Float64Array(N_CORE) }
const coreBase = trigBaseline(alpha, beta, holeTrend, holePlunge)
const coreTime = median(() => coreToPlaneBatch({ alpha, beta, holeTrend, holePlunge }, out))

// Poles: three joint sets and some scatter.
function poles(n: number): Line[] {
  const sets = [
    [40, 70],
    [200, 30],
    [310, 5],
  ]
  return Array.from({ length: n }, (_, i) => {
    const [t, p] = sets[i % 3]
    if (i % 10 === 9) return { trend: random() * 360, plunge: random() * 90 }
    return {
      trend: t + (random() - 0.5) * 30,
      plunge: Math.min(90, Math.abs(p + (random() - 0.5) * 20)),
    }
  })
}

// 2. Density: 100,000 poles on the default grid (≥ 2,000 nodes inside the primitive).
const densityPoles = poles(100_000)
const densityBase = trigBaseline(
  Float64Array.from(densityPoles, (l) => l.trend),
  Float64Array.from(densityPoles, (l) => l.plunge),
)
const nodes = densityGrid(densityPoles, { method: 'kamb' })!.inside.reduce((a, b) => a + b, 0)
const kambTime = median(() => densityGrid(densityPoles, { method: 'kamb' }))
const expTime = median(() => densityGrid(densityPoles, { method: 'exponential' }))

// 3. Statistics: Fisher (axial) and orientation tensor of 1,000,000 poles as direction cosines.
const statPoles = poles(1_000_000)
const xyz = linesToXyz(statPoles)
const statBase = trigBaseline(
  Float64Array.from(statPoles, (l) => l.trend),
  Float64Array.from(statPoles, (l) => l.plunge),
)
const statTime = median(() => {
  fisherStatsBatch(xyz)
  orientationTensorBatch(xyz)
})

const rate = N_CORE / (coreTime / 1000)
const baseRate = N_CORE / (coreBase / 1000)
const rows = [
  {
    what: 'coreToPlaneBatch, 1e6 items, mixed holes',
    figure: `${(rate / 1e6).toFixed(2)} M/s`,
    target: '≥ 5 M/s, ≥ 0.6× base',
    ratio: `${(rate / baseRate).toFixed(2)}× base rate`,
    pass: rate >= 5e6 && rate / baseRate >= 0.6,
  },
  {
    what: `densityGrid kamb, 1e5 poles, ${nodes} nodes`,
    figure: `${kambTime.toFixed(1)} ms`,
    target: '≤ 30 ms',
    ratio: `${(kambTime / densityBase).toFixed(2)}× base time`,
    pass: kambTime <= 30,
  },
  {
    what: `densityGrid exponential, 1e5 poles, ${nodes} nodes`,
    figure: `${expTime.toFixed(1)} ms`,
    target: '≤ 30 ms',
    ratio: `${(expTime / densityBase).toFixed(2)}× base time`,
    pass: expTime <= 30,
  },
  {
    what: 'fisherStatsBatch + orientationTensorBatch, 1e6',
    figure: `${statTime.toFixed(1)} ms`,
    target: '≤ 50 ms',
    ratio: `${(statTime / statBase).toFixed(2)}× base time`,
    pass: statTime <= 50,
  },
]

const header = ['what', 'figure', 'target', 'ratio to baseline', 'result']
const table = rows.map((r) => [r.what, r.figure, r.target, r.ratio, r.pass ? 'pass' : 'miss'])
const widths = header.map((h, c) => Math.max(h.length, ...table.map((row) => row[c].length)))
const line = (cells: string[]) => cells.map((s, c) => s.padEnd(widths[c])).join(' | ')
console.log(`orient bench: Node ${process.version}, median of ${REPEATS} after ${WARMUP} warm-ups`)
console.log(
  `baselines (sin + cos of the same inputs): core ${coreBase.toFixed(1)} ms = ${(baseRate / 1e6).toFixed(2)} M items/s; ` +
    `density poles ${densityBase.toFixed(2)} ms; statistics poles ${statBase.toFixed(1)} ms`,
)
console.log(line(header))
console.log(widths.map((w) => '-'.repeat(w)).join('-|-'))
for (const row of table) console.log(line(row))
if (sink === 42) console.log('')
process.exitCode = 0
