import { eq } from 'drizzle-orm'
import { beforeAll, describe, expect, it } from 'vitest'
import { holeAt, planeToCore } from '../../orient/index'
import { capturedMails, intervals, structureSets } from '../../schema/index'
import {
  auditOf,
  expectFrozen,
  freezeSuite,
  mailsTo,
  reviewedInterval,
  snapshot,
} from './freeze-setup'

const ctx = freezeSuite()
const stations = [
  { depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' as const },
  { depth: 100, azimuth: 0, plunge: 60, azimuthReference: 'true' as const },
]
// Two tight groups of planes, entered as core angles (derived with planeToCore).
const planes = [
  { dip: 50, dipDirection: 190 },
  { dip: 52, dipDirection: 195 },
  { dip: 48, dipDirection: 186 },
  { dip: 80, dipDirection: 100 },
  { dip: 78, dipDirection: 104 },
  { dip: 82, dipDirection: 97 },
]
let interval: { id: number; name: string; version: number }
const url = () => `${ctx.base}/intervals/${interval.id}`
const setsOf = () =>
  ctx.fx.db
    .select()
    .from(structureSets)
    .where(eq(structureSets.intervalId, interval.id))
    .orderBy(structureSets.id)

beforeAll(async () => {
  await ctx.logger.put(`${ctx.base}/survey`, { stations })
  let depth = 10
  for (const plane of planes) {
    const core = planeToCore(plane, holeAt(stations, depth)!)!
    await ctx.logger.post(`${ctx.base}/structures`, { depth, type: 'joint', ...core })
    depth += 2
  }
  interval = await reviewedInterval(ctx, { name: 'A', fromDepth: 5, toDepth: 40 }, 'draft')
  expect((await ctx.engineer.post(`${url()}/sets/cluster`, { k: 2 })).status).toBe(200)
  const checked = await ctx.engineer.post(`${url()}/check`, { version: interval.version })
  interval = (await ctx.lead.post(`${url()}/approve`, { version: checked.body.data.version })).body
    .data
})

/** Every set write of the interval view, against the interval's first set. */
async function setWrites(who: 'logger' | 'engineer' | 'lead') {
  const [first, second] = await setsOf()
  const c = ctx[who]
  return [
    await c.post(`${url()}/sets`, { name: 'S3', centreTrend: 10, centrePlunge: 40, coneAngle: 15 }),
    await c.patch(`${url()}/sets/${first.id}`, { version: first.version, coneAngle: 25 }),
    await c.delete(`${url()}/sets/${second.id}`),
    await c.put(`${url()}/sets/${first.id}/members`, { structureIds: [] }),
    await c.post(`${url()}/sets/cluster`, { k: 2 }),
  ]
}

describe('set writes on an approved interval', () => {
  it('POST/PATCH/DELETE sets, PUT members, POST cluster → 409 interval_approved for engineer and lead, 403 for a logger; nothing changed', async () => {
    const before = await snapshot(ctx)
    expect(before.sets).toHaveLength(2)
    for (const who of ['engineer', 'lead'] as const)
      for (const res of await setWrites(who)) expectFrozen(res, interval, '5–40')
    for (const res of await setWrites('logger')) expect(res.status).toBe(403)
    expect(await snapshot(ctx)).toEqual(before)
  })

  it('POST .../sets/cluster on an issued interval → 409 interval_approved as well', async () => {
    await ctx.fx.db.update(intervals).set({ status: 'issued' }).where(eq(intervals.id, interval.id))
    const res = await ctx.lead.post(`${url()}/sets/cluster`, { k: 2 })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
    expect(res.body.error.message).toContain('the issued interval "A" (5–40 m)')
    await ctx.fx.db
      .update(intervals)
      .set({ status: 'approved' })
      .where(eq(intervals.id, interval.id))
  })
})

describe('set writes on a checked interval', () => {
  it('POST .../sets/cluster → 200, the interval back to draft, audited, its checker mailed', async () => {
    const [row] = await ctx.fx.db.select().from(intervals).where(eq(intervals.id, interval.id))
    const reopened = await ctx.lead.post(`${url()}/reopen`, {
      version: row.version,
      reason: 're-cluster with the new picks',
    })
    const checked = await ctx.engineer.post(`${url()}/check`, {
      version: reopened.body.data.version,
    })
    expect(checked.body.data.status).toBe('checked')
    await ctx.fx.db.delete(capturedMails)
    const res = await ctx.lead.post(`${url()}/sets/cluster`, { k: 2 })
    expect(res.status).toBe(200)
    expect(res.body.data.map((s: { name: string }) => s.name)).toEqual(['Set 1', 'Set 2'])
    const [after] = await ctx.fx.db.select().from(intervals).where(eq(intervals.id, interval.id))
    expect(after).toMatchObject({ status: 'draft', checkedBy: null })
    const [event] = await auditOf(ctx, interval.id, 'back-to-draft')
    expect(event.after).toEqual({ status: 'draft', reason: 'its sets were re-clustered into 2' })
    const [mail] = await mailsTo(ctx, 'engineer@test.example')
    expect(mail.subject).toBe('[Test project] Back to draft: TST-01 A')
  })
})
