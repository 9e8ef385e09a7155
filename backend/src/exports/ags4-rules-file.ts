import type { AgsContext } from './ags4-context'
import { AGS_EDITIONS } from './ags4-standard'

/**
 * The file as a whole: one PROJ row (Rule 13), one TRAN row naming an AGS4 edition (14), single
 * characters for TRAN_DLIM (11a) and TRAN_RCON (16a), a TYPE group (17), a UNIT group where
 * units are used (15), and DICT rows complete enough to define what they declare (18).
 */
export function checkFile(ctx: AgsContext) {
  for (const [name, rule] of [
    ['PROJ', '13'],
    ['TRAN', '14'],
  ] as const) {
    const g = ctx.byName.get(name)
    if (!g) ctx.report(1, rule, `the file has no ${name} group`)
    else if (g.data.length !== 1)
      ctx.report(g.line, rule, `${name} has ${g.data.length} DATA rows; it must have exactly one`)
  }
  const edition = ctx.column('TRAN', 'TRAN_AGS')[0]
  const known = (v: string) =>
    (AGS_EDITIONS as readonly string[]).includes(v) ||
    (ctx.complete && v === ctx.dictionary.edition)
  if (edition && edition.value && !known(edition.value))
    ctx.report(edition.line, '14', `TRAN_AGS "${edition.value}" names no AGS4 edition`, true)
  for (const [heading, rule] of [
    ['TRAN_DLIM', '11a'],
    ['TRAN_RCON', '16a'],
  ] as const) {
    const cell = ctx.column('TRAN', heading)[0]
    if (cell && cell.value.length > 1)
      ctx.report(cell.line, rule, `${heading} "${cell.value}" must be a single character`)
  }
  if (ctx.groups.length && !ctx.byName.has('TYPE'))
    ctx.report(1, '17', 'the file has no TYPE group listing the data types it uses')
  const unitUsed = ctx.groups.some(
    (g) =>
      g.units.some((u) => u !== '') ||
      g.types.some((t, i) => t === 'PU' && g.data.some((r) => r.fields[i])),
  )
  if (unitUsed && !ctx.byName.has('UNIT'))
    ctx.report(1, '15', 'the file has no UNIT group listing the units it uses')
  checkDict(ctx)
}

/** DICT rows: a HEADING row names its heading, status and type; a GROUP row its parent. */
function checkDict(ctx: AgsContext) {
  const dict = ctx.byName.get('DICT')
  if (!dict) return
  const at = (fields: string[], h: string) => fields[dict.headings.indexOf(h)] ?? ''
  for (const { line, fields } of dict.data) {
    const kind = at(fields, 'DICT_TYPE')
    const group = at(fields, 'DICT_GRP')
    // A standard group keeps the dictionary's parent; PROJ, TRAN and the like have none.
    if (kind === 'GROUP' && !at(fields, 'DICT_PGRP') && !ctx.defs.get(group)?.standard)
      ctx.report(line, '18', `DICT defines group ${group} without its parent group (DICT_PGRP)`)
    if (kind !== 'HEADING') continue
    const missing = ['DICT_HDNG', 'DICT_STAT', 'DICT_DTYP'].filter((h) => !at(fields, h))
    if (missing.length)
      ctx.report(line, '18', `a DICT HEADING row of ${group} leaves ${missing.join(', ')} empty`)
    if (ctx.defs.has(group)) continue
    if (ctx.complete)
      ctx.report(
        line,
        '18',
        `DICT defines headings of ${group}, which is neither a standard group nor defined by a DICT GROUP row`,
      )
    else ctx.unchecked('dict', group, line)
  }
}
