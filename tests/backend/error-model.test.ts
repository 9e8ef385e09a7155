import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { auditEvents, intervals, projects, structureSets, structures } from '../../schema/index'
import { DEFAULT_ERROR_MODEL } from '../../orient/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'
import { seedReconciliationHole } from './reconciliation-setup'

let fx: Fixture
let lead: Client
let engineer: Client
const P = () => `/api/projects/${fx.projectId}`
const version = async () =>
  (await fx.db.select().from(projects).where(eq(projects.id, fx.projectId)))[0].version
const rowsById = () =>
  fx.db.select().from(structures).where(eq(structures.holeId, fx.holeId)).orderBy(structures.id)
const cones = async () => (await rowsById()).map((s) => s.uncertainty95)

beforeAll(async () => {
  fx = await createFixture()
  await seedReconciliationHole(fx)
  lead = await clientFor(fx.app, 'lead')
  engineer = await clientFor(fx.app, 'engineer')
})
afterAll(() => fx.close())

describe('GET /api/projects/:projectId/error-model', () => {
  it('GET error-model → the stated defaults, nothing changed', async () => {
    const res = await engineer.get(`${P()}/error-model`)
    expect(res.status).toBe(200)
    expect(res.body.data.model).toEqual(DEFAULT_ERROR_MODEL)
    expect(res.body.data.defaults).toEqual(DEFAULT_ERROR_MODEL)
    expect(res.body.data.changed).toEqual([])
    expect(res.body.data.version).toBe(await version())
  })

  it('stored structures carry a Monte Carlo cone from the defaults (every oriented one)', async () => {
    const rows = await fx.db.select().from(structures).where(eq(structures.holeId, fx.holeId))
    expect(rows).toHaveLength(120)
    for (const s of rows) {
      expect(s.uncertainty95).toBeGreaterThan(1)
      // alpha ±2°, beta ±5° (1σ) put a core pole's 95 % cone well under 20° in a 60° hole
      expect(s.uncertainty95).toBeLessThan(20)
      expect(Array.isArray(s.uncertaintyReasons)).toBe(true)
    }
  })
})

describe('PUT /api/projects/:projectId/error-model', () => {
  it('PUT error-model → 403 for an engineer, 400 naming a bad field', async () => {
    const body = { model: DEFAULT_ERROR_MODEL, version: await version() }
    expect((await engineer.put(`${P()}/error-model`, body)).status).toBe(403)
    const bad = await lead.put(`${P()}/error-model`, {
      model: { ...DEFAULT_ERROR_MODEL, alphaSd: -1 },
      version: await version(),
    })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toContain('alphaSd')
  })

  it('PUT error-model → 409 while an approved interval would change; nothing changes', async () => {
    const [i] = await fx.db
      .insert(intervals)
      .values({ holeId: fx.holeId, name: 'Signed', fromDepth: 10, toDepth: 20, status: 'approved' })
      .returning()
    const before = await cones()
    const res = await lead.put(`${P()}/error-model`, {
      model: { ...DEFAULT_ERROR_MODEL, betaSd: 1 },
      version: await version(),
    })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
    expect(await cones()).toEqual(before)
    await fx.db.delete(intervals).where(eq(intervals.id, i.id))
  })

  it('PUT error-model smaller reading errors → smaller cones, audited, checked interval back to draft; stale → 409', async () => {
    const [checked] = await fx.db
      .insert(intervals)
      .values({ holeId: fx.holeId, name: 'Checked', fromDepth: 10, toDepth: 20, status: 'checked' })
      .returning()
    const before = await cones()
    const v = await version()
    const model = { ...DEFAULT_ERROR_MODEL, alphaSd: 0.5, betaSd: 1 }
    const res = await lead.put(`${P()}/error-model`, { model, version: v })
    expect(res.status, JSON.stringify(res.body)).toBe(200)
    expect(res.body.data.changed.sort()).toEqual(['alphaSd', 'betaSd'])
    expect(res.body.data.version).toBe(v + 1)
    const after = await cones()
    const rows = await rowsById()
    rows.forEach((s, k) => {
      // image picks do not read alpha or beta: their cones stay as they were
      if (s.source === 'core') expect(after[k]!).toBeLessThan(before[k]!)
      else expect(after[k]).toBe(before[k])
    })
    const [i] = await fx.db.select().from(intervals).where(eq(intervals.id, checked.id))
    expect(i.status).toBe('draft')
    const [audited] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'project'), eq(auditEvents.action, 'update-error-model')))
    expect(audited.before).toEqual({ alphaSd: 2, betaSd: 5 })
    const stale = await lead.put(`${P()}/error-model`, { model: DEFAULT_ERROR_MODEL, version: v })
    expect(stale.status).toBe(409)
  })
})

describe('GET intervals/:intervalId/analysis — set uncertainty', () => {
  it('analysis sets carry alpha95, the survey (systematic) cone and the combined cone', async () => {
    const [i] = await fx.db
      .insert(intervals)
      .values({ holeId: fx.holeId, name: 'Whole', fromDepth: 0, toDepth: 50 })
      .returning()
    // one of the seeded families (dip direction 040, dip 35 → pole 220/55)
    await fx.db.insert(structureSets).values({
      intervalId: i.id,
      name: 'J1',
      centreTrend: 220,
      centrePlunge: 55,
      coneAngle: 25,
    })
    const res = await engineer.get(`${P()}/holes/${fx.holeId}/intervals/${i.id}/analysis`)
    expect(res.status).toBe(200)
    const [set] = res.body.data.sets
    expect(set.count).toBeGreaterThan(20)
    expect(set.systematic95).toBeGreaterThan(0)
    // magnetic survey azimuth ±1.5°, inclination ±0.2° (1σ): the shared term is a few degrees
    expect(set.systematic95).toBeLessThan(6)
    expect(set.uncertainty95).toBeCloseTo(Math.hypot(set.alpha95, set.systematic95), 1)
    expect(res.body.data.structures[0].uncertainty95).toBeTypeOf('number')
  })
})
