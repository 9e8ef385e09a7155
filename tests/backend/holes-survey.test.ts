import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { auditEvents, holes, projects, surveyStations } from '../../schema/index'
import { magneticDeclination } from '../../orient/index'
import { toLatLon } from '../../backend/src/services/crs'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let logger: Client
let lead: Client
let viewer: Client
const survey = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}/survey`

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
  lead = await clientFor(fx.app, 'lead')
  viewer = await clientFor(fx.app, 'viewer')
})
afterAll(() => fx.close())

describe('PUT /api/projects/:projectId/holes/:holeId/survey', () => {
  it('PUT survey → stations sorted by depth, magnetic azimuths corrected with the manual declination', async () => {
    const res = await logger.put(survey(), {
      stations: [
        { depth: 60, azimuth: 14, plunge: 57, azimuthReference: 'magnetic', method: 'multishot' },
        { depth: 0, azimuth: 10, plunge: 60, azimuthReference: 'magnetic' },
        { depth: 30, azimuth: 359, plunge: 58.5, azimuthReference: 'magnetic' },
      ],
    })
    expect(res.status).toBe(200)
    // project declination is −2° (west): true = magnetic + D (common practice)
    expect(res.body.data.map((s: { depth: number }) => s.depth)).toEqual([0, 30, 60])
    expect(res.body.data.map((s: { azimuth: number }) => s.azimuth)).toEqual([8, 357, 12])
    expect(res.body.data[0]).toMatchObject({
      azimuthEntered: 10,
      azimuthReference: 'magnetic',
      declinationApplied: -2,
    })
    const [hole] = await fx.db.select().from(holes).where(eq(holes.id, fx.holeId))
    expect(hole.surveyRevision).toBe(1)
    const events = await fx.db.select().from(auditEvents).where(eq(auditEvents.entity, 'survey'))
    expect(events).toHaveLength(1)
    expect(events[0]).toMatchObject({ action: 'replace', userId: fx.userIds.logger })
  })

  it('PUT survey → grid azimuths corrected with the manual convergence (true = grid + convergence)', async () => {
    const [p] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
    await lead.patch(`/api/projects/${fx.projectId}`, {
      version: p.version,
      convergenceMode: 'manual',
      gridConvergenceDeg: 1.5,
    })
    const res = await logger.put(survey(), {
      stations: [{ depth: 0, azimuth: 359, plunge: 60, azimuthReference: 'grid' }],
    })
    expect(res.body.data[0]).toMatchObject({
      azimuth: 0.5,
      convergenceApplied: 1.5,
      declinationApplied: 0,
    })
  })

  it('PUT survey → 400 naming stations.1.depth for a repeated depth, and nothing is replaced', async () => {
    const before = await fx.db
      .select()
      .from(surveyStations)
      .where(eq(surveyStations.holeId, fx.holeId))
    const res = await logger.put(survey(), {
      stations: [
        { depth: 0, azimuth: 10, plunge: 60 },
        { depth: 0, azimuth: 11, plunge: 61 },
        { depth: 20, azimuth: 400, plunge: 95 },
      ],
    })
    expect(res.status).toBe(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toEqual(
      expect.arrayContaining([
        'body.stations.1.depth',
        'body.stations.2.azimuth',
        'body.stations.2.plunge',
      ]),
    )
    const after = await fx.db
      .select()
      .from(surveyStations)
      .where(eq(surveyStations.holeId, fx.holeId))
    expect(after).toEqual(before)
  })

  it('PUT survey → 403 for a viewer, and the survey is unchanged', async () => {
    const before = await countRows(fx.db, 'survey_stations')
    const res = await viewer.put(survey(), { stations: [] })
    expect(res.status).toBe(403)
    expect(await countRows(fx.db, 'survey_stations')).toBe(before)
  })

  it('PUT survey → automatic declination from the World Magnetic Model at the collar', async () => {
    const [p] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
    const patched = await lead.patch(`/api/projects/${fx.projectId}`, {
      version: p.version,
      declinationMode: 'auto',
    })
    expect(patched.status).toBe(200)
    const res = await logger.put(survey(), {
      stations: [
        {
          depth: 0,
          azimuth: 10,
          plunge: 60,
          azimuthReference: 'magnetic',
          surveyedOn: '2026-06-01',
        },
      ],
    })
    const place = toLatLon(32630, 512000, 6012000)!
    const expected = magneticDeclination({ ...place, date: new Date('2026-06-01'), heightKm: 0.2 })!
    expect(res.body.data[0].declinationApplied).toBeCloseTo(expected, 9)
    expect(res.body.data[0].azimuth).toBeCloseTo(10 + expected, 9)
  })
})

describe('site CRS', () => {
  it('toLatLon() UTM zone 30N: easting 500000 lies on the central meridian, 3° W (common practice)', () => {
    const p = toLatLon(32630, 500000, 0)!
    expect(p.longitude).toBeCloseTo(-3, 9)
    expect(p.latitude).toBeCloseTo(0, 9)
  })

  it('PATCH /api/projects/:projectId → 400 naming body.crsEpsg when auto declination meets an unknown CRS', async () => {
    const [p] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
    const res = await lead.patch(`/api/projects/${fx.projectId}`, {
      version: p.version,
      crsEpsg: 3112,
      declinationMode: 'auto',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('body.crsEpsg')
  })
})

describe('PATCH optimistic locking', () => {
  it('PATCH /api/projects/:projectId/holes/:holeId → 409 for a stale version, and the row keeps the first edit', async () => {
    const url = `/api/projects/${fx.projectId}/holes/${fx.holeId}`
    const { version } = (await logger.get(url)).body.data
    expect((await logger.patch(url, { version, coreSize: 'NQ' })).status).toBe(200)
    const stale = await lead.patch(url, { version, coreSize: 'PQ' })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale_version')
    expect((await viewer.get(url)).body.data.coreSize).toBe('NQ')
  })

  it('POST /api/projects/:projectId/holes → 409 for a duplicate name in the project, 400 naming bad fields', async () => {
    const url = `/api/projects/${fx.projectId}/holes`
    const body = {
      name: 'TST-01',
      collarEast: 1,
      collarNorth: 2,
      collarElevation: 3,
      plannedAzimuth: 0,
      plannedPlunge: 60,
      finalDepth: 50,
    }
    expect((await logger.post(url, body)).status).toBe(409)
    const bad = await logger.post(url, {
      ...body,
      name: 'TST-09',
      plannedAzimuth: 'north',
      finalDepth: -5,
    })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details.map((d: { path: string }) => d.path).sort()).toEqual([
      'body.finalDepth',
      'body.plannedAzimuth',
    ])
  })

  it('GET a hole of another project through this project → 404', async () => {
    const [other] = await fx.db
      .insert(holes)
      .values({
        projectId: fx.otherProjectId,
        name: 'OTH-01',
        collarEast: 0,
        collarNorth: 0,
        collarElevation: 0,
        plannedAzimuth: 0,
        plannedPlunge: 90,
        finalDepth: 10,
      })
      .returning()
    expect((await lead.get(`/api/projects/${fx.projectId}/holes/${other.id}`)).status).toBe(404)
  })
})
