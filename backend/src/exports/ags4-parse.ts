/** A rule broken somewhere in an AGS4 file, with the 1-based line it was found on. */
export interface AgsIssue {
  line: number
  rule: string
  message: string
}

export interface ParsedRow {
  line: number
  fields: string[]
}

export interface ParsedGroup {
  name: string
  line: number
  headings: string[]
  units: string[]
  types: string[]
  data: ParsedRow[]
}

const rowTags = ['GROUP', 'HEADING', 'UNIT', 'TYPE', 'DATA'] as const
// Every field double-quoted, inner quotes doubled, fields separated by commas (AGS4 rules 4–6).
const quotedRow = /^"(?:[^"]|"")*"(?:,"(?:[^"]|"")*")*$/
const fieldPattern = /"((?:[^"]|"")*)"/g

/**
 * Reads AGS4 text into groups, reporting the syntax rules: ASCII only, CR LF line ends, quoted
 * fields, GROUP → HEADING → UNIT → TYPE → DATA order, equal field counts, blank lines between groups.
 */
export function parseAgs(text: string): { groups: ParsedGroup[]; issues: AgsIssue[] } {
  const issues: AgsIssue[] = []
  const groups: ParsedGroup[] = []
  const issue = (line: number, rule: string, message: string) =>
    issues.push({ line, rule, message })
  const lines = text.split('\n')
  if (lines[lines.length - 1] === '') lines.pop()
  else issue(lines.length, 'line-end', 'the last line must end with CR LF')
  let group: ParsedGroup | undefined
  let last = -1
  let previousBlank = true
  lines.forEach((raw, i) => {
    const n = i + 1
    const isLast = i === lines.length - 1 && !text.endsWith('\n')
    if (!isLast && !raw.endsWith('\r')) issue(n, 'line-end', 'line ends with LF only (needs CR LF)')
    const content = raw.endsWith('\r') ? raw.slice(0, -1) : raw
    if (content.includes('\r')) issue(n, 'line-end', 'CR inside a line')
    if (/[^\x20-\x7e\r]/.test(content)) issue(n, 'ascii', 'non-ASCII or control character')
    if (content.trim() === '') {
      group = undefined
      previousBlank = true
      return
    }
    if (!quotedRow.test(content)) {
      issue(n, 'quoting', 'every field must be double-quoted, inner quotes doubled')
      previousBlank = false
      return
    }
    const fields = [...content.matchAll(fieldPattern)].map((m) => m[1].replace(/""/g, '"'))
    const tag = fields[0]
    const at = (rowTags as readonly string[]).indexOf(tag)
    if (at < 0) issue(n, 'row-type', `unknown row type "${tag}"`)
    else if (tag === 'GROUP') {
      if (!previousBlank) issue(n, 'blank-line', 'groups must be separated by a blank line')
      group = { name: fields[1] ?? '', line: n, headings: [], units: [], types: [], data: [] }
      groups.push(group)
      last = 0
      if (fields.length !== 2) issue(n, 'field-count', 'a GROUP row has exactly two fields')
    } else if (!group) issue(n, 'row-order', `${tag} row outside a group`)
    else {
      const expected = Math.min(last + 1, 4)
      if (at > expected) issue(n, 'row-order', `missing ${rowTags[expected]} row before ${tag}`)
      else if (at < expected && !(at === 4 && last === 4))
        issue(n, 'row-order', `${tag} row out of order`)
      last = Math.max(last, at)
      if (tag === 'HEADING') group.headings = fields.slice(1)
      else if (fields.length !== group.headings.length + 1)
        issue(
          n,
          'field-count',
          `${fields.length} fields, HEADING row has ${group.headings.length + 1}`,
        )
      if (tag === 'UNIT') group.units = fields.slice(1)
      if (tag === 'TYPE') group.types = fields.slice(1)
      if (tag === 'DATA') group.data.push({ line: n, fields: fields.slice(1) })
    }
    previousBlank = false
  })
  for (const g of groups) {
    if (!g.headings.length) issue(g.line, 'row-order', `group ${g.name} has no HEADING row`)
    else if (!g.units.length) issue(g.line, 'row-order', `group ${g.name} has no UNIT row`)
    else if (!g.types.length) issue(g.line, 'row-order', `group ${g.name} has no TYPE row`)
  }
  return { groups, issues }
}
