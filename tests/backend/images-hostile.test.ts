import { describe, expect, it } from 'vitest'
import { clientFor } from './fixture'
import { damagedBody, imageBytes, imagesSuite, storedCounts, uploadImage } from './images-setup'

// Every file here is refused before anything is stored, within a second, with a reason a person
// can act on (status, code, and the words that say what is wrong).
const ctx = imagesSuite({ IMAGE_UPLOAD_LIMIT_MB: '0.25' })
const fields = { topDepth: 10, bottomDepth: 10.6, northReference: 'true' }

async function expectRefused(
  bytes: Buffer,
  name: string,
  status: number,
  code: string,
  words: string,
) {
  const before = await storedCounts(ctx.fx)
  const t0 = performance.now()
  const res = await uploadImage(ctx.logger, ctx.url(), bytes, name, fields)
  const ms = performance.now() - t0
  expect(res.status, JSON.stringify(res.body)).toBe(status)
  expect(res.body.error.code).toBe(code)
  expect(res.body.error.message).toContain(words)
  expect(ms).toBeLessThan(1000)
  expect(await storedCounts(ctx.fx)).toEqual(before)
}

describe('POST H/images (hostile files)', () => {
  it('POST H/images a PNG declaring 40 000 × 40 000 (a decompression bomb) → 413 from the header', () =>
    expectRefused(
      imageBytes('bomb-40000x40000.png'),
      'bomb.png',
      413,
      'image_too_large',
      '40000 samples across: at most 4096',
    ))

  it('POST H/images a 1 × 10⁸ PNG → 413 from the header', () =>
    expectRefused(
      imageBytes('bomb-1x100000000.png'),
      'tall.png',
      413,
      'image_too_large',
      '100000000 rows long: at most 400000',
    ))

  it('POST H/images a PNG cut in half (no IEND) → 422 damaged_file', () =>
    expectRefused(
      imageBytes('broken-truncated.png'),
      'cut.png',
      422,
      'damaged_file',
      'runs past the end: the file is cut short',
    ))

  it('POST H/images a PNG with a damaged IDAT → 422 (CRC mismatch)', () =>
    expectRefused(
      imageBytes('broken-crc.png'),
      'crc.png',
      422,
      'damaged_file',
      'CRC does not match',
    ))

  it('POST H/images a JPEG without EOI → 422', () =>
    expectRefused(
      imageBytes('broken-no-eoi.jpg'),
      'cut.jpg',
      422,
      'damaged_file',
      'end-of-image marker (FF D9)',
    ))

  it('POST H/images a TIFF whose strips lie past its end → 422 naming the strip', () =>
    expectRefused(
      imageBytes('broken-strips.tif'),
      'cut.tif',
      422,
      'damaged_file',
      'TIFF strip 7 (bytes 30918–36038) lies past the end of the file (33598 bytes)',
    ))

  it('POST H/images a GIF named .png → 422 unsupported_format (magic bytes, not the name)', () =>
    expectRefused(
      imageBytes('not-an-image.gif'),
      'image.png',
      422,
      'unsupported_format',
      'not a PNG, JPEG, TIFF or LAS file (it starts 47 49 46 38',
    ))

  it('POST H/images text that is not LAS → 422 unsupported_format', () =>
    expectRefused(Buffer.from('depth,amp\n1,2\n'), 'x.las', 422, 'unsupported_format', 'LAS'))

  it('POST H/images a BigTIFF header → 422 unsupported_format', () =>
    expectRefused(
      Buffer.from([0x49, 0x49, 0x2b, 0x00, 8, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0]),
      'big.tif',
      422,
      'unsupported_format',
      'BigTIFF',
    ))

  it('POST H/images a PNG with a corrupt header chunk → 422', () => {
    const png = Buffer.from(imageBytes('gsq-bh01-amp-grey8.png'))
    png[20] ^= 0xff // IHDR height: its CRC no longer matches
    return expectRefused(png, 'hdr.png', 422, 'damaged_file', 'IHDR')
  })

  it('POST H/images a PNG whose chunks are whole but whose pixels are garbage → 422 from the decoder', () =>
    expectRefused(
      damagedBody(imageBytes('gsq-bh01-amp-grey8.png')),
      'garbage.png',
      422,
      'damaged_file',
      'The PNG image cannot be decoded',
    ))

  it('POST H/images an empty file → 400 naming "file"', async () => {
    const res = await uploadImage(ctx.logger, ctx.url(), Buffer.alloc(0), 'empty.png', fields)
    expect(res.status).toBe(400)
    expect(res.body.error.details[0].path).toBe('file')
  })

  it('POST H/images over IMAGE_UPLOAD_LIMIT_MB → 413, nothing stored', async () => {
    const before = await storedCounts(ctx.fx)
    const res = await uploadImage(
      ctx.logger,
      ctx.url(),
      Buffer.concat([imageBytes('gsq-bh05-amp72.las'), Buffer.alloc(100_000, 0x20)]),
      'big.las',
      fields,
    )
    expect(res.status).toBe(413)
    expect(res.body.error).toMatchObject({
      code: 'too_large',
      message: 'The file is larger than 0.25 MB.',
    })
    expect(await storedCounts(ctx.fx)).toEqual(before)
  })

  it('POST H/images as viewer → 403 before the file is read; outsider → 404', async () => {
    const bytes = imageBytes('gsq-bh01-amp-grey8.png')
    const viewer = await uploadImage(ctx.viewer, ctx.url(), bytes, 'a.png', fields)
    expect(viewer.status).toBe(403)
    const outsider = await uploadImage(ctx.outsider, ctx.url(), bytes, 'a.png', fields)
    expect(outsider.status).toBe(404)
    const anonymous = await uploadImage(
      await clientFor(ctx.fx.app, 'anonymous'),
      ctx.url(),
      bytes,
      'a.png',
      fields,
    )
    expect(anonymous.status).toBe(401)
  })
})
