import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq, sql } from 'drizzle-orm'
import { auditEvents, holes, intervals, structures } from '../../schema/index'
import {
  clientFor,
  countRows,
  createFixture,
  holeValues,
  type Client,
  type Fixture,
} from './fixture'

// Deleting a hole is a soft delete: gone from every list and route at once, restorable by a lead
// for 30 days, purged only by an administrator, never while it holds issued intervals.
let fx: Fixture
let lead: Client
let admin: Client
let engineer: Client
let bigHole = 0
const P = () => `/api/projects/${fx.projectId}`

beforeAll(async () => {
  fx = await createFixture()
  ;[lead, admin, engineer] = await Promise.all(
    (['lead', 'admin', 'engineer'] as const).map((w) => clientFor(fx.app, w)),
  )
  const [h] = await fx.db
    .insert(holes)
    .values({ ...holeValues(fx.projectId, 'TST-BIG'), finalDepth: 600 })
    .returning()
  bigHole = h.id
  // 50,000 structures in one statement (generate_series), and an issued interval over them
  await fx.db
    .execute(sql`insert into structures (hole_id, depth, type, source, input_dip, input_dip_direction, dip, dip_direction)
    select ${bigHole}, g * 0.01, 'joint', 'true', 40, 120, 40, 120 from generate_series(1, 50000) g`)
  await fx.db.insert(intervals).values([
    { holeId: bigHole, name: 'Upper', fromDepth: 0, toDepth: 250, status: 'issued' },
    { holeId: bigHole, name: 'Lower', fromDepth: 250, toDepth: 600, status: 'draft' },
  ])
}, 60_000)
afterAll(() => fx.close())

describe('DELETE …/holes/:holeId (soft) and the bin', () => {
  it('DELETE → 204 at once; the hole leaves lists and routes (404), every row kept, audit counts them', async () => {
    const t0 = performance.now()
    const res = await lead.delete(`${P()}/holes/${bigHole}`)
    expect(res.status).toBe(204)
    expect(performance.now() - t0).toBeLessThan(2000)
    const list = await lead.get(`${P()}/holes`)
    expect(list.body.data.map((h: { id: number }) => h.id)).not.toContain(bigHole)
    expect((await lead.get(`${P()}/holes/${bigHole}`)).status).toBe(404)
    expect((await lead.get(`${P()}/holes/${bigHole}/structures`)).status).toBe(404)
    expect(await countRows(fx.db, 'structures')).toBe(50_000)
    const [event] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'hole'), eq(auditEvents.action, 'delete')))
    expect(event.after).toMatchObject({
      restorableForDays: 30,
      structures: 50_000,
      intervals: 2,
      issuedIntervals: 1,
    })
  })

  it('GET …/holes/deleted → the bin for leads (403 for an engineer); a new hole may not take the name', async () => {
    expect((await engineer.get(`${P()}/holes/deleted`)).status).toBe(403)
    const bin = await lead.get(`${P()}/holes/deleted`)
    expect(bin.status).toBe(200)
    expect(bin.body.data).toEqual([
      expect.objectContaining({
        id: bigHole,
        name: 'TST-BIG',
        deletedBy: 'lead',
        structures: 50_000,
      }),
    ])
    const days =
      (Date.parse(bin.body.data[0].restorableUntil) - Date.parse(bin.body.data[0].deletedAt)) /
      86_400_000
    expect(days).toBe(30)
    const { projectId: _p, ...body } = holeValues(fx.projectId, 'TST-BIG')
    const again = await lead.post(`${P()}/holes`, body)
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('hole_name_in_bin')
  })

  it('DELETE …/purge → 403 for a lead, 409 for an admin while issued intervals are in it', async () => {
    expect((await lead.delete(`${P()}/holes/${bigHole}/purge`)).status).toBe(403)
    const res = await admin.delete(`${P()}/holes/${bigHole}/purge`)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('hole_has_issued')
    expect(await countRows(fx.db, 'structures')).toBe(50_000)
  })

  it('POST …/restore → the hole is back with all its rows; 403 for an engineer; 410 after 30 days', async () => {
    expect((await engineer.post(`${P()}/holes/${bigHole}/restore`)).status).toBe(403)
    const back = await lead.post(`${P()}/holes/${bigHole}/restore`)
    expect(back.status).toBe(200)
    const rows = await lead.get(`${P()}/holes/${bigHole}/structures`)
    expect(rows.body.data).toHaveLength(50_000)
    // Deleted 31 days ago: too late to restore
    await lead.delete(`${P()}/holes/${bigHole}`)
    await fx.db
      .update(holes)
      .set({ deletedAt: new Date(Date.now() - 31 * 86_400_000) })
      .where(eq(holes.id, bigHole))
    const late = await lead.post(`${P()}/holes/${bigHole}/restore`)
    expect(late.status).toBe(410)
    expect(late.body.error.code).toBe('restore_expired')
  })

  it('DELETE …/purge by an admin removes a deleted hole without issued intervals for good', async () => {
    const [small] = await fx.db
      .insert(holes)
      .values(holeValues(fx.projectId, 'TST-SMALL'))
      .returning()
    await fx.db.insert(structures).values({ holeId: small.id, depth: 5, type: 'joint' })
    expect((await admin.delete(`${P()}/holes/${small.id}/purge`)).status).toBe(404) // not deleted yet
    await lead.delete(`${P()}/holes/${small.id}`)
    expect((await admin.delete(`${P()}/holes/${small.id}/purge`)).status).toBe(204)
    expect(await fx.db.select().from(holes).where(eq(holes.id, small.id))).toEqual([])
    expect(await countRows(fx.db, 'structures')).toBe(50_000)
    const [event] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'hole'), eq(auditEvents.action, 'purge')))
    expect(event.before).toMatchObject({ name: 'TST-SMALL', structures: 1 })
  })
})
