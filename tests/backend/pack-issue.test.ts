import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { eq } from 'drizzle-orm'
import { holeAt, planeToCore } from '../../orient/index'
import { intervals } from '../../schema/index'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { startJobQueue, type JobQueue } from '../../backend/src/jobs/queue'
import { packBuildJob } from '../../backend/src/jobs/handlers'
import { contentHashOf } from '../../backend/src/exports/hash'
import { runPackBuild } from '../../backend/src/exports/pack-build'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

let fx: Fixture
let jobs: JobQueue
let app: ReturnType<typeof createApp>
let close: () => Promise<unknown>
const as: Partial<Record<string, Client>> = {}
const url = () => `/api/projects/${fx.projectId}/packs`
const holeUrl = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}`
const stations = [
  { depth: 0, azimuth: 0, plunge: 60, azimuthReference: 'true' },
  { depth: 100, azimuth: 0, plunge: 60, azimuthReference: 'true' },
]
const planes = [
  { dip: 50, dipDirection: 190 },
  { dip: 52, dipDirection: 195 },
  { dip: 48, dipDirection: 186 },
  { dip: 80, dipDirection: 100 },
  { dip: 78, dipDirection: 104 },
  { dip: 82, dipDirection: 97 },
]
let intervalId = 0

async function waitFor(client: Client, id: string) {
  let pack = (await client.get(`${url()}/${id}`)).body.data
  for (let i = 0; i < 150 && !['ready', 'failed', 'issued'].includes(pack.status); i++) {
    await new Promise((r) => setTimeout(r, 200))
    pack = (await client.get(`${url()}/${id}`)).body.data
  }
  return pack
}
beforeAll(async () => {
  fx = await createFixture()
  const { db, pool } = createDb(inject('databaseUrl'), 4)
  const log = createLogger('silent')
  jobs = await startJobQueue(inject('databaseUrl'), { 'pack-build': packBuildJob(db, log) }, log)
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' })
  app = createApp({ db, pool, env, logger: log, jobs })
  close = () => jobs.stop().then(() => pool.end())
  for (const who of ['lead', 'engineer', 'logger', 'viewer', 'outsider', 'anonymous'] as const)
    as[who] = await clientFor(app, who)
  const logger = as.logger!
  await logger.put(`${holeUrl()}/survey`, { stations })
  await logger.put(`${holeUrl()}/runs`, {
    runs: [
      { fromDepth: 0, toDepth: 20, recovered: 20, solid: 19, rqdLength: 18, fractureCount: 6 },
      { fromDepth: 20, toDepth: 40, recovered: 19, solid: 15, rqdLength: 12, fractureCount: 14 },
    ],
  })
  let depth = 10
  for (const plane of planes) {
    const core = planeToCore(plane, holeAt(stations, depth)!)!
    await logger.post(`${holeUrl()}/structures`, {
      depth,
      type: 'joint',
      alpha: core.alpha,
      beta: core.beta,
    })
    depth += 3
  }
  await logger.post(`${holeUrl()}/structures`, { depth: 30.5, type: 'fault', alpha: 40, beta: 100 })
  const engineer = as.engineer!
  const created = await engineer.post(`${holeUrl()}/intervals`, {
    name: 'upper',
    fromDepth: 5,
    toDepth: 40,
    faceDip: 70,
    faceDipDirection: 190,
    frictionDeg: 30,
  })
  intervalId = created.body.data.id
  const sets = `${holeUrl()}/intervals/${intervalId}/sets`
  await engineer.post(sets, { name: 'J1', centreTrend: 10, centrePlunge: 40, coneAngle: 20 })
  await engineer.post(sets, { name: 'J2', centreTrend: 280, centrePlunge: 10, coneAngle: 20 })
})
afterAll(async () => {
  await close()
  await fx.close()
})

describe('a built pack: downloads and issue', () => {
  let id = ''
  beforeAll(async () => {
    const res = await as.lead!.post(url(), {})
    id = res.body.data.id
    expect((await waitFor(as.lead!, id)).status).toBe('ready')
  })

  it('GET files → viewer 403 before issue; engineer 200; unknown file 404', async () => {
    expect((await as.viewer!.get(`${url()}/${id}/files/sets.csv`)).status).toBe(403)
    expect((await as.engineer!.get(`${url()}/${id}/files/nope.csv`)).status).toBe(404)
    expect((await as.outsider!.get(`${url()}/${id}/files/sets.csv`)).status).toBe(404)
  })

  it('every pack route → 401 signed out, 404 for a non-member', async () => {
    const routes = [
      (c: Client) => c.get(`${url()}/${id}`),
      (c: Client) => c.post(`${url()}/${id}/issue`),
      (c: Client) => c.post(`${url()}/${id}/rebuild`),
      (c: Client) => c.delete(`${url()}/${id}`),
      (c: Client) => c.get(`${url()}/${id}/files/report.pdf`),
    ]
    for (const call of routes) {
      expect((await call(as.anonymous!)).status).toBe(401)
      expect((await call(as.outsider!)).status).toBe(404)
    }
    for (const who of ['viewer', 'logger', 'engineer'])
      for (const call of routes.slice(1, 4)) expect((await call(as[who]!)).status).toBe(403)
  })

  it('POST /:packId/issue → 403 engineer; lead freezes it and marks intervals issued; then 409', async () => {
    expect((await as.engineer!.post(`${url()}/${id}/issue`)).status).toBe(403)
    expect((await as.logger!.post(`${url()}/${id}/issue`)).status).toBe(403)
    const res = await as.lead!.post(`${url()}/${id}/issue`)
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({ status: 'issued', issuedByName: 'lead' })
    expect(res.body.data.contentHash).toBe(contentHashOf(res.body.data.files))
    const [interval] = await fx.db.select().from(intervals).where(eq(intervals.id, intervalId))
    expect(interval.status).toBe('issued')
    for (const again of [
      as.lead!.post(`${url()}/${id}/issue`),
      as.lead!.delete(`${url()}/${id}`),
      as.lead!.post(`${url()}/${id}/rebuild`),
    ]) {
      const r = await again
      expect(r.status).toBe(409)
      expect(r.body.error.code).toBe('pack_issued')
    }
    const v = await as.viewer!.get(`${url()}/${id}/files/sets.csv`)
    expect(v.status).toBe(200)
    expect(v.headers['x-content-sha256']).toBe(
      res.body.data.files.find((f: { name: string }) => f.name === 'sets.csv').sha256,
    )
  })
})

describe('DELETE /api/projects/:projectId/packs/:packId', () => {
  it('DELETE → 403 engineer, 204 lead for a non-issued pack, then 404', async () => {
    const res = await as.lead!.post(url(), { holeIds: [fx.holeId] })
    const pack = await waitFor(as.lead!, res.body.data.id)
    expect(pack.status).toBe('ready')
    // A retried job (server restart mid-build) rebuilds from scratch: same files, no duplicates.
    await runPackBuild(fx.db, pack.id)
    const again = (await as.lead!.get(`${url()}/${pack.id}`)).body.data
    expect(again.status).toBe('ready')
    expect(again.files.map((f: { name: string }) => f.name)).toEqual(
      pack.files.map((f: { name: string }) => f.name),
    )
    const sha = (p: typeof pack, name: string) =>
      p.files.find((f: { name: string }) => f.name === name).sha256
    expect(sha(again, 'structures.csv')).toBe(sha(pack, 'structures.csv'))
    expect(again.inputsHash).toBe(pack.inputsHash)
    // New data after the build: issuing would freeze a stale pack.
    await as.logger!.post(`${holeUrl()}/structures`, {
      depth: 60,
      type: 'vein',
      alpha: 70,
      beta: 20,
    })
    const stale = await as.lead!.post(`${url()}/${pack.id}/issue`)
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('pack_stale')
    expect((await as.engineer!.delete(`${url()}/${pack.id}`)).status).toBe(403)
    expect((await as.lead!.delete(`${url()}/${pack.id}`)).status).toBe(204)
    expect((await as.lead!.get(`${url()}/${pack.id}`)).status).toBe(404)
    expect((await as.lead!.get(`${url()}/not-a-uuid`)).status).toBe(404)
  })
})
