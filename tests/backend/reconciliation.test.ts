import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { adjustments, auditEvents, intervals, structures } from '../../schema/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'
import { BAD_RUN, SHIFT, TURN, seedReconciliationHole } from './reconciliation-setup'

let fx: Fixture
let engineer: Client
let logger: Client
let viewer: Client
let runs: Awaited<ReturnType<typeof seedReconciliationHole>>['runs']
const H = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`

const byId = async () =>
  new Map(
    (await fx.db.select().from(structures).where(eq(structures.holeId, fx.holeId))).map((s) => [
      s.id,
      s,
    ]),
  )

beforeAll(async () => {
  fx = await createFixture()
  ;({ runs } = await seedReconciliationHole(fx))
  engineer = await clientFor(fx.app, 'engineer')
  logger = await clientFor(fx.app, 'logger')
  viewer = await clientFor(fx.app, 'viewer')
})
afterAll(() => fx.close())

describe('GET H/reconciliation', () => {
  it('GET H/reconciliation synthetic hole (+0.35 m, one run turned 25°): shift, rotation, verdicts', async () => {
    const res = await viewer.get(`${H()}/reconciliation`)
    expect(res.status).toBe(200)
    const d = res.body.data
    expect(d.counts).toEqual({ core: 60, image: 60 })
    expect(Math.abs(d.depthShift - SHIFT)).toBeLessThan(0.05)
    expect(d.depthShiftSpread).toBeLessThan(0.05)
    expect(d.matches.length).toBeGreaterThanOrEqual(54)
    for (const [k, run] of d.runs.entries()) {
      if (k === BAD_RUN) {
        expect(Math.abs(run.rotation - TURN)).toBeLessThan(2)
        expect(run.verdict).toBe('wrong')
      } else expect(run.verdict, run.reason).toBe('ok')
      expect(run.runId).toBe(runs[k].id)
    }
    expect(d.appliedDepthShift).toBe(0)
    expect(d.adjustments).toEqual([])
  })

  it('GET H/reconciliation?depthWindow=-1 → 400 naming depthWindow', async () => {
    const res = await viewer.get(`${H()}/reconciliation?depthWindow=-1&okAngle=9&wrongAngle=3`)
    expect(res.status).toBe(400)
    const paths = res.body.error.details.map((x: { path: string }) => x.path).join(' ')
    expect(paths).toContain('depthWindow')
  })
})

describe('POST H/reconciliation/apply and DELETE H/reconciliation/adjustments/:id', () => {
  it("POST H/reconciliation/apply → 403 for a logger, 400 for an empty body or another hole's run", async () => {
    expect((await logger.post(`${H()}/reconciliation/apply`, { depthShift: 0.3 })).status).toBe(403)
    const empty = await engineer.post(`${H()}/reconciliation/apply`, {})
    expect(empty.status).toBe(400)
    expect(JSON.stringify(empty.body.error.details)).toContain('depthShift')
    const stranger = await engineer.post(`${H()}/reconciliation/apply`, {
      runRotations: [{ runId: 999_999, rotation: 3 }],
    })
    expect(stranger.status).toBe(400)
    expect(stranger.body.error.details[0].path).toBe('body.runRotations.0.runId')
    // image structures from 10.4 m up would land above the collar
    const above = await engineer.post(`${H()}/reconciliation/apply`, { depthShift: 12 })
    expect(above.status).toBe(400)
    expect(above.body.error.details[0].path).toBe('body.depthShift')
    expect(await fx.db.select().from(adjustments)).toEqual([])
  })

  it('POST H/reconciliation/apply → 409 where an approved interval holds the turned run; nothing changes', async () => {
    const [i] = await fx.db
      .insert(intervals)
      .values({ holeId: fx.holeId, name: 'Frozen', fromDepth: 21, toDepth: 23, status: 'approved' })
      .returning()
    const before = await byId()
    const res = await engineer.post(`${H()}/reconciliation/apply`, {
      runRotations: [{ runId: runs[BAD_RUN].id, rotation: 25 }],
    })
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
    expect(res.body.error.message).toContain('Frozen')
    expect(await byId()).toEqual(before)
    expect(await fx.db.select().from(adjustments)).toEqual([])
    await fx.db.delete(intervals).where(eq(intervals.id, i.id))
  })

  it('POST H/reconciliation/apply records shift and rotation, keeps logged values, recomputes; DELETE undoes each', async () => {
    const before = await byId()
    const estimate = (await viewer.get(`${H()}/reconciliation`)).body.data
    const rotation = estimate.runs[BAD_RUN].rotation
    const res = await engineer.post(`${H()}/reconciliation/apply`, {
      depthShift: estimate.depthShift,
      runRotations: [{ runId: runs[BAD_RUN].id, rotation }],
      reason: 'wireline depth; mark drawn on the wrong side in run 3',
    })
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.data.recomputed).toBe(120)
    expect(res.body.data.adjustments.map((a: { kind: string }) => a.kind).sort()).toEqual([
      'depth-shift',
      'run-rotation',
    ])
    const after = await byId()
    for (const [id, s] of after) {
      const was = before.get(id)!
      if (s.source === 'image') {
        // stored = logged − shift, the shift kept beside it
        expect(s.depth).toBeCloseTo(was.depth - estimate.depthShift, 9)
        expect(s.depthShiftApplied).toBeCloseTo(estimate.depthShift, 9)
      } else {
        expect(s.beta).toBe(was.beta)
        expect(s.depth).toBe(was.depth)
        const inRun = s.depth >= runs[BAD_RUN].fromDepth && s.depth < runs[BAD_RUN].toDepth
        expect(s.betaRotationApplied).toBe(inRun ? rotation : 0)
        if (inRun) expect(s.dipDirection).not.toBeCloseTo(was.dipDirection!, 1)
        else expect(s.dipDirection).toBeCloseTo(was.dipDirection!, 9)
      }
    }
    const again = (await viewer.get(`${H()}/reconciliation`)).body.data
    expect(again.appliedDepthShift).toBeCloseTo(estimate.depthShift, 9)
    // the estimates stay relative to the logged records; the residual is what is left
    expect(Math.abs(again.depthShift - estimate.depthShift)).toBeLessThan(0.01)
    expect(again.runs[BAD_RUN].appliedRotation).toBeCloseTo(rotation, 9)
    expect(Math.abs(again.runs[BAD_RUN].residual)).toBeLessThan(2)
    expect(again.runs[BAD_RUN].verdict).toBe('ok')
    expect(again.adjustments.filter((a: { active: boolean }) => a.active)).toHaveLength(2)
    const [audited] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'hole'), eq(auditEvents.action, 'reconcile-apply')))
    expect(audited.userId).toBe(fx.userIds.engineer)

    // undo the rotation: the run's structures are back to their first values exactly
    const rotationId = again.adjustments.find((a: { kind: string }) => a.kind === 'run-rotation').id
    const undo = await engineer.delete(`${H()}/reconciliation/adjustments/${rotationId}`)
    expect(undo.status).toBe(200)
    expect(undo.body.data.undone.active).toBe(false)
    expect(undo.body.data.undone.undoneBy).toBe('engineer')
    const undone = await byId()
    for (const [id, s] of undone)
      if (s.source === 'core') {
        expect(s.betaRotationApplied).toBe(0)
        expect(s.dipDirection).toBe(before.get(id)!.dipDirection)
      }
    const twice = await engineer.delete(`${H()}/reconciliation/adjustments/${rotationId}`)
    expect(twice.status).toBe(409)
    expect(twice.body.error.code).toBe('already_undone')
    expect((await engineer.delete(`${H()}/reconciliation/adjustments/999999`)).status).toBe(404)

    // undo the shift: image structures back at their logged depths
    const shiftId = again.adjustments.find((a: { kind: string }) => a.kind === 'depth-shift').id
    expect((await engineer.delete(`${H()}/reconciliation/adjustments/${shiftId}`)).status).toBe(200)
    for (const [id, s] of await byId()) {
      expect(s.depth).toBeCloseTo(before.get(id)!.depth, 9)
      expect(s.depthShiftApplied).toBe(0)
    }
  })
})
