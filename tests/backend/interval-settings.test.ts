import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { holeAt, planeToCore } from '../../orient/index'
import { auditEvents, intervals } from '../../schema/index'
import { settingsOf } from '../../backend/src/services/intervals'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let as: Record<'logger' | 'engineer' | 'lead' | 'viewer', Client>
let intervalId = 0
const base = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const url = () => `${base()}/intervals/${intervalId}`
const row = async () =>
  (await fx.db.select().from(intervals).where(eq(intervals.id, intervalId)))[0]
const stations = [
  { depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' },
  { depth: 100, azimuth: 0, plunge: 60, azimuthReference: 'true' },
]
// Two loose sets: the Terzaghi weights (Terzaghi 1965) differ within each, so weighting shows.
const planes = [
  [50, 190],
  [58, 200],
  [42, 180],
  [80, 100],
  [70, 110],
  [85, 92],
].map(([dip, dipDirection]) => ({ dip, dipDirection }))

beforeAll(async () => {
  fx = await createFixture({ SMTP_URL: 'smtp://127.0.0.1:9' })
  const who = ['logger', 'engineer', 'lead', 'viewer'] as const
  const clients = await Promise.all(who.map((w) => clientFor(fx.app, w)))
  as = Object.fromEntries(who.map((w, i) => [w, clients[i]])) as typeof as
  await as.logger.put(`${base()}/survey`, { stations })
  let depth = 10
  for (const plane of planes) {
    const core = planeToCore(plane, holeAt(stations, depth)!)!
    await as.logger.post(`${base()}/structures`, { depth, type: 'joint', ...core })
    depth += 3
  }
  const created = await as.engineer.post(`${base()}/intervals`, {
    name: 'upper',
    fromDepth: 5,
    toDepth: 40,
  })
  intervalId = created.body.data.id
  await as.engineer.post(`${url()}/sets`, {
    name: 'J1',
    centreTrend: 10,
    centrePlunge: 40,
    coneAngle: 25,
  })
  await as.engineer.post(`${url()}/sets`, {
    name: 'J2',
    centreTrend: 280,
    centrePlunge: 10,
    coneAngle: 25,
  })
})
afterAll(() => fx.close())

describe('PATCH /api/projects/:projectId/holes/:holeId/intervals/:intervalId settings', () => {
  it('PATCH intervals/:id → 400 naming each bad setting; nothing saved', async () => {
    const version = (await row()).version
    for (const [field, value] of [
      ['weighting', 'heavy'],
      ['contourMethod', 'kernel'],
      ['lateralLimitDeg', 95],
      ['topplingLimitDeg', -1],
      ['frictionDeg', 90],
      ['faceDipDirection', 361],
      ['faceDip', '70'],
    ] as const) {
      const res = await as.engineer.patch(url(), { version, [field]: value })
      expect(res.status).toBe(400)
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual([`body.${field}`])
    }
    expect((await row()).version).toBe(version)
  })

  it('PATCH intervals/:id → 403 logger and viewer; 200 engineer saves every setting', async () => {
    const body = {
      version: (await row()).version,
      weighting: 'none',
      contourMethod: 'exponential',
      faceDip: 70,
      faceDipDirection: 190,
      frictionDeg: 30,
      lateralLimitDeg: 25,
      topplingLimitDeg: 35,
    }
    for (const who of ['logger', 'viewer'] as const)
      expect((await as[who].patch(url(), body)).status).toBe(403)
    const res = await as.engineer.patch(url(), body)
    expect(res.status).toBe(200)
    const { version: _v, ...settings } = body
    expect(res.body.data).toMatchObject(settings)
    expect(settingsOf(await row())).toEqual(settings)
  })
})

describe('GET …/intervals/:intervalId/analysis and the saved settings', () => {
  it('GET analysis (no query) → the saved settings, equal to the same settings given explicitly', async () => {
    const plain = (await as.viewer.get(`${url()}/analysis`)).body.data
    expect(plain.settings.used).toEqual(plain.settings.saved)
    expect(plain.settings.saved).toMatchObject({ weighting: 'none', lateralLimitDeg: 25 })
    expect(plain.settings.overridden).toEqual([])
    const explicit = (
      await as.viewer.get(
        `${url()}/analysis?weighting=none&lateralLimitDeg=25&topplingLimitDeg=35&faceDip=70`,
      )
    ).body.data
    expect(explicit.settings.overridden).toEqual([])
    for (const key of ['sets', 'intersections', 'kinematics'])
      expect(plain[key]).toEqual(explicit[key])
    expect(plain.kinematics).toMatchObject({
      face: { dip: 70, dipDirection: 190 },
      friction: 30,
      lateralLimit: 25,
      topplingLimit: 35,
    })
  })

  it('GET analysis?weighting=terzaghi&lateralLimitDeg=10 → overrides for exploring, named as such', async () => {
    const plain = (await as.viewer.get(`${url()}/analysis`)).body.data
    const explored = (
      await as.viewer.get(`${url()}/analysis?weighting=terzaghi&lateralLimitDeg=10`)
    ).body.data
    expect(explored.settings.overridden).toEqual(['weighting', 'lateralLimitDeg'])
    expect(explored.settings.saved).toEqual(plain.settings.saved)
    expect(explored.kinematics.lateralLimit).toBe(10)
    expect(explored.sets[0].weightedCount).not.toBe(plain.sets[0].weightedCount)
    expect(plain.sets[0].weightedCount).toBe(plain.sets[0].count)
    for (const [query, path] of [
      ['weighting=heavy', 'query.weighting'],
      ['faceDip=', 'query.faceDip'],
      ['lateralLimitDeg=91', 'query.lateralLimitDeg'],
    ]) {
      const bad = await as.viewer.get(`${url()}/analysis?${query}`)
      expect(bad.status).toBe(400)
      expect(bad.body.error.details[0].path).toBe(path)
    }
  })
})

describe('PATCH on a checked or approved interval', () => {
  it('PATCH a checked interval’s settings → 200 and back to draft, audited; a rename keeps it checked', async () => {
    const checked = await as.engineer.post(`${url()}/check`, { version: (await row()).version })
    expect(checked.body.data.status).toBe('checked')
    const renamed = await as.engineer.patch(url(), {
      version: checked.body.data.version,
      name: 'upper limestone',
    })
    expect(renamed.body.data).toMatchObject({ status: 'checked', name: 'upper limestone' })
    const res = await as.engineer.patch(url(), {
      version: renamed.body.data.version,
      weighting: 'terzaghi',
    })
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({ status: 'draft', checkedBy: null, weighting: 'terzaghi' })
    expect(await row()).toMatchObject({ status: 'draft', checkedAt: null })
    const audits = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'interval'), eq(auditEvents.action, 'back-to-draft')))
    expect(audits).toHaveLength(1)
    expect(audits[0].before).toMatchObject({ status: 'checked', checkedBy: fx.userIds.engineer })
  })

  it('PATCH or DELETE an approved interval → 409 interval_approved for engineer and lead; nothing changes', async () => {
    const checked = await as.engineer.post(`${url()}/check`, { version: (await row()).version })
    const approved = await as.lead.post(`${url()}/approve`, {
      version: checked.body.data.version,
    })
    expect(approved.body.data.status).toBe('approved')
    const before = await row()
    for (const who of ['engineer', 'lead'] as const)
      for (const body of [{ weighting: 'none' }, { fromDepth: 6 }, { name: 'renamed' }]) {
        const res = await as[who].patch(url(), { version: before.version, ...body })
        expect(res.status).toBe(409)
        expect(res.body.error.code).toBe('interval_approved')
        expect(res.body.error.message).toContain('"upper limestone"')
      }
    const gone = await as.lead.delete(`${url()}?version=${before.version}`)
    expect(gone.status).toBe(409)
    expect(gone.body.error.code).toBe('interval_approved')
    expect(await row()).toEqual(before)
  })
})
