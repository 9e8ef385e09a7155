import { eq } from 'drizzle-orm'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { coreRuns, holes, structures } from '../../schema/index'
import {
  clientFor,
  countRows,
  createFixture,
  holeValues,
  type Client,
  type Fixture,
} from './fixture'

let fx: Fixture
let logger: Client
let holeId: number
const base = () => `/api/projects/${fx.projectId}/holes/${holeId}`
const beyond = { path: 'body.depth', message: "beyond the hole's final depth (80 m)" }
const run = (fromDepth: number, toDepth: number) => ({
  fromDepth,
  toDepth,
  recovered: toDepth - fromDepth,
  solid: toDepth - fromDepth,
  rqdLength: toDepth - fromDepth,
})
const hole = async () => (await fx.db.select().from(holes).where(eq(holes.id, holeId)))[0]

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
  const [row] = await fx.db
    .insert(holes)
    .values({ ...holeValues(fx.projectId, 'TST-80'), finalDepth: 80 })
    .returning()
  holeId = row.id
})
afterAll(() => fx.close())

describe("depths beyond the hole's final depth", () => {
  it('POST .../structures at 95 m in an 80 m hole → 400 invalid_input naming body.depth; at 80 m → 201', async () => {
    const res = await logger.post(`${base()}/structures`, { depth: 95, type: 'joint', alpha: 40 })
    expect(res.status).toBe(400)
    expect(res.body.error).toMatchObject({ code: 'invalid_input', details: [beyond] })
    expect(res.body.error.message).toBe(
      "95 m is beyond the hole's final depth (80 m): extend the hole's final depth first.",
    )
    expect(await countRows(fx.db, 'structures')).toBe(0)
    const last = await logger.post(`${base()}/structures`, { depth: 80, type: 'joint', alpha: 40 })
    expect(last.status).toBe(201)
  })

  it('PATCH .../structures/:id to 80.5 m → 400 naming body.depth; the row keeps its depth', async () => {
    const [s] = await fx.db.select().from(structures).where(eq(structures.holeId, holeId))
    const res = await logger.patch(`${base()}/structures/${s.id}`, {
      version: s.version,
      depth: 80.5,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([beyond])
    const [after] = await fx.db.select().from(structures).where(eq(structures.id, s.id))
    expect(after).toEqual(s)
  })

  it('POST, PATCH and PUT .../runs ending beyond 80 m → 400 naming toDepth; nothing stored', async () => {
    const message = "beyond the hole's final depth (80 m)"
    const add = await logger.post(`${base()}/runs`, run(78, 81))
    expect(add.status).toBe(400)
    expect(add.body.error.details).toEqual([{ path: 'body.toDepth', message }])
    const put = await logger.put(`${base()}/runs`, { runs: [run(70, 75), run(75, 82)] })
    expect(put.status).toBe(400)
    expect(put.body.error.details).toEqual([{ path: 'body.runs.1.toDepth', message }])
    expect(await countRows(fx.db, 'core_runs')).toBe(0)
    const ok = await logger.post(`${base()}/runs`, run(77, 80))
    expect(ok.status).toBe(201)
    const stretch = await logger.patch(`${base()}/runs/${ok.body.data.id}`, {
      version: ok.body.data.version,
      toDepth: 80.2,
    })
    expect(stretch.status).toBe(400)
    expect(stretch.body.error.details).toEqual([{ path: 'body.toDepth', message }])
    const [stored] = await fx.db.select().from(coreRuns).where(eq(coreRuns.holeId, holeId))
    expect(stored.toDepth).toBe(80)
  })

  it('PATCH .../holes/:id with finalDepth above the deepest structure or run → 400 naming body.finalDepth', async () => {
    const h = await hole()
    const res = await logger.patch(`/api/projects/${fx.projectId}/holes/${holeId}`, {
      version: h.version,
      finalDepth: 79,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([
      {
        path: 'body.finalDepth',
        message:
          'shallower than its deepest structure (80 m); shallower than the end of its deepest core run (80 m)',
      },
    ])
    expect(await hole()).toEqual(h)
  })

  it('PATCH .../holes/:id extending finalDepth to 100 m → 200; then a structure at 95 m → 201', async () => {
    const h = await hole()
    const res = await logger.patch(`/api/projects/${fx.projectId}/holes/${holeId}`, {
      version: h.version,
      finalDepth: 100,
    })
    expect(res.status).toBe(200)
    const deeper = await logger.post(`${base()}/structures`, {
      depth: 95,
      type: 'joint',
      alpha: 40,
    })
    expect(deeper.status).toBe(201)
  })

  it('POST .../imports kind picks with a pick beyond the final depth → 422 naming its line and depth column; nothing kept', async () => {
    const before = await countRows(fx.db, 'imports')
    const res = await logger
      .postMultipart(`${base()}/imports`)
      .field('kind', 'picks')
      .field('options', JSON.stringify({ azimuthReference: 'highside' }))
      .attach(
        'file',
        Buffer.from(
          'depth,amplitude,diameter,trough,type\n50,96,96,90,joint\n101.5,96,96,90,joint\n',
        ),
        'picks.csv',
      )
    expect(res.status).toBe(422)
    expect(res.body.error.details).toEqual([
      {
        path: 'file.line.3.depth',
        message:
          "row 2 (line 3), column depth: depth 101.5 m is beyond the hole's final depth (100 m)",
      },
    ])
    expect(await countRows(fx.db, 'imports')).toBe(before)
  })
})
