import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import proj4 from 'proj4'
import { projects } from '../../schema/index'
import { crsDefinition, crsGeographic, gridConvergenceAt } from '../../backend/src/services/crs'
import { convergenceDetail } from '../../backend/src/services/declination'
import { demoHoles, demoProject } from '../../backend/src/db/demo-data'
import { expectAngle } from '../orient/expect-angle'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

/** Easting/northing of a latitude/longitude given in the CRS's own datum. */
const gridOf = (epsg: number, lat: number, lon: number) =>
  proj4(crsGeographic(epsg)!, crsDefinition(epsg)!, [lon, lat])

/*
 * Hand computations with the meridian convergence series of the transverse Mercator projection
 * (Redfearn 1948, "Transverse Mercator formulae", Empire Survey Review 9(69): 318–322; terms as
 * recalled from memory of its published form):
 *   γ = Δλ·sin φ + (Δλ³/3)·sin φ·cos²φ·(1 + 3η² + 2η⁴) + (Δλ⁵/15)·sin φ·cos⁴φ·(2 − tan²φ),
 *   η² = e′²·cos²φ, e′² = e²/(1 − e²), Δλ = λ − λ0 in radians; γ > 0 east of λ0 in the north.
 */
describe('gridConvergenceAt() against the series by hand', () => {
  it('gridConvergenceAt() UTM 30N (EPSG:32630) at 54° N, 2° W: Δλ = +1°, γ = +0.809046°', () => {
    // WGS 84 e² = 0.00669438, η² = 0.00232844; terms 0.8090170° + 2.858e-5° + 6e-11°
    const [e, n] = gridOf(32630, 54, -2)
    expectAngle(gridConvergenceAt(32630, e, n), 0.8090456, 1e-6)
  })

  it('gridConvergenceAt() British National Grid (EPSG:27700) at 57° N, 5° W: Δλ = −3°, γ = −2.516698°', () => {
    // Airy 1830 e² = 0.00667054, η² = 0.00199198; terms −2.5160117° − 6.861e-4° + 4e-8°
    const [e, n] = gridOf(27700, 57, -5)
    expectAngle(gridConvergenceAt(27700, e, n), -2.5166978, 1e-6)
  })

  it('gridConvergenceAt() MGA zone 55 (EPSG:28355) at 33° S, 150° E: south of the equator γ < 0 east of λ0', () => {
    // GRS 80 e² = 0.00669438, η² = 0.00474035; terms −1.6339171° − 1.0652e-3° − 6.4e-7°
    const [e, n] = gridOf(28355, -33, 150)
    expectAngle(gridConvergenceAt(28355, e, n), -1.634983, 1e-6)
  })

  it('gridConvergenceAt() on the central meridian is 0, and unknown CRSs give undefined', () => {
    const [e, n] = gridOf(32630, 54, -3)
    expectAngle(gridConvergenceAt(32630, e, n), 0, 1e-9)
    expect(gridConvergenceAt(3112, 500000, 6000000)).toBeUndefined()
  })
})

describe('convergenceFor() / convergenceDetail()', () => {
  it('convergenceDetail() GSQ-BH01 of the demo: +0.155° from EPSG:32630 at the collar', () => {
    // Collar 54.26138° N, 2.80948° W: Δλ·sin φ = 0.190518° × 0.811520 = 0.154609°, plus 3e-6°
    const bh01 = demoHoles.find((h) => h.name === 'GSQ-BH01')!
    const detail = convergenceDetail({ ...demoProject, convergenceMode: 'auto' }, bh01)
    expect(detail.source).toBe('crs')
    expectAngle(detail.convergenceDeg, 0.154642, 1e-5)
  })

  it('convergenceDetail() manual mode → the typed value; auto with an unknown CRS → manual fallback', () => {
    const collar = { collarEast: 512410, collarNorth: 6012620 }
    const manual = { crsEpsg: 32630, convergenceMode: 'manual' as const, gridConvergenceDeg: -0.9 }
    expect(convergenceDetail(manual, collar)).toEqual({ convergenceDeg: -0.9, source: 'manual' })
    const unknown = { ...manual, crsEpsg: 3112, convergenceMode: 'auto' as const }
    expect(convergenceDetail(unknown, collar)).toEqual({
      convergenceDeg: -0.9,
      source: 'manual-fallback',
    })
  })
})

let fx: Fixture
let lead: Client
let logger: Client
const P = () => `/api/projects/${fx.projectId}`
const version = async () =>
  (await fx.db.select().from(projects).where(eq(projects.id, fx.projectId)))[0].version

beforeAll(async () => {
  fx = await createFixture()
  lead = await clientFor(fx.app, 'lead')
  logger = await clientFor(fx.app, 'logger')
})
afterAll(() => fx.close())

describe('grid-referenced surveys with automatic convergence', () => {
  it('GET /api/projects/:projectId → collarConvergence lists each hole with its value and source', async () => {
    const res = await logger.get(P())
    expect(res.status).toBe(200)
    expect(res.body.data.convergenceMode).toBe('auto')
    expect(res.body.data.collarConvergence).toEqual([
      { holeId: fx.holeId, name: 'TST-01', convergenceDeg: expect.any(Number), source: 'crs' },
    ])
    expectAngle(
      res.body.data.collarConvergence[0].convergenceDeg,
      gridConvergenceAt(32630, 512000, 6012000)!,
      1e-12,
    )
  })

  it('PUT /api/projects/:projectId/holes/:holeId/survey → a grid azimuth gets the CRS convergence at the collar', async () => {
    const gamma = gridConvergenceAt(32630, 512000, 6012000)!
    // 12 km east of 3° W at 54.3° N: about +0.15° (Δλ·sin φ)
    expect(gamma).toBeGreaterThan(0.14)
    expect(gamma).toBeLessThan(0.16)
    const res = await logger.put(`${P()}/holes/${fx.holeId}/survey`, {
      stations: [{ depth: 0, azimuth: 10, plunge: 60, azimuthReference: 'grid' }],
    })
    expect(res.status).toBe(200)
    expect(res.body.data[0].convergenceApplied).toBeCloseTo(gamma, 12)
    expect(res.body.data[0].azimuth).toBeCloseTo(10 + gamma, 12)
  })

  it('PATCH /api/projects/:projectId → 400 naming body.crsEpsg for auto convergence with an unknown CRS', async () => {
    const res = await lead.patch(P(), { version: await version(), crsEpsg: 3112 })
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('body.crsEpsg')
    expect(res.body.error.details[0].message).toMatch(/grid convergence/)
  })

  it('POST /api/projects → an unknown CRS starts with manual convergence, a known one with auto', async () => {
    const admin = await clientFor(fx.app, 'admin')
    const body = { name: 'Elsewhere', leadUserId: fx.userIds.lead }
    const odd = await admin.post('/api/projects', { ...body, code: 'ODD', crsEpsg: 3112 })
    expect(odd.status).toBe(201)
    expect(odd.body.data.convergenceMode).toBe('manual')
    const utm = await admin.post('/api/projects', { ...body, code: 'UTM', crsEpsg: 32755 })
    expect(utm.body.data.convergenceMode).toBe('auto')
    const refused = await admin.post('/api/projects', {
      ...body,
      code: 'BAD',
      crsEpsg: 3112,
      convergenceMode: 'auto',
    })
    expect(refused.status).toBe(400)
    expect(refused.body.error.details[0].path).toBe('body.crsEpsg')
  })
})
