import { describe, expect, it } from 'vitest'
import { holes } from '../../schema/index'
import { holeValues } from './fixture'
import { imageBytes, imagesSuite, storedCounts, uploadImage } from './images-setup'

const ctx = imagesSuite()

describe('POST H/images (form fields)', () => {
  const bytes = () => imageBytes('gsq-bh02-amp-grey8.jpg')
  const post = (fields: Record<string, string | number | boolean>, hole?: number) =>
    uploadImage(ctx.logger, ctx.url(hole), bytes(), 'strip.jpg', {
      confirmDuplicate: true,
      ...fields,
    })

  it('POST H/images without topDepth / bottomDepth → 400 naming the field', async () => {
    const before = await storedCounts(ctx.fx)
    const a = await post({ bottomDepth: 11 })
    expect(a.status).toBe(400)
    expect(a.body.error.details).toEqual([
      { path: 'body.topDepth', message: 'required for an image file' },
    ])
    const b = await post({ topDepth: 10 })
    expect(b.body.error.details[0].path).toBe('body.bottomDepth')
    expect(await storedCounts(ctx.fx)).toEqual(before)
  })

  it('POST H/images with bottomDepth ≤ topDepth, or past the final depth → 400', async () => {
    const a = await post({ topDepth: 11, bottomDepth: 10 })
    expect(a.status).toBe(400)
    expect(a.body.error.details[0]).toMatchObject({ path: 'body.bottomDepth' })
    // the fixture hole ends at 100 m
    const b = await post({ topDepth: 99.9, bottomDepth: 100.1 })
    expect(b.status).toBe(400)
    expect(b.body.error.details[0]).toEqual({
      path: 'body.bottomDepth',
      message: "below the hole's final depth of 100 m",
    })
  })

  it('POST H/images with a row step outside 0.2–50 mm → 400 "N rows over X m is Y mm per row"', async () => {
    const fine = await post({ topDepth: 10, bottomDepth: 10.03 })
    expect(fine.status).toBe(400)
    expect(fine.body.error.message).toContain('300 rows over 0.03 m is 0.1 mm per row')
    const coarse = await post({ topDepth: 10, bottomDepth: 25.1 })
    expect(coarse.status).toBe(400)
    expect(coarse.body.error.message).toContain('300 rows over 15.1 m is 50.3 mm per row')
  })

  it('POST H/images north without northReference → magnetic assumed and said in the notes', async () => {
    const res = await post({ topDepth: 10, bottomDepth: 10.6 })
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({ azimuthReference: 'north', northReference: 'magnetic' })
    expect(res.body.data.notes.join(' ')).toContain('magnetic north assumed')
  })

  it('POST H/images highside + northReference → 400; highside alone stores no north', async () => {
    const bad = await post({
      topDepth: 10,
      bottomDepth: 10.6,
      azimuthReference: 'highside',
      northReference: 'true',
    })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.northReference')
    const ok = await post({ topDepth: 10, bottomDepth: 10.6, azimuthReference: 'highside' })
    expect(ok.body.data).toMatchObject({ azimuthReference: 'highside', northReference: null })
  })

  it('POST H/images: kind, leftAzimuth (to 0…360) and diameterMm as entered', async () => {
    const res = await post({
      topDepth: 10,
      bottomDepth: 10.6,
      northReference: 'true',
      kind: 'traveltime',
      leftAzimuth: -90,
      diameterMm: 101.5,
    })
    expect(res.body.data).toMatchObject({
      kind: 'traveltime',
      leftAzimuth: 270,
      diameterMm: 101.5,
      diameterSource: 'entered',
    })
  })

  it('POST H/images without diameterMm: the hole nominal size (HQ 96 mm, common practice)', async () => {
    const res = await post({ topDepth: 10, bottomDepth: 10.6, northReference: 'true' })
    expect(res.body.data).toMatchObject({ diameterMm: 96, diameterSource: 'hole' })
    const [odd] = await ctx.fx.db
      .insert(holes)
      .values({ ...holeValues(ctx.fx.projectId, 'TST-ODD'), coreSize: 'BQ3' })
      .returning()
    const refused = await post({ topDepth: 10, bottomDepth: 10.6 }, odd.id)
    expect(refused.status).toBe(400)
    expect(refused.body.error.details[0].path).toBe('body.diameterMm')
  })

  it('POST H/images with an unknown field or a bad number → 400 naming it', async () => {
    const res = await post({ topDepth: 'ten', bottomDepth: 11, colour: 'red' })
    expect(res.status).toBe(400)
    const paths = res.body.error.details.map((d: { path: string }) => d.path)
    expect(paths).toContain('body.topDepth')
    expect(paths.join(' ')).toContain('body')
  })

  it('POST H/images without a file → 400 naming "file"', async () => {
    const res = await ctx.logger.postMultipart(ctx.url()).field('topDepth', '10')
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('file')
  })

  it('POST H/images the same file twice → 409 duplicate_image, stored with confirmDuplicate', async () => {
    const [hole] = await ctx.fx.db
      .insert(holes)
      .values(holeValues(ctx.fx.projectId, 'TST-DUP'))
      .returning()
    const first = await post({ topDepth: 10, bottomDepth: 10.6, confirmDuplicate: false }, hole.id)
    expect(first.status).toBe(201)
    const before = await storedCounts(ctx.fx)
    const again = await post({ topDepth: 20, bottomDepth: 20.6, confirmDuplicate: false }, hole.id)
    expect(again.status).toBe(409)
    expect(again.body.error).toMatchObject({
      code: 'duplicate_image',
      meta: { duplicateOf: { imageId: first.body.data.id, fileName: 'strip.jpg' } },
    })
    expect(await storedCounts(ctx.fx)).toEqual(before)
    const confirmed = await post(
      { topDepth: 20, bottomDepth: 20.6, confirmDuplicate: true },
      hole.id,
    )
    expect(confirmed.status).toBe(201)
  })
})
