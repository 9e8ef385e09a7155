import { describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { inflateSync } from 'node:zlib'
import { auditEvents, imagePicks, images, imageTiles, structures } from '../../schema/index'
import { decodeTile } from '../../backend/src/services/image-rows'
import { countRows } from './fixture'
import { binary, imageBytes, imagesSuite, storedLevel, uploadImage } from './images-setup'

const ctx = imagesSuite()
const fields = { topDepth: 10, bottomDepth: 11.2, northReference: 'true', confirmDuplicate: true }
const upload = (file = 'gsq-bh01-amp-grey8.png') =>
  uploadImage(ctx.logger, ctx.url(), imageBytes(file), file, fields)

describe('GET H/images, GET H/images/:imageId', () => {
  it('GET H/images → every image of the hole as ImageMeta with pickCount, never the lease or hash', async () => {
    const made = (await upload()).body.data
    const [structure] = await ctx.fx.db
      .insert(structures)
      .values({ holeId: ctx.fx.holeId, depth: 10.5, type: 'joint', source: 'image' })
      .returning()
    await ctx.fx.db.insert(imagePicks).values({
      structureId: structure.id,
      imageId: made.id,
      points: [],
      centreDepth: 10.5,
      heightMm: 40,
      troughAzimuth: 120,
      diameterMm: 96,
      azimuthReference: 'north',
      northReference: 'true',
      rmsMm: 0.5,
    })
    const res = await ctx.viewer.get(ctx.url())
    expect(res.status).toBe(200)
    const listed = res.body.data.find((m: { id: number }) => m.id === made.id)
    expect(listed).toMatchObject({
      id: made.id,
      pickCount: 1,
      status: 'ready',
      holeId: ctx.fx.holeId,
    })
    for (const secret of ['attempt', 'leaseUntil', 'sha256'])
      expect(listed).not.toHaveProperty(secret)
    const one = await ctx.viewer.get(`${ctx.url()}/${made.id}`)
    expect(one.status).toBe(200)
    expect(one.body.data).toEqual(listed)
  })

  it('GET H/images/:imageId of another hole, or unknown → 404; outsider → 404', async () => {
    const made = (await upload()).body.data
    const [other] = await ctx.fx.db.select().from(images).where(eq(images.id, made.id))
    expect(other.holeId).toBe(ctx.fx.holeId)
    const elsewhere = `/api/projects/${ctx.fx.projectId}/holes/${ctx.fx.holeId + 999}/images/${made.id}`
    expect((await ctx.viewer.get(elsewhere)).status).toBe(404)
    expect((await ctx.viewer.get(`${ctx.url()}/999999`)).status).toBe(404)
    expect((await ctx.outsider.get(`${ctx.url()}/${made.id}`)).status).toBe(404)
    expect((await ctx.outsider.get(ctx.url())).status).toBe(404)
  })
})

describe('GET H/images/:imageId/tiles/:level/:tile', () => {
  it('GET tiles → the stored deflated bytes as they are, with the tile headers', async () => {
    const made = (await upload()).body.data
    const [stored] = await ctx.fx.db
      .select()
      .from(imageTiles)
      .where(and(eq(imageTiles.imageId, made.id), eq(imageTiles.level, 0), eq(imageTiles.tile, 2)))
    const res = await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/0/2`).buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers).toMatchObject({
      'content-type': 'application/octet-stream',
      'content-encoding': 'deflate',
      // 600 rows: tiles of 256, 256 and 88
      'x-tile-rows': '88',
      'cache-control': 'private, max-age=3600',
      'content-length': String(stored.bytes.length),
    })
    expect(res.headers.etag).toMatch(new RegExp(`^"${made.id}-0-2-[0-9a-f]{16}"$`))
    // superagent inflates deflate itself: the body is the raw samples
    expect(Buffer.from(res.body).equals(inflateSync(stored.bytes))).toBe(true)
    const level0 = await storedLevel(ctx.fx, made.id, 0, 8)
    expect(decodeTile(stored.bytes, 8)).toEqual(level0.samples.subarray(512 * 72))
  })

  it('GET tiles with If-None-Match of its ETag → 304', async () => {
    const made = (await upload()).body.data
    const first = await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/1/0`)
    const again = await ctx.viewer
      .get(`${ctx.url()}/${made.id}/tiles/1/0`)
      .set('If-None-Match', first.headers.etag)
    expect(again.status).toBe(304)
  })

  it('GET tiles of a level or tile that does not exist → 404; bad numbers → 400', async () => {
    const made = (await upload()).body.data
    expect(made.levels).toBe(3)
    expect((await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/3/0`)).status).toBe(404)
    expect((await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/0/3`)).status).toBe(404)
    expect((await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/0/-1`)).status).toBe(400)
    expect((await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/x/0`)).status).toBe(400)
    expect((await ctx.outsider.get(`${ctx.url()}/${made.id}/tiles/0/0`)).status).toBe(404)
  })

  it('GET tiles while the image is processing → 409 image_processing; failed → 409 image_failed', async () => {
    const made = (await upload()).body.data
    await ctx.fx.db
      .update(images)
      .set({ status: 'processing', progress: 40 })
      .where(eq(images.id, made.id))
    const busy = await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/0/0`)
    expect(busy.status).toBe(409)
    expect(busy.body.error).toMatchObject({ code: 'image_processing' })
    expect(busy.body.error.message).toContain('40 %')
    await ctx.fx.db
      .update(images)
      .set({ status: 'failed', message: 'damaged' })
      .where(eq(images.id, made.id))
    const failed = await ctx.viewer.get(`${ctx.url()}/${made.id}/tiles/0/0`)
    expect(failed.body.error.code).toBe('image_failed')
  })
})

describe('GET H/images/:imageId/file', () => {
  it('GET file → the original bytes as an attachment with their media type', async () => {
    const bytes = imageBytes('gsq-bh03-optical-rgb.tif')
    const made = (await upload('gsq-bh03-optical-rgb.tif')).body.data
    const res = await ctx.viewer.get(`${ctx.url()}/${made.id}/file`).buffer(true).parse(binary)
    expect(res.status).toBe(200)
    expect(res.headers['content-type']).toBe('image/tiff')
    expect(res.headers['content-disposition']).toBe('attachment; filename=gsq-bh03-optical-rgb.tif')
    expect(Buffer.from(res.body).equals(bytes)).toBe(true)
    expect((await ctx.outsider.get(`${ctx.url()}/${made.id}/file`)).status).toBe(404)
  })
})

describe('DELETE H/images/:imageId', () => {
  it('DELETE as viewer → 403, nothing changed', async () => {
    const made = (await upload()).body.data
    const res = await ctx.viewer.delete(`${ctx.url()}/${made.id}`)
    expect(res.status).toBe(403)
    expect((await ctx.viewer.get(`${ctx.url()}/${made.id}`)).status).toBe(200)
    expect((await ctx.outsider.delete(`${ctx.url()}/${made.id}`)).status).toBe(404)
  })

  it('DELETE as logger → 204: image, file and tiles gone in one go, audited; picks stay as structures', async () => {
    const made = (await upload()).body.data
    const [structure] = await ctx.fx.db
      .insert(structures)
      .values({ holeId: ctx.fx.holeId, depth: 10.7, type: 'vein', source: 'image' })
      .returning()
    await ctx.fx.db.insert(imagePicks).values({
      structureId: structure.id,
      imageId: made.id,
      points: [],
      centreDepth: 10.7,
      heightMm: 30,
      troughAzimuth: 45,
      diameterMm: 96,
      azimuthReference: 'north',
      northReference: 'true',
      rmsMm: 0.2,
    })
    const res = await ctx.logger.delete(`${ctx.url()}/${made.id}`)
    expect(res.status).toBe(204)
    expect((await ctx.viewer.get(`${ctx.url()}/${made.id}`)).status).toBe(404)
    const { rows } = await ctx.fx.db.execute<{ n: number }>(
      `select (select count(*) from image_tiles where image_id = ${made.id})::int +
              (select count(*) from image_files where image_id = ${made.id})::int as n`,
    )
    expect(rows[0].n).toBe(0)
    const [pick] = await ctx.fx.db
      .select()
      .from(imagePicks)
      .where(eq(imagePicks.structureId, structure.id))
    expect(pick.imageId).toBeNull()
    expect(await countRows(ctx.fx.db, 'structures')).toBeGreaterThan(0)
    const [event] = await ctx.fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'image'), eq(auditEvents.action, 'delete')))
    expect(event).toMatchObject({ entityId: String(made.id), userId: ctx.fx.userIds.logger })
    expect(event.before).toMatchObject({ fileName: 'gsq-bh01-amp-grey8.png', pickCount: 1 })
    expect((await ctx.logger.delete(`${ctx.url()}/${made.id}`)).status).toBe(404)
  })
})
