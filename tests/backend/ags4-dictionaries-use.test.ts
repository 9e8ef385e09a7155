import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { auditEvents } from '../../schema/index'
import { actors, countRows } from './fixture'
import { dictionaryText, edit, lineOf, site } from './ags4-files'
import {
  bytes,
  dictionariesUrl as url,
  dictionarySuite,
  dictionaryUploadName as fileName,
} from './ags4-dictionaries-setup'

// GET and DELETE /api/ags/dictionaries, and POST /api/ags/validate with a dictionary loaded (our
// own test subset of AGS 4.1.1): a file declaring that edition is checked against it.
const ctx = dictionarySuite()
const load = (text?: string, who?: string) => ctx.load(text, who)

describe('GET /api/ags/dictionaries', () => {
  it('GET /api/ags/dictionaries → 200 for every signed-in user, newest edition first; 401 signed out', async () => {
    await load()
    const noEdition = edit(dictionaryText, '"4.1.1","Downdip tests"', '"","Downdip tests"')
    await ctx.as
      .admin!.postMultipart(url)
      .field('edition', '4.0.4')
      .attach('file', bytes(noEdition), fileName)
    for (const who of actors) {
      const res = await ctx.as[who]!.get(url)
      expect(res.status, who).toBe(200)
      expect(res.body.data.map((d: { edition: string }) => d.edition)).toEqual(['4.1.1', '4.0.4'])
      expect(res.body.meta).toEqual({ count: 2 })
    }
    expect((await ctx.as.anonymous!.get(url)).status).toBe(401)
  })
})

describe('DELETE /api/ags/dictionaries/:edition', () => {
  it('DELETE /api/ags/dictionaries/:edition → 204 and audited; 404 the second time; 400 a malformed edition', async () => {
    await load()
    const res = await ctx.as.admin!.delete(`${url}/4.1.1`)
    expect(res.status).toBe(204)
    expect(await countRows(ctx.fx.db, 'ags_dictionary_groups')).toBe(0)
    const [event] = await ctx.fx.db
      .select()
      .from(auditEvents)
      .where(eq(auditEvents.action, 'delete'))
    expect(event).toMatchObject({ entity: 'ags-dictionary', entityId: '4.1.1', after: null })
    expect(event.before).toMatchObject({ edition: '4.1.1', groupCount: 28 })
    expect((await ctx.as.admin!.delete(`${url}/4.1.1`)).status).toBe(404)
    const bad = await ctx.as.admin!.delete(`${url}/latest`)
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('params.edition')
  })

  it('DELETE /api/ags/dictionaries/:edition → 401 signed out, 403 for every role but admin, 403 without the CSRF token', async () => {
    await load()
    expect((await ctx.as.anonymous!.delete(`${url}/4.1.1`)).status).toBe(401)
    for (const who of ['lead', 'engineer', 'logger', 'viewer', 'outsider'])
      expect((await ctx.as[who]!.delete(`${url}/4.1.1`)).status, who).toBe(403)
    const agent = await ctx.adminWithoutToken()
    const noToken = await agent.delete(`${url}/4.1.1`)
    expect([noToken.status, noToken.body.error.code]).toEqual([403, 'csrf_token'])
    expect(await countRows(ctx.fx.db, 'ags_dictionaries')).toBe(1)
  })
})

describe('POST /api/ags/validate with a loaded dictionary', () => {
  const check = async (text: string) =>
    (await ctx.as.viewer!.upload('/api/ags/validate', bytes(text), 'received.ags')).body.data

  it("POST /api/ags/validate → the declared edition's loaded dictionary: nothing unchecked, and a fault in SAMP found", async () => {
    const before = await check(site)
    expect(before).toMatchObject({
      errors: 0,
      dictionary: { edition: '4.1.1', source: 'built-in' },
    })
    expect(before.unchecked.map((u: { group: string }) => u.group)).toContain('GEOL')
    await load()
    const after = await check(site)
    expect(after).toMatchObject({
      errors: 0,
      warnings: 0,
      unchecked: [],
      dictionary: { edition: '4.1.1', source: 'loaded' },
    })
    const broken = edit(site, '"GSQ-BH06","8.00","1","C"', '"GSQ-BH09","8.00","1","C"')
    expect((await check(broken)).findings).toEqual([
      {
        line: lineOf(broken, '"GSQ-BH09"'),
        rule: '10c',
        severity: 'error',
        message: 'Rule 10c: no LOCA row has LOCA_ID "GSQ-BH09"',
      },
    ])
  })

  it('POST /api/ags/validate → a file of another edition is not checked against the 4.1.1 dictionary', async () => {
    await load()
    const other = edit(site, '"4.1.1","Greyscar Aggregates"', '"4.0.4","Greyscar Aggregates"')
    const res = await check(other)
    expect(res.dictionary).toEqual({ edition: '4.1.1', source: 'built-in' })
    expect(res.unchecked[0].message).toContain('the 4.0.4 standard dictionary is not loaded')
    // after removal the 4.1.1 file falls back to the built-in groups
    await ctx.as.admin!.delete(`${url}/4.1.1`)
    expect((await check(site)).dictionary.source).toBe('built-in')
  })
})
