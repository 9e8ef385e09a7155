import { eq } from 'drizzle-orm'
import { beforeAll, describe, expect, it } from 'vitest'
import { capturedMails, coreRuns, intervals, surveyStations } from '../../schema/index'
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
const roles = ['logger', 'engineer', 'lead'] as const
const station = { depth: 50, azimuth: 2, plunge: 61, azimuthReference: 'true' }
const run = (fromDepth: number, toDepth: number) => ({
  fromDepth,
  toDepth,
  recovered: toDepth - fromDepth,
  solid: toDepth - fromDepth,
  rqdLength: toDepth - fromDepth,
})
const runs = [run(0, 10), run(12, 20), run(50, 60)]

const runRows = () =>
  ctx.fx.db.select().from(coreRuns).where(eq(coreRuns.holeId, ctx.fx.holeId)).orderBy(coreRuns.id)
const intervalRow = async (id: number) =>
  (await ctx.fx.db.select().from(intervals).where(eq(intervals.id, id)))[0]

beforeAll(async () => {
  await ctx.logger.put(`${ctx.base}/survey`, {
    stations: [
      { depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' },
      { depth: 100, azimuth: 0, plunge: 60, azimuthReference: 'true' },
    ],
  })
  await ctx.logger.put(`${ctx.base}/runs`, { runs })
  for (const depth of [8, 14, 55])
    await ctx.logger.post(`${ctx.base}/structures`, { depth, type: 'joint', alpha: 40, beta: 90 })
  approved = await reviewedInterval(ctx, { name: 'A', fromDepth: 5, toDepth: 20 }, 'approved')
})

describe('survey writes in a hole with an approved interval', () => {
  it('PUT, POST, PATCH and DELETE .../survey → 409 interval_approved for logger, engineer and lead; nothing changed', async () => {
    const [first] = await ctx.fx.db
      .select()
      .from(surveyStations)
      .where(eq(surveyStations.holeId, ctx.fx.holeId))
    const before = await snapshot(ctx)
    for (const who of roles) {
      const c = ctx[who]
      expectFrozen(await c.put(`${ctx.base}/survey`, { stations: [station] }), approved, '5–20')
      expectFrozen(await c.post(`${ctx.base}/survey`, station), approved, '5–20')
      const patch = await c.patch(`${ctx.base}/survey/${first.id}`, {
        version: first.version,
        azimuth: 3,
      })
      expectFrozen(patch, approved, '5–20')
      expect(patch.body.error.message).toContain("Changing the hole's survey would change")
      expectFrozen(await c.delete(`${ctx.base}/survey/${first.id}`), approved, '5–20')
    }
    expect(await snapshot(ctx)).toEqual(before)
  })
})

describe('core run writes', () => {
  it('PUT, POST, PATCH and DELETE .../runs reaching the approved interval → 409 for every role; nothing changed', async () => {
    const [r0, r12] = await runRows()
    const before = await snapshot(ctx)
    for (const who of roles) {
      const c = ctx[who]
      const replaced = await c.put(`${ctx.base}/runs`, {
        runs: [run(0, 10), run(12, 19.5), run(50, 60)],
      })
      expectFrozen(replaced, approved, '5–20')
      // the gap 10–12 m lies inside the interval
      expectFrozen(await c.post(`${ctx.base}/runs`, run(10, 12)), approved, '5–20')
      const edit = await c.patch(`${ctx.base}/runs/${r12.id}`, {
        version: r12.version,
        markConfidence: 'none',
      })
      expectFrozen(edit, approved, '5–20')
      expect(edit.body.error.message).toContain('Editing core run 12–20 m would change')
      expectFrozen(await c.delete(`${ctx.base}/runs/${r0.id}`), approved, '5–20')
    }
    expect(await snapshot(ctx)).toEqual(before)
  })

  it('PATCH and PUT .../runs away from the approved interval → 200 (a run decides only the structures in its own extent)', async () => {
    const [, , r50] = await runRows()
    const edit = await ctx.logger.patch(`${ctx.base}/runs/${r50.id}`, {
      version: r50.version,
      markConfidence: 'poor',
    })
    expect(edit.status).toBe(200)
    const flags = async () =>
      (await ctx.logger.get(`${ctx.base}/structures`)).body.data.map(
        (s: { depth: number; flags: string[] }) => [s.depth, s.flags],
      )
    // the poor marks of 50–60 m reached the structure in that run; nothing else moved
    expect(await flags()).toEqual([
      [8, []],
      [14, []],
      [55, ['poor-mark']],
    ])
    // The runs inside the interval are sent back unchanged: only 50–60 m differs (marks good again).
    const replaced = await ctx.logger.put(`${ctx.base}/runs`, {
      runs: [run(0, 10), run(12, 20), { ...run(50, 60), fractureCount: 4 }],
    })
    expect(replaced.status).toBe(200)
    expect((await flags())[2]).toEqual([55, []])
    expect((await intervalRow(approved.id)).status).toBe('approved')
  })
})

describe('hole writes in a checked interval', () => {
  it('PUT .../survey by a logger → 200, the checked interval back to draft, audited, its checker mailed', async () => {
    const row = await intervalRow(approved.id)
    const reopened = await ctx.lead.post(`${ctx.base}/intervals/${approved.id}/reopen`, {
      version: row.version,
      reason: 'survey to be re-run',
    })
    expect(reopened.status).toBe(200)
    const checked = await ctx.engineer.post(`${ctx.base}/intervals/${approved.id}/check`, {
      version: reopened.body.data.version,
    })
    expect(checked.body.data.status).toBe('checked')
    await ctx.fx.db.delete(capturedMails)
    const res = await ctx.logger.put(`${ctx.base}/survey`, { stations: [station] })
    expect(res.status).toBe(200)
    expect(await intervalRow(approved.id)).toMatchObject({ status: 'draft', checkedBy: null })
    const [event] = await auditOf(ctx, approved.id, 'back-to-draft')
    expect(event).toMatchObject({
      userId: ctx.fx.userIds.logger,
      after: { status: 'draft', reason: "the hole's survey changed" },
    })
    const [mail] = await mailsTo(ctx, 'engineer@test.example')
    expect(mail.subject).toBe('[Test project] Back to draft: TST-01 A')
    expect(mail.text).toContain("(the hole's survey changed)")
  })

  it('PATCH .../runs/:id inside a checked interval → 200 and back to draft, its checker mailed', async () => {
    const row = await intervalRow(approved.id)
    await ctx.engineer.post(`${ctx.base}/intervals/${approved.id}/check`, { version: row.version })
    await ctx.fx.db.delete(capturedMails)
    const [, r12] = await runRows()
    const edit = await ctx.logger.patch(`${ctx.base}/runs/${r12.id}`, {
      version: r12.version,
      markConfidence: 'poor',
    })
    expect(edit.status).toBe(200)
    expect((await intervalRow(approved.id)).status).toBe('draft')
    const [mail] = await mailsTo(ctx, 'engineer@test.example')
    expect(mail.text).toContain('(core run 12–20 m was edited)')
    // the run's mark confidence reached the structure inside it
    const structures = (await ctx.logger.get(`${ctx.base}/structures`)).body.data
    expect(structures.find((s: { depth: number }) => s.depth === 14).flags).toEqual(['poor-mark'])
  })
})
