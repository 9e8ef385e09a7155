import { beforeAll, describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { intervals } from '../../schema/index'
import { contentHashOf } from '../../backend/src/exports/hash'
import { runPackBuild } from '../../backend/src/services/pack-build'
import type { Client } from './fixture'
import { packSuite } from './pack-setup'

const { ctx, url, holeUrl, waitFor } = packSuite()
const as = ctx.as

describe('a built pack: downloads and issue', () => {
  let id = ''
  beforeAll(async () => {
    const res = await as.lead!.post(url(), {})
    id = res.body.data.id
    expect((await waitFor(as.lead!, id)).status).toBe('ready')
  })

  it('GET files → viewer 403 before issue; engineer 200; unknown file 404', async () => {
    expect((await as.viewer!.get(`${url()}/${id}/files/sets.csv`)).status).toBe(403)
    expect((await as.engineer!.get(`${url()}/${id}/files/nope.csv`)).status).toBe(404)
    expect((await as.outsider!.get(`${url()}/${id}/files/sets.csv`)).status).toBe(404)
  })

  it('every pack route → 401 signed out, 404 for a non-member', async () => {
    const routes = [
      (c: Client) => c.get(`${url()}/${id}`),
      (c: Client) => c.post(`${url()}/${id}/issue`),
      (c: Client) => c.post(`${url()}/${id}/rebuild`),
      (c: Client) => c.delete(`${url()}/${id}`),
      (c: Client) => c.get(`${url()}/${id}/files/report.pdf`),
    ]
    for (const call of routes) {
      expect((await call(as.anonymous!)).status).toBe(401)
      expect((await call(as.outsider!)).status).toBe(404)
    }
    for (const who of ['viewer', 'logger', 'engineer'])
      for (const call of routes.slice(1, 4)) expect((await call(as[who]!)).status).toBe(403)
  })

  it('POST /:packId/issue → 403 engineer; lead freezes it and marks its approved intervals issued; then 409', async () => {
    expect((await as.engineer!.post(`${url()}/${id}/issue`)).status).toBe(403)
    expect((await as.logger!.post(`${url()}/${id}/issue`)).status).toBe(403)
    const res = await as.lead!.post(`${url()}/${id}/issue`)
    expect(res.status).toBe(200)
    expect(res.body.data).toMatchObject({ status: 'issued', issuedByName: 'lead' })
    expect(res.body.data.contentHash).toBe(contentHashOf(res.body.data.files))
    const rows = await ctx.fx.db
      .select()
      .from(intervals)
      .where(eq(intervals.holeId, ctx.fx.holeId))
      .orderBy(intervals.fromDepth)
    expect(rows.map((i) => [i.name, i.status])).toEqual([
      ['upper', 'issued'],
      ['lower', 'issued'],
    ])
    // Issuing keeps the sign-off: who checked and who approved.
    expect(rows.every((i) => i.checkedBy === ctx.fx.userIds.engineer)).toBe(true)
    expect(rows.every((i) => i.approvedBy === ctx.fx.userIds.lead)).toBe(true)
    for (const again of [
      as.lead!.post(`${url()}/${id}/issue`),
      as.lead!.delete(`${url()}/${id}`),
      as.lead!.post(`${url()}/${id}/rebuild`),
    ]) {
      const r = await again
      expect(r.status).toBe(409)
      expect(r.body.error.code).toBe('pack_issued')
    }
    const v = await as.viewer!.get(`${url()}/${id}/files/sets.csv`)
    expect(v.status).toBe(200)
    expect(v.headers['x-content-sha256']).toBe(
      res.body.data.files.find((f: { name: string }) => f.name === 'sets.csv').sha256,
    )
  })
})

describe('DELETE /api/projects/:projectId/packs/:packId', () => {
  it('DELETE → 403 engineer, 204 lead for a non-issued pack, then 404', async () => {
    const res = await as.lead!.post(url(), { holeIds: [ctx.fx.holeId] })
    const pack = await waitFor(as.lead!, res.body.data.id)
    expect(pack.status).toBe('ready')
    // A retried job (server restart mid-build) rebuilds from scratch: same files, no duplicates.
    await runPackBuild(ctx.fx.db, pack.id)
    const again = (await as.lead!.get(`${url()}/${pack.id}`)).body.data
    expect(again.status).toBe('ready')
    expect(again.files.map((f: { name: string }) => f.name)).toEqual(
      pack.files.map((f: { name: string }) => f.name),
    )
    const sha = (p: typeof pack, name: string) =>
      p.files.find((f: { name: string }) => f.name === name).sha256
    expect(sha(again, 'structures.csv')).toBe(sha(pack, 'structures.csv'))
    expect(again.inputsHash).toBe(pack.inputsHash)
    // New data after the build (below every interval): issuing would freeze a stale pack.
    const vein = await as.logger!.post(`${holeUrl()}/structures`, {
      depth: 90,
      type: 'vein',
      alpha: 70,
      beta: 20,
    })
    expect(vein.status).toBe(201)
    const stale = await as.lead!.post(`${url()}/${pack.id}/issue`)
    expect(stale.status).toBe(409)
    expect(stale.body.error.code).toBe('pack_stale')
    expect((await as.engineer!.delete(`${url()}/${pack.id}`)).status).toBe(403)
    expect((await as.lead!.delete(`${url()}/${pack.id}`)).status).toBe(204)
    expect((await as.lead!.get(`${url()}/${pack.id}`)).status).toBe(404)
    expect((await as.lead!.get(`${url()}/not-a-uuid`)).status).toBe(404)
  })
})
