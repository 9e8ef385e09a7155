import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { auditEvents, imageFiles, images } from '../../schema/index'
import { grey16, grey8, rgb8 } from '../../testdata/images/raster-files'
import {
  expectedNextRow,
  imageBytes,
  imagesSuite,
  sharpPixels,
  storedLevel,
  uploadImage,
} from './images-setup'

const ctx = imagesSuite()
const depths = { topDepth: 10, bottomDepth: 11.2, northReference: 'true' }

/** Each raster: its layout as stored, and whether its pixels are exactly the generator's. */
/** The generator's palette (grey8 to 16 levels) and alpha (every fifth sample transparent) files. */
const palette = (w: number, h: number) => Uint8Array.from(grey8(w, h), (v) => v & 0xf0)
const onBlack = (w: number, h: number) => grey8(w, h).map((v, i) => (i % 5 === 0 ? 0 : v))

const cases = [
  {
    file: 'gsq-bh01-amp-grey8.png',
    w: 72,
    h: 600,
    ch: 1,
    bits: 8,
    kind: 'amplitude',
    exact: grey8,
  },
  {
    file: 'gsq-bh01-amp-grey16.png',
    w: 90,
    h: 520,
    ch: 1,
    bits: 16,
    kind: 'amplitude',
    exact: grey16,
  },
  { file: 'gsq-bh02-amp-grey8.jpg', w: 64, h: 300, ch: 1, bits: 8, kind: 'amplitude' },
  { file: 'gsq-bh02-optical-rgb.jpg', w: 120, h: 400, ch: 3, bits: 8, kind: 'optical' },
  {
    file: 'gsq-bh03-amp-grey8.tif',
    w: 80,
    h: 300,
    ch: 1,
    bits: 8,
    kind: 'amplitude',
    exact: grey8,
  },
  {
    file: 'gsq-bh03-amp-grey16.tif',
    w: 64,
    h: 300,
    ch: 1,
    bits: 16,
    kind: 'amplitude',
    exact: grey16,
  },
  {
    file: 'gsq-bh03-optical-rgb.tif',
    w: 100,
    h: 280,
    ch: 3,
    bits: 8,
    kind: 'optical',
    exact: rgb8,
  },
  {
    file: 'gsq-bh04-palette-grey.png',
    w: 72,
    h: 300,
    ch: 1,
    bits: 8,
    kind: 'amplitude',
    exact: palette,
  },
  {
    file: 'gsq-bh04-grey-alpha.png',
    w: 72,
    h: 300,
    ch: 1,
    bits: 8,
    kind: 'amplitude',
    exact: onBlack,
  },
  // 16-bit colour v·257 comes back as v: 8-bit RGB
  {
    file: 'gsq-bh04-optical-rgb16.png',
    w: 60,
    h: 280,
    ch: 3,
    bits: 8,
    kind: 'optical',
    exact: rgb8,
  },
] as const

describe('POST H/images (rasters)', () => {
  for (const c of cases) {
    it(`POST H/images ${c.file} → 201, ${c.w} × ${c.h} × ${c.ch} at ${c.bits} bits; level 0 = the file's pixels, level 1 = means of row pairs`, async () => {
      const bytes = imageBytes(c.file)
      const res = await uploadImage(ctx.logger, ctx.url(), bytes, c.file, {
        ...depths,
        confirmDuplicate: true,
      })
      expect(res.status, JSON.stringify(res.body)).toBe(201)
      const meta = res.body.data
      expect(meta).toMatchObject({
        source: 'raster',
        kind: c.kind,
        width: c.w,
        height: c.h,
        channels: c.ch,
        sampleBits: c.bits,
        status: 'ready',
        progress: 100,
        tileRows: 256,
        topDepth: 10,
        bottomDepth: 11.2,
        fileName: c.file,
        fileSize: bytes.length,
      })
      expect(res.body.meta.images).toHaveLength(1)
      // ceil(h / 2^L) rows per level until one fits in a 256-row tile
      let levels = 1
      for (let rows: number = c.h; rows > 256; rows = Math.ceil(rows / 2)) levels++
      expect(meta.levels).toBe(levels)
      const level0 = await storedLevel(ctx.fx, meta.id, 0, c.bits)
      expect(level0.rows).toBe(c.h)
      expect(level0.tiles.map((t) => t.rows)).toEqual(
        Array.from({ length: Math.ceil(c.h / 256) }, (_, t) => Math.min(256, c.h - 256 * t)),
      )
      const pixels = await sharpPixels(bytes, c.ch, c.bits)
      expect(Buffer.from(level0.samples.buffer).equals(Buffer.from(pixels.buffer))).toBe(true)
      if ('exact' in c) expect(Array.from(level0.samples)).toEqual(Array.from(c.exact(c.w, c.h)))
      const level1 = await storedLevel(ctx.fx, meta.id, 1, c.bits)
      const rowLength = c.w * c.ch
      expect(level1.rows).toBe(Math.ceil(c.h / 2))
      for (const k of [0, 37, level1.rows - 1])
        expect(Array.from(level1.samples.subarray(k * rowLength, (k + 1) * rowLength))).toEqual(
          expectedNextRow(level0.samples, rowLength, c.h, k),
        )
    })
  }

  it('POST H/images stores the file in chunks equal to the upload and audits the create', async () => {
    const bytes = imageBytes('gsq-bh03-amp-grey16.tif')
    const res = await uploadImage(ctx.logger, ctx.url(), bytes, 'strip.tif', {
      ...depths,
      confirmDuplicate: true,
    })
    expect(res.status).toBe(201)
    const chunks = await ctx.fx.db
      .select()
      .from(imageFiles)
      .where(eq(imageFiles.imageId, res.body.data.id))
    expect(Buffer.concat(chunks.map((c) => c.bytes)).equals(bytes)).toBe(true)
    const [row] = await ctx.fx.db.select().from(images).where(eq(images.id, res.body.data.id))
    expect(row.mediaType).toBe('image/tiff')
    expect(row.createdBy).toBe(ctx.fx.userIds.logger)
    const events = await ctx.fx.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.entityId, String(row.id)))
    expect(events.filter((e) => e.entity === 'image').map((e) => e.action)).toEqual(['create'])
  })

  it('POST H/images reads the format from the bytes: a PNG named .las is a PNG', async () => {
    const res = await uploadImage(
      ctx.logger,
      ctx.url(),
      imageBytes('gsq-bh01-amp-grey8.png'),
      'not-really.las',
      { ...depths, confirmDuplicate: true },
    )
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({ source: 'raster', mediaType: 'image/png', width: 72 })
  })
})
