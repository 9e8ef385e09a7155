import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import {
  fisherStats,
  planeIntersection,
  planeOfPole,
  planeToCore,
  holeAt,
} from '../../orient/index'
import { countRows, clientFor, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let engineer: Client
let logger: Client
const base = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const stations = [
  { depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' },
  { depth: 100, azimuth: 0, plunge: 60, azimuthReference: 'true' },
]
// Two tight sets of planes entered as core angles through the API (values derived with planeToCore).
const setA = [
  { dip: 50, dipDirection: 190 },
  { dip: 52, dipDirection: 195 },
  { dip: 48, dipDirection: 186 },
  { dip: 51, dipDirection: 192 },
]
const setB = [
  { dip: 80, dipDirection: 100 },
  { dip: 78, dipDirection: 104 },
  { dip: 82, dipDirection: 97 },
  { dip: 79, dipDirection: 101 },
]

beforeAll(async () => {
  fx = await createFixture()
  engineer = await clientFor(fx.app, 'engineer')
  logger = await clientFor(fx.app, 'logger')
  await logger.put(`${base()}/survey`, { stations })
  await logger.put(`${base()}/runs`, {
    runs: [{ fromDepth: 0, toDepth: 60, recovered: 60, solid: 58, rqdLength: 50 }],
  })
  let depth = 10
  for (const plane of [...setA, ...setB]) {
    const core = planeToCore(plane, holeAt(stations, depth)!)!
    await logger.post(`${base()}/structures`, {
      depth,
      type: 'joint',
      alpha: core.alpha,
      beta: core.beta,
    })
    depth += 2
  }
})
afterAll(() => fx.close())

describe('intervals', () => {
  it('POST intervals → 201 for an engineer, 403 for a logger, 409 interval_overlap naming body.fromDepth', async () => {
    const body = {
      name: 'upper',
      fromDepth: 5,
      toDepth: 40,
      faceDip: 70,
      faceDipDirection: 190,
      frictionDeg: 30,
    }
    expect((await logger.post(`${base()}/intervals`, body)).status).toBe(403)
    const created = await engineer.post(`${base()}/intervals`, body)
    expect(created.status).toBe(201)
    const before = await countRows(fx.db, 'intervals')
    const clash = await engineer.post(`${base()}/intervals`, {
      name: 'clash',
      fromDepth: 39,
      toDepth: 50,
    })
    expect(clash.status).toBe(409)
    expect(clash.body.error).toMatchObject({
      code: 'interval_overlap',
      details: [{ path: 'body.fromDepth' }],
    })
    expect(await countRows(fx.db, 'intervals')).toBe(before)
    // touching is fine: [5, 40) and [40, 50)
    expect(
      (await engineer.post(`${base()}/intervals`, { name: 'lower', fromDepth: 40, toDepth: 50 }))
        .status,
    ).toBe(201)
    const list = (await logger.get(`${base()}/intervals`)).body.data
    expect(
      list.map((i: { name: string; structureCount: number }) => [i.name, i.structureCount]),
    ).toEqual([
      ['upper', 8],
      ['lower', 0],
    ])
  })

  it('POST intervals/:id/sets/cluster → two sets; analysis equals orient for the same members', async () => {
    const [upper] = (await logger.get(`${base()}/intervals`)).body.data
    const url = `${base()}/intervals/${upper.id}`
    const suggest = await logger.get(`${url}/sets/suggest?maxK=4`)
    expect(suggest.body.data.k).toBe(2)
    expect((await logger.post(`${url}/sets/cluster`, { k: 2 })).status).toBe(403)
    expect((await engineer.post(`${url}/sets/cluster`, { k: 2 })).status).toBe(200)
    // Unweighted, to compare with orient's plain Fisher statistics (the saved default is Terzaghi).
    const a = (await logger.get(`${url}/analysis?weighting=none`)).body.data
    expect(a.interval).toMatchObject({ name: 'upper', domainName: null })
    // the first plane of the second set jumps in beta against the last of the first (same type, same run)
    expect(a.counts).toEqual({ total: 8, oriented: 8, unoriented: 0, flagged: 1 })
    expect(
      a.structures
        .filter((s: { flags: string[] }) => s.flags.length)
        .map((s: { depth: number; flags: string[] }) => [s.depth, s.flags]),
    ).toEqual([[18, ['beta-jump']]])
    expect(a.sets.map((s: { count: number }) => s.count)).toEqual([4, 4])
    const members = (setId: number) =>
      a.structures
        .filter((s: { setId: number }) => s.setId === setId)
        .map((s: { poleTrend: number; polePlunge: number }) => ({
          trend: s.poleTrend,
          plunge: s.polePlunge,
        }))
    for (const set of a.sets) {
      const stats = fisherStats(members(set.id))!
      const mean = planeOfPole(stats.mean)!
      expect(set.kappa).toBeCloseTo(stats.kappa, 0)
      expect(set.alpha95).toBeCloseTo(stats.alpha95, 2)
      expect(set.mean.dip).toBeCloseTo(mean.dip, 2)
      expect(set.mean.dipDirection).toBeCloseTo(mean.dipDirection, 2)
    }
    const [s1, s2] = a.sets
    const line = planeIntersection(s1.mean, s2.mean)!
    expect(a.intersections).toHaveLength(1)
    expect(a.intersections[0].trend).toBeCloseTo(line.trend, 1)
    expect(a.intersections[0].plunge).toBeCloseTo(line.plunge, 1)
    // The ~50/190 set daylights in a 70/190 face above 30° friction: planar sliding (Markland 1972)
    const planar = a.kinematics.items.filter(
      (i: { planar: { possible: boolean } }) => i.planar.possible,
    )
    expect(planar).toHaveLength(4)
    expect(a.kinematics.planar).toEqual({ possible: 4, percent: 50 })
  })

  it('PUT sets/:setId/members → membership by hand; a structure outside the interval → 400', async () => {
    const [upper] = (await logger.get(`${base()}/intervals`)).body.data
    const url = `${base()}/intervals/${upper.id}`
    const a = (await logger.get(`${url}/analysis`)).body.data
    const ids = a.structures.map((s: { id: number }) => s.id)
    const res = await engineer.put(`${url}/sets/${a.sets[0].id}/members`, {
      structureIds: ids.slice(0, 3),
    })
    expect(res.status).toBe(200)
    const after = (await logger.get(`${url}/analysis`)).body.data
    expect(after.sets.find((s: { id: number }) => s.id === a.sets[0].id).count).toBe(3)
    const outside = await engineer.put(`${url}/sets/${a.sets[0].id}/members`, {
      structureIds: [999999],
    })
    expect(outside.status).toBe(400)
    expect(outside.body.error.details[0].path).toBe('body.structureIds')
  })

  it('POST intervals/:id/sets → a cone set; DELETE intervals/:id?version= stale → 409', async () => {
    const [, lower] = (await logger.get(`${base()}/intervals`)).body.data
    const cone = await engineer.post(`${base()}/intervals/${lower.id}/sets`, {
      name: 'J1',
      centreTrend: 10,
      centrePlunge: 40,
      coneAngle: 20,
    })
    expect(cone.status).toBe(201)
    expect(cone.body.data).toMatchObject({ rule: 'cone', coneAngle: 20 })
    expect((await engineer.delete(`${base()}/intervals/${lower.id}?version=99`)).status).toBe(409)
    expect(
      (await engineer.delete(`${base()}/intervals/${lower.id}?version=${lower.version}`)).status,
    ).toBe(204)
  })
})
