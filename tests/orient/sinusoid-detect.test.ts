import { beforeAll, describe, expect, it } from 'vitest'
import { DEFAULT_MIN_SCORE, detectSinusoids, imagePickToPlane, renderWallImage } from '../../orient'
import type { ImageRows, Plane, PlantedTrace, SinusoidCandidate } from '../../orient'
import { seeded } from './sample'

const D2R = Math.PI / 180
const DIAMETER = 96 // mm
/** The stated hole both planted and found traces are converted in (GSQ-BH03, high-side image). */
const HOLE = { trend: 125, plunge: 65 }
const ROW = 0.002 // m

/**
 * 20 traces down a 6 m window: relative dips 0–55° and every fifth one steep (60–72°), trough
 * azimuths anywhere, contrast 0.3–0.8, thickness 4–14 mm, every third one partial (15–40 %
 * missing), centres 0.15–0.28 m apart.
 */
function plantTwenty(random: () => number, top: number): PlantedTrace[] {
  const out: PlantedTrace[] = []
  let depth = top + 0.35
  for (let i = 0; i < 20; i++) {
    const dip = i % 5 === 0 ? 60 + random() * 12 : random() * 55
    out.push({
      depth,
      height: (DIAMETER / 1000) * Math.tan(dip * D2R),
      troughAzimuth: random() * 360,
      contrast: 0.3 + random() * 0.5,
      thickness: 0.004 + random() * 0.01,
      gaps: i % 3 === 0 ? 0.15 + random() * 0.25 : 0,
    })
    depth += 0.15 + random() * 0.13
  }
  return out
}

const normal = (p: Plane) => [
  Math.sin(p.dip * D2R) * Math.sin(p.dipDirection * D2R),
  Math.sin(p.dip * D2R) * Math.cos(p.dipDirection * D2R),
  Math.cos(p.dip * D2R),
]
/** The true plane a trace on this hole's high-side image stands for. */
const planeOf = (t: { height: number; troughAzimuth: number }) =>
  imagePickToPlane(
    {
      amplitude: t.height * 1000,
      diameter: DIAMETER,
      troughAzimuth: t.troughAzimuth,
      reference: 'highside',
    },
    HOLE,
  )!
const poleAngle = (a: Plane, b: Plane) => {
  const [p, q] = [normal(a), normal(b)]
  return Math.acos(Math.min(1, Math.abs(p[0] * q[0] + p[1] * q[1] + p[2] * q[2]))) / D2R
}

/** Recall (planted traces found within 3° and 0.05 m) and the fraction of candidates matching none. */
function score(planted: PlantedTrace[], found: SinusoidCandidate[]) {
  const hit = new Set<number>()
  let falses = 0
  for (const c of found) {
    const pc = planeOf(c)
    const i = planted.findIndex(
      (t) => Math.abs(t.depth - c.depth) <= 0.05 && poleAngle(pc, planeOf(t)) <= 3,
    )
    if (i >= 0) hit.add(i)
    else falses++
  }
  return {
    recall: hit.size / planted.length,
    falseFraction: found.length ? falses / found.length : 0,
  }
}

function wall(
  seed: number,
  opts: { width?: number; rowStep?: number; noise?: number; texture?: number } = {},
) {
  const width = opts.width ?? 360
  const rowStep = opts.rowStep ?? ROW
  const topDepth = 212.4
  const traces = plantTwenty(seeded(seed), topDepth)
  const rows = Math.round(6 / rowStep)
  const values = renderWallImage({
    width,
    rows,
    topDepth,
    rowStep,
    traces,
    seed,
    noise: opts.noise,
    texture: opts.texture,
  })
  const img: ImageRows = { width, rows, topDepth, rowStep, leftAzimuth: 0, values }
  return { img, traces }
}

describe('detectSinusoids() on synthetic walls with 20 planted traces', () => {
  const cases = [
    { seed: 11, label: '360 samples, 2 mm rows' },
    { seed: 12, label: '360 samples, 2 mm rows' },
    { seed: 13, label: '360 samples, 2 mm rows' },
    {
      seed: 14,
      label: '180 samples, noisy (0.06), rough texture (0.2)',
      width: 180,
      noise: 0.06,
      texture: 0.2,
    },
    {
      seed: 15,
      label: '180 samples, noisy (0.06), rough texture (0.2)',
      width: 180,
      noise: 0.06,
      texture: 0.2,
    },
    { seed: 16, label: '1 mm rows', rowStep: 0.001 },
  ]
  for (const { seed, label, ...opts } of cases)
    it(`detectSinusoids() seed ${seed}, ${label}: recall ≥ 0.8 within 3° and 0.05 m, false ≤ 0.2`, () => {
      const { img, traces } = wall(seed, opts)
      const found = detectSinusoids(img, { diameter: DIAMETER })
      const { recall, falseFraction } = score(traces, found)
      expect(recall).toBeGreaterThanOrEqual(0.8)
      expect(falseFraction).toBeLessThanOrEqual(0.2)
      for (const c of found) expect(c.score).toBeGreaterThanOrEqual(DEFAULT_MIN_SCORE)
    })
})

describe('detectSinusoids() results', () => {
  const { img, traces } = wall(21)
  let found: SinusoidCandidate[] = []
  beforeAll(() => {
    found = detectSinusoids(img, { diameter: DIAMETER })
  })

  it('detectSinusoids() best first, scores in [0, 1], heights within D·tan(80°)', () => {
    expect(found.length).toBeGreaterThan(10)
    for (let i = 1; i < found.length; i++)
      expect(found[i].score).toBeLessThanOrEqual(found[i - 1].score)
    for (const c of found) {
      expect(c.score).toBeGreaterThanOrEqual(0)
      expect(c.score).toBeLessThanOrEqual(1)
      expect(c.height).toBeLessThanOrEqual((DIAMETER / 1000) * Math.tan(80 * D2R))
      expect(c.troughAzimuth).toBeGreaterThanOrEqual(0)
      expect(c.troughAzimuth).toBeLessThan(360)
    }
  })

  it('detectSinusoids() maxCandidates, minScore and maxRelativeDip are kept', () => {
    expect(detectSinusoids(img, { diameter: DIAMETER, maxCandidates: 5 })).toHaveLength(5)
    const sure = detectSinusoids(img, { diameter: DIAMETER, minScore: 0.9 })
    for (const c of sure) expect(c.score).toBeGreaterThanOrEqual(0.9)
    const flat = detectSinusoids(img, { diameter: DIAMETER, maxRelativeDip: 30 })
    for (const c of flat)
      expect(c.height).toBeLessThanOrEqual((DIAMETER / 1000) * Math.tan(30 * D2R) * 1.02)
    expect(score(traces, flat).recall).toBeGreaterThan(0.3)
  })

  it('detectSinusoids() bright bands (the image inverted) and any grey scale give the same traces', () => {
    const inverted = detectSinusoids(
      { ...img, values: img.values.map((v) => 1 - v) },
      { diameter: DIAMETER },
    )
    const counts = detectSinusoids(
      { ...img, values: img.values.map((v) => 200 + 65535 * v) },
      { diameter: DIAMETER },
    )
    expect(score(traces, inverted).recall).toBeGreaterThanOrEqual(0.8)
    expect(counts.length).toBe(found.length)
    counts.forEach((c, i) => expect(c.depth).toBeCloseTo(found[i].depth, 6))
  })
})

describe('detectSinusoids() on awkward images', () => {
  const width = 360
  const rows = 1500
  const base = { width, rows, topDepth: 40, rowStep: ROW, leftAzimuth: 30 }
  const two: PlantedTrace[] = [
    { depth: 40.8, height: 0.15, troughAzimuth: 75, contrast: 0.5 },
    { depth: 42.1, height: 0.32, troughAzimuth: 250, contrast: 0.45, gaps: 0.2 },
  ]
  const values = renderWallImage({ ...base, traces: two, seed: 5 })
  const finds = (v: Float32Array) => {
    const got = detectSinusoids({ ...base, values: v }, { diameter: DIAMETER })
    return two.every((t) =>
      got.some(
        (c) => Math.abs(c.depth - t.depth) <= 0.01 && poleAngle(planeOf(c), planeOf(t)) <= 1,
      ),
    )
  }

  it('detectSinusoids() blank, constant, all-NaN, too small or malformed images → []', () => {
    const opts = { diameter: DIAMETER }
    expect(detectSinusoids({ ...base, values: new Float32Array(width * rows) }, opts)).toEqual([])
    expect(
      detectSinusoids({ ...base, values: new Float32Array(width * rows).fill(0.37) }, opts),
    ).toEqual([])
    expect(
      detectSinusoids({ ...base, values: new Float32Array(width * rows).fill(NaN) }, opts),
    ).toEqual([])
    expect(detectSinusoids({ ...base, rows: 3, values: values.slice(0, 3 * width) }, opts)).toEqual(
      [],
    )
    expect(detectSinusoids({ ...base, values: values.slice(0, 100) }, opts)).toEqual([])
    expect(detectSinusoids({ ...base, rowStep: 0, values }, opts)).toEqual([])
    expect(detectSinusoids({ ...base, rowStep: NaN, values }, opts)).toEqual([])
    expect(detectSinusoids({ ...base, values }, { diameter: 0 })).toEqual([])
  })

  it('detectSinusoids() tolerates no-value rows, a no-value strip of columns, scattered NaN and ±Infinity', () => {
    expect(finds(values)).toBe(true)
    const rowsOut = values.slice()
    rowsOut.fill(NaN, 200 * width, 260 * width)
    expect(finds(rowsOut)).toBe(true)
    const strip = values.slice()
    for (let r = 0; r < rows; r++) strip.fill(NaN, r * width + 100, r * width + 150)
    expect(finds(strip)).toBe(true)
    expect(finds(values.map((v, i) => (i % 7 === 0 ? NaN : i % 13 === 0 ? Infinity : v)))).toBe(
      true,
    )
  })

  it('detectSinusoids() texture and clutter alone give few or no candidates', () => {
    for (const [seed, noise, texture] of [
      [31, 0.03, 0.12],
      [32, 0.06, 0.2],
      [33, 0.01, 0.3],
    ]) {
      const v = renderWallImage({
        ...base,
        rows: 3000,
        traces: [],
        seed,
        noise,
        texture,
        spots: 60,
      })
      const got = detectSinusoids({ ...base, rows: 3000, values: v }, { diameter: DIAMETER })
      expect(got.length, `seed ${seed}`).toBeLessThanOrEqual(1)
    }
  })
})
