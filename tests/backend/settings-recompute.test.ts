import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import {
  auditEvents,
  holes,
  intervals,
  projects,
  structures,
  surveyStations,
} from '../../schema/index'
import { magneticDeclination } from '../../orient/index'
import { toLatLon } from '../../backend/src/services/crs'
import { expectAngle } from '../orient/expect-angle'
import { clientFor, createFixture, holeValues, type Client, type Fixture } from './fixture'

let fx: Fixture
let lead: Client
let logger: Client
let trueHoleId: number
const P = () => `/api/projects/${fx.projectId}`
const H = (id = fx.holeId) => `${P()}/holes/${id}`
const project = async () =>
  (await fx.db.select().from(projects).where(eq(projects.id, fx.projectId)))[0]
const stationsOf = (holeId: number) =>
  fx.db.select().from(surveyStations).where(eq(surveyStations.holeId, holeId))
const holeRow = async (id: number) => (await fx.db.select().from(holes).where(eq(holes.id, id)))[0]
const structure = async () =>
  (await fx.db.select().from(structures).where(eq(structures.holeId, fx.holeId)))[0]
const patch = async (body: object) =>
  lead.patch(P(), { version: (await project()).version, ...body })

/** WMM declination at the fixture collar on the survey date (the value auto mode must apply). */
const place = toLatLon(32630, 512000, 6012000)!
const wmm = magneticDeclination({ ...place, date: new Date('2026-03-02'), heightKm: 0.2 })!

beforeAll(async () => {
  fx = await createFixture()
  lead = await clientFor(fx.app, 'lead')
  logger = await clientFor(fx.app, 'logger')
  const [other] = await fx.db.insert(holes).values(holeValues(fx.projectId, 'TST-02')).returning()
  trueHoleId = other.id
})
afterAll(() => fx.close())

beforeEach(async () => {
  await fx.db.delete(intervals)
  await fx.db.delete(structures)
  expect((await patch({ declinationMode: 'auto', convergenceMode: 'auto' })).status).toBe(200)
  await logger.put(`${H()}/survey`, {
    stations: [
      { depth: 0, azimuth: 20, plunge: 60, azimuthReference: 'magnetic', surveyedOn: '2026-03-02' },
      { depth: 50, azimuth: 21, plunge: 60, azimuthReference: 'grid' },
    ],
  })
  await logger.put(`${H(trueHoleId)}/survey`, {
    stations: [{ depth: 0, azimuth: 30, plunge: 70, azimuthReference: 'true' }],
  })
  const made = await logger.post(`${H()}/structures`, {
    depth: 20,
    type: 'joint',
    alpha: 40,
    beta: 30,
  })
  expect(made.status).toBe(201)
})

describe('PATCH /api/projects/:projectId — declination and convergence settings', () => {
  it('PATCH project → manual 10° corrects the magnetic station again and recomputes its structures', async () => {
    const [before] = (await stationsOf(fx.holeId)).filter((s) => s.depth === 0)
    // The case: a WMM value (about −0.09° here) must not survive a switch to manual 10°.
    expect(before.declinationApplied).toBeCloseTo(wmm, 9)
    expect(Math.abs(wmm)).toBeLessThan(1)
    const structureBefore = await structure()
    const revision = (await holeRow(fx.holeId)).surveyRevision
    const res = await patch({ declinationMode: 'manual', declinationDeg: 10 })
    expect(res.status).toBe(200)
    const [after] = (await stationsOf(fx.holeId)).filter((s) => s.depth === 0)
    expect(after.declinationApplied).toBe(10)
    expectAngle(after.azimuth, 30, 1e-9)
    expectAngle(after.azimuth - before.azimuth, 10 - wmm, 1e-9)
    const structureAfter = await structure()
    expect(structureAfter.declinationApplied).toBe(10)
    expect(structureAfter.surveyRevision).toBe(revision + 1)
    expect(Math.abs(structureAfter.dipDirection! - structureBefore.dipDirection!)).toBeGreaterThan(
      2,
    )
    // A true-north survey does not depend on the settings: that hole is left alone.
    expect((await holeRow(trueHoleId)).surveyRevision).toBe(1)
    const events = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'hole'), eq(auditEvents.action, 'recompute-conventions')))
    expect(events.at(-1)).toMatchObject({
      entityId: String(fx.holeId),
      userId: fx.userIds.lead,
      after: { stations: 1, structures: 1, surveyRevision: revision + 1 },
    })
  })

  it('PATCH project → manual convergence corrects the grid station (true = grid + γ)', async () => {
    const res = await patch({ convergenceMode: 'manual', gridConvergenceDeg: -1.25 })
    expect(res.status).toBe(200)
    const [grid] = (await stationsOf(fx.holeId)).filter((s) => s.depth === 50)
    expect(grid.convergenceApplied).toBe(-1.25)
    expectAngle(grid.azimuth, 19.75, 1e-9)
    expect(res.body.data.collarConvergence).toContainEqual({
      holeId: fx.holeId,
      name: 'TST-01',
      convergenceDeg: -1.25,
      source: 'manual',
    })
  })

  it('PATCH project → 409 interval_approved when an approved interval would change, and nothing changes', async () => {
    await fx.db
      .insert(intervals)
      .values({ holeId: fx.holeId, name: 'Upper', fromDepth: 10, toDepth: 40, status: 'approved' })
    const before = { project: await project(), stations: await stationsOf(fx.holeId) }
    const s = await structure()
    const res = await patch({ declinationMode: 'manual', declinationDeg: 10 })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
    expect(res.body.error.message).toContain('"Upper" (10–40 m)')
    expect(res.body.error.message).toContain('TST-01')
    expect(await project()).toEqual(before.project)
    expect(await stationsOf(fx.holeId)).toEqual(before.stations)
    expect(await structure()).toEqual(s)
  })

  it('PATCH project → a checked interval of a changed hole goes back to draft, audited', async () => {
    const [checked] = await fx.db
      .insert(intervals)
      .values({
        holeId: fx.holeId,
        name: 'Lower',
        fromDepth: 40,
        toDepth: 90,
        status: 'checked',
        checkedBy: fx.userIds.engineer,
        checkedAt: new Date(),
      })
      .returning()
    expect((await patch({ declinationMode: 'manual', declinationDeg: 3 })).status).toBe(200)
    const [after] = await fx.db.select().from(intervals).where(eq(intervals.id, checked.id))
    expect(after).toMatchObject({ status: 'draft', checkedBy: null })
    const [event] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'interval'), eq(auditEvents.entityId, String(checked.id))))
    expect(event).toMatchObject({ action: 'back-to-draft', userId: fx.userIds.lead })
  })

  it('PATCH project → a name change alone recomputes nothing', async () => {
    const revision = (await holeRow(fx.holeId)).surveyRevision
    expect((await patch({ name: 'Renamed' })).status).toBe(200)
    expect((await holeRow(fx.holeId)).surveyRevision).toBe(revision)
  })
})
