import { agsGroups } from './ags4-dictionary'
import { parseAgs, type AgsIssue, type ParsedGroup } from './ags4-parse'
import { knownTypes, valueFits } from './ags4-values'

export type { AgsIssue } from './ags4-parse'

export const AGS_EDITIONS = ['4.0.3', '4.0.4', '4.1', '4.1.1', '4.2']
const headingForm = /^[A-Z0-9]{4}_[A-Z0-9]{1,4}$/

/**
 * Checks AGS4 text against the published rules Downdip relies on and returns every violation
 * with its line: syntax (see parseAgs), group and heading names, UNIT/TYPE/ABBR/DICT listings,
 * value formats by TYPE, one-row PROJ and TRAN, edition, unique keys, required fields, parents.
 */
export function validateAgs(text: string): AgsIssue[] {
  const { groups, issues } = parseAgs(text)
  const issue = (line: number, rule: string, message: string) =>
    issues.push({ line, rule, message })
  const byName = new Map<string, ParsedGroup>()
  for (const g of groups) {
    if (!/^[A-Z0-9]{4}$/.test(g.name))
      issue(g.line, 'group-name', `group name "${g.name}" is not 4 upper-case characters`)
    if (byName.has(g.name)) issue(g.line, 'group-name', `group ${g.name} appears twice`)
    byName.set(g.name, g)
  }
  const column = (group: string, heading: string) => {
    const g = byName.get(group)
    const i = g?.headings.indexOf(heading) ?? -1
    return g && i >= 0 ? g.data.map((r) => r.fields[i]) : []
  }
  const units = new Set(column('UNIT', 'UNIT_UNIT'))
  const types = new Set(column('TYPE', 'TYPE_TYPE'))
  const abbrHeadings = column('ABBR', 'ABBR_HDNG')
  const abbr = new Set(column('ABBR', 'ABBR_CODE').map((c, i) => `${abbrHeadings[i]}|${c}`))
  const dictGroups = column('DICT', 'DICT_GRP')
  const dictHeadings = column('DICT', 'DICT_HDNG')
  const dictStats = column('DICT', 'DICT_STAT')
  const declared = (group: string, heading: string) =>
    dictGroups.some((g, i) => g === group && dictHeadings[i] === heading)
  const locaIds = new Set(column('LOCA', 'LOCA_ID'))

  for (const name of ['PROJ', 'TRAN', 'UNIT', 'TYPE']) {
    if (!byName.has(name)) issue(1, 'required-group', `group ${name} is missing`)
  }
  for (const name of ['PROJ', 'TRAN']) {
    const g = byName.get(name)
    if (g && g.data.length !== 1)
      issue(g.line, 'single-row', `${name} must have exactly one DATA row`)
  }
  const tranAgs = column('TRAN', 'TRAN_AGS')[0]
  if (byName.has('TRAN') && !AGS_EDITIONS.includes(tranAgs ?? ''))
    issue(byName.get('TRAN')!.line, 'edition', `TRAN_AGS "${tranAgs ?? ''}" names no AGS4 edition`)

  for (const g of groups) {
    const standard = (agsGroups[g.name] ?? []).filter((h) => !h.user)
    const headingLine = g.line + 1
    let userSeen = false
    const keys: number[] = []
    const required: number[] = []
    g.headings.forEach((h, i) => {
      if (h.length > 9)
        issue(headingLine, 'heading-name', `heading "${h}" is longer than 9 characters`)
      else if (!headingForm.test(h))
        issue(headingLine, 'heading-name', `heading "${h}" is not GRUP_XXXX`)
      if (g.headings.indexOf(h) !== i)
        issue(headingLine, 'heading-name', `heading ${h} appears twice`)
      const std = standard.find((s) => s.name === h)
      if (std) {
        if (userSeen)
          issue(headingLine, 'heading-order', `standard heading ${h} after user-defined headings`)
        if (std.status === 'KEY') keys.push(i)
        if (std.status === 'REQUIRED') required.push(i)
      } else {
        userSeen = true
        if (!declared(g.name, h))
          issue(headingLine, 'dict', `user-defined heading ${g.name}.${h} is not declared in DICT`)
        const stat = dictStats.find((_, k) => dictGroups[k] === g.name && dictHeadings[k] === h)
        if (stat === 'KEY') keys.push(i)
        if (stat === 'REQUIRED') required.push(i)
      }
      const unit = g.units[i] ?? ''
      const type = g.types[i] ?? ''
      if (unit && !units.has(unit))
        issue(headingLine + 1, 'unit', `unit "${unit}" is not listed in UNIT`)
      if (!knownTypes.test(type))
        issue(headingLine + 2, 'type', `"${type}" is not an AGS4 data type`)
      else if (!types.has(type))
        issue(headingLine + 2, 'type', `type "${type}" is not listed in TYPE`)
    })
    const seenKeys = new Map<string, number>()
    for (const row of g.data) {
      row.fields.forEach((v, i) => {
        const type = g.types[i] ?? ''
        const problem = valueFits(v, type, g.units[i] ?? '')
        if (problem) issue(row.line, 'value', `${g.headings[i]}: ${problem}`)
        if (type === 'PA' && v && g.name !== 'ABBR' && !abbr.has(`${g.headings[i]}|${v}`))
          issue(row.line, 'abbr', `${g.headings[i]} code "${v}" is not listed in ABBR`)
      })
      // Rule: REQUIRED fields hold data; KEY fields may be blank (e.g. DICT_HDNG on a GROUP row).
      for (const i of required)
        if (!row.fields[i]) issue(row.line, 'required', `${g.headings[i]} must not be empty`)
      if (keys.length) {
        const combo = keys.map((i) => row.fields[i]).join('\u0000')
        const first = seenKeys.get(combo)
        if (first) issue(row.line, 'key', `duplicate key (same as line ${first})`)
        else seenKeys.set(combo, row.line)
      }
      const li = g.headings.indexOf('LOCA_ID')
      if (g.name !== 'LOCA' && li >= 0 && !locaIds.has(row.fields[li]))
        issue(row.line, 'parent', `LOCA_ID "${row.fields[li]}" has no LOCA row`)
    }
  }
  return issues.sort((a, b) => a.line - b.line)
}
