import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest'
import { and, asc, eq } from 'drizzle-orm'
import {
  auditEvents,
  coreRuns,
  holes,
  imports,
  intervals,
  structures,
  surveyStations,
} from '../../schema/index'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'
import { importFile, importsUrl, nothingWritten, testdata, upload } from './import-setup'

let fx: Fixture
let logger: Client
let viewer: Client
const H = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const undo = (id: string, client = logger) => client.post(`${importsUrl(fx)}/${id}/undo`)
const structureFile = testdata('structures-valid.csv')
const runsOf = () =>
  fx.db
    .select()
    .from(coreRuns)
    .where(eq(coreRuns.holeId, fx.holeId))
    .orderBy(asc(coreRuns.fromDepth))
const structuresOf = () =>
  fx.db
    .select()
    .from(structures)
    .where(eq(structures.holeId, fx.holeId))
    .orderBy(asc(structures.depth))
const undoEvent = async (id: string) =>
  (
    await fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entityId, id), eq(auditEvents.action, 'undo')))
  )[0]
const addInterval = (status: 'checked' | 'approved', fromDepth = 10, toDepth = 20) =>
  fx.db
    .insert(intervals)
    .values({ holeId: fx.holeId, name: `I-${status}`, fromDepth, toDepth, status })

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
  viewer = await clientFor(fx.app, 'viewer')
})
afterAll(() => fx.close())
beforeEach(async () => {
  await fx.db.delete(intervals)
  await fx.db.delete(structures)
  await fx.db.delete(coreRuns)
  await fx.db.delete(imports)
})

describe('POST /api/projects/:projectId/holes/:holeId/imports/:importId/undo — structures', () => {
  it('POST imports/:importId/undo → removes the imported structures only, marks it undone, audits counts', async () => {
    const kept = await logger.post(`${H()}/structures`, {
      depth: 30,
      type: 'fault',
      alpha: 50,
      beta: 10,
    })
    expect(kept.status).toBe(201)
    const id = await importFile(fx, logger, 'structures', structureFile, 's.csv')
    expect((await structuresOf()).map((s) => s.depth)).toEqual([12.4, 15.1, 18.75, 30])
    const res = await undo(id)
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({ id, status: 'undone', removed: 3, restored: 0 })
    expect((await structuresOf()).map((s) => s.id)).toEqual([kept.body.data.id])
    const [row] = await fx.db.select().from(imports).where(eq(imports.id, id))
    expect(row).toMatchObject({ status: 'undone', undoneBy: fx.userIds.logger })
    expect(row.undoneAt).toBeInstanceOf(Date)
    expect(await undoEvent(id)).toMatchObject({
      userId: fx.userIds.logger,
      after: { status: 'undone', kind: 'structures', removed: 3, restored: 0, recomputed: 1 },
    })
    // An undone import is no longer a duplicate of the same file.
    const again = await upload(fx, logger, 'structures', structureFile, 's.csv')
    expect(again.body.data.duplicateOf).toBeNull()
  })

  it('POST imports/:importId/undo → 409 import_undone the second time, 409 import_not_committed for a preview', async () => {
    const id = await importFile(fx, logger, 'structures', structureFile, 's.csv')
    expect((await undo(id)).status).toBe(200)
    const twice = await nothingWritten(fx, () => undo(id))
    expect(twice.status).toBe(409)
    expect(twice.body.error.code).toBe('import_undone')
    const preview = await upload(fx, logger, 'structures', structureFile, 'p.csv')
    const notYet = await nothingWritten(fx, () => undo(preview.body.data.importId))
    expect(notYet.status).toBe(409)
    expect(notYet.body.error.code).toBe('import_not_committed')
  })

  it('POST imports/:importId/undo → 409 naming the approved interval that holds a row, nothing removed', async () => {
    const id = await importFile(fx, logger, 'structures', structureFile, 's.csv')
    await addInterval('approved')
    const res = await nothingWritten(fx, () => undo(id))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_approved')
    expect(res.body.error.message).toContain('"I-approved" (10–20 m)')
    expect(await structuresOf()).toHaveLength(3)
  })

  it('POST imports/:importId/undo → 409 interval_checked for a checked interval that holds a row', async () => {
    const id = await importFile(fx, logger, 'structures', structureFile, 's.csv')
    await addInterval('checked', 18, 19)
    const res = await nothingWritten(fx, () => undo(id))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_checked')
    expect(res.body.error.message).toContain('"I-checked" (18–19 m)')
  })

  it('POST imports/:importId/undo → 409 import_rows_edited when a person edited an imported row', async () => {
    const id = await importFile(fx, logger, 'structures', structureFile, 's.csv')
    const [first] = await structuresOf()
    const edit = await logger.patch(`${H()}/structures/${first.id}`, {
      version: first.version,
      comment: 'checked the core again',
    })
    expect(edit.status).toBe(200)
    const res = await nothingWritten(fx, () => undo(id))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('import_rows_edited')
  })

  it('POST imports/:importId/undo → 403 for a viewer, nothing removed', async () => {
    const id = await importFile(fx, logger, 'structures', structureFile, 's.csv')
    const res = await nothingWritten(fx, () => undo(id, viewer))
    expect(res.status).toBe(403)
  })
})

describe('POST /api/projects/:projectId/holes/:holeId/imports/:importId/undo — replacing imports', () => {
  const handRuns = [
    { fromDepth: 0, toDepth: 4, recovered: 3.9, solid: 3.5, rqdLength: 3, markConfidence: 'fair' },
    { fromDepth: 4, toDepth: 8, recovered: 4, solid: 3.8, rqdLength: 3.4, comment: 'by hand' },
  ]

  it('POST imports/:importId/undo → a runs import puts back the runs it replaced', async () => {
    expect((await logger.put(`${H()}/runs`, { runs: handRuns })).status).toBe(200)
    const before = await runsOf()
    const id = await importFile(fx, logger, 'runs', testdata('runs-valid.csv'), 'runs.csv')
    expect((await runsOf()).map((r) => [r.fromDepth, r.importId])).toEqual([
      [0, id],
      [3, id],
      [6, id],
    ])
    expect((await logger.get(`${importsUrl(fx)}/${id}`)).body.data.replacedCount).toBe(2)
    const res = await undo(id)
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({ status: 'undone', removed: 3, restored: 2 })
    expect(await runsOf()).toEqual(before)
    expect((await undoEvent(id)).after).toMatchObject({ kind: 'runs', removed: 3, restored: 2 })
  })

  it('POST imports/:importId/undo → 409 import_superseded while a later runs import holds the hole', async () => {
    const first = await importFile(fx, logger, 'runs', testdata('runs-valid.csv'), 'a.csv')
    const later = Buffer.from('from,to,recovered,solid,rqd\n0,5,5,4,3\n')
    const second = await importFile(fx, logger, 'runs', later, 'b.csv')
    const refused = await nothingWritten(fx, () => undo(first))
    expect(refused.status).toBe(409)
    expect(refused.body.error.code).toBe('import_superseded')
    expect((await undo(second)).body.data).toMatchObject({ removed: 1, restored: 3 })
    expect((await undo(first)).body.data).toMatchObject({ removed: 3, restored: 0 })
    expect(await runsOf()).toEqual([])
  })

  it('POST imports/:importId/undo → 409 interval_checked for a runs import when the hole has a checked interval', async () => {
    const id = await importFile(fx, logger, 'runs', testdata('runs-valid.csv'), 'runs.csv')
    await addInterval('checked', 60, 70)
    const res = await nothingWritten(fx, () => undo(id))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_checked')
  })

  it('POST imports/:importId/undo → a survey import puts back the stations it replaced, new survey revision', async () => {
    const hand = [
      { depth: 0, azimuth: 5, plunge: 55, azimuthReference: 'true', method: 'gyro' },
      { depth: 40, azimuth: 6, plunge: 54, azimuthReference: 'true', method: 'gyro' },
    ]
    expect((await logger.put(`${H()}/survey`, { stations: hand })).status).toBe(200)
    const stations = () =>
      fx.db
        .select()
        .from(surveyStations)
        .where(eq(surveyStations.holeId, fx.holeId))
        .orderBy(asc(surveyStations.depth))
    const before = await stations()
    const preview = await upload(fx, logger, 'survey', testdata('survey-valid.csv'), 'sv.csv', {
      options: JSON.stringify({ plungeConvention: 'inclination-from-vertical' }),
    })
    const id = preview.body.data.importId
    expect((await logger.post(`${importsUrl(fx)}/${id}/commit`)).status).toBe(200)
    expect(await stations()).toHaveLength(3)
    const revision = async () =>
      (await fx.db.select().from(holes).where(eq(holes.id, fx.holeId)))[0].surveyRevision
    const atImport = await revision()
    const res = await undo(id)
    expect(res.body.data).toMatchObject({ status: 'undone', removed: 3, restored: 2 })
    expect(await stations()).toEqual(before)
    expect(await revision()).toBe(atImport + 1)
  })
})
