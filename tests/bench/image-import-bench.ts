/**
 * Televiewer images: a 300 m amplitude strip (150,000 rows × 360 samples, 2 mm rows, 8-bit grey
 * PNG of a synthetic wall with 300 planted traces) uploaded through the real route — tiled by the
 * 'image-tiling' job (202 → ready) and, without a queue, in the request (201) — then every
 * level-0 tile served through the real route over HTTP. Baselines from the same run: sharp
 * decoding the file alone (the floor for any import), and the same tile bytes read with one
 * plain SELECT (the floor for serving). Prints peak memory; leaves no rows behind.
 * Needs BENCH_DATABASE_URL (npm run bench makes a throwaway one).
 */
import type { AddressInfo } from 'node:net'
import http from 'node:http'
import { randomUUID } from 'node:crypto'
import sharp from 'sharp'
import { and, eq } from 'drizzle-orm'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { runMigrations } from '../../backend/src/db/migrate'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { hashPassword } from '../../backend/src/auth/passport'
import { startJobQueue } from '../../backend/src/jobs/queue'
import { imageTilingJob } from '../../backend/src/jobs/handlers'
import { holes, images, imageTiles, memberships, projects, users } from '../../schema/index'
import { mulberry32, renderWallRows, type PlantedTrace } from '../../orient/index'

const WIDTH = 360
const ROWS = 150_000
const TOP = 20
const STEP = 0.002
const url = process.env.BENCH_DATABASE_URL
if (!url) throw new Error('BENCH_DATABASE_URL is not set: run through `npm run bench`.')

const peak = { rss: 0 }
const sampler = setInterval(() => (peak.rss = Math.max(peak.rss, process.memoryUsage().rss)), 10)
const mb = (bytes: number) => `${(bytes / 1024 / 1024).toFixed(1)} MB`
const ms = (t: number) => `${t.toFixed(0)} ms`
const time = async <T>(fn: () => T | Promise<T>): Promise<[T, number]> => {
  const t0 = performance.now()
  const out = await fn()
  return [out, performance.now() - t0]
}

/** The wall, rendered in chunks (every sample depends on its row and column alone). */
function wall(): Uint8Array {
  const r = mulberry32(20260301)
  const traces: PlantedTrace[] = Array.from({ length: 300 }, () => ({
    depth: TOP + r() * ROWS * STEP,
    height: 0.02 + r() * 0.3,
    troughAzimuth: r() * 360,
  }))
  const o = { width: WIDTH, rows: ROWS, topDepth: TOP, rowStep: STEP, traces, seed: 7 }
  const out = new Uint8Array(WIDTH * ROWS)
  for (let from = 0; from < ROWS; from += 10_000) {
    const grey = renderWallRows(o, from, Math.min(ROWS, from + 10_000))
    for (let i = 0; i < grey.length; i++) out[from * WIDTH + i] = Math.round(255 * grey[i])
  }
  return out
}

const [samples, tRender] = await time(wall)
const [png, tEncode] = await time(() =>
  sharp(samples, { raw: { width: WIDTH, height: ROWS, channels: 1 }, limitInputPixels: false })
    .toColourspace('b-w')
    .png()
    .toBuffer(),
)
console.log(
  `image: ${ROWS} rows × ${WIDTH} (${(ROWS * STEP).toFixed(0)} m at ${STEP * 1000} mm), PNG ${mb(png.length)}; rendered in ${ms(tRender)}, encoded in ${ms(tEncode)}`,
)
const decodes: number[] = []
for (let k = 0; k < 3; k++)
  decodes.push(
    (
      await time(() => sharp(png, { limitInputPixels: false }).extractChannel(0).raw().toBuffer())
    )[1],
  )
const decode = [...decodes].sort((a, b) => a - b)[1]
console.log(`baseline, sharp decode alone (median of 3): ${ms(decode)}`)

const { db, pool } = createDb(url, 6)
await runMigrations(db)
const tag = randomUUID().slice(0, 8)
const [user] = await db
  .insert(users)
  .values({
    email: `img-${tag}@bench.test`,
    name: 'Image bench',
    passwordHash: await hashPassword('bench-password'),
  })
  .returning()
const [project] = await db
  .insert(projects)
  .values({ code: `IB${tag.slice(0, 6).toUpperCase()}`, name: 'Image bench', crsEpsg: 32630 })
  .returning()
await db.insert(memberships).values({ projectId: project.id, userId: user.id, role: 'logger' })
const [hole] = await db
  .insert(holes)
  .values({
    projectId: project.id,
    name: 'GSQ-BH02',
    collarEast: 0,
    collarNorth: 0,
    collarElevation: 0,
    plannedAzimuth: 0,
    plannedPlunge: 70,
    finalDepth: 400,
  })
  .returning()

const log = createLogger('silent')
const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent', DATABASE_URL: url })
const jobs = await startJobQueue(url, { 'image-tiling': imageTilingJob(db, log) }, log)

/** A listening server for one app, and a signed-in caller of it (cookie + CSRF token). */
async function serve(withQueue: boolean) {
  const app = createApp({
    db,
    pool,
    env,
    logger: log,
    mail: createMailer(env, log),
    ...(withQueue ? { jobs } : {}),
  })
  const server = app.listen(0, '127.0.0.1')
  await new Promise((r) => server.once('listening', r))
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  let cookie = ''
  const call = async (path: string, init: RequestInit = {}) => {
    const res = await fetch(base + path, { ...init, headers: { cookie, ...(init.headers ?? {}) } })
    const set = res.headers.getSetCookie().map((c) => c.split(';')[0])
    if (set.length) cookie = set.join('; ')
    return res
  }
  let csrf = ((await (await call('/api/auth/csrf')).json()) as { data: { csrfToken: string } }).data
    .csrfToken
  const login = await call('/api/auth/login', {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': csrf },
    body: JSON.stringify({ email: user.email, password: 'bench-password' }),
  })
  csrf = ((await login.json()) as { data: { csrfToken: string } }).data.csrfToken
  const upload = (name: string) => {
    const form = new FormData()
    for (const [k, v] of Object.entries({
      topDepth: TOP,
      bottomDepth: TOP + ROWS * STEP,
      northReference: 'true',
      confirmDuplicate: true,
    }))
      form.append(k, String(v))
    form.append('file', new Blob([png]), name)
    return call(`/api/projects/${project.id}/holes/${hole.id}/images`, {
      method: 'POST',
      headers: { 'x-csrf-token': csrf },
      body: form,
    })
  }
  return { server, base, cookie: () => cookie, call, upload }
}

/** Kept-alive connections, as a browser holds them. */
const agent = new http.Agent({ keepAlive: true, maxSockets: 8 })
/** One GET over plain node:http: the body as sent (fetch would inflate it). */
function rawGet(base: string, path: string, cookie: string): Promise<number> {
  return new Promise((resolve, reject) => {
    http
      .get(base + path, { headers: { cookie }, agent }, (res) => {
        let n = 0
        res.on('data', (c: Buffer) => (n += c.length))
        res.on('end', () =>
          res.statusCode === 200 ? resolve(n) : reject(new Error(`${res.statusCode}`)),
        )
      })
      .on('error', reject)
  })
}

try {
  // 1. the job path: 202 at once, then the worker tiles it
  const queued = await serve(true)
  const t0 = performance.now()
  const res = await queued.upload('gsq-bh02-amp-300m.png')
  const tAnswer = performance.now() - t0
  const body = (await res.json()) as { data: { id: number; status: string } }
  if (res.status !== 202)
    throw new Error(`expected 202, got ${res.status}: ${JSON.stringify(body)}`)
  let status = 'processing'
  while (status === 'processing') {
    await new Promise((r) => setTimeout(r, 50))
    status = (
      await db.select({ s: images.status }).from(images).where(eq(images.id, body.data.id))
    )[0].s
  }
  const tReady = performance.now() - t0
  if (status !== 'ready') throw new Error(`image ${status}`)
  console.log(
    `route + job: 202 after ${ms(tAnswer)} (checks, file stored); ready after ${ms(tReady)} = ${(tReady / decode).toFixed(1)} × the decode alone`,
  )
  // 2. without a queue the same upload is tiled in the request
  const inline = await serve(false)
  const [res2, tInline] = await time(() => inline.upload('gsq-bh02-amp-300m-inline.png'))
  if (res2.status !== 201) throw new Error(`expected 201, got ${res2.status}`)
  console.log(
    `route, tiled in the request: 201 after ${ms(tInline)} = ${(tInline / decode).toFixed(1)} × the decode alone`,
  )

  // 3. serving: every level-0 tile through the route, one after another and 8 at a time
  const id = body.data.id
  const tiles = Math.ceil(ROWS / 256)
  const path = (t: number) =>
    `/api/projects/${project.id}/holes/${hole.id}/images/${id}/tiles/0/${t}`
  let bytes = 0
  const [, tSerial] = await time(async () => {
    for (let t = 0; t < tiles; t++) bytes += await rawGet(queued.base, path(t), queued.cookie())
  })
  const [, tParallel] = await time(async () => {
    let next = 0
    await Promise.all(
      Array.from({ length: 8 }, async () => {
        while (next < tiles) await rawGet(queued.base, path(next++), queued.cookie())
      }),
    )
  })
  // the app's own floor: any signed-in request (session, project and hole checks), here GET H
  const holePath = `/api/projects/${project.id}/holes/${hole.id}`
  const [, tFloor] = await time(async () => {
    for (let t = 0; t < tiles; t++) await rawGet(queued.base, holePath, queued.cookie())
  })
  const [rows, tSelect] = await time(() =>
    db
      .select({ bytes: imageTiles.bytes })
      .from(imageTiles)
      .where(and(eq(imageTiles.imageId, id), eq(imageTiles.level, 0))),
  )
  const selectBytes = rows.reduce((n, r) => n + r.bytes.length, 0)
  if (selectBytes !== bytes) throw new Error(`served ${bytes} bytes, stored ${selectBytes}`)
  const rate = (n: number, t: number) =>
    `${((n * 1000) / t).toFixed(0)} tiles/s, ${mb((bytes * 1000) / t)}/s`
  console.log(`tiles: ${tiles} at level 0, ${mb(bytes)} deflated (raw ${mb(ROWS * WIDTH)})`)
  console.log(`  route, one at a time: ${ms(tSerial)} — ${rate(tiles, tSerial)}`)
  console.log(`  route, 8 at a time:   ${ms(tParallel)} — ${rate(tiles, tParallel)}`)
  console.log(
    `  baseline, one plain SELECT of the same bytes: ${ms(tSelect)}; route one at a time = ${(tSerial / tSelect).toFixed(1)} ×, 8 at a time = ${(tParallel / tSelect).toFixed(1)} ×`,
  )
  console.log(
    `  baseline, ${tiles} × GET H (the app's per-request floor, no tile): ${ms(tFloor)}; tiles one at a time = ${(tSerial / tFloor).toFixed(2)} × that`,
  )
  queued.server.close()
  inline.server.close()
} finally {
  agent.destroy()
  await jobs.stop()
  await db.delete(projects).where(eq(projects.id, project.id))
  await db.delete(users).where(eq(users.id, user.id))
  await pool.end()
  clearInterval(sampler)
  console.log(`peak RSS ${mb(peak.rss)}`)
}
