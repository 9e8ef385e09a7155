// Throughput of the orientation Monte Carlo (orientationUncertainty) on one core: 100,000 stored
// structures of mixed sources × 500 draws, beside two baselines measured in the same run:
// (a) the bare draw loop — 50 M draws doing only the four angle additions from the draw tables and
// one dot product, the floor the hint-level design can reach — and (b) coreToPlane once per
// structure, the product's own conversion. Not a timed test: prints a table and exits 0.
// Run: npx tsx tests/bench/uncertainty-bench.ts
import {
  DEFAULT_ERROR_MODEL,
  coreToPlane,
  orientationUncertainty,
  setMeanSystematic95,
  uncertaintyColumns,
} from '../../orient'
import type { UncertaintyColumns } from '../../orient'

const D = Math.PI / 180
const N = 100_000
const DRAWS = 500
const WARMUP = 1
const REPEATS = 5

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

const random = seeded(2026)
let sink = 0

/**
 * n structures from 200 surveyed holes (one in ten steep, 80–90°, some vertical), each with its
 * own hole direction and curvature: 60 % core, 25 % image picks (half north-referenced), 15 %
 * orientations entered as measured; magnetic or gyro survey azimuth errors by hole.
 */
function structures(n: number): UncertaintyColumns {
  const c = uncertaintyColumns(n)
  for (let i = 0; i < n; i++) {
    const hole = i % 200
    const depth = random()
    const k = random()
    c.source[i] = k < 0.6 ? 0 : k < 0.85 ? 2 : 1
    c.holeTrend[i] = (hole * 37 + depth * 25) % 360
    c.holePlunge[i] = hole % 10 === 0 ? Math.min(90, 80 + 11 * depth) : 40 + (hole % 40) + 5 * depth
    c.holeTrendRate[i] = (random() - 0.5) * 0.2
    c.holePlungeRate[i] = (random() - 0.5) * 0.1
    c.azimuthSd[i] = hole % 3 === 0 ? 0.5 : 1.5
    c.alpha[i] = random() * 90
    c.beta[i] = random() * 360
    c.amplitude[i] = random() * 400
    c.diameter[i] = 96
    c.trough[i] = random() * 360
    c.north[i] = i % 2
    c.inputDip[i] = random() * 90
    c.inputDipDirection[i] = random() * 360
  }
  return c
}

const cols = structures(N)

// Cold: the first call in the process, compilation included.
const t0 = performance.now()
const first = orientationUncertainty(cols, DEFAULT_ERROR_MODEL)
const cold = performance.now() - t0
const warm = median(() => orientationUncertainty(cols, DEFAULT_ERROR_MODEL))

// (a) The bare draw loop: four angle additions from tables and one dot product per draw.
const tables = Array.from({ length: 8 }, () => Float64Array.from({ length: DRAWS }, () => random()))
const bare = median(() => {
  const [ac, as, bc, bs, tc, ts, pc, ps] = tables
  let acc = 0
  for (let i = 0; i < N; i++) {
    const a = cols.alpha[i] * D
    const b = cols.beta[i] * D
    const t = cols.holeTrend[i] * D
    const p = cols.holePlunge[i] * D
    const sa0 = Math.sin(a)
    const ca0 = Math.cos(a)
    const sb0 = Math.sin(b)
    const cb0 = Math.cos(b)
    const st0 = Math.sin(t)
    const ct0 = Math.cos(t)
    const sp0 = Math.sin(p)
    const cp0 = Math.cos(p)
    for (let d = 0; d < DRAWS; d++) {
      const sa = sa0 * ac[d] + ca0 * as[d]
      const sb = sb0 * bc[d] + cb0 * bs[d]
      const st = st0 * tc[d] + ct0 * ts[d]
      const sp = sp0 * pc[d] + cp0 * ps[d]
      // One dot product of two vectors built from them.
      acc += sa * st + sb * sp + sa * sb
    }
  }
  sink += acc
})

// (b) coreToPlane once per structure.
const conversion = median(() => {
  let acc = 0
  for (let i = 0; i < N; i++) {
    const p = coreToPlane(
      { alpha: cols.alpha[i], beta: cols.beta[i] },
      { trend: cols.holeTrend[i], plunge: cols.holePlunge[i] },
    )
    acc += p ? p.dip : 0
  }
  sink += acc
})

// Set mean, systematic term: 2,000 members in 20 holes.
const members = structures(2000)
const groups = Int32Array.from({ length: 2000 }, (_, i) => i % 20)
const setTime = median(() => setMeanSystematic95(members, groups, undefined, DEFAULT_ERROR_MODEL))

const finite = first.cone95.filter(Number.isFinite)
const sorted = Float64Array.from(finite).sort()
const rate = N / (warm / 1000)
const rows = [
  {
    what: `orientationUncertainty, 1e5 mixed × ${DRAWS}, warm`,
    figure: `${(warm / 1000).toFixed(2)} s = ${(rate / 1000).toFixed(0)} k/s`,
    target: '< 2 s',
    ratio: `${(warm / bare).toFixed(2)}× bare loop; ${(warm / conversion).toFixed(0)}× coreToPlane`,
    pass: warm < 2000,
  },
  {
    what: `orientationUncertainty, 1e5 mixed × ${DRAWS}, cold`,
    figure: `${(cold / 1000).toFixed(2)} s`,
    target: '< 2 s',
    ratio: `${(cold / bare).toFixed(2)}× bare loop`,
    pass: cold < 2000,
  },
  {
    what: `(a) bare loop, ${(N * DRAWS) / 1e6} M draws`,
    figure: `${(bare / 1000).toFixed(2)} s = ${((N * DRAWS) / bare / 1000).toFixed(0)} M draws/s`,
    target: 'baseline',
    ratio: '1.00×',
    pass: true,
  },
  {
    what: '(b) coreToPlane, 1e5 calls',
    figure: `${conversion.toFixed(1)} ms`,
    target: 'baseline',
    ratio: `${(conversion / bare).toFixed(3)}× bare loop`,
    pass: true,
  },
  {
    what: `setMeanSystematic95, 2,000 members, 20 holes × ${DRAWS}`,
    figure: `${setTime.toFixed(0)} ms`,
    target: '< 1 s',
    ratio: `${(setTime / conversion).toFixed(1)}× coreToPlane 1e5`,
    pass: setTime < 1000,
  },
]

const header = ['what', 'figure', 'target', 'ratio to baseline', 'result']
const table = rows.map((r) => [r.what, r.figure, r.target, r.ratio, r.pass ? 'pass' : 'miss'])
const widths = header.map((h, c) => Math.max(h.length, ...table.map((row) => row[c].length)))
const line = (cells: string[]) => cells.map((s, c) => s.padEnd(widths[c])).join(' | ')
const q = (p: number) => sorted[Math.floor(p * (sorted.length - 1))].toFixed(1)
console.log(
  `uncertainty bench: Node ${process.version}, median of ${REPEATS} after ${WARMUP} warm-up`,
)
console.log(
  `cones of the 1e5 structures (deg): median ${q(0.5)}, 90th percentile ${q(0.9)}, max ${q(1)}; ` +
    `${N - finite.length} without a pole`,
)
console.log(line(header))
console.log(widths.map((w) => '-'.repeat(w)).join('-|-'))
for (const row of table) console.log(line(row))
if (sink === 42) console.log('')
process.exitCode = 0
