import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { coreToPlane, holeAt, positionAt } from '../../orient/index'
import { auditEvents, intervals, structures } from '../../schema/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let logger: Client
let engineer: Client
const base = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const expectAngle = (actual: number, expected: number, tol = 1e-6) => {
  const d = Math.abs(((((actual - expected) % 360) + 540) % 360) - 180)
  expect(d, `${actual} vs ${expected}`).toBeLessThanOrEqual(tol)
}

// A curving hole in true-north azimuths (the fixture project's declination only applies to magnetic).
const stations = [
  { depth: 0, azimuth: 10, plunge: 60, azimuthReference: 'true' },
  { depth: 50, azimuth: 20, plunge: 55, azimuthReference: 'true' },
  { depth: 100, azimuth: 30, plunge: 50, azimuthReference: 'true' },
]
const runs = [
  {
    fromDepth: 0,
    toDepth: 30,
    recovered: 29.5,
    solid: 27,
    rqdLength: 24,
    fractureCount: 30,
    markConfidence: 'good',
  },
  {
    fromDepth: 30,
    toDepth: 60,
    recovered: 30,
    solid: 28,
    rqdLength: 25,
    fractureCount: 12,
    markConfidence: 'poor',
  },
  {
    fromDepth: 60,
    toDepth: 80,
    recovered: 19,
    solid: 15,
    rqdLength: 10,
    fractureCount: 40,
    markConfidence: 'none',
  },
]

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
  engineer = await clientFor(fx.app, 'engineer')
  expect((await logger.put(`${base()}/survey`, { stations })).status).toBe(200)
  expect((await logger.put(`${base()}/runs`, { runs })).status).toBe(200)
})
afterAll(() => fx.close())

describe('POST /api/projects/:projectId/holes/:holeId/structures', () => {
  it('POST structures → the dip/dip direction orient computes for the hole direction interpolated at that depth', async () => {
    const res = await logger.post(`${base()}/structures`, {
      depth: 25,
      type: 'joint',
      alpha: 40,
      beta: 300,
    })
    expect(res.status).toBe(201)
    const hole = holeAt(stations, 25)!
    const plane = coreToPlane({ alpha: 40, beta: 300 }, hole)!
    const at = positionAt(stations, 25)!
    expect(res.body.data).toMatchObject({
      depth: 25,
      type: 'joint',
      alpha: 40,
      beta: 300,
      source: 'core',
      flags: [],
    })
    expectAngle(res.body.data.dip, plane.dip)
    expectAngle(res.body.data.dipDirection, plane.dipDirection)
    expectAngle(res.body.data.holeTrend, hole.trend)
    expect(res.body.data.east).toBeCloseTo(512000 + at.east, 6)
    expect(res.body.data.elevation).toBeCloseTo(200 - at.down, 6)
    // Terzaghi (1965) on core: w = 1/sin(alpha)
    expect(res.body.data.terzaghiWeight).toBeCloseTo(1 / Math.sin((40 * Math.PI) / 180), 9)
  })

  it('POST structures → flags: poor mark, unoriented (no usable mark: no dip direction), outside any run', async () => {
    const poor = await logger.post(`${base()}/structures`, {
      depth: 45,
      type: 'joint',
      alpha: 50,
      beta: 10,
    })
    expect(poor.body.data.flags).toEqual(['poor-mark'])
    const none = await logger.post(`${base()}/structures`, {
      depth: 65,
      type: 'joint',
      alpha: 50,
      beta: 10,
    })
    expect(none.body.data.flags).toContain('unoriented')
    expect(none.body.data.dipDirection).toBeNull()
    const outside = await logger.post(`${base()}/structures`, {
      depth: 90,
      type: 'joint',
      alpha: 50,
      beta: 10,
    })
    expect(outside.body.data.flags).toEqual(['outside-run'])
  })

  it('POST structures → beta-jump flag against the previous structure of the same type in the run', async () => {
    await logger.post(`${base()}/structures`, { depth: 5, type: 'bedding', alpha: 50, beta: 100 })
    const jump = await logger.post(`${base()}/structures`, {
      depth: 6,
      type: 'bedding',
      alpha: 52,
      beta: 250,
    })
    expect(jump.body.data.flags).toEqual(['beta-jump'])
    const near = await logger.post(`${base()}/structures`, {
      depth: 7,
      type: 'bedding',
      alpha: 52,
      beta: 270,
    })
    expect(near.body.data.flags).toEqual([])
  })

  it('POST structures → a true orientation is stored as given; Terzaghi from the angle to the hole', async () => {
    const res = await logger.post(`${base()}/structures`, {
      depth: 10,
      type: 'fault',
      source: 'true',
      dip: 70,
      dipDirection: 200,
    })
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({ dip: 70, dipDirection: 200, inputDip: 70, alpha: null })
  })

  it('POST structures → 400 naming alpha for 95 and beta for 400, nothing written', async () => {
    const before = (await fx.db.select().from(structures)).length
    const res = await logger.post(`${base()}/structures`, {
      depth: 11,
      type: 'joint',
      alpha: 95,
      beta: 400,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
      'body.alpha',
      'body.beta',
    ])
    expect((await fx.db.select().from(structures)).length).toBe(before)
  })
})

describe('survey and runs drive the structures', () => {
  it('PATCH survey station → every structure of the hole is recomputed in the same transaction', async () => {
    const list = (await logger.get(`${base()}/structures`)).body.data as {
      id: number
      depth: number
      dipDirection: number
    }[]
    const target = list.find((s) => s.depth === 25)!
    const survey = (await logger.get(`${base()}/survey`)).body.data
    const first = survey[0]
    const res = await logger.patch(`${base()}/survey/${first.id}`, {
      version: first.version,
      azimuth: 40,
    })
    expect(res.status).toBe(200)
    const moved = [{ ...stations[0], azimuth: 40 }, stations[1], stations[2]]
    const plane = coreToPlane({ alpha: 40, beta: 300 }, holeAt(moved, 25)!)!
    const after = (await logger.get(`${base()}/structures/${target.id}`)).body.data
    expectAngle(after.dipDirection, plane.dipDirection)
    expect(after.dipDirection).not.toBeCloseTo(target.dipDirection, 3)
    expect(after.surveyRevision).toBe(2)
    const recompute = await fx.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, 'recompute'))
    expect(recompute.at(-1)!.after).toMatchObject({ surveyRevision: 2 })
  })

  it('GET runs → TCR, SCR, RQD, frequency and Deere class per run', async () => {
    const res = await logger.get(`${base()}/runs`)
    // run 0–30 m: recovered 29.5, solid 27, RQD length 24, 30 fractures
    expect(res.body.data[0].metrics).toMatchObject({
      tcr: (100 * 29.5) / 30,
      scr: 90,
      rqd: 80,
      frequency: 1,
      rqdClass: 'good',
    })
  })

  it('POST runs → 400 for an overlap and for recovered longer than the run', async () => {
    const overlap = await logger.post(`${base()}/runs`, {
      fromDepth: 75,
      toDepth: 85,
      recovered: 9,
      solid: 8,
      rqdLength: 7,
    })
    expect(overlap.status).toBe(400)
    expect(overlap.body.error.details[0]).toMatchObject({ path: 'body.fromDepth' })
    const long = await logger.post(`${base()}/runs`, {
      fromDepth: 80,
      toDepth: 83,
      recovered: 3.5,
      solid: 3,
      rqdLength: 3,
    })
    expect(long.status).toBe(400)
    expect(long.body.error.details.map((d: { path: string }) => d.path)).toContain('body.recovered')
  })
})

describe('PATCH / DELETE structures', () => {
  it('PATCH structures/:structureId → 409 for a stale version; two loggers edit different rows', async () => {
    const second = await clientFor(fx.app, 'logger')
    const [a, b] = (await logger.get(`${base()}/structures`)).body.data
    expect(
      (await logger.patch(`${base()}/structures/${a.id}`, { version: a.version, comment: 'first' }))
        .status,
    ).toBe(200)
    expect(
      (
        await second.patch(`${base()}/structures/${b.id}`, {
          version: b.version,
          comment: 'second',
        })
      ).status,
    ).toBe(200)
    const stale = await second.patch(`${base()}/structures/${a.id}`, {
      version: a.version,
      comment: 'late',
    })
    expect(stale.status).toBe(409)
    expect((await logger.get(`${base()}/structures/${a.id}`)).body.data.comment).toBe('first')
  })

  it('PATCH structures/:structureId with null clears an attribute', async () => {
    const s = (
      await logger.post(`${base()}/structures`, {
        depth: 13,
        type: 'joint',
        alpha: 60,
        beta: 5,
        jrc: 8,
      })
    ).body.data
    const res = await logger.patch(`${base()}/structures/${s.id}`, {
      version: s.version,
      jrc: null,
    })
    expect(res.status).toBe(200)
    expect(res.body.data.jrc).toBeNull()
  })

  it('DELETE structures/:structureId?version= → 409 stale, 204 current', async () => {
    const created = (
      await logger.post(`${base()}/structures`, { depth: 12, type: 'vein', alpha: 70, beta: 30 })
    ).body.data
    expect(
      (await logger.delete(`${base()}/structures/${created.id}?version=${created.version + 1}`))
        .status,
    ).toBe(409)
    expect(
      (await logger.delete(`${base()}/structures/${created.id}?version=${created.version}`)).status,
    ).toBe(204)
  })

  it('PATCH structures in a checked interval → 403 for a logger, 200 for an engineer', async () => {
    const s = (
      await logger.post(`${base()}/structures`, { depth: 14, type: 'joint', alpha: 70, beta: 30 })
    ).body.data
    await fx.db
      .insert(intervals)
      .values({ holeId: fx.holeId, name: 'checked', fromDepth: 13, toDepth: 16, status: 'checked' })
    const refused = await logger.patch(`${base()}/structures/${s.id}`, {
      version: s.version,
      alpha: 71,
    })
    expect(refused.status).toBe(403)
    expect(
      (await engineer.patch(`${base()}/structures/${s.id}`, { version: s.version, alpha: 71 }))
        .status,
    ).toBe(200)
  })
})
