import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { auditEvents, coreRuns, imports, intervals, structures } from '../../schema/index'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'
import { importsUrl, nothingWritten, testdata, upload } from './import-setup'

let fx: Fixture
let logger: Client
const structureFile = testdata('structures-valid.csv') // depths 12.40, 15.10, 18.75
const commit = (id: string) => logger.post(`${importsUrl(fx)}/${id}/commit`)
const addInterval = (status: 'checked' | 'approved', fromDepth: number, toDepth: number) =>
  fx.db
    .insert(intervals)
    .values({
      holeId: fx.holeId,
      name: `I-${status}`,
      fromDepth,
      toDepth,
      status,
      checkedBy: fx.userIds.engineer,
    })
    .returning()

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
})
afterAll(() => fx.close())
beforeEach(async () => {
  await fx.db.delete(intervals)
  await fx.db.delete(structures)
  await fx.db.delete(coreRuns)
  await fx.db.delete(imports)
})

describe('POST /api/projects/:projectId/holes/:holeId/imports/:importId/commit — reviewed intervals', () => {
  it('POST imports → the preview lists the approved and checked intervals the rows reach', async () => {
    await addInterval('approved', 10, 13)
    await addInterval('checked', 18, 30)
    await fx.db.insert(intervals).values({
      holeId: fx.holeId,
      name: 'Untouched',
      fromDepth: 40,
      toDepth: 50,
      status: 'approved',
    })
    const preview = await upload(fx, logger, 'structures', structureFile, 's.csv')
    expect(preview.status).toBe(201)
    expect(
      preview.body.data.intervalsReached.map((i: { name: string; status: string }) => [
        i.name,
        i.status,
      ]),
    ).toEqual([
      ['I-approved', 'approved'],
      ['I-checked', 'checked'],
    ])
  })

  it('POST imports/:importId/commit → 409 interval_approved for structures inside an approved interval, nothing written', async () => {
    await addInterval('approved', 15, 16)
    const preview = await upload(fx, logger, 'structures', structureFile, 's.csv')
    const res = await nothingWritten(fx, () => commit(preview.body.data.importId))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
    expect(res.body.error.message).toContain('"I-approved" (15–16 m)')
  })

  it('POST imports/:importId/commit → structures beside (not inside) an approved interval go in', async () => {
    await addInterval('approved', 13, 15)
    const preview = await upload(fx, logger, 'structures', structureFile, 's.csv')
    expect((await commit(preview.body.data.importId)).status).toBe(200)
    expect(await countRows(fx.db, 'structures')).toBe(3)
  })

  it('POST imports/:importId/commit → a checked interval the rows reach goes back to draft, audited', async () => {
    const [checked] = await addInterval('checked', 18, 19)
    const preview = await upload(fx, logger, 'structures', structureFile, 's.csv')
    expect((await commit(preview.body.data.importId)).status).toBe(200)
    const [after] = await fx.db.select().from(intervals).where(eq(intervals.id, checked.id))
    expect(after).toMatchObject({ status: 'draft', checkedBy: null })
    const events = await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'interval'), eq(auditEvents.entityId, String(checked.id))))
    expect(events.map((e) => e.action)).toEqual(['back-to-draft'])
  })

  it('POST imports/:importId/commit → 409 for a runs import while the hole has an approved interval anywhere', async () => {
    await addInterval('approved', 60, 70)
    const preview = await upload(fx, logger, 'runs', testdata('runs-valid.csv'), 'runs.csv')
    expect(preview.body.data.intervalsReached).toHaveLength(1)
    const res = await nothingWritten(fx, () => commit(preview.body.data.importId))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
  })
})
