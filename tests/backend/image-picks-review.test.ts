import { eq } from 'drizzle-orm'
import { beforeAll, describe, expect, it } from 'vitest'
import { capturedMails, imagePicks, intervals, type Image } from '../../schema/index'
import { countRows } from './fixture'
import {
  auditOf,
  expectFrozen,
  freezeSuite,
  mailsTo,
  reviewedInterval,
  snapshot,
} from './freeze-setup'
import { insertImage, tracePoints } from './image-picks-fixture'

// Image picks follow the review rules of every structure write: the freeze of approved intervals,
// checked intervals locked to loggers and sent back to draft by an engineer's change.
const ctx = freezeSuite()
let image: Image
let approved: { id: number; name: string; version: number }
let checked: { id: number; name: string; version: number }
let outside: { structureId: number; structure: { version: number } }
let inside: { structureId: number; structure: { version: number } }
const picks = () => `${ctx.base}/images/${image.id}/picks`
const roles = ['logger', 'engineer', 'lead'] as const

async function state() {
  return { ...(await snapshot(ctx)), picks: await countRows(ctx.fx.db, 'image_picks') }
}

beforeAll(async () => {
  await ctx.logger.put(`${ctx.base}/survey`, {
    stations: [{ depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' }],
  })
  image = await insertImage(ctx.fx.db, {
    holeId: ctx.fx.holeId,
    topDepth: 0,
    bottomDepth: 60,
    width: 36,
    height: 3000,
    azimuthReference: 'highside',
  })
  outside = (await ctx.logger.post(picks(), { points: tracePoints(50, 40, 90), type: 'joint' }))
    .body.data
  inside = (await ctx.logger.post(picks(), { points: tracePoints(10, 40, 90), type: 'joint' })).body
    .data
  approved = await reviewedInterval(ctx, { name: 'A', fromDepth: 5, toDepth: 20 }, 'approved')
  checked = await reviewedInterval(ctx, { name: 'B', fromDepth: 30, toDepth: 45 }, 'checked')
})

describe('image picks in an approved interval', () => {
  it('POST picks → 409 interval_approved for logger, engineer and lead; nothing changed', async () => {
    const before = await state()
    for (const who of roles) {
      const res = await ctx[who].post(picks(), { points: tracePoints(12.5, 40, 90), type: 'joint' })
      expectFrozen(res, approved, '5–20')
      expect(res.body.error.message).toBe(
        'A pick at 12.5 m would change the approved interval "A" (5–20 m): a lead must reopen it first.',
      )
    }
    expect(await state()).toEqual(before)
  })

  it('PATCH picks/:id moving a pick into the approved interval → 409 for every role; nothing changed', async () => {
    const before = await state()
    for (const who of roles) {
      const res = await ctx[who].patch(`${picks()}/${outside.structureId}`, {
        points: tracePoints(15, 40, 90),
        version: outside.structure.version,
      })
      expectFrozen(res, approved, '5–20')
    }
    expect(await state()).toEqual(before)
  })

  it('PATCH and DELETE a pick inside the approved interval → 409 for every role; nothing changed', async () => {
    const before = await state()
    const url = `${picks()}/${inside.structureId}`
    for (const who of roles) {
      const edit = await ctx[who].patch(url, {
        comment: 'rough',
        version: inside.structure.version,
      })
      expectFrozen(edit, approved, '5–20')
      const gone = await ctx[who].delete(`${url}?version=${inside.structure.version}`)
      expectFrozen(gone, approved, '5–20')
    }
    expect(await state()).toEqual(before)
  })
})

describe('image picks in a checked interval', () => {
  it("POST picks → 403 for a logger; an engineer's pick → 201, the interval back to draft, audited, its checker mailed", async () => {
    await ctx.fx.db.delete(capturedMails)
    const body = { points: tracePoints(36, 40, 90), type: 'joint' }
    const refused = await ctx.logger.post(picks(), body)
    expect(refused.status).toBe(403)
    const res = await ctx.engineer.post(picks(), body)
    expect(res.status).toBe(201)
    const [row] = await ctx.fx.db.select().from(intervals).where(eq(intervals.id, checked.id))
    expect(row).toMatchObject({ status: 'draft', checkedBy: null, checkedAt: null })
    const [event] = await auditOf(ctx, checked.id, 'back-to-draft')
    expect(event).toMatchObject({
      userId: ctx.fx.userIds.engineer,
      after: { status: 'draft', reason: `a structure was picked on image "${image.name}" at 36 m` },
    })
    const [mail] = await mailsTo(ctx, 'engineer@test.example')
    expect(mail.subject).toBe('[Test project] Back to draft: TST-01 B')
    expect(mail.text).toContain(`TST-01 "B" (30–45 m) went back to draft after a change inside it`)
  })
})

describe('Idempotency-Key on POST picks', () => {
  it('POST picks twice with one key → one pick, the same 201 body, the retry marked replayed', async () => {
    const before = await countRows(ctx.fx.db, 'image_picks')
    const key = 'd0wnd1p0-0000-4000-8000-000000000001'
    const body = { points: tracePoints(55, 30, 200), type: 'vein', suggested: true }
    const first = await ctx.logger.post(picks(), body).set('Idempotency-Key', key)
    const again = await ctx.logger.post(picks(), body).set('Idempotency-Key', key)
    expect(first.status).toBe(201)
    expect(again.status).toBe(201)
    expect(again.body).toEqual(first.body)
    expect(again.headers['idempotent-replayed']).toBe('true')
    expect(await countRows(ctx.fx.db, 'image_picks')).toBe(before + 1)
    const stored = await ctx.fx.db
      .select()
      .from(imagePicks)
      .where(eq(imagePicks.structureId, first.body.data.structureId))
    expect(stored).toHaveLength(1)
  })

  it('POST picks: the same key with other points → 422 idempotency_key_reused, nothing stored', async () => {
    const key = 'd0wnd1p0-0000-4000-8000-000000000002'
    await ctx.logger
      .post(picks(), { points: tracePoints(56, 30, 200), type: 'vein' })
      .set('Idempotency-Key', key)
    const before = await countRows(ctx.fx.db, 'image_picks')
    const res = await ctx.logger
      .post(picks(), { points: tracePoints(57, 30, 200), type: 'vein' })
      .set('Idempotency-Key', key)
    expect(res.status).toBe(422)
    expect(res.body.error.code).toBe('idempotency_key_reused')
    expect(await countRows(ctx.fx.db, 'image_picks')).toBe(before)
  })
})
