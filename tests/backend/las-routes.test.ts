import { describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { auditEvents, imports } from '../../schema/index'
import { countRows } from './fixture'
import { lasBytes, lasSuite } from './las-setup'

const ctx = lasSuite('GSQ-BH02')
const logs = (hole = ctx.holeId, project = ctx.fx.projectId) =>
  `/api/projects/${project}/holes/${hole}/logs`

const counts = async () => ({
  imports: await countRows(ctx.fx.db, 'imports'),
  curves: await countRows(ctx.fx.db, 'log_curves'),
})

describe('POST /api/projects/:projectId/holes/:ctx.holeId/logs', () => {
  it('POST logs (unwrapped LAS 2.0) → 201 preview; the import is kept with its original bytes', async () => {
    const bytes = lasBytes('gsq-bh02-plain.las')
    const res = await ctx.logger.upload(logs(), bytes, 'gsq-bh02-plain.las')
    expect(res.status).toBe(201)
    const data = res.body.data
    expect(data).toMatchObject({
      fileName: 'gsq-bh02-plain.las',
      version: '2.0',
      wrap: false,
      depthUnit: 'M',
      index: { mnemonic: 'DEPT', unit: 'M' },
      depthRange: { from: 10, to: 12 },
      step: 0.25,
      sampleCount: 9,
      problems: [],
      wellNameMatchesHole: true,
      deviation: null,
    })
    expect(data.well).toMatchObject({
      name: 'GSQ-BH02',
      company: 'GREYSCAR QUARRY LTD',
      uwi: 'GSQ-BH02-L1',
      date: '2024-03-14',
      start: 10,
      stop: 12,
      nullValue: -999.25,
    })
    expect(data.curves).toEqual([
      {
        mnemonic: 'GR',
        unit: 'GAPI',
        description: 'NATURAL GAMMA',
        nullCount: 1,
        min: 45.2,
        max: 61.35,
      },
      {
        mnemonic: 'DEN',
        unit: 'G/CC',
        description: 'BULK DENSITY',
        nullCount: 1,
        min: 2.65,
        max: 2.702,
      },
      {
        mnemonic: 'RES',
        unit: 'OHMM',
        description: 'RESISTIVITY',
        nullCount: 1,
        min: 98.6,
        max: 120.5,
      },
    ])
    const [row] = await ctx.fx.db.select().from(imports).where(eq(imports.id, data.importId))
    expect(row).toMatchObject({ kind: 'las', status: 'previewed', holeId: ctx.holeId, rowCount: 9 })
    expect(row.createdBy).toBe(ctx.fx.userIds.logger)
    expect(Buffer.compare(row.file, bytes)).toBe(0)
    const events = await ctx.fx.db
      .select()
      .from(auditEvents)
      .where(and(eq(auditEvents.entity, 'import'), eq(auditEvents.entityId, data.importId)))
    expect(events.map((e) => e.action)).toEqual(['create'])
  })

  it('POST logs (feet, deviation channels) → depths in metres, AZI/DEVI reported, name mismatch flagged', async () => {
    const res = await ctx.logger.upload(logs(), lasBytes('gsq-bh03-feet-deviation.las'), 'bh03.las')
    expect(res.status).toBe(201)
    expect(res.body.data).toMatchObject({
      depthUnit: 'FT',
      depthRange: { from: 0, to: 12.192 },
      step: 1.524,
      wellNameMatchesHole: false,
      deviation: { azimuthCurve: 'AZI', inclinationCurve: 'DEVI' },
    })
  })

  it.each([
    ['broken-no-ascii.las', 12],
    ['broken-curve-count.las', 16],
    ['broken-text-in-data.las', 16],
    ['broken-truncated.las', 18],
    ['broken-version.las', 2],
    ['broken-binary.las', 3],
    ['broken-no-version-first.las', 1],
  ])('POST logs (%s) → 400 at file.line.%i, nothing stored, under a second', async (name, line) => {
    const before = await counts()
    const t0 = performance.now()
    const res = await ctx.logger.upload(logs(), lasBytes(name), name)
    expect(performance.now() - t0).toBeLessThan(1000)
    expect(res.status).toBe(400)
    expect(res.body.error.code).toBe('invalid_file')
    expect(res.body.error.details[0].path).toBe(`file.line.${line}`)
    expect(res.body.error.message).toContain(`Line ${line}:`)
    expect(await counts()).toEqual(before)
  })

  it('POST logs → 403 for ctx.viewer, 404 for a non-member and for another project’s hole', async () => {
    const before = await counts()
    const bytes = lasBytes('gsq-bh02-plain.las')
    expect((await ctx.viewer.upload(logs(), bytes, 'a.las')).status).toBe(403)
    expect((await ctx.outsider.upload(logs(), bytes, 'a.las')).status).toBe(404)
    expect(
      (await ctx.logger.upload(logs(ctx.holeId, ctx.fx.otherProjectId), bytes, 'a.las')).status,
    ).toBe(404)
    expect((await ctx.logger.upload(logs(999_999), bytes, 'a.las')).status).toBe(404)
    expect(await counts()).toEqual(before)
  })
})

describe('POST /api/projects/:projectId/holes/:ctx.holeId/logs/imports/:importId/commit', () => {
  const preview = async (name: string, hole = ctx.holeId) =>
    (await ctx.logger.upload(logs(hole), lasBytes(name), name)).body.data.importId as string

  it('POST commit → one row per curve, depths shifted, NULL kept as null; the import is committed', async () => {
    const importId = await preview('gsq-bh02-plain.las')
    const res = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, { depthShift: 0.5 })
    expect(res.status).toBe(200)
    expect(res.body.data.curves.map((c: { mnemonic: string }) => c.mnemonic)).toEqual([
      'GR',
      'DEN',
      'RES',
    ])
    const gr = await ctx.logger.get(`${logs()}/${res.body.data.curves[0].id}`)
    expect(gr.body.data).toEqual({
      id: res.body.data.curves[0].id,
      mnemonic: 'GR',
      unit: 'GAPI',
      depths: [10.5, 10.75, 11, 11.25, 11.5, 11.75, 12, 12.25, 12.5],
      values: [45.2, 47.85, null, 52.1, 55, 61.35, 58.4, 50.05, 48.6],
    })
    const [row] = await ctx.fx.db.select().from(imports).where(eq(imports.id, importId))
    expect(row.status).toBe('committed')
    expect(row.options).toMatchObject({ depthShift: 0.5, curves: ['GR', 'DEN', 'RES'] })
    const again = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, {})
    expect(again.status).toBe(409)
    expect(again.body.error.code).toBe('import_not_previewed')
  })

  it('POST commit (feet) → depths ×0.3048; leading NULL samples not stored', async () => {
    const importId = await preview('gsq-bh03-feet-deviation.las')
    const res = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, {
      curves: ['GR', 'AZI'],
    })
    const byName = (m: string) =>
      (res.body.data.curves as { id: number; mnemonic: string }[]).find((c) => c.mnemonic === m)!
    // stored in the file's order, whatever the order asked for
    expect(res.body.data.curves.map((c: { mnemonic: string }) => c.mnemonic)).toEqual(['AZI', 'GR'])
    const [gr, azi] = [byName('GR'), byName('AZI')]
    const grData = (await ctx.logger.get(`${logs()}/${gr.id}`)).body.data
    expect(grData.depths).toEqual([1.524, 3.048, 4.572, 6.096, 7.62, 9.144, 10.668, 12.192])
    expect(grData.values[0]).toBe(40.5)
    const aziData = (await ctx.logger.get(`${logs()}/${azi.id}`)).body.data
    expect(aziData.depths[0]).toBe(0)
    expect(aziData.values.slice(3, 5)).toEqual([358.8, 0.4])
  })

  it('POST commit (wrapped) → the wrapped values, the chosen curve only', async () => {
    const importId = await preview('gsq-bh02-wrapped.las')
    const res = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, { curves: ['PE'] })
    const pe = (await ctx.logger.get(`${logs()}/${res.body.data.curves[0].id}`)).body.data
    expect(pe).toMatchObject({ depths: [14, 14.2, 14.4, 14.6], values: [3.12, null, 3.18, 3.21] })
  })

  it('POST commit with unknown curves or a bad body → 400, nothing stored', async () => {
    const importId = await preview('gsq-bh05-single-space.las')
    const before = await counts()
    const res = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, {
      curves: ['XX', 'DEPT'],
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([
      { path: 'body.curves.0', message: 'No such curve in the file.' },
      { path: 'body.curves.1', message: 'That is the depth index.' },
    ])
    const bad = await ctx.logger.post(`${logs()}/imports/${importId}/commit`, { depthShift: 'x' })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.depthShift')
    expect(await counts()).toEqual(before)
  })

  it('POST commit → 404 through another hole, for an unknown id; 403 for ctx.viewer', async () => {
    const importId = await preview('gsq-bh05-single-space.las')
    const before = await counts()
    expect(
      (await ctx.logger.post(`${logs(ctx.otherHoleId)}/imports/${importId}/commit`)).status,
    ).toBe(404)
    const unknown = '00000000-0000-4000-8000-000000000000'
    expect((await ctx.logger.post(`${logs()}/imports/${unknown}/commit`)).status).toBe(404)
    expect((await ctx.logger.post(`${logs()}/imports/not-a-uuid/commit`)).status).toBe(404)
    expect((await ctx.viewer.post(`${logs()}/imports/${importId}/commit`)).status).toBe(403)
    expect((await ctx.outsider.post(`${logs()}/imports/${importId}/commit`)).status).toBe(404)
    expect(await counts()).toEqual(before)
  })
})
