import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { auditEvents, holes, intervals, memberships, projects } from '../../schema/index'
import { clientFor, createFixture, holeValues, type Client, type Fixture } from './fixture'

// Deleting a project is a soft delete by an administrator: gone for everyone at once, restorable
// by its lead or an administrator for 30 days, purged only by an administrator, never with issued
// intervals. Others asking about it learn nothing (404).
let fx: Fixture
let admin: Client
let lead: Client
let viewer: Client
let doomed = 0
const makeProject = async (code: string) => {
  const [p] = await fx.db.insert(projects).values({ code, name: code, crsEpsg: 32630 }).returning()
  for (const who of ['lead', 'viewer'] as const)
    await fx.db.insert(memberships).values({ projectId: p.id, userId: fx.userIds[who], role: who })
  return p.id
}

beforeAll(async () => {
  fx = await createFixture()
  ;[admin, lead, viewer] = await Promise.all(
    (['admin', 'lead', 'viewer'] as const).map((w) => clientFor(fx.app, w)),
  )
  doomed = await makeProject('DOOM')
  const [h] = await fx.db.insert(holes).values(holeValues(doomed, 'DOOM-01')).returning()
  await fx.db
    .insert(intervals)
    .values({ holeId: h.id, name: 'Issued', fromDepth: 0, toDepth: 50, status: 'issued' })
})
afterAll(() => fx.close())

describe('DELETE /api/projects/:projectId (soft) and the project bin', () => {
  it('DELETE → 403 for the lead, 204 for an admin; the project is gone from lists and routes', async () => {
    expect((await lead.delete(`/api/projects/${doomed}`)).status).toBe(403)
    expect((await admin.delete(`/api/projects/${doomed}`)).status).toBe(204)
    const listed = (await lead.get('/api/projects')).body.data.map((p: { id: number }) => p.id)
    expect(listed).not.toContain(doomed)
    expect((await lead.get(`/api/projects/${doomed}`)).status).toBe(404)
    expect((await admin.get(`/api/projects/${doomed}/holes`)).status).toBe(404)
    const [event] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'project'), eq(auditEvents.action, 'delete')))
    expect(event.after).toMatchObject({ holes: 1, intervals: 1, issuedIntervals: 1 })
  })

  it('GET /api/projects/bin → the lead and admin see it, a viewer does not; the viewer cannot restore (404)', async () => {
    const codes = async (c: Client) =>
      (await c.get('/api/projects/bin')).body.data.map((p: { code: string }) => p.code)
    expect(await codes(lead)).toEqual(['DOOM'])
    expect(await codes(admin)).toEqual(['DOOM'])
    expect(await codes(viewer)).toEqual([])
    expect((await viewer.post(`/api/projects/bin/${doomed}/restore`)).status).toBe(404)
  })

  it('DELETE /api/projects/bin/:id → 403 for the lead, 409 for an admin while issued intervals are in it', async () => {
    expect((await lead.delete(`/api/projects/bin/${doomed}`)).status).toBe(403)
    const res = await admin.delete(`/api/projects/bin/${doomed}`)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('project_has_issued')
  })

  it('POST /api/projects/bin/:id/restore by the lead → back with its holes; 410 after 30 days', async () => {
    const back = await lead.post(`/api/projects/bin/${doomed}/restore`)
    expect(back.status).toBe(200)
    expect((await lead.get(`/api/projects/${doomed}/holes`)).body.data).toHaveLength(1)
    await admin.delete(`/api/projects/${doomed}`)
    await fx.db
      .update(projects)
      .set({ deletedAt: new Date(Date.now() - 31 * 86_400_000) })
      .where(eq(projects.id, doomed))
    const late = await lead.post(`/api/projects/bin/${doomed}/restore`)
    expect(late.status).toBe(410)
  })

  it('DELETE /api/projects/bin/:id by an admin purges a deleted project without issued intervals', async () => {
    const spare = await makeProject('SPARE')
    await admin.delete(`/api/projects/${spare}`)
    expect((await admin.delete(`/api/projects/bin/${spare}`)).status).toBe(204)
    expect(await fx.db.select().from(projects).where(eq(projects.id, spare))).toEqual([])
  })
})
