import { describe, expect, it } from 'vitest'
import type { ImagePickRecord } from '../../frontend/src/api/images'
import * as pr from '../../frontend/src/logic/image-picking/pick-rows'
import * as uf from '../../frontend/src/logic/image-picking/upload-fields'
import { expectAngle } from '../orient/expect-angle'

const saved = (id: number, depth: number, dip: number | null, dipDirection: number | null) =>
  ({
    structureId: id,
    imageId: 3,
    points: [],
    centreDepth: depth,
    heightMm: 40,
    troughAzimuth: 90,
    diameterMm: 96,
    azimuthReference: 'north',
    northReference: 'true',
    rmsMm: 0.5,
    suggested: false,
    structure: {
      id,
      depth,
      type: 'fault',
      confidence: null,
      comment: '',
      dip,
      dipDirection,
      flags: [],
      version: 1,
    },
  }) satisfies ImagePickRecord

describe('pick rows, poles and stepping', () => {
  it('pickPoles(): the lower-hemisphere pole trend = dip direction + 180, plunge = 90 − dip (common practice)', () => {
    const [pole, ...rest] = pr.pickPoles([saved(1, 30, 60, 300), saved(2, 31, null, null)])
    expect(rest).toEqual([])
    expectAngle(pole!.trend, 120, 1e-9)
    expect(pole!.plunge).toBeCloseTo(30, 9)
    expect(pole!.id).toBe(1)
  })

  it('pickRows() lists saved and pending picks down the hole; stepKey() walks them', () => {
    const fit = { depth: 30.5, height: 0.02, troughAzimuth: 10, rms: 0.001, residuals: [] }
    const pending = pr.newPending(4, {
      points: [],
      type: 'joint',
      confidence: null,
      comment: '',
      suggested: true,
      fit,
    })
    const rows = pr.pickRows([saved(1, 31, 60, 300), saved(2, 30, 20, 10)], [pending])
    expect(rows.map((r) => r.key)).toEqual(['pick:2', 'pending:4', 'pick:1'])
    expect(rows[1]).toMatchObject({ status: 'saving', heightMm: 20, rmsMm: 1, suggested: true })
    expect(pr.stepKey(rows, null, 1)?.key).toBe('pick:2')
    expect(pr.stepKey(rows, null, -1)?.key).toBe('pick:1')
    expect(pr.stepKey(rows, 'pending:4', 1)?.key).toBe('pick:1')
    expect(pr.stepKey(rows, 'pick:1', 1)?.key).toBe('pick:1')
    expect(pr.stepKey([], null, 1)).toBeNull()
  })

  it('pendingBody() sends only what was given; newPending() gives every pick its own key', () => {
    const fit = { depth: 1, height: 0, troughAzimuth: 0, rms: 0, residuals: [] }
    const fields = {
      points: [],
      type: 'vein',
      confidence: null,
      comment: '',
      suggested: false,
      fit,
    }
    const a = pr.newPending(1, fields)
    const b = pr.newPending(2, fields)
    expect(a.idempotencyKey).not.toBe(b.idempotencyKey)
    expect(pr.pendingBody(a)).toEqual({ points: [], type: 'vein' })
  })
})

describe('the upload form', () => {
  const png = new File([new Uint8Array([1])], 'gsq-bh02-atv.png', { type: 'image/png' })
  const las = new File(['~V'], 'GSQ-BH02.LAS')

  it('checkUpload(): a picture needs both depths, the bottom below the top; a LAS file does not', () => {
    const d = { ...uf.emptyUpload(), file: png, topDepth: 30, bottomDepth: 29 }
    expect(uf.checkUpload(d)).toEqual({ bottomDepth: 'Must be deeper than the top.' })
    expect(uf.checkUpload({ ...uf.emptyUpload(), file: las })).toEqual({})
    expect(Object.keys(uf.checkUpload(uf.emptyUpload()))).toEqual(['file'])
  })

  it('toUpload(): LAS depths come from the file; which north only for north-referenced images', () => {
    const d = { ...uf.emptyUpload(), file: las, topDepth: 1, bottomDepth: 2 }
    expect(uf.toUpload(d)).toMatchObject({ topDepth: undefined, bottomDepth: undefined })
    const hs = { ...uf.emptyUpload(), file: png, azimuthReference: 'highside' as const }
    expect(uf.toUpload(hs, true)).toMatchObject({
      northReference: undefined,
      confirmDuplicate: true,
    })
  })

  it('uploadErrors(): server details land on their field, the rest under the form', () => {
    expect(
      uf.uploadErrors(
        [
          { path: 'body.bottomDepth', message: 'must be below topDepth' },
          { path: 'file', message: 'not a PNG, JPEG, TIFF or LAS file' },
          { path: 'body.extra', message: 'unknown field' },
        ],
        'Invalid input',
      ),
    ).toEqual({
      bottomDepth: 'must be below topDepth',
      file: 'not a PNG, JPEG, TIFF or LAS file',
      form: 'body.extra: unknown field',
    })
    expect(uf.uploadErrors([], 'The file is too large.')).toEqual({
      file: 'The file is too large.',
    })
  })

  it('nominalDiameterMm(): NQ 75.7, HQ 96, PQ 122.6 mm (common practice, from memory)', () => {
    expect(uf.nominalDiameterMm('HQ3')).toBe(96)
    expect(uf.nominalDiameterMm('nq')).toBe(75.7)
    expect(uf.nominalDiameterMm('BQ')).toBeUndefined()
  })
})
