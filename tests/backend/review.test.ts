import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { auditEvents, intervals, structures } from '../../schema/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let logger: Client
let engineer: Client
let lead: Client
let viewer: Client
const base = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
let intervalId: number
const version = async () =>
  (await fx.db.select().from(intervals).where(eq(intervals.id, intervalId)))[0].version

beforeAll(async () => {
  // No SMTP server listens here: notifications fail quietly and never undo a review step.
  fx = await createFixture({ SMTP_URL: 'smtp://127.0.0.1:9' })
  ;[logger, engineer, lead, viewer] = await Promise.all(
    (['logger', 'engineer', 'lead', 'viewer'] as const).map((who) => clientFor(fx.app, who)),
  )
  const created = await engineer.post(`${base()}/intervals`, {
    name: 'upper',
    fromDepth: 0,
    toDepth: 30,
  })
  intervalId = created.body.data.id
})
afterAll(() => fx.close())

describe('interval review: draft → checked → approved, reopen with a reason', () => {
  it('POST intervals/:id/check → 403 for a logger, 200 for an engineer; approve → 403 for an engineer, 200 for the lead', async () => {
    const url = `${base()}/intervals/${intervalId}`
    expect((await logger.post(`${url}/submit`)).status).toBe(200)
    expect((await logger.post(`${url}/check`, { version: await version() })).status).toBe(403)
    const checked = await engineer.post(`${url}/check`, { version: await version() })
    expect(checked.status).toBe(200)
    expect(checked.body.data).toMatchObject({ status: 'checked', checkedBy: fx.userIds.engineer })
    expect((await engineer.post(`${url}/approve`, { version: await version() })).status).toBe(403)
    const approved = await lead.post(`${url}/approve`, { version: await version() })
    expect(approved.body.data).toMatchObject({ status: 'approved', approvedBy: fx.userIds.lead })
    expect((await lead.post(`${url}/approve`, { version: await version() })).status).toBe(409)
  })

  it('checked intervals lock their structures: a logger cannot add one inside, an engineer can', async () => {
    // "upper" is approved by now and frozen for everyone: this runs in a second, checked interval.
    const lower = await engineer.post(`${base()}/intervals`, {
      name: 'lower',
      fromDepth: 30,
      toDepth: 60,
    })
    await fx.db
      .update(intervals)
      .set({ status: 'checked', checkedBy: fx.userIds.engineer })
      .where(eq(intervals.id, lower.body.data.id))
    const refused = await logger.post(`${base()}/structures`, {
      depth: 40,
      type: 'joint',
      alpha: 40,
    })
    expect(refused.status).toBe(403)
    expect(
      (await fx.db.select().from(structures).where(eq(structures.holeId, fx.holeId))).length,
    ).toBe(0)
    expect(
      (await engineer.post(`${base()}/structures`, { depth: 40, type: 'joint', alpha: 40 })).status,
    ).toBe(201)
  })

  it('POST intervals/:id/reopen → 400 without a reason, 403 for an engineer on an approved interval, 200 for the lead; audited with the reason', async () => {
    const url = `${base()}/intervals/${intervalId}`
    const noReason = await lead.post(`${url}/reopen`, { version: await version() })
    expect(noReason.status).toBe(400)
    expect(noReason.body.error.details[0].path).toBe('body.reason')
    expect(
      (
        await engineer.post(`${url}/reopen`, {
          version: await version(),
          reason: 'spacing looks off',
        })
      ).status,
    ).toBe(403)
    const reopened = await lead.post(`${url}/reopen`, {
      version: await version(),
      reason: 'set 2 needs the image picks',
    })
    expect(reopened.body.data).toMatchObject({ status: 'draft', checkedBy: null, approvedBy: null })
    const [event] = await fx.db.select().from(auditEvents).where(eq(auditEvents.action, 'reopen'))
    expect(event).toMatchObject({
      userId: fx.userIds.lead,
      before: { status: 'approved' },
      after: { status: 'draft', reason: 'set 2 needs the image picks' },
    })
  })
})

describe('comments and the audit view', () => {
  it('POST comments → 201 for a logger with an @e-mail mention of a member; 403 for a viewer; 404 for a structure of another project', async () => {
    const [s] = await fx.db.select().from(structures).where(eq(structures.holeId, fx.holeId))
    const res = await logger.post(`/api/projects/${fx.projectId}/comments`, {
      entity: 'structure',
      entityId: s.id,
      body: 'Is this a drilling break? @engineer@test.example please look (and @nobody@test.example)',
    })
    expect(res.status).toBe(201)
    expect(res.body.data.mentions).toEqual([fx.userIds.engineer])
    expect(
      (
        await viewer.post(`/api/projects/${fx.projectId}/comments`, {
          entity: 'structure',
          entityId: s.id,
          body: 'x',
        })
      ).status,
    ).toBe(403)
    const list = await viewer.get(
      `/api/projects/${fx.projectId}/comments?entity=structure&entityId=${s.id}`,
    )
    expect(list.body.data).toHaveLength(1)
    expect(list.body.data[0]).toMatchObject({ userName: 'logger' })
    const foreign = await logger.post(`/api/projects/${fx.projectId}/comments`, {
      entity: 'interval',
      entityId: 999999,
      body: 'x',
    })
    expect(foreign.status).toBe(404)
  })

  it('GET audit → newest first with before/after, filtered by action; 403 for a logger', async () => {
    expect((await logger.get(`/api/projects/${fx.projectId}/audit`)).status).toBe(403)
    const res = await engineer.get(
      `/api/projects/${fx.projectId}/audit?entity=interval&action=check`,
    )
    expect(res.status).toBe(200)
    expect(res.body.data).toHaveLength(1)
    expect(res.body.data[0]).toMatchObject({
      action: 'check',
      userName: 'engineer',
      before: { status: 'draft' },
      after: { status: 'checked' },
    })
    const page = await engineer.get(`/api/projects/${fx.projectId}/audit?limit=2`)
    expect(page.body.data).toHaveLength(2)
    expect(page.body.data[0].id).toBeGreaterThan(page.body.data[1].id)
    expect(page.body.meta.next).toBe(page.body.data[1].id)
  })
})
