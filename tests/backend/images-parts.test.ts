import { describe, expect, it } from 'vitest'
import { decodeTile, encodeTile } from '../../backend/src/services/image-rows'
import { levelCount, nextLevel, tileCount } from '../../backend/src/imports/images/pyramid'
import { encodeTileAsync } from '../../backend/src/imports/images/store'
import { arrayMember, findArrays, kindOfStem } from '../../backend/src/imports/images/las-arrays'
import { lasRows } from '../../backend/src/imports/images/las-depths'
import { sniffFormat } from '../../backend/src/imports/images/formats'
import type { LasCurve } from '../../backend/src/imports/las/index'

describe('pyramid', () => {
  it('levelCount() halves (rounding up) until a level fits in one tile', () => {
    expect(levelCount(256, 256)).toBe(1)
    expect(levelCount(257, 256)).toBe(2)
    // 150,000 → 75,000 → 37,500 → … → 147 rows: 11 levels
    expect(levelCount(150_000, 256)).toBe(11)
    // 600 rows: 3 tiles, 300 rows: 2, 150 rows: 1
    expect(tileCount(600, 256)).toBe(6)
  })

  it('nextLevel() means row pairs rounded half up; a lone last row is copied', () => {
    const level = { level: 0, rows: 3, samples: Uint8Array.of(10, 255, 11, 0, 7, 9) }
    const next = nextLevel(level, 2, false)
    expect(next).toMatchObject({ level: 1, rows: 2 })
    // (10 + 11) / 2 = 10.5 → 11; (255 + 0) / 2 = 127.5 → 128; the third row alone
    expect(Array.from(next.samples)).toEqual([11, 128, 7, 9])
  })

  it('nextLevel() where 0 = no value (LAS arrays): no-value samples left out of the mean', () => {
    const rows = Uint16Array.of(0, 0, 65535, 100, 0, 3, 65535, 201)
    const next = nextLevel({ level: 0, rows: 2, samples: rows }, 4, true)
    // none + none → none; none + 3 → 3; 65535 twice → 65535; (100 + 201) / 2 = 150.5 → 151
    expect(Array.from(next.samples)).toEqual([0, 3, 65535, 151])
  })

  it('encodeTileAsync() gives encodeTile’s bytes exactly (uint8 and uint16), and decodeTile reads them', async () => {
    const u8 = Uint8Array.from({ length: 5000 }, (_, i) => (i * 37) & 255)
    const u16 = Uint16Array.from({ length: 5000 }, (_, i) => (i * 7919) & 0xffff)
    expect((await encodeTileAsync(u8)).equals(encodeTile(u8))).toBe(true)
    expect((await encodeTileAsync(u16)).equals(encodeTile(u16))).toBe(true)
    expect(decodeTile(await encodeTileAsync(u16.subarray(1000, 2000)), 16)).toEqual(
      u16.subarray(1000, 2000),
    )
  })
})

const curve = (mnemonic: string, line = 1): LasCurve => ({
  mnemonic,
  unit: 'MV',
  value: '',
  description: '',
  format: '',
  line,
  values: new Float64Array(2),
})

describe('LAS image arrays', () => {
  it('arrayMember() reads AMP01, AMP[0], AMP_3, TT-12; not GR, DEPT or an over-long index', () => {
    expect(arrayMember('AMP01')).toEqual({ stem: 'AMP', index: 1 })
    expect(arrayMember('amp[0]')).toEqual({ stem: 'AMP', index: 0 })
    expect(arrayMember('AMP_3')).toEqual({ stem: 'AMP', index: 3 })
    expect(arrayMember('TT-12')).toEqual({ stem: 'TT', index: 12 })
    expect(arrayMember('GR')).toBeUndefined()
    expect(arrayMember('AMP123456')).toBeUndefined()
    expect(arrayMember('[3]')).toBeUndefined()
  })

  it('findArrays() groups ≥ 8 members by stem in index order; caliper arms and short groups stay curves', () => {
    const curves = [
      curve('DEPT'),
      ...[3, 1, 2, 4, 5, 6, 7, 8].map((i) => curve(`AMP${i}`)),
      ...[1, 2, 3, 4, 5, 6, 7, 8].map((i) => curve(`CAL${i}`)),
      ...[1, 2, 3].map((i) => curve(`RES${i}`)),
    ]
    const arrays = findArrays(curves)
    expect(arrays.map((a) => a.stem)).toEqual(['AMP'])
    expect(arrays[0].members.map((m) => m.mnemonic)).toEqual(
      [1, 2, 3, 4, 5, 6, 7, 8].map((i) => `AMP${i}`),
    )
  })

  it('findArrays() refuses a repeated index, naming its line', () => {
    const curves = [curve('DEPT'), ...[1, 2, 3, 4, 5, 6, 7, 8].map((i) => curve(`AMP${i}`, i + 1))]
    curves.push(curve('AMP08', 20))
    expect(() => findArrays(curves)).toThrow(/give the same index/)
  })

  it('kindOfStem(): AMP… amplitude, TT/TRT/TIME… travel time, else unknown', () => {
    expect(kindOfStem('AMPL')).toBe('amplitude')
    expect(kindOfStem('TT')).toBe('traveltime')
    expect(kindOfStem('TRTM')).toBe('traveltime')
    expect(kindOfStem('IMG')).toBeUndefined()
  })

  it('lasRows(): regular depths map row for row; a sample is the centre of its row', () => {
    const rows = lasRows(Float64Array.of(10, 10.002, 10.004, 10.006))
    expect(rows).toMatchObject({ rows: 4, topDepth: 9.999, bottomDepth: 10.007, notes: [] })
    expect(Array.from(rows.source)).toEqual([0, 1, 2, 3])
  })

  it('lasRows(): a gap is resampled at the median step; rows with no sample within a step stay empty', () => {
    const depths = Float64Array.of(10, 10.01, 10.02, 10.03, 10.1, 10.11, 10.12)
    const rows = lasRows(depths)
    // median step 10 mm; 10.00 … 10.12 is 13 rows; 10.05–10.08 have no sample within 10 mm
    expect(rows.rows).toBe(13)
    expect(Array.from(rows.source)).toEqual([0, 1, 2, 3, 3, -1, -1, -1, -1, 4, 4, 5, 6])
    expect(rows.notes[0]).toContain('4 without a sample within one step left empty')
  })
})

describe('sniffFormat()', () => {
  it('sniffFormat() by magic bytes: PNG, JPEG, TIFF both byte orders, BigTIFF, LAS in UTF-8/UTF-16', () => {
    expect(sniffFormat(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]))).toBe('png')
    expect(sniffFormat(Buffer.from([0xff, 0xd8, 0xff, 0xe0]))).toBe('jpeg')
    expect(sniffFormat(Buffer.from('II*\0'))).toBe('tiff')
    expect(sniffFormat(Buffer.from('MM\0*'))).toBe('tiff')
    expect(sniffFormat(Buffer.from('II+\0'))).toBe('bigtiff')
    expect(sniffFormat(Buffer.from('\ufeff  ~Version\n'))).toBe('las')
    expect(sniffFormat(Buffer.from('~VERSION\n', 'utf16le'))).toBe('las')
    expect(sniffFormat(Buffer.from('~W\n'))).toBeUndefined()
    expect(sniffFormat(Buffer.from('GIF89a'))).toBeUndefined()
  })
})
