import { and, asc, eq, inArray, sql } from 'drizzle-orm'
import { afterAll, beforeAll, expect, inject } from 'vitest'
import { createDb } from '../../backend/src/db/client'
import { startFakeSmtp, type FakeSmtp } from '../../backend/src/mail/fake-smtp'
import {
  auditEvents,
  capturedMails,
  coreRuns,
  holes,
  intervals,
  setMembers,
  structures,
  structureSets,
  surveyStations,
} from '../../schema/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

/**
 * The freeze tests' world: the fixture with mail captured by a fake SMTP server, and signed-in
 * logger, engineer and lead clients. Registers its own hooks.
 */
export function freezeSuite() {
  const ctx = {
    fx: undefined as unknown as Fixture,
    logger: undefined as unknown as Client,
    engineer: undefined as unknown as Client,
    lead: undefined as unknown as Client,
    base: '',
  }
  let fake: FakeSmtp
  let closeFakeDb: () => Promise<void>
  beforeAll(async () => {
    const { db, pool } = createDb(inject('databaseUrl'), 2)
    closeFakeDb = () => pool.end()
    fake = await startFakeSmtp({ port: 0, db })
    ctx.fx = await createFixture({ SMTP_URL: `smtp://127.0.0.1:${fake.port}` })
    ;[ctx.logger, ctx.engineer, ctx.lead] = await Promise.all(
      (['logger', 'engineer', 'lead'] as const).map((who) => clientFor(ctx.fx.app, who)),
    )
    ctx.base = `/api/projects/${ctx.fx.projectId}/holes/${ctx.fx.holeId}`
  })
  afterAll(async () => {
    await fake.stop()
    await closeFakeDb()
    await ctx.fx.close()
  })
  return ctx
}

export type FreezeContext = ReturnType<typeof freezeSuite>

/** A new interval taken through the review by the API: checked by the engineer, approved by the lead. */
export async function reviewedInterval(
  ctx: FreezeContext,
  range: { name: string; fromDepth: number; toDepth: number },
  status: 'draft' | 'checked' | 'approved',
) {
  const created = await ctx.engineer.post(`${ctx.base}/intervals`, range)
  expect(created.status).toBe(201)
  let interval = created.body.data
  const url = `${ctx.base}/intervals/${interval.id}`
  if (status !== 'draft') {
    interval = (await ctx.engineer.post(`${url}/check`, { version: interval.version })).body.data
    expect(interval.status).toBe('checked')
  }
  if (status === 'approved') {
    interval = (await ctx.lead.post(`${url}/approve`, { version: interval.version })).body.data
    expect(interval.status).toBe('approved')
  }
  return interval as { id: number; version: number; status: string; name: string }
}

/** Everything an interval's analysis reads in the hole, plus the audit trail's length. */
export async function snapshot(ctx: FreezeContext) {
  const { db } = ctx.fx
  const holeId = ctx.fx.holeId
  const ids = (
    await db.select({ id: intervals.id }).from(intervals).where(eq(intervals.holeId, holeId))
  ).map((i) => i.id)
  const sets = ids.length
    ? await db
        .select()
        .from(structureSets)
        .where(inArray(structureSets.intervalId, ids))
        .orderBy(asc(structureSets.id))
    : []
  return {
    hole: await db.select().from(holes).where(eq(holes.id, holeId)),
    structures: await db
      .select()
      .from(structures)
      .where(eq(structures.holeId, holeId))
      .orderBy(asc(structures.id)),
    stations: await db
      .select()
      .from(surveyStations)
      .where(eq(surveyStations.holeId, holeId))
      .orderBy(asc(surveyStations.id)),
    runs: await db
      .select()
      .from(coreRuns)
      .where(eq(coreRuns.holeId, holeId))
      .orderBy(asc(coreRuns.id)),
    intervals: await db
      .select()
      .from(intervals)
      .where(eq(intervals.holeId, holeId))
      .orderBy(asc(intervals.id)),
    sets,
    members: sets.length
      ? await db
          .select()
          .from(setMembers)
          .where(
            inArray(
              setMembers.setId,
              sets.map((s) => s.id),
            ),
          )
          .orderBy(asc(setMembers.setId), asc(setMembers.structureId))
      : [],
    audit: (await db.select({ n: sql<number>`count(*)::int` }).from(auditEvents))[0].n,
  }
}

/** The 409 every role gets for a write into an approved interval, naming it. */
export function expectFrozen(
  res: { status: number; body: { error?: { code: string; message: string; details: unknown } } },
  interval: { id: number; name: string },
  range: string,
) {
  expect(res.status).toBe(409)
  expect(res.body.error?.code).toBe('interval_approved')
  expect(res.body.error?.message).toContain(`approved interval "${interval.name}" (${range} m)`)
  expect(res.body.error?.details).toEqual([
    { path: 'interval', message: `${interval.id} "${interval.name}" (${range} m) is approved` },
  ])
}

/** Mails captured for one address, oldest first. */
export const mailsTo = (ctx: FreezeContext, email: string) =>
  ctx.fx.db
    .select()
    .from(capturedMails)
    .where(eq(capturedMails.to, email))
    .orderBy(asc(capturedMails.id))

/** The audit rows of one interval with one action. */
export const auditOf = (ctx: FreezeContext, intervalId: number, action: string) =>
  ctx.fx.db
    .select()
    .from(auditEvents)
    .where(
      and(
        eq(auditEvents.entity, 'interval'),
        eq(auditEvents.entityId, String(intervalId)),
        eq(auditEvents.action, action),
      ),
    )
