import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { auditEvents } from '../../schema/index'
import { clientFor, createFixture, type Fixture } from './fixture'

// The approval records what the approver saw: the interval's analysis settings at that moment.
let fx: Fixture
beforeAll(async () => {
  fx = await createFixture()
})
afterAll(() => fx.close())

describe('POST …/intervals/:id/approve', () => {
  it('the audit row of the approval carries the saved analysis settings', async () => {
    const [engineer, lead] = await Promise.all([
      clientFor(fx.app, 'engineer'),
      clientFor(fx.app, 'lead'),
    ])
    const url = `/api/projects/${fx.projectId}/holes/${fx.holeId}/intervals`
    const made = await engineer.post(url, {
      name: 'Audit',
      fromDepth: 10,
      toDepth: 20,
      faceDip: 70,
      faceDipDirection: 190,
      frictionDeg: 30,
    })
    expect(made.status).toBe(201)
    const id = made.body.data.id
    const checked = await engineer.post(`${url}/${id}/check`, { version: made.body.data.version })
    const approved = await lead.post(`${url}/${id}/approve`, { version: checked.body.data.version })
    expect(approved.status).toBe(200)
    const [row] = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'interval'), eq(auditEvents.action, 'approve')))
    expect(row.after).toMatchObject({
      status: 'approved',
      settings: {
        weighting: 'terzaghi',
        contourMethod: 'kamb',
        faceDip: 70,
        faceDipDirection: 190,
        frictionDeg: 30,
        lateralLimitDeg: 20,
        topplingLimitDeg: 30,
      },
    })
  })
})
