import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import { intervals, projects, structures } from '../../schema/index'
import { analyseInterval } from '../../backend/src/services/analysis'
import { validateAgs } from '../../backend/src/exports/ags4-validate'
import { loadPackData } from '../../backend/src/services/pack-data'
import { buildReport } from '../../backend/src/exports/pdf-report'
import { packSuite } from './pack-setup'
import { agsGroup, parseCsv, pdfText } from './pack-text'

const { ctx, url, waitFor, fileText } = packSuite()
const as = ctx.as
const stamp = /\d{4}-\d{2}-\d{2} \d{2}:\d{2} UTC/

describe('POST /api/projects/:projectId/packs', () => {
  it('POST /packs → 401 signed out, 404 non-member, 403 viewer/logger/engineer, 400 foreign ids', async () => {
    expect((await as.anonymous!.post(url(), {})).status).toBe(401)
    expect((await as.outsider!.post(url(), {})).status).toBe(404)
    for (const who of ['viewer', 'logger', 'engineer'])
      expect((await as[who]!.post(url(), {})).status).toBe(403)
    const bad = await as.lead!.post(url(), { intervalIds: [999999] })
    expect(bad.status).toBe(400)
    expect(bad.body.error.details[0].path).toBe('body.intervalIds')
    expect((await as.lead!.post(url(), { holeIds: ['x'] })).status).toBe(400)
  })
})

describe('a whole-project pack', () => {
  let id = ''
  it('POST /packs {} → 202 queued, then ready through the job queue with progress 100', async () => {
    const res = await as.lead!.post(url(), {})
    expect(res.status).toBe(202)
    expect(res.body.data).toMatchObject({ status: 'queued', progress: 0 })
    id = res.body.data.id
    const pack = await waitFor(as.lead!, id)
    expect(pack).toMatchObject({ status: 'ready', progress: 100, createdByName: 'lead' })
    expect(pack.draft).toBe(false)
    expect(pack.inputsHash).toMatch(/^[0-9a-f]{64}$/)
    expect(pack.files.map((f: { name: string }) => f.name).sort()).toEqual(
      [
        'intersections.csv',
        ...[ctx.intervalId, ctx.lowerId].flatMap((i) => [`net-${i}.png`, `net-${i}.svg`]),
        'project.ags',
        'report.pdf',
        'sets.csv',
        'structures.csv',
      ].sort(),
    )
    expect(pack.intervals.map((i: { name: string; status: string }) => [i.name, i.status])).toEqual(
      [
        ['upper', 'approved'],
        ['lower', 'approved'],
      ],
    )
    expect(pack.files.every((f: { size: number }) => f.size > 100)).toBe(true)
  })

  it('GET /packs → members list it; non-member 404; signed out 401', async () => {
    const list = await as.viewer!.get(url())
    expect(list.status).toBe(200)
    expect(list.body.data[0]).toMatchObject({ id, status: 'ready' })
    expect(list.body.data[0].files).toBeUndefined()
    expect((await as.outsider!.get(url())).status).toBe(404)
    expect((await as.anonymous!.get(url())).status).toBe(401)
  })

  it('sets.csv and intersections.csv carry analyseInterval numbers with the saved settings', async () => {
    const [interval] = await ctx.fx.db
      .select()
      .from(intervals)
      .where(eq(intervals.id, ctx.intervalId))
    const analysis = await analyseInterval(ctx.fx.db, interval)
    expect(analysis.sets.map((s) => s.count)).toEqual([3, 3])
    const csv = parseCsv((await fileText(as.engineer!, id, 'sets.csv')).toString())
    expect(csv.data).toHaveLength(5)
    csv.data.slice(0, 2).forEach((row, i) => {
      const s = analysis.sets[i]
      expect(row).toMatchObject({
        hole: 'TST-01',
        interval: 'upper',
        set: s.name,
        count: String(s.count),
        weighting: 'terzaghi',
      })
      expect(Number(row.mean_dip_deg)).toBe(s.mean!.dip)
      expect(Number(row.mean_dip_direction_deg)).toBe(s.mean!.dipDirection)
      expect(Number(row.fisher_k)).toBe(s.kappa)
      expect(Number(row.alpha95_deg)).toBe(s.alpha95)
      expect(Number(row.weighted_count)).toBe(s.weightedCount)
      // RQD: (18 + 12) / 40 over the two runs, weighted by overlap (15 m and 20 m) → 77.1 %
      expect(row.interval_rqd_pct).toBe(((90 * 15 + 60 * 20) / 35).toFixed(1))
    })
    expect(csv.data.map((r) => [r.interval, r.weighting])).toEqual([
      ['upper', 'terzaghi'],
      ['upper', 'terzaghi'],
      ['lower', 'none'],
      ['lower', 'none'],
      ['lower', 'none'],
    ])
    const x = parseCsv((await fileText(as.engineer!, id, 'intersections.csv')).toString())
    expect(x.data[0]).toEqual(
      expect.objectContaining({
        set_a: 'J1',
        set_b: 'J2',
        trend_deg: analysis.intersections[0].trend!.toFixed(2),
      }),
    )
    expect(x.data).toHaveLength(1 + 3)
  })

  it('every CSV starts with a # header naming each interval’s checker and approver with dates', async () => {
    for (const name of ['structures.csv', 'sets.csv', 'intersections.csv']) {
      const text = (await fileText(as.engineer!, id, name)).toString()
      const head = text.split('\r\n').filter((l) => l.startsWith('# '))
      expect(head[0]).toMatch(new RegExp(`^# Downdip design pack TST ${id.slice(0, 8)}: ${name}`))
      expect(text.startsWith(head.join('\r\n'))).toBe(true)
      expect(text).not.toContain('DRAFT')
      for (const interval of ['upper', 'lower']) {
        const line = head.find((l) => l.startsWith(`# TST-01 ${interval} `))!
        expect(line).toMatch(new RegExp(`checked by engineer on ${stamp.source}`))
        expect(line).toMatch(new RegExp(`approved by lead on ${stamp.source}`))
      }
      expect(head.find((l) => l.startsWith('# TST-01 lower'))).toContain(
        'unweighted Fisher statistics; exponential-kernel contours; face 65/230; friction 28 deg; lateral limit 25 deg; toppling limit 35 deg',
      )
    }
  })

  it('project.ags passes the validator; DINT names checker and approver; DISC rows carry the stored orientations', async () => {
    const ags = (await fileText(as.engineer!, id, 'project.ags')).toString('ascii')
    expect(validateAgs(ags)).toEqual([])
    expect(agsGroup(ags, 'DINT')).toEqual([
      expect.objectContaining({
        DINT_NAME: 'upper',
        DINT_STAT: 'approved',
        DINT_CHKB: 'engineer',
        DINT_APPB: 'lead',
        DINT_WGHT: 'terzaghi',
        DINT_CONT: 'kamb',
        DINT_FDIP: '70.00',
      }),
      expect.objectContaining({ DINT_NAME: 'lower', DINT_WGHT: 'none', DINT_LATL: '25.00' }),
    ])
    for (const row of agsGroup(ags, 'DINT'))
      for (const at of [row.DINT_CHKD, row.DINT_APPD])
        expect(at).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d$/)
    expect(agsGroup(ags, 'TRAN')[0].TRAN_STAT).toBe('Design pack')
    expect(ags).toContain('"TRAN_AGS"')
    expect(ags).toContain('"4.1.1"')
    expect(ags).toContain('must be checked by a competent person')
    const stored = await ctx.fx.db
      .select()
      .from(structures)
      .where(eq(structures.holeId, ctx.fx.holeId))
      .orderBy(structures.depth)
    const disc = ags
      .split('\r\n\r\n')
      .find((g) => g.startsWith('"GROUP","DISC"'))!
      .split('\r\n')
      .filter((l) => l.startsWith('"DATA"'))
    expect(disc).toHaveLength(stored.length)
    const head = ags
      .split('\r\n')
      .find((l) => l.startsWith('"HEADING","LOCA_ID","DISC_TOP"'))!
      .split(',')
    disc.forEach((line, i) => {
      const f = line.split(',').map((v) => v.replace(/"/g, ''))
      expect(Number(f[head.indexOf('"DISC_DIP"')])).toBe(Number(stored[i].dip!.toFixed(2)))
      expect(Number(f[head.indexOf('"DISC_DIR"')])).toBe(Number(stored[i].dipDirection!.toFixed(2)))
      expect(Number(f[head.indexOf('"DISC_ALPH"')])).toBe(Number(stored[i].alpha!.toFixed(1)))
    })
    expect(ags).toContain('"ABBR_HDNG"')
    expect(ags).toMatch(/"DISC_TYPE","Fault","Fault"/)
  })

  it('report.pdf has a cover, an interval page and a depth view; the SVG net is drawn', async () => {
    const pdf = (await fileText(as.engineer!, id, 'report.pdf')).toString('latin1')
    expect(pdf.startsWith('%PDF-')).toBe(true)
    // Cover, a page per interval, a depth view of the one hole.
    expect(pdf.match(/\/Type \/Page\b/g)).toHaveLength(4)
    const svg = (await fileText(as.engineer!, id, `net-${ctx.intervalId}.svg`)).toString()
    expect(svg.match(/<circle [^>]*r="2.5"/g)).toHaveLength(7)
    const png = await fileText(as.engineer!, id, `net-${ctx.intervalId}.png`)
    expect(png.subarray(1, 4).toString('latin1')).toBe('PNG')
    // IHDR width and height: the 600 x 484 SVG drawn at zoom 2
    expect([png.readUInt32BE(16), png.readUInt32BE(20)]).toEqual([1200, 968])
  })
})

describe('buildReport()', () => {
  it('buildReport() uncompressed: the set table text shows the analysed means', async () => {
    const [project] = await ctx.fx.db
      .select()
      .from(projects)
      .where(eq(projects.id, ctx.fx.projectId))
    const data = await loadPackData(ctx.fx.db, project, {})
    const pdf = await buildReport(data, {
      packId: '00000000-0000-4000-8000-000000000000',
      builtBy: 'lead',
      builtAt: new Date('2026-12-01T10:00:00Z'),
      font: 'helvetica',
      compress: false,
    })
    const text = pdfText(pdf).flat()
    const mean = data.intervals[0].analysis.sets[0].mean!
    expect(text).toContain(mean.dip.toFixed(1))
    expect(text).toContain(mean.dipDirection.toFixed(1))
    expect(text).toContain('Design pack')
    expect(text.join(' ')).toContain('Kinematic screening is not a stability analysis')
    expect(text).toContain('J1 / J2')
    expect(text).toContain('Sign-off')
    expect(text.filter((t) => /^engineer, \d{4}-\d\d-\d\d \d\d:\d\d UTC$/.test(t))).toHaveLength(2)
    expect(text.filter((t) => /^lead, \d{4}-\d\d-\d\d \d\d:\d\d UTC$/.test(t))).toHaveLength(2)
    expect(text.join(' ')).not.toContain('DRAFT')
  })
})
