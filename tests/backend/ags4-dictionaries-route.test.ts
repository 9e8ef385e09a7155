import { describe, expect, it } from 'vitest'
import { and, eq } from 'drizzle-orm'
import { agsDictionaryGroups, auditEvents } from '../../schema/index'
import { sha256Hex } from '../../backend/src/exports/hash'
import { countRows } from './fixture'
import { dictionaryText, edit, lab, lineOf, site } from './ags4-files'
import {
  bytes,
  dictionariesUrl as url,
  dictionarySuite,
  dictionaryUploadName as fileName,
} from './ags4-dictionaries-setup'

// POST /api/ags/dictionaries: an administrator loads an edition's standard dictionary (here our
// own test subset of AGS 4.1.1, testdata/ags4/dictionary), replacing one loaded before.
const ctx = dictionarySuite()
const load = (text?: string, who?: string) => ctx.load(text, who)

describe('POST /api/ags/dictionaries', () => {
  it('POST /api/ags/dictionaries → 201: the edition from TRAN_AGS, counts, SHA-256, who and when', async () => {
    const res = await load()
    expect(res.status).toBe(201)
    expect(res.body.meta).toEqual({ replaced: false })
    expect(res.body.data).toMatchObject({
      edition: '4.1.1',
      fileName: 'gsq-test-dictionary-4-1-1.ags',
      fileSize: bytes(dictionaryText).length,
      sha256: sha256Hex(bytes(dictionaryText)),
      groupCount: 28,
      headingCount: 220,
      loadedBy: ctx.fx.userIds.admin,
      loadedByName: 'admin',
    })
    const groups = await ctx.fx.db
      .select()
      .from(agsDictionaryGroups)
      .orderBy(agsDictionaryGroups.position)
    expect(groups.map((g) => g.name).slice(0, 3)).toEqual(['PROJ', 'ABBR', 'DICT'])
    expect(groups.find((g) => g.name === 'SAMP')).toMatchObject({
      parent: 'LOCA',
      title: 'Group SAMP (test subset)',
    })
    const [event] = await ctx.fx.db.select().from(auditEvents)
    expect(event).toMatchObject({
      projectId: null,
      userId: ctx.fx.userIds.admin,
      entity: 'ags-dictionary',
      entityId: '4.1.1',
      action: 'create',
    })
  })

  it('POST /api/ags/dictionaries → 200 replaces the edition in one transaction, audited with before and after', async () => {
    await load()
    const smaller = edit(
      dictionaryText,
      '"DATA","HEADING","GRAT","GRAT_PERP","OTHER","0DP","Test subset definition","%",""\r\n',
      '',
    )
    const res = await load(smaller)
    expect(res.status).toBe(200)
    expect(res.body.meta).toEqual({ replaced: true })
    expect(res.body.data).toMatchObject({ headingCount: 219, sha256: sha256Hex(bytes(smaller)) })
    expect(await countRows(ctx.fx.db, 'ags_dictionaries')).toBe(1)
    expect(await countRows(ctx.fx.db, 'ags_dictionary_groups')).toBe(28)
    const [grat] = await ctx.fx.db
      .select()
      .from(agsDictionaryGroups)
      .where(and(eq(agsDictionaryGroups.edition, '4.1.1'), eq(agsDictionaryGroups.name, 'GRAT')))
    expect(grat.headings.map((h) => h.name)).not.toContain('GRAT_PERP')
    const events = await ctx.fx.db.select().from(auditEvents).orderBy(auditEvents.id)
    expect(events.map((e) => e.action)).toEqual(['create', 'replace'])
    expect(events[1].before).toMatchObject({ headingCount: 220 })
    expect(events[1].after).toMatchObject({ headingCount: 219 })
  })

  it('POST /api/ags/dictionaries → a refused replacement leaves the loaded edition whole', async () => {
    await load()
    const broken = edit(dictionaryText, '"GRAT_SIZE","KEY","3SF"', '"GRAT_SIZE","KEY","3XF"')
    const res = await load(broken)
    expect(res.status).toBe(400)
    expect((await ctx.as.admin!.get(url)).body.data[0]).toMatchObject({ headingCount: 220 })
    expect(await countRows(ctx.fx.db, 'ags_dictionary_groups')).toBe(28)
  })

  it('POST /api/ags/dictionaries → concurrent loads of one edition: both answer, one edition stays', async () => {
    const [a, b] = await Promise.all([load(), load()])
    expect([a.status, b.status].sort()).toEqual([200, 201])
    expect(await countRows(ctx.fx.db, 'ags_dictionary_groups')).toBe(28)
  })

  it('POST /api/ags/dictionaries → 400 naming the line and heading: not a dictionary, a bad DICT row', async () => {
    const data = await load(site)
    expect(data.status).toBe(400)
    expect(data.body.error).toMatchObject({
      code: 'invalid_file',
      details: [
        {
          path: 'file',
          message: 'the file has no DICT group: it is not an AGS4 standard dictionary',
        },
      ],
    })
    const userGroups = await load(lab)
    expect(userGroups.body.error.details).toEqual([
      {
        path: `file.line.${lineOf(lab, '"DATA","GROUP","GSQC"')}.DICT_PGRP`,
        message: 'the parent group SAMP of GSQC is not defined in the file',
      },
    ])
    const type = edit(dictionaryText, '"GRAT_SIZE","KEY","3SF"', '"GRAT_SIZE","KEY","3XF"')
    expect((await load(type)).body.error.details).toEqual([
      {
        path: `file.line.${lineOf(type, '"3XF"')}.DICT_DTYP`,
        message: 'DICT_DTYP "3XF": not an AGS4 data type',
      },
    ])
    expect(await countRows(ctx.fx.db, 'ags_dictionaries')).toBe(0)
    expect(await countRows(ctx.fx.db, 'audit_events')).toBe(0)
  })

  it('POST /api/ags/dictionaries → the edition field: used where TRAN_AGS is missing, refused where it differs or is malformed', async () => {
    const noEdition = edit(dictionaryText, '"4.1.1","Downdip tests"', '"","Downdip tests"')
    const none = await load(noEdition)
    expect(none.status).toBe(400)
    expect(none.body.error.details).toEqual([
      { path: 'body.edition', message: 'the file has no TRAN_AGS: give the edition' },
    ])
    const given = await ctx.as
      .admin!.postMultipart(url)
      .field('edition', '4.0.4')
      .attach('file', bytes(noEdition), fileName)
    expect(given.status).toBe(201)
    expect(given.body.data.edition).toBe('4.0.4')
    const differs = await ctx.as
      .admin!.postMultipart(url)
      .field('edition', '4.0.4')
      .attach('file', bytes(dictionaryText), fileName)
    expect(differs.status).toBe(400)
    expect(differs.body.error.details).toEqual([
      { path: 'body.edition', message: "the file's TRAN_AGS (line 11) says 4.1.1" },
    ])
    const malformed = await ctx.as
      .admin!.postMultipart(url)
      .field('edition', 'four')
      .attach('file', bytes(dictionaryText), fileName)
    expect(malformed.status).toBe(400)
    expect(malformed.body.error.details[0].path).toBe('body.edition')
    const extra = await ctx.as
      .admin!.postMultipart(url)
      .field('note', 'x')
      .attach('file', bytes(dictionaryText), fileName)
    expect(extra.status).toBe(400)
    expect(extra.body.error.details[0].path).toBe('body')
  })

  it('POST /api/ags/dictionaries → 401 signed out, 403 for every role but admin (before the upload is read), 403 without the CSRF token', async () => {
    expect((await load(dictionaryText, 'anonymous')).status).toBe(401)
    for (const who of ['lead', 'engineer', 'logger', 'viewer', 'outsider']) {
      const res = await load(dictionaryText, who)
      expect(res.status, who).toBe(403)
      expect(res.body.error.code).toBe('forbidden')
    }
    const agent = await ctx.adminWithoutToken()
    const noToken = await agent.post(url).attach('file', bytes(dictionaryText), fileName)
    expect(noToken.status).toBe(403)
    expect(noToken.body.error.code).toBe('csrf_token')
    expect(await countRows(ctx.fx.db, 'ags_dictionaries')).toBe(0)
  })
})
