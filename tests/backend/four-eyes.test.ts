import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { auditEvents, intervals, projects } from '../../schema/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let engineer: Client
let lead: Client
let admin: Client
const base = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const projectUrl = () => `/api/projects/${fx.projectId}`
const row = async (id: number) =>
  (await fx.db.select().from(intervals).where(eq(intervals.id, id)))[0]
const approvals = async () =>
  (await fx.db.select().from(auditEvents).where(eq(auditEvents.action, 'approve'))).length

/** A new interval the lead has checked themselves. */
async function checkedByLead(name: string, fromDepth: number) {
  const created = await engineer.post(`${base()}/intervals`, {
    name,
    fromDepth,
    toDepth: fromDepth + 10,
  })
  const url = `${base()}/intervals/${created.body.data.id}`
  const checked = await lead.post(`${url}/check`, { version: created.body.data.version })
  expect(checked.body.data).toMatchObject({ status: 'checked', checkedBy: fx.userIds.lead })
  return { url, id: created.body.data.id as number, version: checked.body.data.version as number }
}

beforeAll(async () => {
  fx = await createFixture()
  ;[engineer, lead, admin] = await Promise.all(
    (['engineer', 'lead', 'admin'] as const).map((who) => clientFor(fx.app, who)),
  )
})
afterAll(() => fx.close())

describe('four eyes: the approver is not the checker', () => {
  it('POST .../approve by the lead who checked → 409 four_eyes (on by default); the interval stays checked', async () => {
    const [project] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
    expect(project.fourEyes).toBe(true)
    const i = await checkedByLead('upper', 0)
    const before = await approvals()
    const res = await lead.post(`${i.url}/approve`, { version: i.version })
    expect(res.status).toBe(409)
    expect(res.body.error).toMatchObject({
      code: 'four_eyes',
      message: 'Four-eyes rule: you checked this interval, so another lead must approve it.',
    })
    expect(await row(i.id)).toMatchObject({ status: 'checked', approvedBy: null })
    expect(await approvals()).toBe(before)
  })

  it('POST .../approve by another lead → 200 with the rule on', async () => {
    const i = await checkedByLead('middle', 10)
    const res = await admin.post(`${i.url}/approve`, { version: i.version })
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({
      status: 'approved',
      checkedBy: fx.userIds.lead,
      approvedBy: fx.userIds.admin,
    })
  })

  it('PATCH /api/projects/:id { fourEyes } → 403 for an engineer, 400 for a non-boolean, 200 for the lead (audited)', async () => {
    const [project] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
    const refused = await engineer.patch(projectUrl(), {
      version: project.version,
      fourEyes: false,
    })
    expect(refused.status).toBe(403)
    const bad = await lead.patch(projectUrl(), { version: project.version, fourEyes: 'no' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.fourEyes')
    const res = await lead.patch(projectUrl(), { version: project.version, fourEyes: false })
    expect(res.status).toBe(200)
    expect(res.body.data.fourEyes).toBe(false)
    const [event] = await fx.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.entity, 'project'))
      .orderBy(auditEvents.id)
    expect(event).toMatchObject({
      action: 'update',
      before: { fourEyes: true },
      after: { fourEyes: false },
    })
  })

  it('POST .../approve by the lead who checked → 200 once the project turns four eyes off', async () => {
    const i = await checkedByLead('lower', 20)
    const res = await lead.post(`${i.url}/approve`, { version: i.version })
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({
      status: 'approved',
      checkedBy: fx.userIds.lead,
      approvedBy: fx.userIds.lead,
    })
  })
})
