import { eq } from 'drizzle-orm'
import { beforeAll, describe, expect, it } from 'vitest'
import { capturedMails, intervals, memberships, structures } from '../../schema/index'
import {
  auditOf,
  expectFrozen,
  freezeSuite,
  mailsTo,
  reviewedInterval,
  snapshot,
} from './freeze-setup'

const ctx = freezeSuite()
let approved: { id: number; name: string; version: number }
let checked: { id: number; name: string; version: number }
const ids: Record<number, { id: number; version: number }> = {}
const structureUrl = (depth: number) => `${ctx.base}/structures/${ids[depth].id}`

beforeAll(async () => {
  const { logger } = ctx
  await logger.put(`${ctx.base}/survey`, {
    stations: [{ depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' }],
  })
  await logger.put(`${ctx.base}/runs`, {
    runs: [{ fromDepth: 0, toDepth: 90, recovered: 90, solid: 85, rqdLength: 80 }],
  })
  for (const depth of [10, 35, 70]) {
    const res = await logger.post(`${ctx.base}/structures`, { depth, type: 'joint', alpha: 40 })
    ids[depth] = res.body.data
  }
  approved = await reviewedInterval(ctx, { name: 'A', fromDepth: 5, toDepth: 20 }, 'approved')
  checked = await reviewedInterval(ctx, { name: 'B', fromDepth: 30, toDepth: 45 }, 'checked')
})

const roles = ['logger', 'engineer', 'lead'] as const

describe('structure writes in an approved interval', () => {
  it('POST .../structures → 409 interval_approved naming the interval, for logger, engineer and lead; nothing changed', async () => {
    const before = await snapshot(ctx)
    for (const who of roles) {
      const res = await ctx[who].post(`${ctx.base}/structures`, {
        depth: 12.5,
        type: 'joint',
        alpha: 30,
      })
      expectFrozen(res, approved, '5–20')
      expect(res.body.error.message).toBe(
        'A structure at 12.5 m would change the approved interval "A" (5–20 m): a lead must reopen it first.',
      )
    }
    expect(await snapshot(ctx)).toEqual(before)
  })

  it('PATCH .../structures/:id → 409 for every role, inside the interval or moved into it; nothing changed', async () => {
    const before = await snapshot(ctx)
    for (const who of roles) {
      const edit = await ctx[who].patch(structureUrl(10), {
        version: ids[10].version,
        comment: 'rough',
      })
      expectFrozen(edit, approved, '5–20')
      const moveIn = await ctx[who].patch(structureUrl(70), { version: ids[70].version, depth: 15 })
      expectFrozen(moveIn, approved, '5–20')
    }
    expect(await snapshot(ctx)).toEqual(before)
  })

  it('DELETE .../structures/:id → 409 for every role; nothing changed', async () => {
    const before = await snapshot(ctx)
    for (const who of roles) {
      const res = await ctx[who].delete(`${structureUrl(10)}?version=${ids[10].version}`)
      expectFrozen(res, approved, '5–20')
    }
    expect(await snapshot(ctx)).toEqual(before)
  })

  it('PATCH .../structures/:id outside every reviewed interval → 200 (the freeze covers [from, to) only)', async () => {
    const res = await ctx.logger.patch(structureUrl(70), {
      version: ids[70].version,
      depth: 20,
    })
    expect(res.status).toBe(200)
    expect(res.body.data.depth).toBe(20)
    ids[70] = res.body.data
  })
})

describe('structure writes in a checked interval', () => {
  it('POST .../structures → 403 for a logger; for the lead 201 and the interval back to draft, audited, its checker mailed', async () => {
    await ctx.fx.db.delete(capturedMails)
    const refused = await ctx.logger.post(`${ctx.base}/structures`, {
      depth: 36,
      type: 'joint',
      alpha: 50,
    })
    expect(refused.status).toBe(403)
    const res = await ctx.lead.post(`${ctx.base}/structures`, {
      depth: 36,
      type: 'joint',
      alpha: 50,
    })
    expect(res.status).toBe(201)
    const [row] = await ctx.fx.db.select().from(intervals).where(eq(intervals.id, checked.id))
    expect(row).toMatchObject({ status: 'draft', checkedBy: null, checkedAt: null })
    expect(row.version).toBe(checked.version + 1)
    const [event] = await auditOf(ctx, checked.id, 'back-to-draft')
    expect(event).toMatchObject({
      userId: ctx.fx.userIds.lead,
      before: { status: 'checked', checkedBy: ctx.fx.userIds.engineer },
      after: { status: 'draft', reason: 'a structure was added at 36 m' },
    })
    const [mail] = await mailsTo(ctx, 'engineer@test.example')
    expect(mail.subject).toBe('[Test project] Back to draft: TST-01 B')
    expect(mail.text).toContain(
      'TST-01 "B" (30–45 m) went back to draft after a change inside it (a structure was added at 36 m).',
    )
    expect(await ctx.fx.db.select().from(capturedMails)).toHaveLength(1)
  })

  it('DELETE .../structures/:id by an engineer in a draft interval → 204 with no notice', async () => {
    await ctx.fx.db.delete(capturedMails)
    const res = await ctx.engineer.delete(`${structureUrl(35)}?version=${ids[35].version}`)
    expect(res.status).toBe(204)
    expect(await ctx.fx.db.select().from(capturedMails)).toHaveLength(0)
  })
})

describe('reopening an approved interval', () => {
  it('POST .../reopen by the lead → the checker and approver are mailed by user id; then the write goes through', async () => {
    await ctx.fx.db.delete(capturedMails)
    // The checker has since become a viewer: only the notice by user id still reaches them.
    await ctx.fx.db
      .update(memberships)
      .set({ role: 'viewer' })
      .where(eq(memberships.userId, ctx.fx.userIds.engineer))
    const [row] = await ctx.fx.db.select().from(intervals).where(eq(intervals.id, approved.id))
    const reopened = await ctx.lead.post(`${ctx.base}/intervals/${approved.id}/reopen`, {
      version: row.version,
      reason: 'the joint at 10 m needs its beta',
    })
    expect(reopened.status).toBe(200)
    expect(reopened.body.data.status).toBe('draft')
    const to = (await ctx.fx.db.select().from(capturedMails)).map((m) => m.to).sort()
    expect(to).toEqual(['engineer@test.example', 'lead@test.example'])
    const [mail] = await mailsTo(ctx, 'engineer@test.example')
    expect(mail.subject).toBe('[Test project] Reopened: TST-01 A (5–20 m)')
    expect(mail.text).toContain('lead reopened TST-01 A (5–20 m): the joint at 10 m needs its beta')
    await ctx.fx.db
      .update(memberships)
      .set({ role: 'engineer' })
      .where(eq(memberships.userId, ctx.fx.userIds.engineer))

    const edit = await ctx.logger.patch(structureUrl(10), {
      version: ids[10].version,
      beta: 120,
    })
    expect(edit.status).toBe(200)
    const [stored] = await ctx.fx.db.select().from(structures).where(eq(structures.id, ids[10].id))
    expect(stored.beta).toBe(120)
  })
})
