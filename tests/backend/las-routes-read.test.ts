import { beforeAll, describe, expect, inject, it } from 'vitest'
import request from 'supertest'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { clientFor, countRows } from './fixture'
import { lasBytes, lasSuite } from './las-setup'

const ctx = lasSuite('GSQ-BH03')
let importId: string
let curveIds: Record<string, number>
const logs = (hole = ctx.holeId) => `/api/projects/${ctx.fx.projectId}/holes/${hole}/logs`

beforeAll(async () => {
  const name = 'GSQ BH03 – deviation run.las'
  const upload = await ctx.logger.upload(logs(), lasBytes('gsq-bh03-feet-deviation.las'), name)
  importId = upload.body.data.importId
  const commit = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, { depthShift: -0.2 })
  const committed = commit.body.data.curves as { id: number; mnemonic: string }[]
  curveIds = Object.fromEntries(committed.map((c) => [c.mnemonic, c.id]))
})

describe('GET /api/projects/:projectId/holes/:ctx.holeId/logs', () => {
  it('GET logs → the hole’s curves without sample arrays, for any member', async () => {
    const res = await ctx.viewer.get(logs())
    expect(res.status).toBe(200)
    expect(res.body.meta).toEqual({ count: 3 })
    expect(res.body.data[2]).toEqual({
      id: curveIds.GR,
      mnemonic: 'GR',
      unit: 'GAPI',
      description: 'NATURAL GAMMA',
      sourceFile: 'GSQ BH03 – deviation run.las',
      depthShift: -0.2,
      minDepth: 1.324,
      maxDepth: 11.992,
      sampleCount: 8,
      importId,
    })
    expect((await ctx.viewer.get(logs(ctx.otherHoleId))).body.data).toEqual([])
    expect((await ctx.outsider.get(logs())).status).toBe(404)
  })
})

describe('GET /api/projects/:projectId/holes/:ctx.holeId/logs/:curveId', () => {
  it('GET logs/:curveId → depths (m, shifted) and values; 404 through another hole', async () => {
    const res = await ctx.viewer.get(`${logs()}/${curveIds.DEVI}`)
    expect(res.status).toBe(200)
    expect(res.body.data.depths.slice(0, 3)).toEqual([-0.2, 1.324, 2.848])
    expect(res.body.data.values.slice(0, 3)).toEqual([30, 30.1, 30.3])
    expect((await ctx.viewer.get(`${logs(ctx.otherHoleId)}/${curveIds.DEVI}`)).status).toBe(404)
    expect((await ctx.viewer.get(`${logs()}/abc`)).status).toBe(404)
  })
})

describe('GET /api/projects/:projectId/holes/:ctx.holeId/logs/imports/:importId/file', () => {
  it('GET file → the uploaded bytes as an attachment under the original name', async () => {
    const res = await ctx.viewer.get(`${logs()}/imports/${importId}/file`).responseType('blob')
    expect(res.status).toBe(200)
    expect(Buffer.compare(res.body as Buffer, lasBytes('gsq-bh03-feet-deviation.las'))).toBe(0)
    expect(res.headers['content-disposition']).toContain('attachment')
    expect(res.headers['content-disposition']).toContain("filename*=UTF-8''GSQ%20BH03%20%E2%80%93")
    expect((await ctx.viewer.get(`${logs(ctx.otherHoleId)}/imports/${importId}/file`)).status).toBe(
      404,
    )
  })
})

describe('POST /api/projects/:projectId/holes/:ctx.holeId/logs/imports/:importId/survey-from-deviation', () => {
  const url = () => `${logs()}/imports/${importId}/survey-from-deviation`

  it('POST survey-from-deviation → stations every 3 m for comparison; nothing written', async () => {
    const before = await countRows(ctx.fx.db, 'survey_stations')
    const res = await ctx.logger.post(url(), { interval: 3 })
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({
      azimuthCurve: 'AZI',
      inclinationCurve: 'DEVI',
      interval: 3,
    })
    const stations = res.body.data.stations as { depth: number; azimuth: number; plunge: number }[]
    expect(stations.map((s) => s.depth)).toEqual([0, 3.048, 6.096, 9.144, 12.192])
    expect(stations.map((s) => s.azimuth)).toEqual([355, 357.5, 0.4, 2.9, 5.6])
    expect(stations[1].plunge).toBeCloseTo(59.7, 9)
    expect(await countRows(ctx.fx.db, 'survey_stations')).toBe(before)
  })

  it('POST survey-from-deviation → 400 without deviation channels, 400 bad interval, 403 ctx.viewer', async () => {
    const plain = await ctx.logger.upload(logs(), lasBytes('gsq-bh02-plain.las'), 'plain.las')
    const none = await ctx.logger.post(
      `${logs()}/imports/${plain.body.data.importId}/survey-from-deviation`,
    )
    expect(none.status).toBe(400)
    expect(none.body.error.code).toBe('no_deviation')
    expect((await ctx.logger.post(url(), { interval: -1 })).status).toBe(400)
    expect((await ctx.viewer.post(url(), {})).status).toBe(403)
  })
})

describe('POST /api/projects/:projectId/holes/:ctx.holeId/logs (edge cases)', () => {
  it('POST logs (LAS 3.0, comma) → the ~Inclinometry_* set read and offered as a survey', async () => {
    const res = await ctx.logger.upload(logs(), lasBytes('gsq-bh06-las3-comma.las'), 'bh06.las')
    expect(res.status).toBe(201)
    expect(res.body.data.version).toBe('3.0')
    expect(res.body.data.problems).toEqual([
      {
        line: 29,
        message:
          'Data set INCLINOMETRY: 2 rows of 3 columns read (a hole survey: offered as a survey import).',
      },
    ])
    expect(res.body.data.dataSets).toEqual([
      {
        name: 'INCLINOMETRY',
        kind: 'inclinometry',
        line: 25,
        rows: 2,
        columns: ['MD', 'AZIM', 'INCL'],
      },
    ])
    expect(res.body.data.deviation).toEqual({ azimuthCurve: 'AZIM', inclinationCurve: 'INCL' })
  })

  it('POST logs without a file, or an empty one → 400 naming the field', async () => {
    const res = await ctx.logger.post(logs(), { note: 'no file' })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([{ path: 'file', message: 'required' }])
    const empty = await ctx.logger.upload(logs(), Buffer.alloc(0), 'empty.las')
    expect(empty.status).toBe(400)
    expect(empty.body.error.details).toEqual([{ path: 'file', message: 'The file is empty.' }])
  })

  it('POST logs over UPLOAD_LIMIT_MB → 413 in the error shape; signed out → 401', async () => {
    const saved = process.env.UPLOAD_LIMIT_MB
    process.env.UPLOAD_LIMIT_MB = '0.5'
    const { db, pool } = createDb(inject('databaseUrl'), 2)
    const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' })
    const log = createLogger('silent')
    const small = createApp({ db, pool, env, logger: log, mail: createMailer(env, log) })
    if (saved === undefined) delete process.env.UPLOAD_LIMIT_MB
    else process.env.UPLOAD_LIMIT_MB = saved
    try {
      const client = await clientFor(small, 'logger')
      const before = await countRows(ctx.fx.db, 'imports')
      const big = Buffer.concat([lasBytes('gsq-bh02-plain.las'), Buffer.alloc(600 * 1024, '#\n')])
      const res = await client.upload(logs(), big, 'big.las')
      expect(res.status).toBe(413)
      expect(res.body.error).toEqual({
        code: 'too_large',
        message: 'The file is larger than 0.5 MB.',
        details: [{ path: 'file', message: 'over 0.5 MB' }],
      })
      expect(await countRows(ctx.fx.db, 'imports')).toBe(before)
      const anonymous = request.agent(small)
      const csrf = (await anonymous.get('/api/auth/csrf')).body.data.csrfToken as string
      const signedOut = await anonymous
        .post(logs())
        .set('X-CSRF-Token', csrf)
        .attach('file', lasBytes('gsq-bh02-plain.las'), 'a.las')
      expect(signedOut.status).toBe(401)
    } finally {
      await pool.end()
    }
  })
})
