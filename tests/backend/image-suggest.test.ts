import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { holes, type Image } from '../../schema/index'
import { suggestionLevel } from '../../backend/src/services/image-suggest'
import { expectAngle } from '../orient/expect-angle'
import { clientFor, createFixture, holeValues, type Client, type Fixture } from './fixture'
import { renderWallImage } from '../../orient/index'
import { azimuthGap, insertImage, tracePoints } from './image-picks-fixture'

let fx: Fixture
let logger: Client
let viewer: Client
let image: Image
const url = (q: string) =>
  `/api/projects/${fx.projectId}/holes/${image.holeId}/images/${image.id}/suggestions?${q}`

// Vertical hole, true-north image, D = 96 mm: relative dip = dip, trough azimuth = dip direction
// (REFERENCES.md image-log sinusoids, Crain's Petrophysical Handbook atan(H/D)).
interface PlantedTrace {
  depth: number
  heightMm: number
  trough: number
}
const planted: PlantedTrace[] = [
  { depth: 10.8, heightMm: 96, trough: 90 }, // 45/090
  { depth: 11.9, heightMm: 40, trough: 200 }, // atan(40/96) = 22.62 → 22.6/200
  { depth: 13.1, heightMm: 150, trough: 315 }, // atan(150/96) = 57.38 → 57.4/315
]
const plantedDip = (t: PlantedTrace) => (Math.atan(t.heightMm / 96) * 180) / Math.PI

interface Suggestion {
  depth: number
  height: number
  troughAzimuth: number
  dip: number
  dipDirection: number
  score: number
}
const near = (s: Suggestion, t: PlantedTrace) =>
  Math.abs(s.depth - t.depth) < 0.005 &&
  Math.abs(s.height - t.heightMm) < 3 &&
  azimuthGap(s.troughAzimuth, t.trough) < 2

beforeAll(async () => {
  fx = await createFixture()
  ;[logger, viewer] = await Promise.all(
    (['logger', 'viewer'] as const).map((who) => clientFor(fx.app, who)),
  )
  const [hole] = await fx.db
    .insert(holes)
    .values({ ...holeValues(fx.projectId, 'TST-V'), plannedPlunge: 90 })
    .returning()
  await logger.put(`/api/projects/${fx.projectId}/holes/${hole.id}/survey`, {
    stations: [{ depth: 0, azimuth: 0, plunge: 90, azimuthReference: 'true' }],
  })
  // 10–14 m at 2 mm a row, 2° a column: the synthetic wall (grey 0..1) stored as 8-bit samples.
  const width = 180
  const wall = renderWallImage({
    width,
    rows: 2000,
    topDepth: 10,
    rowStep: 0.002,
    seed: 13,
    traces: planted.map((t) => ({
      depth: t.depth,
      height: t.heightMm / 1000,
      troughAzimuth: t.trough,
    })),
  })
  image = await insertImage(fx.db, {
    holeId: hole.id,
    topDepth: 10,
    bottomDepth: 14,
    width,
    height: 2000,
    sample: (r, c) => Math.round(wall[r * width + c] * 255),
  })
})
afterAll(() => fx.close())

describe('GET H/images/:imageId/suggestions', () => {
  it('GET suggestions → every planted trace found, with its dip and dip direction, best first', async () => {
    const res = await viewer.get(url('from=10&to=14'))
    expect(res.status).toBe(200)
    const found: Suggestion[] = res.body.data
    // The three traces and nothing else: the wall's texture offers no false sinusoid.
    expect(found).toHaveLength(planted.length)
    const scores = found.map((s) => s.score)
    expect(scores).toEqual([...scores].sort((a, b) => b - a))
    for (const t of planted) {
      const hit = found.find((s) => near(s, t))
      expect(hit, `trace at ${t.depth} m`).toBeDefined()
      expectAngle(hit!.dip, plantedDip(t), 0.5)
      expectAngle(hit!.dipDirection, t.trough, 2)
    }
  })

  it('GET suggestions → the window is clamped to the image; only centres inside it are offered', async () => {
    const res = await viewer.get(url('from=5&to=11.5'))
    expect(res.status).toBe(200)
    const found: Suggestion[] = res.body.data
    expect(found.some((s) => near(s, planted[0]))).toBe(true)
    expect(found.every((s) => s.depth >= 10 && s.depth <= 11.5)).toBe(true)
  })

  it('GET suggestions → a trace already picked on the image is left out; the others remain', async () => {
    const t = planted[0]
    const pick = await logger.post(
      `/api/projects/${fx.projectId}/holes/${image.holeId}/images/${image.id}/picks`,
      { points: tracePoints(t.depth, t.heightMm, t.trough, 30), type: 'joint', suggested: true },
    )
    expect(pick.status).toBe(201)
    const found: Suggestion[] = (await viewer.get(url('from=10&to=14'))).body.data
    expect(found.some((s) => near(s, planted[0]))).toBe(false)
    expect(found.some((s) => near(s, planted[1]))).toBe(true)
    expect(found.some((s) => near(s, planted[2]))).toBe(true)
  })

  it('GET suggestions → 400 for a window outside the image, longer than 20 m, or upside down', async () => {
    const outside = await viewer.get(url('from=30&to=40'))
    expect(outside.status).toBe(400)
    expect(outside.body.error.details).toEqual([
      { path: 'query.from', message: 'outside the image (10–14 m)' },
    ])
    expect((await viewer.get(url('from=0&to=25'))).body.error.details[0].path).toBe('query.to')
    expect((await viewer.get(url('from=12&to=11'))).status).toBe(400)
  })
})

describe('suggestionLevel()', () => {
  const fine = { topDepth: 0, bottomDepth: 100, height: 200_000, width: 360, levels: 10 } as Image
  it('suggestionLevel() 0.5 mm rows: a 2 m window at level 1 (1 mm a row)', () => {
    expect(suggestionLevel(fine, 2)).toBe(1)
  })
  it('suggestionLevel() 0.5 mm rows, 20 m × 360 samples: coarser until under 3 M samples (level 3, 4 mm)', () => {
    // level 1: 20 000 rows × 360 = 7.2 M; level 2: 3.6 M; level 3: 1.8 M
    expect(suggestionLevel(fine, 20)).toBe(3)
  })
  it('suggestionLevel() rows already coarser than 1 mm stay at level 0; never past the last level', () => {
    expect(suggestionLevel({ ...fine, height: 20_000 }, 2)).toBe(0)
    expect(suggestionLevel({ ...fine, levels: 2 }, 20)).toBe(1)
  })
})
