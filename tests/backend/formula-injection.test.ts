import { describe, expect, it } from 'vitest'
import { eq } from 'drizzle-orm'
import Papa from 'papaparse'
import { neutraliseCell, neutraliseLine } from '../../backend/src/exports/cell-safety'
import { parseAgs } from '../../backend/src/exports/ags4-parse'
import { domains, holes, intervals, structureSets, structures } from '../../schema/index'
import { packSuite } from './pack-setup'

// OWASP "CSV Injection": text cells starting with = + - @ TAB CR are neutralised with a leading
// apostrophe in every exported CSV and in AGS4 DATA rows; numbers stay numbers.
const { ctx, url, waitFor, fileText } = packSuite()
const hostile = ['=HYPERLINK("http://x")', '+SUM(1,2)', '-2+3*cmd', '@evil', '\tTAB', '\rCR']
const TRIGGER = /^[=+\-@\t\r]/
const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/

describe('formula injection in pack files', () => {
  it('neutraliseCell(): text triggers get an apostrophe, numbers and plain text do not', () => {
    expect(hostile.map(neutraliseCell)).toEqual(hostile.map((h) => `'${h}`))
    for (const n of ['-12.5', '+3', '-0.001', '1e-3', 'joint', 'GSQ-BH01', ''])
      expect(neutraliseCell(n)).toBe(n)
    // a comment line splits into cells at commas and semicolons: each piece is guarded
    expect(neutraliseLine('Interval =A, checked by @x')).toBe('Interval =A, checked by @x')
    expect(neutraliseLine('a,=b; @c,-d,-12.5')).toBe("a,'=b; '@c,'-d,-12.5")
  })

  it('no cell of structures.csv, sets.csv, intersections.csv or project.ags starts a formula', async () => {
    const db = ctx.fx.db
    const [hole] = await db.select().from(holes).where(eq(holes.id, ctx.fx.holeId))
    await db.update(holes).set({ name: hostile[0] }).where(eq(holes.id, hole.id))
    const [domain] = await db
      .insert(domains)
      .values({ projectId: ctx.fx.projectId, name: hostile[4] })
      .returning()
    await db
      .update(intervals)
      .set({ name: hostile[1], domainId: domain.id })
      .where(eq(intervals.id, ctx.intervalId))
    const sets = await db
      .select()
      .from(structureSets)
      .where(eq(structureSets.intervalId, ctx.intervalId))
    await db.update(structureSets).set({ name: hostile[2] }).where(eq(structureSets.id, sets[0].id))
    await db.update(structureSets).set({ name: hostile[3] }).where(eq(structureSets.id, sets[1].id))
    await db
      .update(structures)
      .set({ comment: hostile[5], infillType: '=1+1' })
      .where(eq(structures.holeId, hole.id))
    const id = (await ctx.as.lead!.post(url(), {})).body.data.id
    expect((await waitFor(ctx.as.lead!, id)).status).toBe('ready')

    const offenders: string[] = []
    let neutralised = 0
    const look = (file: string, cell: string) => {
      if (cell.startsWith("'") && TRIGGER.test(cell.slice(1))) neutralised++
      if (TRIGGER.test(cell) && !NUMBER.test(cell))
        offenders.push(`${file}: ${JSON.stringify(cell)}`)
    }
    for (const name of ['structures.csv', 'sets.csv', 'intersections.csv']) {
      const text = (await fileText(ctx.as.engineer!, id, name)).toString('utf8')
      const rows = Papa.parse<string[]>(text, { skipEmptyLines: true }).data
      for (const row of rows) for (const cell of row) look(name, cell)
    }
    const ags = (await fileText(ctx.as.engineer!, id, 'project.ags')).toString('ascii')
    for (const g of parseAgs(ags).groups)
      for (const r of g.data) for (const cell of r.fields) look('project.ags', cell)
    expect(offenders).toEqual([])
    expect(neutralised).toBeGreaterThanOrEqual(6)
  })
})
