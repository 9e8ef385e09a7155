import { describe, expect, it } from 'vitest'
import { countRows } from './fixture'
import { lasBytes, lasSuite } from './las-setup'

// CWLS LAS 2.0 §2.3: the first curve is the index (depth); it must be a real, increasing number.
// A depth of 1e308 or a shift that puts a log kilometres off the hole is refused, nothing stored.
const ctx = lasSuite('GSQ-BH02')
const logs = () => `/api/projects/${ctx.fx.projectId}/holes/${ctx.holeId}/logs`

describe('LAS depths out of range', () => {
  it('POST logs with a depth of 1e308 → 400 naming line 18, nothing stored', async () => {
    const before = await countRows(ctx.fx.db, 'imports')
    const name = 'broken-depth-overflow.las'
    const res = await ctx.logger.upload(logs(), lasBytes(name), name)
    expect(res.status).toBe(400)
    expect(res.body.error.details).toContainEqual({
      path: 'file.line.18',
      message: 'Depth 1e+308 is out of range (at most 100000 in any unit).',
    })
    expect(await countRows(ctx.fx.db, 'imports')).toBe(before)
  })

  it('POST commit with a depth shift that makes depths absurd → 400 naming body.depthShift, nothing stored', async () => {
    const up = await ctx.logger.upload(logs(), lasBytes('gsq-bh02-plain.las'), 'plain.las')
    expect(up.status).toBe(201)
    const res = await ctx.logger.post(`${logs()}/imports/${up.body.data.importId}/commit`, {
      depthShift: -500,
    })
    expect(res.status).toBe(400)
    expect(res.body.error.details).toEqual([
      {
        path: 'body.depthShift',
        message: 'gives depths -490.00–-488.00 m; stored depths must lie within -100–15000 m',
      },
    ])
    expect(await countRows(ctx.fx.db, 'log_curves')).toBe(0)
  })
})
