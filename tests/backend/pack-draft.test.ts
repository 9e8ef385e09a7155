import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { intervals, packs, projects } from '../../schema/index'
import { validateAgs } from '../../backend/src/exports/ags4-validate'
import { loadPackData } from '../../backend/src/services/pack-data'
import { buildReport } from '../../backend/src/exports/pdf-report'
import { packSuite } from './pack-setup'
import { agsGroup, pdfText } from './pack-text'

// `upper` is approved, `lower` stays a draft.
const { ctx, url, holeUrl, waitFor, fileText, approve } = packSuite({ draft: true })
const as = ctx.as
const MARK = 'DRAFT — not for design'

const statuses = async () =>
  (
    await ctx.fx.db
      .select({ name: intervals.name, status: intervals.status })
      .from(intervals)
      .where(eq(intervals.holeId, ctx.fx.holeId))
      .orderBy(intervals.fromDepth)
  ).map((i) => [i.name, i.status])

describe('a pack holding a draft interval', () => {
  let id = ''

  it('POST /packs {} → a draft preview: draft = true, every CSV starts with the draft mark', async () => {
    id = (await as.lead!.post(url(), {})).body.data.id
    const pack = await waitFor(as.lead!, id)
    expect(pack).toMatchObject({ status: 'ready', draft: true })
    expect(pack.message).toMatch(/^Draft preview/)
    for (const name of ['structures.csv', 'sets.csv', 'intersections.csv']) {
      const text = (await fileText(as.engineer!, id, name)).toString('utf8')
      expect(text.startsWith(`# ${MARK}`)).toBe(true)
      expect(text).toMatch(/# TST-01 lower \(40\.00-80\.00 m\) draft: not checked; not approved\./)
    }
  })

  it('project.ags says DRAFT in PROJ_MEMO and TRAN_STAT and still passes the validator', async () => {
    const ags = (await fileText(as.engineer!, id, 'project.ags')).toString('ascii')
    expect(validateAgs(ags)).toEqual([])
    // AGS4 files are ASCII: the em dash is written as a hyphen.
    expect(agsGroup(ags, 'TRAN')[0].TRAN_STAT).toBe('DRAFT - not for design')
    expect(agsGroup(ags, 'PROJ')[0].PROJ_MEMO.startsWith('DRAFT - not for design')).toBe(true)
    expect(agsGroup(ags, 'DINT').map((r) => [r.DINT_NAME, r.DINT_CHKB, r.DINT_APPB])).toEqual([
      ['upper', 'engineer', 'lead'],
      ['lower', '', ''],
    ])
  })

  it('net SVGs carry the draft mark (the PNGs are drawn from them)', async () => {
    for (const intervalId of [ctx.intervalId, ctx.lowerId]) {
      const svg = (await fileText(as.engineer!, id, `net-${intervalId}.svg`)).toString('utf8')
      expect(svg).toContain(MARK)
    }
  })

  it('buildReport() of a draft: every page has the draft mark in its header and its footer', async () => {
    const [project] = await ctx.fx.db
      .select()
      .from(projects)
      .where(eq(projects.id, ctx.fx.projectId))
    const data = await loadPackData(ctx.fx.db, project, {})
    expect(data.draft).toBe(true)
    const pdf = await buildReport(data, {
      packId: '00000000-0000-4000-8000-000000000000',
      builtBy: 'lead',
      builtAt: new Date('2026-12-01T10:00:00Z'),
      font: 'helvetica',
      compress: false,
    })
    const pages = pdfText(pdf)
    // Cover, two interval pages, the depth view.
    expect(pages).toHaveLength(4)
    for (const page of pages) {
      const marked = page.filter((line) => line.includes(MARK))
      expect(marked.length).toBeGreaterThanOrEqual(2)
      expect(page.some((line) => /^DRAFT — not for design - .* - page \d of 4/.test(line))).toBe(
        true,
      )
    }
    expect(pages[0]).toContain('not approved')
  })

  it('POST /:packId/issue → 409 pack_draft; no interval changes status', async () => {
    const before = await statuses()
    expect(before).toEqual([
      ['upper', 'approved'],
      ['lower', 'draft'],
    ])
    const res = await as.lead!.post(`${url()}/${id}/issue`)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('pack_draft')
    expect(await statuses()).toEqual(before)
    const [row] = await ctx.fx.db.select().from(packs).where(eq(packs.id, id))
    expect(row.status).toBe('ready')
  })
})

describe('POST /:packId/issue re-checks approval', () => {
  it('POST /:packId/issue → 409 interval_not_approved when a packed interval was reopened after the build', async () => {
    await approve(ctx.lowerId)
    const id = (await as.lead!.post(url(), {})).body.data.id
    expect(await waitFor(as.lead!, id)).toMatchObject({ status: 'ready', draft: false })
    const upper = `${holeUrl()}/intervals/${ctx.intervalId}`
    const { version } = (await as.lead!.get(upper)).body.data
    const reopened = await as.lead!.post(`${upper}/reopen`, {
      version,
      reason: 'Set J2 needs another look',
    })
    expect(reopened.status).toBe(200)
    const res = await as.lead!.post(`${url()}/${id}/issue`)
    expect(res.status).toBe(409)
    expect(res.body.error.code).toBe('interval_not_approved')
    expect(res.body.error.message).toContain('"upper" is draft')
    expect(await statuses()).toEqual([
      ['upper', 'draft'],
      ['lower', 'approved'],
    ])
  })
})
