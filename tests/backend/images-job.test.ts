import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { and, eq, sql } from 'drizzle-orm'
import sharp from 'sharp'
import { images, imageTiles } from '../../schema/index'
import { createApp } from '../../backend/src/app'
import { createDb } from '../../backend/src/db/client'
import { loadEnv } from '../../backend/src/env'
import { createLogger } from '../../backend/src/logger'
import { createMailer } from '../../backend/src/mail/transport'
import { startJobQueue, type JobQueue } from '../../backend/src/jobs/queue'
import { imageTilingJob } from '../../backend/src/jobs/handlers'
import { tileImage } from '../../backend/src/services/image-tiling'
import { IMAGE_INTERRUPTED, sweepInterrupted } from '../../backend/src/services/leases'
import { grey8 } from '../../testdata/images/raster-files'
import { clientFor, createFixture, type Client, type Fixture } from './fixture'
import { damagedBody, imageBytes, sharpPixels, storedLevel, uploadImage } from './images-setup'

// Images over 4 M samples go to the 'image-tiling' job through a real pg-boss queue.
let fx: Fixture
let jobs: JobQueue
let logger: Client
let close: () => Promise<unknown>
const url = () => `/api/projects/${fx.projectId}/holes/${fx.holeId}/images`
/** 360 samples × 12,000 rows (4.32 M) at 2 mm: 24 m of wall. */
const W = 360
const H = 12_000
let big: Buffer
const fields = { topDepth: 10, bottomDepth: 34, northReference: 'true', confirmDuplicate: true }

beforeAll(async () => {
  fx = await createFixture()
  const { db, pool } = createDb(inject('databaseUrl'), 4)
  const log = createLogger('silent')
  const env = loadEnv({ ...process.env, NODE_ENV: 'test', LOG_LEVEL: 'silent' })
  jobs = await startJobQueue(
    inject('databaseUrl'),
    { 'image-tiling': imageTilingJob(db, log) },
    log,
  )
  const app = createApp({ db, pool, env, logger: log, jobs, mail: createMailer(env, log) })
  logger = await clientFor(app, 'logger')
  close = () => jobs.stop().then(() => pool.end())
  big = await sharp(grey8(W, H), { raw: { width: W, height: H, channels: 1 } })
    .toColourspace('b-w')
    .png()
    .toBuffer()
}, 60_000)
afterAll(async () => {
  await close()
  await fx.close()
})

/** Polls the image until it leaves `processing`, keeping every progress figure seen. */
async function waitDone(id: number) {
  const seen: number[] = []
  for (let i = 0; i < 300; i++) {
    const [row] = await fx.db.select().from(images).where(eq(images.id, id))
    seen.push(row.progress)
    if (row.status !== 'processing') return { row, seen }
    await new Promise((r) => setTimeout(r, 20))
  }
  throw new Error('still processing')
}

describe('POST H/images (large: the image-tiling job)', () => {
  it('POST H/images 360 × 12,000 → 202 processing, then the job tiles it to ready; level 0 = the file', async () => {
    const res = await uploadImage(logger, url(), big, 'gsq-bh02-amp-24m.png', fields)
    expect(res.status, JSON.stringify(res.body)).toBe(202)
    expect(res.body.data).toMatchObject({ status: 'processing', progress: 0, width: W, height: H })
    expect(res.body.meta.images).toHaveLength(1)
    const { row, seen } = await waitDone(res.body.data.id)
    expect(row).toMatchObject({
      status: 'ready',
      progress: 100,
      levels: 7,
      attempt: null,
      leaseUntil: null,
    })
    expect(seen.every((p, i) => i === 0 || p >= seen[i - 1])).toBe(true)
    const level0 = await storedLevel(fx, row.id, 0, 8)
    expect(
      Buffer.from(level0.samples.buffer).equals(Buffer.from((await sharpPixels(big, 1, 8)).buffer)),
    ).toBe(true)
    // 12,000 → 6,000 → … → 188 rows: ⌈12000/256⌉ + ⌈6000/256⌉ + … tiles
    expect(await fx.db.$count(imageTiles, eq(imageTiles.imageId, row.id))).toBe(
      47 + 24 + 12 + 6 + 3 + 2 + 1,
    )
    const tile = await logger.get(`${url()}/${row.id}/tiles/6/0`)
    expect(tile.status).toBe(200)
    expect(tile.headers['x-tile-rows']).toBe('188')
  })

  it('a damaged body found by the job → failed with the reason, no tiles stored', async () => {
    const res = await uploadImage(logger, url(), damagedBody(big), 'damaged.png', fields)
    expect(res.status).toBe(202)
    const { row } = await waitDone(res.body.data.id)
    expect(row.status).toBe('failed')
    expect(row.message).toContain('cannot be decoded')
    expect(await fx.db.$count(imageTiles, eq(imageTiles.imageId, row.id))).toBe(0)
    const tile = await logger.get(`${url()}/${row.id}/tiles/0/0`)
    expect(tile.status).toBe(409)
    expect(tile.body.error.code).toBe('image_failed')
    // a failed image is no duplicate: the file can be uploaded again as it is
    const again = await uploadImage(logger, url(), damagedBody(big), 'again.png', {
      ...fields,
      confirmDuplicate: false,
    })
    expect(again.status).toBe(202)
    await waitDone(again.body.data.id)
  })
})

describe('tileImage() (the job body)', () => {
  /** An image stored as the upload leaves it for the job, without the queue: processing, attempt. */
  async function stored(attempt: string) {
    const res = await uploadImage(logger, url(), big, 'x.png', fields)
    await waitDone(res.body.data.id)
    await fx.db.delete(imageTiles).where(eq(imageTiles.imageId, res.body.data.id))
    await fx.db
      .update(images)
      .set({ status: 'processing', progress: 0, attempt, leaseUntil: null, levels: 0 })
      .where(eq(images.id, res.body.data.id))
    return res.body.data.id as number
  }

  it('tileImage() deletes tiles a dead attempt left, writes all again; a second run does nothing', async () => {
    const attempt = crypto.randomUUID()
    const id = await stored(attempt)
    await fx.db.insert(imageTiles).values([
      { imageId: id, level: 0, tile: 0, rows: 1, bytes: Buffer.from('junk') },
      { imageId: id, level: 9, tile: 0, rows: 1, bytes: Buffer.from('junk') },
    ])
    expect(await tileImage(fx.db, id, attempt)).toBe('ready')
    expect(
      await fx.db.$count(imageTiles, and(eq(imageTiles.imageId, id), eq(imageTiles.level, 9))),
    ).toBe(0)
    const level0 = await storedLevel(fx, id, 0, 8)
    expect(level0.rows).toBe(H)
    expect(await tileImage(fx.db, id, attempt)).toBe('skipped')
  })

  it('tileImage() of a LAS image reads its array again from the stored file', async () => {
    const res = await uploadImage(
      logger,
      url(),
      imageBytes('gsq-bh05-amp-tt-brackets.las'),
      'a.las',
      fields,
    )
    expect(res.status).toBe(201)
    const tt = res.body.meta.images[1]
    const before = await storedLevel(fx, tt.id, 0, 16)
    const attempt = crypto.randomUUID()
    await fx.db.delete(imageTiles).where(eq(imageTiles.imageId, tt.id))
    await fx.db
      .update(images)
      .set({ status: 'processing', attempt, levels: 0 })
      .where(eq(images.id, tt.id))
    expect(await tileImage(fx.db, tt.id, attempt)).toBe('ready')
    const after = await storedLevel(fx, tt.id, 0, 16)
    expect(after.samples).toEqual(before.samples)
    expect((await fx.db.select().from(images).where(eq(images.id, tt.id)))[0].levels).toBe(2)
  })

  it('tileImage() for a stale attempt, or while another attempt holds a live lease → skipped', async () => {
    const attempt = crypto.randomUUID()
    const id = await stored(attempt)
    expect(await tileImage(fx.db, id, crypto.randomUUID())).toBe('skipped')
    await fx.db
      .update(images)
      .set({ leaseUntil: sql`now() + interval '1 minute'` })
      .where(eq(images.id, id))
    expect(await tileImage(fx.db, id, attempt)).toBe('skipped')
    expect(await fx.db.$count(imageTiles, eq(imageTiles.imageId, id))).toBe(0)
  })

  it('sweepInterrupted() marks an image whose lease lapsed failed — interrupted; its job then does nothing', async () => {
    const attempt = crypto.randomUUID()
    const id = await stored(attempt)
    await fx.db
      .update(images)
      .set({ leaseUntil: sql`now() - interval '1 second'` })
      .where(eq(images.id, id))
    const swept = await sweepInterrupted(fx.db)
    expect(swept.images).toBe(1)
    const [row] = await fx.db.select().from(images).where(eq(images.id, id))
    expect(row).toMatchObject({ status: 'failed', message: IMAGE_INTERRUPTED, attempt: null })
    expect(await tileImage(fx.db, id, attempt)).toBe('skipped')
  })

  it('tileImage() reports progress on the row as tiles go in', async () => {
    const attempt = crypto.randomUUID()
    const id = await stored(attempt)
    const seen = new Set<number>()
    let running = true
    const watch = (async () => {
      while (running) {
        const [row] = await fx.db
          .select({ p: images.progress })
          .from(images)
          .where(eq(images.id, id))
        seen.add(row.p)
        await new Promise((r) => setTimeout(r, 2))
      }
    })()
    await tileImage(fx.db, id, attempt)
    running = false
    await watch
    expect([...seen].some((p) => p >= 10 && p < 100)).toBe(true)
    const [done] = await fx.db.select().from(images).where(eq(images.id, id))
    expect(done).toMatchObject({ status: 'ready', progress: 100 })
  })
})
