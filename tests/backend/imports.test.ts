import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { readFileSync } from 'node:fs'
import { startJobQueue, type JobQueue } from '../../backend/src/jobs/queue'
import { importCommitJob } from '../../backend/src/jobs/handlers'
import { createApp } from '../../backend/src/app'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { loadEnv } from '../../backend/src/env'
import { createDb } from '../../backend/src/db/client'
import { inject } from 'vitest'
import { clientFor, countRows, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let logger: Client
let viewer: Client
const url = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}/imports`
const testdata = (name: string) =>
  readFileSync(new URL(`../../testdata/csv/${name}`, import.meta.url))

function upload(
  client: Client,
  kind: string,
  file: Buffer,
  name: string,
  extra: Record<string, string> = {},
) {
  const req = client.postMultipart(url()).field('kind', kind)
  for (const [k, v] of Object.entries(extra)) req.field(k, v)
  return req.attach('file', file, name)
}

async function nothingWritten<T>(action: () => Promise<T>): Promise<T> {
  const tables = ['structures', 'imports', 'core_runs', 'survey_stations', 'audit_events']
  const before = await Promise.all(tables.map((t) => countRows(fx.db, t)))
  const result = await action()
  expect(await Promise.all(tables.map((t) => countRows(fx.db, t)))).toEqual(before)
  return result
}

beforeAll(async () => {
  fx = await createFixture()
  logger = await clientFor(fx.app, 'logger')
  viewer = await clientFor(fx.app, 'viewer')
})
afterAll(() => fx.close())

describe('POST /api/projects/:projectId/holes/:holeId/imports — bad files', () => {
  it('imports → 400 missing_columns naming the unmapped column', async () => {
    const res = await nothingWritten(() =>
      upload(logger, 'structures', testdata('structures-missing-columns.csv'), 'a.csv'),
    )
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('missing_columns')
    expect(res.body.error.details).toEqual([
      { path: 'mapping.type', message: expect.stringContaining('"type"') },
    ])
  })

  it('imports → 422 naming row and column for text in numeric columns', async () => {
    const res = await nothingWritten(() =>
      upload(logger, 'structures', testdata('structures-text-in-numbers.csv'), 'b.csv'),
    )
    expect(res.status).toBe(422)
    expect(res.body.error.details).toEqual([
      {
        path: 'file.line.3.alpha',
        message: 'row 2 (line 3), column alpha: "sixty" is not a number',
      },
      {
        path: 'file.line.4.depth',
        message: 'row 3 (line 4), column depth: "14.2m" is not a number',
      },
    ])
    expect(res.body.error.meta).toMatchObject({
      rowCount: 3,
      errorCount: 2,
      headers: ['depth', 'type', 'alpha', 'beta'],
    })
  })

  it('imports → 422 for alpha 95, naming line 3 and column alpha', async () => {
    const res = await nothingWritten(() =>
      upload(logger, 'structures', testdata('structures-alpha-95.csv'), 'c.csv'),
    )
    expect(res.status).toBe(422)
    expect(res.body.error.details).toHaveLength(1)
    expect(res.body.error.details[0].path).toBe('file.line.3.alpha')
    expect(res.body.error.details[0].message).toMatch(/90/)
  })

  it('imports → 422 for repeated survey depths (dip negative down)', async () => {
    const res = await nothingWritten(() =>
      upload(logger, 'survey', testdata('survey-duplicate-depths.csv'), 'd.csv', {
        options: JSON.stringify({
          plungeConvention: 'dip-negative-down',
          azimuthReference: 'true',
        }),
      }),
    )
    expect(res.status).toBe(422)
    expect(res.body.error.details).toEqual([
      {
        path: 'file.line.4.depth',
        message: 'row 3 (line 4), column depth: depth 30 repeats line 3',
      },
    ])
  })

  it("imports → 422 naming line and column for structures beyond the hole's final depth (100 m)", async () => {
    const file = Buffer.from('depth,type,alpha,beta\n99.5,joint,60,0\n100.5,joint,45,90\n')
    const res = await nothingWritten(() => upload(logger, 'structures', file, 'deep.csv'))
    expect(res.status).toBe(422)
    expect(res.body.error.details).toEqual([
      {
        path: 'file.line.3.depth',
        message:
          "row 2 (line 3), column depth: depth 100.5 m is beyond the hole's final depth (100 m)",
      },
    ])
  })

  it('imports → 422 naming the to column of a run and the station depth beyond the final depth', async () => {
    const runs = Buffer.from('from,to,recovered,solid,rqd\n97,100,3,3,3\n100,103,3,3,3\n')
    const r = await nothingWritten(() => upload(logger, 'runs', runs, 'runs.csv'))
    expect(r.status).toBe(422)
    expect(r.body.error.details.map((d: { path: string }) => d.path)).toEqual(['file.line.3.to'])
    // 330 ft = 100.584 m: the depth is compared in metres after conversion
    const survey = Buffer.from('md,azimuth,dip\n0,10,60\n330,11,59\n')
    const s = await nothingWritten(() =>
      upload(logger, 'survey', survey, 'survey.csv', {
        options: JSON.stringify({ depthUnit: 'ft', azimuthReference: 'true' }),
      }),
    )
    expect(s.status).toBe(422)
    expect(s.body.error.details).toEqual([
      {
        path: 'file.line.3.md',
        message:
          "row 2 (line 3), column md: depth 100.584 m is beyond the hole's final depth (100 m)",
      },
    ])
  })

  it('imports → 400 empty_file for an empty file', async () => {
    const res = await nothingWritten(() =>
      upload(logger, 'structures', testdata('empty.csv'), 'empty.csv'),
    )
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('empty_file')
  })

  it('imports → 400 not_text for 10 MB of binary junk', async () => {
    let seed = 7
    const junk = Buffer.alloc(10 * 1024 * 1024)
    for (let i = 0; i < junk.length; i++)
      junk[i] = (seed = (seed * 1103515245 + 12345) & 0x7fffffff) >> 16
    const res = await nothingWritten(() => upload(logger, 'structures', junk, 'junk.csv'))
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('not_text')
  })

  it('imports → 403 for a viewer, nothing written', async () => {
    const res = await nothingWritten(() =>
      upload(viewer, 'structures', testdata('structures-valid.csv'), 'v.csv'),
    )
    expect(res.status).toBe(403)
  })
})

describe('imports → preview → commit', () => {
  it('imports a byte-order-marked, semicolon file with decimal commas', async () => {
    const res = await upload(
      logger,
      'structures',
      testdata('structures-bom-semicolon.csv'),
      'bom.csv',
    )
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({
      rowCount: 2,
      headers: ['Depth', 'Type', 'Alpha', 'Beta', 'Comment'],
    })
    expect(
      res.body.data.sample.map((s: { depth: number; alpha: number }) => [s.depth, s.alpha]),
    ).toEqual([
      [20.5, 60],
      [21.25, 45.5],
    ])
    const commit = await logger.post(`${url()}/${res.body.data.importId}/commit`)
    expect(commit.status).toBe(200)
    expect(commit.body.data).toMatchObject({ status: 'committed', rowCount: 2, progress: 100 })
    const list = (await logger.get(`/api/projects/${fx.projectId}/holes/${fx.holeId}/structures`))
      .body.data
    expect(list.map((s: { depth: number; type: string }) => [s.depth, s.type])).toEqual([
      [20.5, 'joint'],
      [21.25, 'fault'],
    ])
    expect((await logger.post(`${url()}/${res.body.data.importId}/commit`)).status).toBe(409)
  })

  it('imports runs, then a survey given as inclination from vertical', async () => {
    const runs = await upload(logger, 'runs', testdata('runs-valid.csv'), 'runs.csv')
    expect(runs.status).toBe(201)
    await logger.post(`${url()}/${runs.body.data.importId}/commit`)
    const listed = (await logger.get(`/api/projects/${fx.projectId}/holes/${fx.holeId}/runs`)).body
      .data
    expect(listed.map((r: { markConfidence: string }) => r.markConfidence)).toEqual([
      'good',
      'fair',
      'poor',
    ])
    const survey = await upload(logger, 'survey', testdata('survey-valid.csv'), 'survey.csv', {
      options: JSON.stringify({
        plungeConvention: 'inclination-from-vertical',
        azimuthReference: 'magnetic',
      }),
    })
    expect(survey.status).toBe(201)
    expect(survey.body.data.mapping).toEqual({
      depth: 'depth',
      azimuth: 'azimuth',
      plunge: 'inclination',
      method: 'tool',
    })
    await logger.post(`${url()}/${survey.body.data.importId}/commit`)
    const stations = (await logger.get(`/api/projects/${fx.projectId}/holes/${fx.holeId}/survey`))
      .body.data
    // inclination 30° from vertical = plunge 60°; magnetic 10.0 with declination −2 → true 8.0
    expect(stations[0]).toMatchObject({
      depth: 0,
      plunge: 60,
      azimuth: 8,
      azimuthReference: 'magnetic',
    })
  })
})

describe('large imports run as background jobs', () => {
  let jobs: JobQueue
  let app: ReturnType<typeof createApp>
  let close: () => Promise<unknown>
  beforeAll(async () => {
    const { db, pool } = createDb(inject('databaseUrl'), 4)
    const log = createLogger('silent')
    const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' })
    const mail = createMailer(env, log)
    jobs = await startJobQueue(
      inject('databaseUrl'),
      { 'import-commit': importCommitJob(db, pool, mail, log) },
      log,
    )
    app = createApp({ db, pool, env, logger: log, jobs, mail })
    close = () => jobs.stop().then(() => pool.end())
  })
  afterAll(() => close())

  it('imports 6,000 structures → 202 queued, then committed by the worker with progress', async () => {
    const lines = ['depth,type,alpha,beta']
    for (let i = 0; i < 6000; i++)
      lines.push(`${(0.01 * i).toFixed(2)},joint,${10 + (i % 80)},${(i * 7) % 360}`)
    const client = await clientFor(app, 'logger')
    const before = await countRows(fx.db, 'structures')
    const preview = await upload(client, 'structures', Buffer.from(lines.join('\n')), 'big.csv')
    expect(preview.status).toBe(201)
    expect(preview.body.data).toMatchObject({ rowCount: 6000, background: true })
    expect(preview.body.data.sample).toHaveLength(20)
    const queued = await client.post(`${url()}/${preview.body.data.importId}/commit`)
    expect(queued.status).toBe(202)
    let status = queued.body.data
    for (let i = 0; i < 100 && status.status !== 'committed' && status.status !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 200))
      status = (await client.get(`${url()}/${preview.body.data.importId}`)).body.data
    }
    expect(status).toMatchObject({ status: 'committed', progress: 100 })
    expect(await countRows(fx.db, 'structures')).toBe(before + 6000)
  })
})
