import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { inject } from 'vitest'
import { eq } from 'drizzle-orm'
import Papa from 'papaparse'
import { holeAt, planeToCore } from '../../orient/index'
import { intervals, projects, structures } from '../../schema/index'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { startJobQueue, type JobQueue } from '../../backend/src/jobs/queue'
import { packBuildJob } from '../../backend/src/jobs/handlers'
import { analyseInterval } from '../../backend/src/services/analysis'
import { validateAgs } from '../../backend/src/exports/ags4-validate'
import { loadPackData, PACK_ANALYSIS } from '../../backend/src/exports/pack-data'
import { buildReport } from '../../backend/src/exports/pdf-report'
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
async function fileText(client: Client, id: string, name: string): Promise<Buffer> {
  const res = await client.get(`${url()}/${id}/files/${name}`).buffer(true)
  expect(res.status).toBe(200)
  // supertest keeps text types as res.text and binary ones as a Buffer body.
  return Buffer.isBuffer(res.body) ? res.body : Buffer.from(res.text, 'latin1')
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

describe('POST /api/projects/:projectId/packs', () => {
  it('POST /packs → 401 signed out, 404 non-member, 403 viewer/logger/engineer, 400 foreign ids', async () => {
    expect((await as.anonymous!.post(url(), {})).status).toBe(401)
    expect((await as.outsider!.post(url(), {})).status).toBe(404)
    for (const who of ['viewer', 'logger', 'engineer'])
      expect((await as[who]!.post(url(), {})).status).toBe(403)
    const bad = await as.lead!.post(url(), { intervalIds: [999999] })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.intervalIds')
    expect((await as.lead!.post(url(), { holeIds: ['x'] })).status).toBe(400)
  })
})

describe('a whole-project pack', () => {
  let id = ''
  it('POST /packs {} → 202 queued, then ready through the job queue with progress 100', async () => {
    const res = await as.lead!.post(url(), {})
    expect(res.status).toBe(202)
    expect(res.body.data).toMatchObject({ status: 'queued', progress: 0 })
    id = res.body.data.id
    const pack = await waitFor(as.lead!, id)
    expect(pack).toMatchObject({ status: 'ready', progress: 100, createdByName: 'lead' })
    expect(pack.inputsHash).toMatch(/^[0-9a-f]{64}$/)
    expect(pack.files.map((f: { name: string }) => f.name)).toEqual([
      'intersections.csv',
      `net-${intervalId}.png`,
      `net-${intervalId}.svg`,
      'project.ags',
      'report.pdf',
      'sets.csv',
      'structures.csv',
    ])
    expect(pack.files.every((f: { size: number }) => f.size > 100)).toBe(true)
  })

  it('GET /packs → members list it; non-member 404; signed out 401', async () => {
    const list = await as.viewer!.get(url())
    expect(list.status).toBe(200)
    expect(list.body.data[0]).toMatchObject({ id, status: 'ready' })
    expect(list.body.data[0].files).toBeUndefined()
    expect((await as.outsider!.get(url())).status).toBe(404)
    expect((await as.anonymous!.get(url())).status).toBe(401)
  })

  it('sets.csv and intersections.csv carry analyseInterval numbers (Terzaghi-weighted)', async () => {
    const [interval] = await fx.db.select().from(intervals).where(eq(intervals.id, intervalId))
    const analysis = await analyseInterval(fx.db, interval, PACK_ANALYSIS)
    expect(analysis.sets.map((s) => s.count)).toEqual([3, 3])
    const csv = Papa.parse<Record<string, string>>(
      (await fileText(as.engineer!, id, 'sets.csv')).toString(),
      { header: true, skipEmptyLines: true },
    )
    expect(csv.data).toHaveLength(2)
    csv.data.forEach((row, i) => {
      const s = analysis.sets[i]
      expect(row).toMatchObject({
        hole: 'TST-01',
        interval: 'upper',
        set: s.name,
        count: String(s.count),
        weighting: 'terzaghi',
      })
      expect(Number(row.mean_dip_deg)).toBe(s.mean!.dip)
      expect(Number(row.mean_dip_direction_deg)).toBe(s.mean!.dipDirection)
      expect(Number(row.fisher_k)).toBe(s.kappa)
      expect(Number(row.alpha95_deg)).toBe(s.alpha95)
      expect(Number(row.weighted_count)).toBe(s.weightedCount)
      // RQD: (18 + 12) / 40 over the two runs, weighted by overlap (15 m and 20 m) → 77.1 %
      expect(row.interval_rqd_pct).toBe(((90 * 15 + 60 * 20) / 35).toFixed(1))
    })
    const x = Papa.parse<Record<string, string>>(
      (await fileText(as.engineer!, id, 'intersections.csv')).toString(),
      { header: true, skipEmptyLines: true },
    )
    expect(x.data).toEqual([
      expect.objectContaining({
        set_a: 'J1',
        set_b: 'J2',
        trend_deg: analysis.intersections[0].trend!.toFixed(2),
      }),
    ])
  })

  it('project.ags passes the validator; DISC rows carry the stored orientations', async () => {
    const ags = (await fileText(as.engineer!, id, 'project.ags')).toString('ascii')
    expect(validateAgs(ags)).toEqual([])
    expect(ags).toContain('"TRAN_AGS"')
    expect(ags).toContain('"4.1.1"')
    expect(ags).toContain('must be checked by a competent person')
    const stored = await fx.db
      .select()
      .from(structures)
      .where(eq(structures.holeId, fx.holeId))
      .orderBy(structures.depth)
    const disc = ags
      .split('\r\n\r\n')
      .find((g) => g.startsWith('"GROUP","DISC"'))!
      .split('\r\n')
      .filter((l) => l.startsWith('"DATA"'))
    expect(disc).toHaveLength(stored.length)
    const head = ags
      .split('\r\n')
      .find((l) => l.startsWith('"HEADING","LOCA_ID","DISC_TOP"'))!
      .split(',')
    disc.forEach((line, i) => {
      const f = line.split(',').map((v) => v.replace(/"/g, ''))
      expect(Number(f[head.indexOf('"DISC_DIP"')])).toBe(Number(stored[i].dip!.toFixed(2)))
      expect(Number(f[head.indexOf('"DISC_DIR"')])).toBe(Number(stored[i].dipDirection!.toFixed(2)))
      expect(Number(f[head.indexOf('"DISC_ALPH"')])).toBe(Number(stored[i].alpha!.toFixed(1)))
    })
    expect(ags).toContain('"ABBR_HDNG"')
    expect(ags).toMatch(/"DISC_TYPE","Fault","Fault"/)
  })

  it('report.pdf has a cover, an interval page and a depth view; the SVG net is drawn', async () => {
    const pdf = (await fileText(as.engineer!, id, 'report.pdf')).toString('latin1')
    expect(pdf.startsWith('%PDF-')).toBe(true)
    expect(pdf.match(/\/Type \/Page\b/g)).toHaveLength(3)
    const svg = (await fileText(as.engineer!, id, `net-${intervalId}.svg`)).toString()
    expect(svg.match(/<circle [^>]*r="2.5"/g)).toHaveLength(7)
    const png = await fileText(as.engineer!, id, `net-${intervalId}.png`)
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG')
    // IHDR width and height: the 600 x 470 SVG drawn at zoom 2
    expect([png.readUInt32BE(16), png.readUInt32BE(20)]).toEqual([1200, 940])
  })
})

describe('buildReport()', () => {
  it('buildReport() uncompressed: the set table text shows the analysed means', async () => {
    const [project] = await fx.db.select().from(projects).where(eq(projects.id, fx.projectId))
    const data = await loadPackData(fx.db, project, {})
    const pdf = await buildReport(data, {
      packId: '00000000-0000-4000-8000-000000000000',
      builtBy: 'lead',
      builtAt: new Date('2026-12-01T10:00:00Z'),
      font: 'helvetica',
      compress: false,
    })
    // Standard-font text is written as hex strings inside TJ arrays: decode and join each array.
    const text = [...pdf.toString('latin1').matchAll(/\[([^\]]*)\] TJ/g)].map((m) =>
      [...m[1].matchAll(/<([0-9a-f]*)>/g)]
        .map((h) => Buffer.from(h[1], 'hex').toString('latin1'))
        .join(''),
    )
    const mean = data.intervals[0].analysis.sets[0].mean!
    expect(text).toContain(mean.dip.toFixed(1))
    expect(text).toContain(mean.dipDirection.toFixed(1))
    expect(text).toContain('Design pack')
    expect(text.join(' ')).toContain('Kinematic screening is not a stability analysis')
    expect(text).toContain('J1 / J2')
  })
})
