import type { AgsContext, HeadingDef } from './ags4-context'
import type { ParsedGroup } from './ags4-parse'
import { isKey, isRequired } from './ags4-standard'
import { checkerFor, knownTypes } from './ags4-values'
import { checkCodes } from './ags4-rules-codes'

/**
 * Per group: the UNIT and TYPE rows (Rules 8, 15, 17), KEY and REQUIRED headings present (10a,
 * 10b), and per row: values fit their TYPE (8), ID values unique in their own group (8), no key
 * combination twice (10a), REQUIRED fields filled (10b), no field of spaces only (12), and the
 * codes listed in UNIT, TYPE, ABBR and FILE (15, 16, 17, 20).
 */
export function checkData(ctx: AgsContext) {
  for (const g of ctx.groups) {
    const defs = g.headings.map((h) => ctx.heading(g.name, h))
    checkHeaderRows(ctx, g, defs)
    checkRows(ctx, g, defs)
  }
}

function checkHeaderRows(ctx: AgsContext, g: ParsedGroup, defs: (HeadingDef | undefined)[]) {
  g.headings.forEach((h, i) => {
    const type = g.types[i] ?? ''
    const unit = g.units[i] ?? ''
    if (!knownTypes.test(type))
      ctx.report(g.typeLine, '8', `${h}: "${type}" is not an AGS4 data type`)
    else if (ctx.byName.has('TYPE') && !ctx.types.has(type))
      ctx.report(g.typeLine, '17', `${h}: type "${type}" is not listed in the TYPE group`)
    const def = defs[i]
    if (def && def.type && knownTypes.test(type) && def.type !== type)
      ctx.report(
        g.typeLine,
        '8',
        `${h} is written as ${type}; the ${def.source === 'dict' ? 'DICT group' : 'dictionary'} defines it as ${def.type}`,
        true,
      )
    if (unit && ctx.byName.has('UNIT') && !ctx.units.has(unit))
      ctx.report(g.unitLine, '15', `${h}: unit "${unit}" is not listed in the UNIT group`)
  })
  for (const d of ctx.defs.get(g.name)?.headings ?? []) {
    if (g.headings.includes(d.name)) continue
    if (isKey(d.status))
      ctx.report(g.headingLine, '10a', `KEY heading ${d.name} is missing from ${g.name}`)
    else if (isRequired(d.status))
      ctx.report(g.headingLine, '10b', `REQUIRED heading ${d.name} is missing from ${g.name}`)
  }
}

function checkRows(ctx: AgsContext, g: ParsedGroup, defs: (HeadingDef | undefined)[]) {
  const keys = defs.flatMap((d, i) => (d && isKey(d.status) ? [i] : []))
  const required = defs.flatMap((d, i) => (d && isRequired(d.status) ? [i] : []))
  // Rule 8, ID: unique identifiers, unique in the group they identify (LOCA_ID in LOCA).
  const ids = g.headings.flatMap((h, i) =>
    g.types[i] === 'ID' && h.slice(0, 4) === g.name ? [i] : [],
  )
  const fits = g.headings.map((_, i) => checkerFor(g.types[i] ?? '', g.units[i] ?? ''))
  const seenKeys = new Map<string, number>()
  const seenIds = ids.map(() => new Map<string, number>())
  for (const row of g.data) {
    row.fields.forEach((v, i) => {
      const h = g.headings[i]
      if (h === undefined) return
      const problem = fits[i](v)
      if (problem) ctx.report(row.line, '8', `${h}: ${problem}`)
      if (v !== '' && v.trim() === '')
        ctx.report(row.line, '12', `${h} holds only spaces; an empty field is written ""`, true)
    })
    for (const i of required)
      if ((row.fields[i] ?? '').trim() === '')
        ctx.report(row.line, '10b', `REQUIRED field ${g.headings[i]} is empty`)
    if (keys.length) {
      const combo = JSON.stringify(keys.map((i) => row.fields[i] ?? ''))
      const first = seenKeys.get(combo)
      if (first)
        ctx.report(
          row.line,
          '10a',
          `the KEY fields repeat those of line ${first} (${keys.map((i) => g.headings[i]).join(', ')})`,
        )
      else seenKeys.set(combo, row.line)
    }
    ids.forEach((i, k) => {
      const v = row.fields[i] ?? ''
      const first = seenIds[k].get(v)
      if (v && first)
        ctx.report(row.line, '8', `${g.headings[i]} "${v}" is not unique (also line ${first})`)
      else if (v) seenIds[k].set(v, row.line)
    })
    checkCodes(ctx, g, row)
  }
}
