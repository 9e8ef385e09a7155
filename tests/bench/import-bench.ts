/**
 * Import of 100,000 structures through the API (parse, validate, compute, insert) against
 * PostgreSQL COPY of the same rows in the same run. Prints figures and the ratio; exits 0.
 * Needs BENCH_DATABASE_URL (npm run bench makes a throwaway one).
 */
import request from 'supertest'
import { Readable } from 'node:stream'
import { pipeline } from 'node:stream/promises'
import { from as copyFrom } from 'pg-copy-streams'
import { sql } from 'drizzle-orm'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { runMigrations } from '../../backend/src/db/migrate'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { hashPassword } from '../../backend/src/auth/passport'
import { holes, memberships, projects, surveyStations, users } from '../../schema/index'

const N = 100_000
const url = process.env.BENCH_DATABASE_URL
if (!url) throw new Error('BENCH_DATABASE_URL is not set: run through `npm run bench`.')
const { db, pool } = createDb(url, 4)
await runMigrations(db)
await db.execute(sql`truncate users, projects restart identity cascade`)
const [user] = await db
  .insert(users)
  .values({
    email: 'bench@bench.test',
    name: 'bench',
    passwordHash: await hashPassword('bench-password'),
  })
  .returning()
const [project] = await db
  .insert(projects)
  .values({ code: 'BEN', name: 'Bench', crsEpsg: 32630 })
  .returning()
await db.insert(memberships).values({ projectId: project.id, userId: user.id, role: 'logger' })
const [hole] = await db
  .insert(holes)
  .values({
    projectId: project.id,
    name: 'BEN-01',
    collarEast: 0,
    collarNorth: 0,
    collarElevation: 0,
    plannedAzimuth: 10,
    plannedPlunge: 60,
    finalDepth: 1100,
  })
  .returning()
await db.insert(surveyStations).values(
  Array.from({ length: 12 }, (_, i) => ({
    holeId: hole.id,
    depth: i * 100,
    azimuth: 10 + i,
    azimuthEntered: 10 + i,
    plunge: 60 - i,
  })),
)

const lines = ['depth,type,alpha,beta,jrc,comment']
for (let i = 0; i < N; i++)
  lines.push(`${(i * 0.01).toFixed(2)},joint,${10 + (i % 80)},${(i * 37) % 360},${i % 20},row ${i}`)
const csv = Buffer.from(lines.join('\n'))

const env = loadEnv({
  ...process.env,
  NODE_ENV: 'test',
  LOG_LEVEL: 'silent',
  UPLOAD_LIMIT_MB: '100',
})
const log = createLogger('silent')
const app = createApp({ db, pool, env, logger: log, mail: createMailer(env, log) })
const agent = request.agent(app)
let csrf = (await agent.get('/api/auth/csrf')).body.data.csrfToken
csrf = (
  await agent
    .post('/api/auth/login')
    .set('X-CSRF-Token', csrf)
    .send({ email: 'bench@bench.test', password: 'bench-password' })
).body.data.csrfToken
const base = `/api/projects/${project.id}/holes/${hole.id}/imports`

const t0 = performance.now()
const preview = await agent
  .post(base)
  .set('X-CSRF-Token', csrf)
  .field('kind', 'structures')
  .attach('file', csv, 'bench.csv')
const t1 = performance.now()
if (preview.status !== 201)
  throw new Error(`preview ${preview.status}: ${JSON.stringify(preview.body).slice(0, 300)}`)
const commit = await agent
  .post(`${base}/${preview.body.data.importId}/commit`)
  .set('X-CSRF-Token', csrf)
const t2 = performance.now()
if (commit.status !== 200) throw new Error(`commit ${commit.status}`)

// Baseline: COPY of the same rows, every column the import writes, into the same table.
const cols =
  'hole_id, depth, type, source, alpha, beta, gamma, reference_line, input_dip, input_dip_direction, dip, dip_direction, ' +
  'pole_trend, pole_plunge, hole_trend, hole_plunge, east, north, elevation, terzaghi_weight, declination_applied, ' +
  'survey_revision, flags, roughness, jrc, aperture_mm, infill_type, infill_thickness_mm, persistence, wall_weathering, ' +
  'state, confidence, comment, import_id, created_by, updated_by'
const { rows } = await pool.query(`select ${cols} from structures order by id`)
const text = rows
  .map((r) =>
    Object.values(r)
      .map((v) => (v === null ? '\\N' : Array.isArray(v) ? `{${v.join(',')}}` : String(v)))
      .join('\t'),
  )
  .join('\n')
await pool.query('truncate structures cascade')
const client = await pool.connect()
const c0 = performance.now()
await client.query('begin')
await pipeline(
  Readable.from([text]),
  client.query(copyFrom(`copy structures (${cols}) from stdin`)),
)
await client.query('commit')
const c1 = performance.now()
client.release()

const api = t2 - t0
const copy = c1 - c0
console.log(
  `\nImport of ${N.toLocaleString('en')} structures (${(csv.length / 1e6).toFixed(1)} MB CSV)`,
)
console.log(`  upload + preview (parse, validate, compute)  ${(t1 - t0).toFixed(0)} ms`)
console.log(`  commit (parse, validate, compute, COPY)      ${(t2 - t1).toFixed(0)} ms`)
console.log(
  `  whole import through the API                ${api.toFixed(0)} ms  (${((N / api) * 1000).toFixed(0)} rows/s)`,
)
console.log(`  baseline: COPY of the same rows              ${copy.toFixed(0)} ms`)
console.log(
  `  ratio API / COPY                             ${(api / copy).toFixed(2)}x   (target ≤ 2x)`,
)
console.log(`  ratio commit alone / COPY                    ${((t2 - t1) / copy).toFixed(2)}x`)
await pool.end()
