import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createHash } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { auditEvents, imports } from '../../schema/index'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'
import { importsUrl, nothingWritten, testdata, upload } from './import-setup'

let fx: Fixture
let logger: Client
const file = testdata('structures-valid.csv')

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
})
afterAll(() => fx.close())

describe('POST /api/projects/:projectId/holes/:holeId/imports — the same file twice', () => {
  let firstId: string
  let secondId: string

  it('POST imports → stores the SHA-256 of the bytes; a first upload has no duplicate', async () => {
    const preview = await upload(fx, logger, 'structures', file, 'first.csv')
    expect(preview.status).toBe(201)
    expect(preview.body.data.duplicateOf).toBeNull()
    firstId = preview.body.data.importId
    const [row] = await fx.db.select().from(imports).where(eq(imports.id, firstId))
    expect(row.sha256).toBe(createHash('sha256').update(file).digest('hex'))
    expect((await logger.post(`${importsUrl(fx)}/${firstId}/commit`)).status).toBe(200)
  })

  it('POST imports → the preview names the committed import with the same bytes', async () => {
    const [first] = await fx.db.select().from(imports).where(eq(imports.id, firstId))
    const preview = await upload(fx, logger, 'structures', file, 'renamed-copy.csv')
    expect(preview.status).toBe(201)
    secondId = preview.body.data.importId
    expect(preview.body.data.duplicateOf).toEqual({
      importId: firstId,
      fileName: 'first.csv',
      committedAt: first.committedAt!.toISOString(),
    })
  })

  it('POST imports/:importId/commit → 409 duplicate_import without confirmation, nothing written', async () => {
    const res = await nothingWritten(fx, () => logger.post(`${importsUrl(fx)}/${secondId}/commit`))
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('duplicate_import')
    expect(res.body.error.message).toContain('first.csv')
    expect(res.body.error.meta.duplicateOf.importId).toBe(firstId)
    const [row] = await fx.db.select().from(imports).where(eq(imports.id, secondId))
    expect(row.status).toBe('previewed')
  })

  it('POST imports/:importId/commit → 400 naming body.confirmDuplicate when it is not a boolean', async () => {
    const res = await logger.post(`${importsUrl(fx)}/${secondId}/commit`, {
      confirmDuplicate: 'yes',
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('body.confirmDuplicate')
  })

  it('POST imports/:importId/commit { confirmDuplicate: true } → 200, the rows are there twice, audited', async () => {
    const before = await countRows(fx.db, 'structures')
    const res = await logger.post(`${importsUrl(fx)}/${secondId}/commit`, {
      confirmDuplicate: true,
    })
    expect(res.status).toBe(200)
    expect(res.body.data.status).toBe('committed')
    expect(await countRows(fx.db, 'structures')).toBe(before + 3)
    const events = await fx.db.select().from(auditEvents).where(eq(auditEvents.entityId, secondId))
    expect(events[0].after).toMatchObject({ duplicateConfirmed: true, rows: 3 })
  })

  it('POST imports → the same bytes in another hole are no duplicate', async () => {
    const [hole] = (await logger.get(`/api/projects/${fx.projectId}/holes`)).body.data
    const other = await logger.post(`/api/projects/${fx.projectId}/holes`, {
      name: 'TST-02',
      collarEast: hole.collarEast,
      collarNorth: hole.collarNorth,
      collarElevation: 10,
      plannedAzimuth: 0,
      plannedPlunge: 60,
      finalDepth: 50,
    })
    const elsewhere = await logger
      .postMultipart(importsUrl(fx, other.body.data.id))
      .field('kind', 'structures')
      .attach('file', file, 'elsewhere.csv')
    expect(elsewhere.status).toBe(201)
    expect(elsewhere.body.data.duplicateOf).toBeNull()
  })
})
