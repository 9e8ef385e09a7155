import { afterAll, beforeAll, expect, inject } from 'vitest'
import { holeAt, planeToCore } from '../../orient/index'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { startJobQueue, type JobQueue } from '../../backend/src/jobs/queue'
import { packBuildJob } from '../../backend/src/jobs/handlers'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'

/**
 * The design-pack tests' world: the app with a pack-build worker, a client per role, a hole with a
 * survey, two runs, and two intervals entered as core angles: `upper` (six joints in two cone sets
 * and a fault, the demo face, Terzaghi weighting) and `lower` (nine joints in three cone sets,
 * unweighted, its own face and limits). Both are checked by the engineer and approved by the lead,
 * unless `draft` leaves `lower` a draft. Registers its own beforeAll/afterAll.
 */
export function packSuite(options: { draft?: boolean } = {}) {
  const ctx = {
    fx: undefined as unknown as Fixture,
    app: undefined as unknown as ReturnType<typeof createApp>,
    as: {} as Partial<Record<string, Client>>,
    intervalId: 0,
    lowerId: 0,
  }
  let jobs: JobQueue
  let close: () => Promise<unknown>
  const url = () => `/api/projects/${ctx.fx.projectId}/packs`
  const holeUrl = () => `/api/projects/${ctx.fx.projectId}/holes/${ctx.fx.holeId}`
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
  const lowerPlanes = [
    { dip: 35, dipDirection: 230 },
    { dip: 38, dipDirection: 236 },
    { dip: 33, dipDirection: 225 },
    { dip: 70, dipDirection: 320 },
    { dip: 73, dipDirection: 326 },
    { dip: 67, dipDirection: 315 },
    { dip: 60, dipDirection: 60 },
    { dip: 63, dipDirection: 66 },
    { dip: 57, dipDirection: 55 },
  ]

  async function waitFor(client: Client, id: string) {
    let pack = (await client.get(`${url()}/${id}`)).body.data
    for (let i = 0; i < 150 && !['ready', 'failed', 'issued'].includes(pack.status); i++) {
      await new Promise((r) => setTimeout(r, 200))
      pack = (await client.get(`${url()}/${id}`)).body.data
    }
    return pack
  }
  /** Engineer checks, lead approves (four eyes: two people). */
  async function approve(intervalId: number) {
    const url = `${holeUrl()}/intervals/${intervalId}`
    const { version } = (await ctx.as.engineer!.get(url)).body.data
    const checked = await ctx.as.engineer!.post(`${url}/check`, { version })
    expect(checked.status).toBe(200)
    const approved = await ctx.as.lead!.post(`${url}/approve`, {
      version: checked.body.data.version,
    })
    expect(approved.status).toBe(200)
  }
  async function fileText(client: Client, id: string, name: string): Promise<Buffer> {
    const res = await client.get(`${url()}/${id}/files/${name}`).buffer(true)
    expect(res.status).toBe(200)
    // supertest keeps text types as res.text (decoded as UTF-8) and binary ones as a Buffer body.
    return Buffer.isBuffer(res.body) ? res.body : Buffer.from(res.text, 'utf8')
  }

  beforeAll(async () => {
    ctx.fx = await createFixture()
    const { db, pool } = createDb(inject('databaseUrl'), 4)
    const log = createLogger('silent')
    jobs = await startJobQueue(inject('databaseUrl'), { 'pack-build': packBuildJob(db, log) }, log)
    const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' })
    ctx.app = createApp({ db, pool, env, logger: log, jobs, mail: createMailer(env, log) })
    close = () => jobs.stop().then(() => pool.end())
    for (const who of ['lead', 'engineer', 'logger', 'viewer', 'outsider', 'anonymous'] as const)
      ctx.as[who] = await clientFor(ctx.app, who)
    const logger = ctx.as.logger!
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
    await logger.post(`${holeUrl()}/structures`, {
      depth: 30.5,
      type: 'fault',
      alpha: 40,
      beta: 100,
    })
    depth = 46
    for (const plane of lowerPlanes) {
      const core = planeToCore(plane, holeAt(stations, depth)!)!
      await logger.post(`${holeUrl()}/structures`, {
        depth,
        type: 'joint',
        alpha: core.alpha,
        beta: core.beta,
      })
      depth += 2
    }
    const engineer = ctx.as.engineer!
    const created = await engineer.post(`${holeUrl()}/intervals`, {
      name: 'upper',
      fromDepth: 5,
      toDepth: 40,
      faceDip: 70,
      faceDipDirection: 190,
      frictionDeg: 30,
    })
    ctx.intervalId = created.body.data.id
    const sets = `${holeUrl()}/intervals/${ctx.intervalId}/sets`
    await engineer.post(sets, { name: 'J1', centreTrend: 10, centrePlunge: 40, coneAngle: 20 })
    await engineer.post(sets, { name: 'J2', centreTrend: 280, centrePlunge: 10, coneAngle: 20 })
    const lower = await engineer.post(`${holeUrl()}/intervals`, {
      name: 'lower',
      fromDepth: 40,
      toDepth: 80,
      faceDip: 65,
      faceDipDirection: 230,
      frictionDeg: 28,
      weighting: 'none',
      contourMethod: 'exponential',
      lateralLimitDeg: 25,
      topplingLimitDeg: 35,
    })
    expect(lower.status).toBe(201)
    ctx.lowerId = lower.body.data.id
    const lowerSets = `${holeUrl()}/intervals/${ctx.lowerId}/sets`
    for (const [name, centreTrend, centrePlunge] of [
      ['L1', 50, 55],
      ['L2', 140, 20],
      ['L3', 240, 30],
    ] as const)
      await engineer.post(lowerSets, { name, centreTrend, centrePlunge, coneAngle: 20 })
    await approve(ctx.intervalId)
    if (!options.draft) await approve(ctx.lowerId)
  })
  afterAll(async () => {
    await close()
    await ctx.fx.close()
  })
  return { ctx, url, holeUrl, waitFor, fileText, approve, planes, lowerPlanes, stations }
}
