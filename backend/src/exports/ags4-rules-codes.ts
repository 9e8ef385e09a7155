import type { AgsContext } from './ags4-context'
import type { ParsedGroup, ParsedRow } from './ags4-parse'

/**
 * The values one row takes from a list of the file: PU values in UNIT (Rule 15), PA codes in
 * ABBR under their heading, codes joined by TRAN_RCON each listed on its own (16, 16a), PT
 * values in TYPE (17), and FILE_FSET references in the FILE group (20).
 */
export function checkCodes(ctx: AgsContext, g: ParsedGroup, row: ParsedRow) {
  row.fields.forEach((v, i) => {
    if (v === '') return
    const h = g.headings[i]
    const type = g.types[i]
    if (type === 'PU' && !ctx.units.has(v))
      ctx.report(row.line, '15', `${h}: unit "${v}" is not listed in the UNIT group`)
    else if (type === 'PT' && !ctx.types.has(v))
      ctx.report(row.line, '17', `${h}: type "${v}" is not listed in the TYPE group`)
    else if (type === 'PA') checkAbbreviation(ctx, h, v, row.line)
    if (h === 'FILE_FSET' && g.name !== 'FILE' && !ctx.fileSets.has(v))
      ctx.report(
        row.line,
        '20',
        `FILE_FSET "${v}" has no row in the FILE group` +
          (ctx.byName.has('FILE') ? '' : ' (the file has no FILE group)'),
      )
  })
}

function checkAbbreviation(ctx: AgsContext, heading: string, value: string, line: number) {
  const listed = ctx.abbr.get(heading)
  if (listed?.has(value)) return
  const missing = value.split(ctx.concatenator).filter((code) => !listed?.has(code))
  if (!missing.length) return
  const where = ctx.byName.has('ABBR') ? '' : ' (the file has no ABBR group)'
  const joined = value.split(ctx.concatenator).length > 1
  ctx.report(
    line,
    '16',
    `${heading}: ${missing.map((c) => `"${c}"`).join(', ')} ${missing.length > 1 ? 'are' : 'is'} not listed in ABBR${where}` +
      (joined ? ` (codes of "${value}" split at "${ctx.concatenator}")` : ''),
  )
}
