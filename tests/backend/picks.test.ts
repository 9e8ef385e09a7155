import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { holes } from '../../schema/index'
import {
  clientFor,
  countRows,
  createFixture,
  holeValues,
  type Client,
  type Fixture,
} from './fixture'

let fx: Fixture
let logger: Client
const expectAngle = (actual: number, expected: number, tol = 0.01) => {
  const d = Math.abs(((((actual - expected) % 360) + 540) % 360) - 180)
  expect(d, `${actual} vs ${expected}`).toBeLessThanOrEqual(tol)
}

function upload(holeId: number, csv: string, options: object) {
  return logger
    .postMultipart(`/api/projects/${fx.projectId}/holes/${holeId}/imports`)
    .field('kind', 'picks')
    .field('options', JSON.stringify(options))
    .attach('file', Buffer.from(csv), 'picks.csv')
}

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
})
afterAll(() => fx.close())

describe('POST .../imports kind picks (image-log sinusoids)', () => {
  it('imports picks: vertical hole, H = D = 96 mm, trough 090 from true north → 45/090 (derived)', async () => {
    const [vertical] = await fx.db
      .insert(holes)
      .values({ ...holeValues(fx.projectId, 'TST-V'), plannedPlunge: 90, coreSize: 'HQ' })
      .returning()
    await logger.put(`/api/projects/${fx.projectId}/holes/${vertical.id}/survey`, {
      stations: [{ depth: 0, azimuth: 0, plunge: 90, azimuthReference: 'true' }],
    })
    const res = await upload(
      vertical.id,
      'depth,amplitude,diameter,trough,type\n12.5,96,96,90,joint\n',
      {
        azimuthReference: 'north',
        northReference: 'true',
      },
    )
    expect(res.status).toBe(201)
    const commit = await logger.post(
      `/api/projects/${fx.projectId}/holes/${vertical.id}/imports/${res.body.data.importId}/commit`,
    )
    expect(commit.status).toBe(200)
    const [pick] = (
      await logger.get(`/api/projects/${fx.projectId}/holes/${vertical.id}/structures`)
    ).body.data
    expect(pick).toMatchObject({
      source: 'image',
      pickAmplitude: 96,
      pickDiameter: 96,
      pickTroughAzimuth: 90,
      pickReference: 'north',
    })
    expectAngle(pick.dip, 45)
    expectAngle(pick.dipDirection, 90)
    // a vertical hole is steeper than any threshold: flagged, never hidden
    expect(pick.flags).toContain('steep-hole')
  })

  it('imports picks: magnetic-north image in a vertical hole → trough corrected by the declination (−2°)', async () => {
    const [vertical] = await fx.db.select().from(holes).where(eq(holes.name, 'TST-V'))
    const res = await upload(vertical.id, 'depth,amplitude,diameter,trough\n40,96,96,90\n', {
      azimuthReference: 'north',
      northReference: 'magnetic',
    })
    await logger.post(
      `/api/projects/${fx.projectId}/holes/${vertical.id}/imports/${res.body.data.importId}/commit`,
    )
    const picks = (
      await logger.get(`/api/projects/${fx.projectId}/holes/${vertical.id}/structures`)
    ).body.data
    const pick = picks.find((p: { depth: number }) => p.depth === 40)
    // true = magnetic + D with D = −2 (east positive): the deepest point lies at 088 true
    expect(pick.pickAzimuthReference).toBe('north-magnetic')
    expectAngle(pick.pickTroughAzimuth, 88)
    expectAngle(pick.dipDirection, 88)
  })

  it('imports picks: hole 000/60, high-side image, relative dip 30°, trough 180 → 60/180 (derived)', async () => {
    await logger.put(`/api/projects/${fx.projectId}/holes/${fx.holeId}/survey`, {
      stations: [{ depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' }],
    })
    const csv = 'depth,rel_dip,rel_dip_dir,quality\n20,30,180,good\n21,89.5,10,poor\n'
    const res = await upload(fx.holeId, csv, { azimuthReference: 'highside', holeDiameter: 96 })
    expect(res.status).toBe(201)
    expect(res.body.data.flagCounts).toMatchObject({ 'pick-size': 1 })
    await logger.post(
      `/api/projects/${fx.projectId}/holes/${fx.holeId}/imports/${res.body.data.importId}/commit`,
    )
    const picks = (await logger.get(`/api/projects/${fx.projectId}/holes/${fx.holeId}/structures`))
      .body.data
    expectAngle(picks[0].dip, 60)
    expectAngle(picks[0].dipDirection, 180)
    expect(picks[0].pickAmplitude).toBeCloseTo(96 * Math.tan(Math.PI / 6), 9)
    // relative dip 89.5° is a sinusoid ~115 diameters tall: flagged
    expect(picks[1].flags).toContain('pick-size')
  })

  it('imports picks → 422 naming the row when neither amplitude nor relative dip is given; nothing stored', async () => {
    const before = await countRows(fx.db, 'structures')
    const res = await upload(fx.holeId, 'depth,diameter,trough\n30,96,45\n', {
      azimuthReference: 'highside',
    })
    expect(res.status).toBe(422)
    expect(res.body.error.details[0].path).toBe('file.line.2.amplitude')
    expect(await countRows(fx.db, 'structures')).toBe(before)
  })
})
