import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { auditEvents, holes, imagePicks, structures, type Image } from '../../schema/index'
import { imagePickToPlane, planeToImageSinusoid } from '../../orient/index'
import { expectAngle } from '../orient/expect-angle'
import {
  clientFor,
  countRows,
  createFixture,
  holeValues,
  type Client,
  type Fixture,
} from './fixture'
import { insertImage, tracePoints } from './image-picks-fixture'

let fx: Fixture
let logger: Client
let viewer: Client
let outsider: Client
let vertical: number
let deviated: number
const img: Record<'vertical' | 'inclined' | 'magnetic' | 'processing', Image> = {} as never
const H = (holeId: number) => `/api/projects/${fx.projectId}/holes/${holeId}`
const I = (image: Image) => `${H(image.holeId)}/images/${image.id}`
const TAN30 = Math.tan(Math.PI / 6)

async function newHole(name: string, azimuth: number, plunge: number) {
  const [row] = await fx.db
    .insert(holes)
    .values({ ...holeValues(fx.projectId, name), plannedAzimuth: azimuth, plannedPlunge: plunge })
    .returning()
  return row.id
}

beforeAll(async () => {
  fx = await createFixture()
  ;[logger, viewer, outsider] = await Promise.all(
    (['logger', 'viewer', 'outsider'] as const).map((who) => clientFor(fx.app, who)),
  )
  vertical = await newHole('TST-V', 0, 90)
  deviated = await newHole('TST-D', 45, 70)
  const surveys: [number, number, number][] = [
    [vertical, 0, 90],
    [fx.holeId, 0, 60],
    [deviated, 45, 70],
  ]
  for (const [holeId, azimuth, plunge] of surveys) {
    const res = await logger.put(`${H(holeId)}/survey`, {
      stations: [
        { depth: 0, azimuth, plunge, azimuthReference: 'true' },
        { depth: 100, azimuth, plunge, azimuthReference: 'true' },
      ],
    })
    expect(res.status).toBe(200)
  }
  // 10–20 m at 10 mm a row, 5° a column: geometry only, the samples do not matter here.
  const strip = { topDepth: 10, bottomDepth: 20, width: 72, height: 1000 }
  img.vertical = await insertImage(fx.db, { ...strip, holeId: vertical })
  img.inclined = await insertImage(fx.db, {
    ...strip,
    holeId: fx.holeId,
    azimuthReference: 'highside',
  })
  img.magnetic = await insertImage(fx.db, {
    ...strip,
    holeId: deviated,
    northReference: 'magnetic',
  })
  img.processing = await insertImage(fx.db, { ...strip, holeId: vertical, status: 'processing' })
})
afterAll(() => fx.close())

describe('POST H/images/:imageId/fit', () => {
  it("POST fit: vertical hole, north image, D = H = 96 mm, trough 090 → 45/090 (REFERENCES.md image-log check, derived; Crain's Petrophysical Handbook atan(H/D))", async () => {
    const res = await logger.post(`${I(img.vertical)}/fit`, { points: tracePoints(12.5, 96, 90) })
    expect(res.status).toBe(200)
    const fit = res.body.data
    expect(fit.depth).toBeCloseTo(12.5, 9)
    expect(fit.height).toBeCloseTo(96, 6)
    expectAngle(fit.troughAzimuth, 90, 1e-6)
    expect(fit.rmsMm).toBeLessThan(1e-6)
    expectAngle(fit.dip, 45, 0.01)
    expectAngle(fit.dipDirection, 90, 0.01)
  })

  it('POST fit: hole 000/60, high-side image, H/D = tan 30°, trough 180 → 60/180 (REFERENCES.md, derived)', async () => {
    const points = tracePoints(15, 96 * TAN30, 180, 30)
    const res = await logger.post(`${I(img.inclined)}/fit`, { points })
    expect(res.status).toBe(200)
    expect(res.body.data.height).toBeCloseTo(96 * TAN30, 6)
    expectAngle(res.body.data.dip, 60, 0.01)
    expectAngle(res.body.data.dipDirection, 180, 0.01)
  })

  it('POST fit: scattered points → the least-squares trace and its RMS residual in mm', async () => {
    // ±2 mm alternately about the 45/090 trace: the fit keeps the trace, RMS = 2 mm (derived:
    // alternating residuals at 45° steps are orthogonal to 1, sin θ and cos θ).
    const points = tracePoints(12.5, 96, 90).map((p, i) => ({
      ...p,
      depth: p.depth + (i % 2 === 0 ? 0.002 : -0.002),
    }))
    const res = await logger.post(`${I(img.vertical)}/fit`, { points })
    expect(res.body.data.rmsMm).toBeCloseTo(2, 6)
    expect(res.body.data.height).toBeCloseTo(96, 6)
  })

  it('POST fit → 400 naming body.points when the azimuths do not fix a sinusoid', async () => {
    const points = [
      { depth: 12, azimuth: 10 },
      { depth: 12.1, azimuth: 190 },
      { depth: 12.05, azimuth: 10 },
    ]
    const res = await logger.post(`${I(img.vertical)}/fit`, { points })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([
      { path: 'body.points', message: 'give points at three or more different azimuths' },
    ])
  })

  it('POST fit → 400 naming each point outside the image depths (10–20 m), and for fewer than 3 points', async () => {
    const points = [...tracePoints(12.5, 96, 90).slice(0, 3), { depth: 20.5, azimuth: 300 }]
    const res = await logger.post(`${I(img.vertical)}/fit`, { points })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([
      { path: 'body.points.3.depth', message: 'outside the image (10–20 m)' },
    ])
    const two = await logger.post(`${I(img.vertical)}/fit`, { points: points.slice(0, 2) })
    expect(two.status).toBe(400)
    expect(two.body.error.details[0].path).toBe('body.points')
  })

  it('POST fit → 409 image_not_ready while the image is processing; 404 for an image of another hole', async () => {
    const res = await logger.post(`${I(img.processing)}/fit`, { points: tracePoints(12, 50, 0) })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('image_not_ready')
    const wrongHole = `${H(fx.holeId)}/images/${img.vertical.id}/fit`
    expect((await logger.post(wrongHole, { points: tracePoints(12, 50, 0) })).status).toBe(404)
    expect(
      (await logger.post(`${H(vertical)}/images/999999/fit`, { points: tracePoints(12, 50, 0) }))
        .status,
    ).toBe(404)
  })
})

describe('POST H/images/:imageId/picks', () => {
  it("POST picks → 201 with the raw pick and its structure; GET H/structures shows it (source image) with the fit's dip", async () => {
    const points = tracePoints(12.5, 96, 90)
    const fit = (await logger.post(`${I(img.vertical)}/fit`, { points })).body.data
    const res = await logger.post(`${I(img.vertical)}/picks`, {
      points,
      type: 'joint',
      confidence: 'high',
      comment: 'open, iron-stained',
    })
    expect(res.status).toBe(201)
    const pick = res.body.data
    expect(pick).toMatchObject({
      imageId: img.vertical.id,
      points,
      diameterMm: 96,
      azimuthReference: 'north',
      northReference: 'true',
      suggested: false,
      structure: { type: 'joint', confidence: 'high', comment: 'open, iron-stained', version: 1 },
    })
    expect(pick.centreDepth).toBeCloseTo(12.5, 9)
    expect(pick.heightMm).toBeCloseTo(96, 6)
    expect(pick.structure.id).toBe(pick.structureId)
    const listed = (await viewer.get(`${H(vertical)}/structures`)).body.data
    const row = listed.find((s: { id: number }) => s.id === pick.structureId)
    expect(row).toMatchObject({ source: 'image', pickDiameter: 96, pickReference: 'north' })
    expect(row.pickAmplitude).toBeCloseTo(96, 6)
    expectAngle(row.pickTroughAzimuth, 90, 1e-6)
    expect(row.depth).toBeCloseTo(fit.depth, 12)
    expect(row.dip).toBeCloseTo(fit.dip, 9)
    expect(row.dipDirection).toBeCloseTo(fit.dipDirection, 9)
    const [event] = await fx.db
      .select()
      .from(auditEvents)
      .where(
        and(
          eq(auditEvents.entity, 'structure'),
          eq(auditEvents.entityId, String(pick.structureId)),
        ),
      )
    expect(event.action).toBe('create')
    expect(event.after).toMatchObject({ source: 'image', imagePick: { points, suggested: false } })
  })

  it("POST picks on a magnetic-north image in hole 045/70: the structure's trough is referred to true north, the raw pick kept, the plane as computed independently", async () => {
    const declination = -2 // the fixture project's manual declination
    const points = tracePoints(14, 60, 120)
    const fit = (await logger.post(`${I(img.magnetic)}/fit`, { points })).body.data
    const res = await logger.post(`${I(img.magnetic)}/picks`, {
      points,
      type: 'fault',
      suggested: true,
    })
    expect(res.status).toBe(201)
    const [raw] = await fx.db
      .select()
      .from(imagePicks)
      .where(eq(imagePicks.structureId, res.body.data.structureId))
    expectAngle(raw.troughAzimuth, 120, 1e-6)
    expect(raw).toMatchObject({ northReference: 'magnetic', suggested: true })
    const [row] = await fx.db.select().from(structures).where(eq(structures.id, raw.structureId))
    expect(row.pickAzimuthReference).toBe('north-magnetic')
    // Independent route: the whole pick in magnetic coordinates (hole trend 045 − (−2) = 047 from
    // magnetic north), then the plane's dip direction back to true north (+ declination).
    const magnetic = imagePickToPlane(
      { amplitude: 60, diameter: 96, troughAzimuth: 120, reference: 'north' },
      { trend: 45 - declination, plunge: 70 },
    )!
    expectAngle(row.dip!, magnetic.dip, 1e-6)
    expectAngle(row.dipDirection!, magnetic.dipDirection + declination, 1e-6)
    // The stored (true-north) trough is the one that plane leaves on the wall of the true hole.
    const trueTrace = planeToImageSinusoid(
      { dip: magnetic.dip, dipDirection: magnetic.dipDirection + declination },
      { trend: 45, plunge: 70 },
      { reference: 'north', diameter: 96 },
    )!
    expectAngle(row.pickTroughAzimuth!, trueTrace.troughAzimuth, 1e-6)
    expect(trueTrace.height).toBeCloseTo(60, 6)
    expect(fit.dip).toBeCloseTo(row.dip!, 9)
    expect(fit.dipDirection).toBeCloseTo(row.dipDirection!, 9)
  })

  it("POST picks → 400 naming body.points for a pick beyond the hole's final depth (100 m); nothing stored", async () => {
    const deep = await insertImage(fx.db, {
      holeId: vertical,
      topDepth: 95,
      bottomDepth: 105,
      width: 36,
      height: 200,
    })
    const before = [await countRows(fx.db, 'structures'), await countRows(fx.db, 'image_picks')]
    const res = await logger.post(`${I(deep)}/picks`, {
      points: tracePoints(102, 40, 0),
      type: 'joint',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('body.points')
    expect(res.body.error.details[0].message).toContain("beyond the hole's final depth (100 m)")
    expect([await countRows(fx.db, 'structures'), await countRows(fx.db, 'image_picks')]).toEqual(
      before,
    )
  })

  it('POST picks → 409 image_not_ready on a processing image, 400 for an unknown type; nothing stored', async () => {
    const before = await countRows(fx.db, 'image_picks')
    const res = await logger.post(`${I(img.processing)}/picks`, {
      points: tracePoints(12, 40, 0),
      type: 'joint',
    })
    expect(res.status).toBe(409)
    const bad = await logger.post(`${I(img.vertical)}/picks`, {
      points: tracePoints(12, 40, 0),
      type: 'crack',
    })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.type')
    expect(await countRows(fx.db, 'image_picks')).toBe(before)
  })
})

describe('GET, PATCH and DELETE H/images/:imageId/picks', () => {
  let pick: { structureId: number; structure: { version: number; depth: number } }
  const url = () => `${I(img.inclined)}/picks/${pick.structureId}`

  beforeAll(async () => {
    const res = await logger.post(`${I(img.inclined)}/picks`, {
      points: tracePoints(16, 96 * TAN30, 180, 30),
      type: 'bedding',
    })
    pick = res.body.data
  })

  it("GET picks → the image's picks with their structures, for a viewer too", async () => {
    const res = await viewer.get(`${I(img.inclined)}/picks`)
    expect(res.status).toBe(200)
    expect(res.body.data).toHaveLength(1)
    expect(res.body.data[0]).toMatchObject({
      structureId: pick.structureId,
      structure: { type: 'bedding' },
    })
    expectAngle(res.body.data[0].structure.dip, 60, 0.01)
  })

  it('PATCH picks/:id with new points → refitted: new depth, pick columns and plane, version + 1', async () => {
    // Hole 000/60, trough on the low side x, relative dip δ = 45°: pole = cos δ·t − sin δ·x =
    // (0, 0.966, −0.259) (east, north, up), i.e. 000/15, so the plane is 75/180 [derived].
    const points = tracePoints(17, 96, 180, 30)
    const res = await logger.patch(url(), {
      points,
      comment: 'moved',
      version: pick.structure.version,
    })
    expect(res.status).toBe(200)
    const after = res.body.data
    expect(after.structure.depth).toBeCloseTo(17, 9)
    expect(after.heightMm).toBeCloseTo(96, 6)
    expect(after.points).toEqual(points)
    expect(after.structure).toMatchObject({
      comment: 'moved',
      version: pick.structure.version + 1,
      type: 'bedding',
    })
    expectAngle(after.structure.dip, 75, 0.01)
    expectAngle(after.structure.dipDirection, 180, 0.01)
    const [row] = await fx.db.select().from(structures).where(eq(structures.id, pick.structureId))
    expect(row.pickAmplitude).toBeCloseTo(96, 6)
    pick = after
  })

  it('PATCH picks/:id type only → the pick stays where it is; a stale version → 409 stale_version, unchanged', async () => {
    const res = await logger.patch(url(), { type: 'vein', version: pick.structure.version })
    expect(res.status).toBe(200)
    expect(res.body.data.structure).toMatchObject({
      type: 'vein',
      version: pick.structure.version + 1,
    })
    expect(res.body.data.centreDepth).toBeCloseTo(17, 9)
    const stale = await logger.patch(url(), { type: 'joint', version: pick.structure.version })
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('stale_version')
    const [row] = await fx.db.select().from(structures).where(eq(structures.id, pick.structureId))
    expect(row.type).toBe('vein')
    pick = res.body.data
  })

  it('PATCH / DELETE a pick through another image of the hole → 404', async () => {
    const other = await insertImage(fx.db, {
      holeId: fx.holeId,
      topDepth: 10,
      bottomDepth: 20,
      width: 36,
      height: 100,
    })
    const path = `${I(other)}/picks/${pick.structureId}`
    expect(
      (await logger.patch(path, { type: 'joint', version: pick.structure.version })).status,
    ).toBe(404)
    expect((await logger.delete(`${path}?version=${pick.structure.version}`)).status).toBe(404)
  })

  it('DELETE picks/:id → 409 on a stale version, then 204: the structure and its raw pick gone, audited', async () => {
    const stale = await logger.delete(`${url()}?version=${pick.structure.version - 1}`)
    expect(stale.status).toBe(409)
    const res = await logger.delete(`${url()}?version=${pick.structure.version}`)
    expect(res.status).toBe(204)
    expect(
      await fx.db.select().from(structures).where(eq(structures.id, pick.structureId)),
    ).toEqual([])
    expect(
      await fx.db.select().from(imagePicks).where(eq(imagePicks.structureId, pick.structureId)),
    ).toEqual([])
    const events = await fx.db
      .select()
      .from(auditEvents)
      .where(
        and(eq(auditEvents.entityId, String(pick.structureId)), eq(auditEvents.action, 'delete')),
      )
    expect(events[0].before).toMatchObject({
      type: 'vein',
      imagePick: { azimuthReference: 'highside' },
    })
  })
})

describe('roles on H/images/:imageId routes', () => {
  it('viewer → 403 on fit, POST, PATCH and DELETE picks, nothing stored; 200 on GET picks', async () => {
    const created = await logger.post(`${I(img.vertical)}/picks`, {
      points: tracePoints(18, 30, 45),
      type: 'joint',
    })
    const { structureId, structure } = created.body.data
    const before = await countRows(fx.db, 'image_picks')
    const points = tracePoints(13, 30, 45)
    const writes = [
      await viewer.post(`${I(img.vertical)}/fit`, { points }),
      await viewer.post(`${I(img.vertical)}/picks`, { points, type: 'joint' }),
      await viewer.patch(`${I(img.vertical)}/picks/${structureId}`, {
        type: 'vein',
        version: structure.version,
      }),
      await viewer.delete(`${I(img.vertical)}/picks/${structureId}?version=${structure.version}`),
    ]
    expect(writes.map((r) => r.status)).toEqual([403, 403, 403, 403])
    expect(await countRows(fx.db, 'image_picks')).toBe(before)
    const [row] = await fx.db.select().from(structures).where(eq(structures.id, structureId))
    expect(row.type).toBe('joint')
    expect((await viewer.get(`${I(img.vertical)}/picks`)).status).toBe(200)
  })

  it('outsider → 404 on every route (the project is not theirs); signed out → 401', async () => {
    const points = tracePoints(13, 30, 45)
    const base = I(img.vertical)
    const calls = [
      await outsider.post(`${base}/fit`, { points }),
      await outsider.get(`${base}/picks`),
      await outsider.post(`${base}/picks`, { points, type: 'joint' }),
      await outsider.patch(`${base}/picks/1`, { type: 'vein', version: 1 }),
      await outsider.delete(`${base}/picks/1?version=1`),
      await outsider.get(`${base}/suggestions?from=10&to=12`),
    ]
    expect(calls.map((r) => r.status)).toEqual([404, 404, 404, 404, 404, 404])
    const anonymous = await clientFor(fx.app, 'anonymous')
    expect((await anonymous.get(`${base}/picks`)).status).toBe(401)
  })
})
