import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { holes, imageFiles, images } from '../../schema/index'
import { readRows } from '../../backend/src/services/image-rows'
import { amplitude, travelTime } from '../../testdata/images/las-files'
import { holeValues } from './fixture'
import { imageBytes, imagesSuite, storedCounts, storedLevel, uploadImage } from './images-setup'

const ctx = imagesSuite()
const post = (file: string, fields: Record<string, string | number | boolean> = {}) =>
  uploadImage(ctx.logger, ctx.url(), imageBytes(file), file, {
    northReference: 'true',
    confirmDuplicate: true,
    ...fields,
  })
const rowOf = async (id: number) =>
  (await ctx.fx.db.select().from(images).where(eq(images.id, id)))[0]

/** Stored samples read back to values are the file's within half a 16-bit step (uint16 mapping). */
async function expectValues(
  id: number,
  value: (r: number, i: number) => number | null,
  rowOfFile: (r: number) => number = (r) => r,
) {
  const image = await rowOf(id)
  const back = await readRows(ctx.fx.db, image, 0, 0, image.height)
  const half = (image.valueMax! - image.valueMin!) / 65534 / 2
  // readRows hands back float32: its rounding (2^-24 relative) on top
  let nulls = 0
  for (let r = 0; r < image.height; r++)
    for (let i = 0; i < image.width; i++) {
      const want = value(rowOfFile(r), i)
      const got = back.values[r * image.width + i]
      if (want === null) {
        nulls++
        expect(got).toBeNaN()
      } else expect(Math.abs(got - want)).toBeLessThanOrEqual(half + Math.abs(want) * 2 ** -23)
    }
  return nulls
}

describe('POST H/images (LAS image arrays)', () => {
  it('POST H/images AMP01…AMP72 (LAS 2.0) → one image; caliper diameter, azimuth items, NULL → no value', async () => {
    const res = await post('gsq-bh05-amp72.las')
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.meta.images).toHaveLength(1)
    const meta = res.body.data
    expect(meta).toMatchObject({
      source: 'las',
      kind: 'amplitude',
      name: 'AMP',
      mediaType: 'text/plain',
      width: 72,
      height: 300,
      channels: 1,
      sampleBits: 16,
      valueUnit: 'MV',
      // samples at 20.000 … 20.598 m every 2 mm: rows are centred on them
      topDepth: 19.999,
      bottomDepth: 20.599,
      // AZSTART 2.5° is the centre of column 0; AZSTEP 5° × 72 = 360°
      leftAzimuth: 0,
      diameterSource: 'caliper',
      levels: 2,
      status: 'ready',
    })
    // CALI = 3.9 + 0.02·sin(i) in, 25.4 mm an inch (exact, by definition)
    let sum = 0
    for (let i = 0; i < 300; i++) sum += (3.9 + 0.02 * Math.sin(i)) * 25.4
    expect(meta.diameterMm).toBeCloseTo(sum / 300, 2)
    expect(meta.notes.join(' ')).toContain('5° apart (AZSTEP, line 12)')
    expect(meta.valueMin).toBeLessThan(meta.valueMax)
    const nulls = await expectValues(meta.id, amplitude(72, 300))
    expect(nulls).toBeGreaterThan(100)
  })

  it('POST H/images AMP[0]…AMP[35] + TT[0]…TT[35] → two images, bit-size diameter, each with the file', async () => {
    const res = await post('gsq-bh05-amp-tt-brackets.las')
    expect(res.status).toBe(201)
    const [amp, tt] = res.body.meta.images
    expect(res.body.data.id).toBe(amp.id)
    expect(amp).toMatchObject({ name: 'AMP', kind: 'amplitude', width: 36, valueUnit: 'MV' })
    expect(tt).toMatchObject({ name: 'TT', kind: 'traveltime', width: 36, valueUnit: 'US' })
    for (const m of [amp, tt]) {
      expect(m).toMatchObject({ diameterSource: 'bit-size', height: 300, topDepth: 29.999 })
      // BS 3.875 in × 25.4 mm/in
      expect(m.diameterMm).toBeCloseTo(98.425, 1)
      const chunks = await ctx.fx.db.select().from(imageFiles).where(eq(imageFiles.imageId, m.id))
      expect(Buffer.concat(chunks.map((c) => c.bytes))).toEqual(
        imageBytes('gsq-bh05-amp-tt-brackets.las'),
      )
    }
    await expectValues(amp.id, amplitude(36, 300))
    await expectValues(tt.id, travelTime(36, 300))
  })

  it('POST H/images LAS 3.0 AMP[1]…AMP[24] (~Log_Definition) → 24 samples a turn, AZ_STEP 15°', async () => {
    const res = await post('gsq-bh06-las3-array.las')
    expect(res.status, JSON.stringify(res.body)).toBe(201)
    expect(res.body.data).toMatchObject({ width: 24, height: 100, topDepth: 11.998 })
    expect(res.body.data.notes.join(' ')).toContain('15° apart (AZ_STEP, line 13)')
    await expectValues(res.body.data.id, amplitude(24, 100))
  })

  it('POST H/images LAS with irregular depths → resampled to the median step by nearest sample, noted', async () => {
    const res = await post('gsq-bh06-irregular.las')
    expect(res.status).toBe(201)
    // 50 samples 5 mm apart from 15.000, then 50 at 2.5 mm from 15.2525: median step 5 mm
    expect(res.body.data).toMatchObject({ height: 76, topDepth: 14.9975, bottomDepth: 15.3775 })
    expect(res.body.data.notes[0]).toContain('resampled to the median step 5 mm by nearest sample')
    const file = [
      ...Array.from({ length: 50 }, (_, i) => 15 + 0.005 * i),
      ...Array.from({ length: 50 }, (_, i) => 15.2525 + 0.0025 * i),
    ]
    const nearest = (r: number) => {
      const t = 15 + 0.005 * r
      let best = 0
      for (let k = 1; k < file.length; k++)
        if (Math.abs(file[k] - t) <= Math.abs(file[best] - t)) best = k
      return best
    }
    // the generator fills these 16 members with its 72-member pattern
    await expectValues(res.body.data.id, amplitude(72, 100), nearest)
  })

  it('POST H/images LAS logged bottom-up, NULL −9999 → rows turned over, shallowest first', async () => {
    const res = await post('gsq-bh06-bottom-up.las')
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({ height: 51, topDepth: 39.999, bottomDepth: 40.101 })
    // the file's own NULL (−9999) reads as no value
    expect(await expectValues(res.body.data.id, amplitude(72, 51), (r) => 50 - r)).toBeGreaterThan(
      0,
    )
  })

  it('POST H/images LAS: the form leftAzimuth adds to the file, the form kind names a lone array', async () => {
    const res = await post('gsq-bh06-las3-array.las', { leftAzimuth: 30, kind: 'traveltime' })
    expect(res.body.data).toMatchObject({ leftAzimuth: 30, kind: 'traveltime' })
    const hs = await uploadImage(
      ctx.logger,
      ctx.url(),
      imageBytes('gsq-bh06-las3-array.las'),
      'hs.las',
      { azimuthReference: 'highside', confirmDuplicate: true },
    )
    expect(hs.body.data).toMatchObject({ azimuthReference: 'highside', northReference: null })
  })

  it('POST H/images LAS level 1: mean of row pairs with no-value samples (0) left out', async () => {
    const res = await post('gsq-bh05-amp72.las')
    const l0 = await storedLevel(ctx.fx, res.body.data.id, 0, 16)
    const l1 = await storedLevel(ctx.fx, res.body.data.id, 1, 16)
    expect(l1.rows).toBe(150)
    let zeroPairs = 0
    for (let k = 0; k < 150; k++)
      for (let i = 0; i < 72; i++) {
        const [a, b] = [l0.samples[2 * k * 72 + i], l0.samples[(2 * k + 1) * 72 + i]]
        const want = a === 0 || b === 0 ? a + b : Math.floor((a + b + 1) / 2)
        if (a === 0 || b === 0) zeroPairs++
        expect(l1.samples[k * 72 + i]).toBe(want)
      }
    expect(zeroPairs).toBeGreaterThan(0)
  })
})

describe('POST H/images (LAS refusals: 4xx naming the line, nothing stored)', () => {
  const refusals = [
    ['broken-array-gap.las', 422, 'invalid_file', 'index 7 is missing', 'file.line.19'],
    ['broken-azimuth-step.las', 422, 'invalid_file', 'covers 320°, not one turn', 'file.line.12'],
    ['broken-row-step.las', 422, 'invalid_depths', '40 rows over 4 m is 100 mm per row', 'file'],
    ['broken-no-array.las', 422, 'invalid_file', 'holds no image array', 'file'],
    ['broken-curve-bomb.las', 413, 'image_too_large', 'at most 40000000', 'file'],
    ['broken-no-eoi.jpg', 422, 'damaged_file', 'end-of-image marker', 'file'],
  ] as const
  for (const [file, status, code, text, path] of refusals) {
    it(`POST H/images ${file} → ${status} ${code} in under 1 s`, async () => {
      const before = await storedCounts(ctx.fx)
      const t0 = performance.now()
      const res = await post(file, { topDepth: 10, bottomDepth: 10.6 })
      expect(performance.now() - t0).toBeLessThan(1000)
      expect(res.status).toBe(status)
      expect(res.body.error.code).toBe(code)
      expect(res.body.error.message).toContain(text)
      expect(res.body.error.details[0].path).toBe(path)
      expect(await storedCounts(ctx.fx)).toEqual(before)
    })
  }

  it('POST H/images LAS below the hole final depth → 422 invalid_depths', async () => {
    const [short] = await ctx.fx.db
      .insert(holes)
      .values({ ...holeValues(ctx.fx.projectId, 'TST-SHORT'), finalDepth: 20.5 })
      .returning()
    const res = await uploadImage(
      ctx.logger,
      ctx.url(short.id),
      imageBytes('gsq-bh05-amp72.las'),
      'amp.las',
    )
    expect(res.status).toBe(422)
    expect(res.body.error.message).toContain(
      "reaches 20.598 m, below the hole's final depth of 20.5 m",
    )
  })
})
