/**
 * LAS import: a generated 100,000-sample log (index + 8 curves). Times our reader against
 * las-js 3.4.2 (in a child process with a timeout, as its title pattern can backtrack for
 * minutes), the upload + commit through the API, and the storage choice (one row per curve with
 * float8[] arrays against one row per sample) in scratch tables. Prints peak memory; exits 0.
 * Needs BENCH_DATABASE_URL (npm run bench makes a throwaway one); leaves no rows behind.
 */
import request from 'supertest'
import type pg from 'pg'
import { from as copyFrom } from 'pg-copy-streams'
import { spawnSync } from 'node:child_process'
import { Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { runMigrations } from '../../backend/src/db/migrate'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { hashPassword } from '../../backend/src/auth/passport'
import { float8ArrayLiteral, readLas, type LasFile } from '../../backend/src/imports/las/index'
import { holes, memberships, projects, users } from '../../schema/index'

const SAMPLES = 100_000
const CURVES = ['GR', 'DEN', 'RES', 'CAL', 'SP', 'TEMP', 'VELP', 'NPHI']
const url = process.env.BENCH_DATABASE_URL
if (!url) throw new Error('BENCH_DATABASE_URL is not set: run through `npm run bench`.')

// peak memory, sampled through the whole run
const peak = { rss: 0, heapUsed: 0 }
const sample = () => {
  const m = process.memoryUsage()
  peak.rss = Math.max(peak.rss, m.rss)
  peak.heapUsed = Math.max(peak.heapUsed, m.heapUsed)
}
const sampler = setInterval(sample, 10)
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(0)} MB`
const ms = (t: number) => `${t.toFixed(0)} ms`
const time = async <T>(fn: () => T | Promise<T>): Promise<[T, number]> => {
  const t0 = performance.now()
  const out = await fn()
  return [out, performance.now() - t0]
}

/** Greyscar Quarry style log: 0.01 m steps from 20 m, one sample in 500 NULL on each curve. */
function generateLas(): string {
  const head = [
    '~Version Information',
    ' VERS.   2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0',
    ' WRAP.   NO  : ONE LINE PER DEPTH STEP',
    '~Well Information',
    ' STRT.M   20.00 : START DEPTH',
    ` STOP.M   ${(20 + (SAMPLES - 1) * 0.01).toFixed(2)} : STOP DEPTH`,
    ' STEP.M    0.01 : STEP',
    ' NULL.  -999.25 : NULL VALUE',
    ' WELL.  GSQ-BH12 : WELL',
    '~Curve Information',
    ' DEPT.M   : DEPTH',
    ...CURVES.map((c) => ` ${c}.U   : ${c}`),
    '~Parameter Information',
    ' BS  .MM   96.0 : BIT SIZE',
    '~A',
  ]
  const lines = new Array<string>(SAMPLES)
  for (let i = 0; i < SAMPLES; i++) {
    const row = [(20 + i * 0.01).toFixed(2)]
    for (let c = 0; c < CURVES.length; c++) {
      row.push((i + c) % 500 === 0 ? '-999.25' : (50 + 40 * Math.sin(i / (50 + c))).toFixed(4))
    }
    lines[i] = row.join(' ')
  }
  return `${head.join('\n')}\n${lines.join('\n')}\n`
}

interface LasJsRun {
  /** Whole run (read: all five accessors; title: header()). */
  ms?: number
  headerAndData?: number
  outcome: string
}

/** las-js in a child process, killed after `timeoutMs` so a runaway pattern cannot stall us. */
function lasJs(text: string, what: 'read' | 'title', timeoutMs: number): LasJsRun {
  const script = `
    const { Las } = require('las-js')
    let text = ''
    process.stdin.on('data', (c) => (text += c)).on('end', async () => {
      const las = new Las(text, { loadFile: false })
      const t0 = performance.now()
      const done = (outcome, headerAndData) =>
        process.stdout.write(JSON.stringify({ ms: performance.now() - t0, headerAndData, outcome }))
      if (${JSON.stringify(what)} === 'title')
        return las.header().then(() => done('read'), (e) => done('threw ' + String(e).slice(0, 60)))
      const h = await las.header(), d = await las.data()
      const t1 = performance.now() - t0
      await las.wellParams(); await las.curveParams(); await las.logParams()
      done(d.length + ' rows x ' + h.length + ' columns', t1)
    })`
  const child = spawnSync(process.execPath, ['-e', script], {
    input: text,
    timeout: timeoutMs,
    killSignal: 'SIGKILL',
    maxBuffer: 1 << 20,
  })
  if (child.signal) return { outcome: `killed after ${timeoutMs / 1000} s` }
  if (child.status !== 0) return { outcome: `failed: ${child.stderr.toString().slice(0, 200)}` }
  return JSON.parse(child.stdout.toString()) as LasJsRun
}

/**
 * The same curves stored both ways in scratch (temporary) tables on one connection: one row per
 * curve with float8[] arrays (our schema; also with TOAST compression off), and one row per sample
 * keyed (curve, depth), written by multi-row INSERT and by COPY. Read back whole, and one curve.
 */
async function compareStorage(pool: pg.Pool, las: LasFile): Promise<string[]> {
  const client = await pool.connect()
  const q = (text: string, params?: unknown[]) => client.query(text, params)
  const depths = Array.from(las.curves[0].values)
  const curves = las.curves
    .slice(1)
    .map((c) => Array.from(c.values, (v) => (Number.isNaN(v) ? null : v)))
  const out = [`storage, ${curves.length} curves × ${depths.length} samples:`]
  const size = async (table: string) =>
    mb(Number((await q(`select pg_total_relation_size('${table}') as s`)).rows[0].s))
  try {
    for (const storage of ['extended', 'external']) {
      const table = `bench_curve_arrays_${storage}`
      await q(`create temp table ${table} (id serial primary key, depths float8[], vals float8[])`)
      await q(
        `alter table ${table} alter depths set storage ${storage}, alter vals set storage ${storage}`,
      )
      const [, write] = await time(async () => {
        await q('begin')
        const depthText = float8ArrayLiteral(depths)
        for (const values of curves) {
          const sql = `insert into ${table} (depths, vals) values ($1::float8[], $2::float8[])`
          await q(sql, [depthText, float8ArrayLiteral(values)])
        }
        await q('commit')
      })
      const [, read] = await time(() => q(`select depths, vals from ${table} order by id`))
      const [, one] = await time(() => q(`select depths, vals from ${table} where id = 4`))
      out.push(
        `  arrays, storage ${storage}: write ${ms(write)}, read all ${ms(read)}, one curve ${ms(one)}, ${await size(table)}`,
      )
    }
    const table = 'bench_curve_samples'
    await q(
      `create temp table ${table} (curve smallint, depth float8, val float8, primary key (curve, depth))`,
    )
    const [, insert] = await time(async () => {
      await q('begin')
      const batch = 5000
      for (const [k, values] of curves.entries()) {
        for (let a = 0; a < depths.length; a += batch) {
          const params: (number | null)[] = []
          const tuples: string[] = []
          for (let i = a; i < Math.min(a + batch, depths.length); i++) {
            tuples.push(`($${params.length + 1}, $${params.length + 2}, $${params.length + 3})`)
            params.push(k, depths[i], values[i])
          }
          await q(`insert into ${table} (curve, depth, val) values ${tuples.join(',')}`, params)
        }
      }
      await q('commit')
    })
    await q(`truncate ${table}`)
    const [, copy] = await time(async () => {
      // lines batched into ~64 kB chunks: one write per line would measure the stream, not COPY
      function* chunks() {
        let chunk = ''
        for (const [k, values] of curves.entries()) {
          for (let i = 0; i < depths.length; i++) {
            chunk += `${k}\t${depths[i]}\t${values[i] ?? '\\N'}\n`
            if (chunk.length > 65_536) {
              yield chunk
              chunk = ''
            }
          }
        }
        yield chunk
      }
      const sink = client.query(copyFrom(`copy ${table} (curve, depth, val) from stdin`))
      await pipeline(Readable.from(chunks()), sink)
    })
    const [, read] = await time(() => q(`select curve, depth, val from ${table} order by 1, 2`))
    const [, one] = await time(() =>
      q(`select depth, val from ${table} where curve = 3 order by 1`),
    )
    out.push(
      `  rows: write INSERT ${ms(insert)} / COPY ${ms(copy)}, read all ${ms(read)}, one curve ${ms(one)}, ${await size(table)}`,
    )
  } finally {
    client.release()
  }
  return out
}

const text = generateLas()
console.log(`LAS file: ${SAMPLES} samples × ${CURVES.length} curves + index, ${mb(text.length)}`)

// 1. reader against las-js on the same file
const parses: number[] = []
for (let k = 0; k < 5; k++) parses.push((await time(() => readLas(Buffer.from(text))))[1])
const warm = [...parses].sort((a, b) => a - b)[2]
console.log(`readLas: first ${ms(parses[0])}, median of 5 ${ms(warm)}`)
const theirs = lasJs(text, 'read', 120_000)
const lasJsMs = theirs.headerAndData ?? NaN
console.log(
  `las-js 3.4.2 (child process): header()+data() ${ms(lasJsMs)}, with the three param ` +
    `accessors ${ms(theirs.ms ?? NaN)} (${theirs.outcome}); ratio to readLas median ${(lasJsMs / warm).toFixed(1)}×`,
)

// 2. hostile section titles: ours in-process, las-js in a child with a 20 s timeout
const body = '\n DEPT.M : D\n GR.GAPI : G\n~Parameter\n BS.MM 96 : B\n~A\n1 2\n'
const titles: [string, string][] = [
  ["'~Curve Information ' + '-'.repeat(40) + '('", `~Curve Information ${'-'.repeat(40)}(`],
  ["'~Curve Information Information -('", '~Curve Information Information -('],
  ["'~Curve' + ' Information'.repeat(3) + ' -('", `~Curve${' Information'.repeat(3)} -(`],
  ["'~Curve_' + 'x'.repeat(24) + '-('", `~Curve_${'x'.repeat(24)}-(`],
]
for (const [label, title] of titles) {
  const file = `~Version\n VERS. 2.0 : V\n WRAP. NO : W\n~Well\n NULL. -999.25 : N\n${title}${body}`
  const [, ours] = await time(() => readLas(file))
  const run = lasJs(file, 'title', 20_000)
  const theirsMs = run.ms === undefined ? '' : `${ms(run.ms)}, `
  console.log(`title ${label}: readLas ${ours.toFixed(2)} ms; las-js ${theirsMs}${run.outcome}`)
}

// 3. the full import through the API: upload (parse + store file) and commit (curves)
const { db, pool } = createDb(url, 4)
await runMigrations(db)
const tag = randomUUID().slice(0, 8)
const [user] = await db
  .insert(users)
  .values({
    email: `las-${tag}@bench.test`,
    name: 'LAS bench',
    passwordHash: await hashPassword('bench-password'),
  })
  .returning()
const [project] = await db
  .insert(projects)
  .values({ code: `LB${tag.slice(0, 6).toUpperCase()}`, name: 'LAS bench', crsEpsg: 32630 })
  .returning()
await db.insert(memberships).values({ projectId: project.id, userId: user.id, role: 'logger' })
const [hole] = await db
  .insert(holes)
  .values({
    projectId: project.id,
    name: 'GSQ-BH12',
    collarEast: 0,
    collarNorth: 0,
    collarElevation: 0,
    plannedAzimuth: 0,
    plannedPlunge: 60,
    finalDepth: 1100,
  })
  .returning()
try {
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: url })
  const log = createLogger('silent')
  const app = createApp({ db, pool, env, logger: log, mail: createMailer(env, log) })
  const agent = request.agent(app)
  let csrf = (await agent.get('/api/auth/csrf')).body.data.csrfToken as string
  const login = await agent
    .post('/api/auth/login')
    .set('X-CSRF-Token', csrf)
    .send({ email: user.email, password: 'bench-password' })
  csrf = login.body.data.csrfToken
  const base = `/api/projects/${project.id}/holes/${hole.id}/logs`
  const [upload, tUpload] = await time(() =>
    agent.post(base).set('X-CSRF-Token', csrf).attach('file', Buffer.from(text), 'gsq-bh12.las'),
  )
  if (upload.status !== 201)
    throw new Error(`upload ${upload.status}: ${JSON.stringify(upload.body)}`)
  const commitUrl = `${base}/imports/${upload.body.data.importId}/commit`
  const [commit, tCommit] = await time(() =>
    agent.post(commitUrl).set('X-CSRF-Token', csrf).send({}),
  )
  if (commit.status !== 200)
    throw new Error(`commit ${commit.status}: ${JSON.stringify(commit.body)}`)
  const [curve, tRead] = await time(() => agent.get(`${base}/${commit.body.data.curves[0].id}`))
  console.log(
    `API: upload + preview ${ms(tUpload)}, commit ${ms(tCommit)} (${commit.body.data.curves.length} curves), ` +
      `total ${ms(tUpload + tCommit)}; GET one curve ${ms(tRead)} (${curve.body.data.values.length} samples)`,
  )
  const share = ((lasJsMs / (tUpload + tCommit)) * 100).toFixed(0)
  console.log(
    `import throughput ${((SAMPLES / (tUpload + tCommit)) * 1000).toFixed(0)} samples/s; ` +
      `las-js header()+data() alone would take ${share} % of the whole import's time`,
  )

  // 4. storage: arrays per curve against one row per sample
  for (const line of await compareStorage(pool, readLas(text))) console.log(line)
} finally {
  await db.delete(projects).where(eq(projects.id, project.id))
  await db.delete(users).where(eq(users.id, user.id))
  await pool.end()
}
clearInterval(sampler)
sample()
console.log(`peak memory of this process: rss ${mb(peak.rss)}, heapUsed ${mb(peak.heapUsed)}`)
process.exit(0)
