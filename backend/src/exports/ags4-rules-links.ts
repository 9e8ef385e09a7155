import type { AgsContext } from './ags4-context'
import type { ParsedGroup } from './ags4-parse'
import { isKey } from './ags4-standard'

/** The KEY headings a group is identified by, as the file writes them. */
function keyHeadings(ctx: AgsContext, g: ParsedGroup): string[] {
  return g.headings.filter((h) => {
    const d = ctx.heading(g.name, h)
    return d && isKey(d.status)
  })
}

const rowKey = (g: ParsedGroup, headings: string[], fields: string[]) =>
  JSON.stringify(headings.map((h) => fields[g.headings.indexOf(h)] ?? ''))

/**
 * Rule 10c: each row of a child group has its parent row, the parent named by the dictionary
 * (or DICT_PGRP) and matched on the parent's KEY fields the child carries. A parent sharing no
 * KEY heading with the child (LOCA under PROJ) links the whole file, not rows.
 */
export function checkParents(ctx: AgsContext) {
  for (const g of ctx.groups) {
    const parentName = ctx.defs.get(g.name)?.parent
    if (!parentName || !g.data.length) continue
    const parent = ctx.byName.get(parentName)
    if (!ctx.defs.has(parentName) && !ctx.complete) {
      // The parent's KEY headings are not known: the rows cannot be matched to it.
      ctx.unchecked('parent', g.name, g.line, undefined, parentName)
      continue
    }
    const parentKeys = parent
      ? keyHeadings(ctx, parent)
      : (ctx.defs.get(parentName)?.headings ?? []).filter((h) => isKey(h.status)).map((h) => h.name)
    const shared = parentKeys.filter((h) => g.headings.includes(h))
    if (!shared.length) continue
    if (!parent) {
      ctx.report(
        g.line,
        '10c',
        `group ${g.name} has rows but its parent group ${parentName} is missing`,
      )
      continue
    }
    const known = new Set(parent.data.map((r) => rowKey(parent, shared, r.fields)))
    for (const row of g.data)
      if (!known.has(rowKey(g, shared, row.fields)))
        ctx.report(
          row.line,
          '10c',
          `no ${parentName} row has ${shared.map((h) => `${h} "${row.fields[g.headings.indexOf(h)] ?? ''}"`).join(', ')}`,
        )
  }
}

/**
 * Rule 11: a record link (type RL) names a group and the KEY values of one of its rows, parted
 * by TRAN_DLIM (11a), with the row's KEY fields in full (11b); several links are joined by
 * TRAN_RCON; each link must find its row (11c).
 */
export function checkRecordLinks(ctx: AgsContext) {
  const index = new Map<string, Set<string>>()
  const rowsOf = (target: ParsedGroup, keys: string[]) => {
    let set = index.get(target.name)
    if (!set) {
      set = new Set(
        target.data.map((r) =>
          JSON.stringify(keys.map((h) => r.fields[target.headings.indexOf(h)] ?? '')),
        ),
      )
      index.set(target.name, set)
    }
    return set
  }
  for (const g of ctx.groups)
    g.types.forEach((type, i) => {
      if (type !== 'RL') return
      for (const row of g.data) {
        const value = row.fields[i] ?? ''
        if (!value) continue
        for (const link of value.split(ctx.concatenator)) {
          const [group, ...values] = link.split(ctx.delimiter)
          const where = `${g.headings[i]} "${link}"`
          const target = ctx.byName.get(group)
          if (!values.length) {
            ctx.report(
              row.line,
              '11a',
              `${where} has no "${ctx.delimiter}" between the group and its KEY values`,
            )
            continue
          }
          if (!target) {
            ctx.report(
              row.line,
              '11c',
              `${where} links to group ${group}, which the file does not hold`,
            )
            continue
          }
          if (!ctx.defs.has(group) && !ctx.complete) {
            ctx.unchecked('links', g.name, row.line, g.headings[i], group)
            continue
          }
          const keys = keyHeadings(ctx, target)
          if (values.length !== keys.length) {
            ctx.report(
              row.line,
              '11b',
              `${where} gives ${values.length} KEY values; ${group} has ${keys.length} (${keys.join(', ')})`,
            )
            continue
          }
          if (!rowsOf(target, keys).has(JSON.stringify(values)))
            ctx.report(row.line, '11c', `${where} matches no row of ${group}`)
        }
      }
    })
}
