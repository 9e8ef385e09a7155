import { splitRow } from './ags4-row'

/** One finding: the AGS4 rule broken (as the rules number it), where, and what. */
export interface AgsIssue {
  line: number
  rule: string
  severity: 'error' | 'warning'
  message: string
}

export interface ParsedRow {
  line: number
  fields: string[]
}

export interface ParsedGroup {
  name: string
  line: number
  headingLine: number
  unitLine: number
  typeLine: number
  headings: string[]
  units: string[]
  types: string[]
  data: ParsedRow[]
}

export type Report = (line: number, rule: string, message: string, warning?: boolean) => void

export function issueSink(issues: AgsIssue[]): Report {
  return (line, rule, message, warning = false) =>
    issues.push({
      line,
      rule,
      severity: warning ? 'warning' : 'error',
      message: `Rule ${rule}: ${message}`,
    })
}

const order = ['GROUP', 'HEADING', 'UNIT', 'TYPE', 'DATA'] as const
type Descriptor = (typeof order)[number]

/**
 * Reads AGS4 text into groups and reports the rules of the file's form: ASCII only (Rule 1),
 * CR LF line ends (2a), GROUP, HEADING, UNIT, TYPE and then DATA rows (2b), at least one DATA row
 * (2), a data descriptor first on each line (3), field counts (4), quoting (5), commas (6).
 */
export function parseAgs(text: string): { groups: ParsedGroup[]; issues: AgsIssue[] } {
  const issues: AgsIssue[] = []
  const report = issueSink(issues)
  const groups: ParsedGroup[] = []
  // A byte-order mark is no ASCII character; said once, then read past so the rows still parse.
  if (text.startsWith('\ufeff')) {
    report(1, '1', 'the file starts with a byte-order mark (U+FEFF)')
    text = text.slice(1)
  }
  const lines = text.split('\n')
  const endsWithNewline = lines[lines.length - 1] === ''
  if (endsWithNewline) lines.pop()
  else if (text !== '') report(lines.length, '2a', 'the last line does not end with CR LF')
  let group: ParsedGroup | undefined
  let last: Descriptor | undefined
  let blankBefore = true
  const seen = new Map<string, number>()
  lines.forEach((raw, index) => {
    const n = index + 1
    const content = raw.endsWith('\r') ? raw.slice(0, -1) : raw
    if (!raw.endsWith('\r') && (index < lines.length - 1 || endsWithNewline))
      report(n, '2a', 'the line ends with LF alone, not CR LF')
    if (content.includes('\r')) report(n, '2a', 'a carriage return inside the line')
    const wide = /[\u0080-\uffff]/.exec(content)
    if (wide)
      report(n, '1', `non-ASCII character ${JSON.stringify(wide[0])} at column ${wide.index + 1}`)
    if (content.trim() === '') {
      group = undefined
      last = undefined
      blankBefore = true
      return
    }
    const { fields, fault } = splitRow(content)
    if (fault) report(n, fault.rule, fault.message)
    const tag = fields[0] as Descriptor
    if (!order.includes(tag)) {
      report(
        n,
        '3',
        `the line starts with ${JSON.stringify(fields[0])}, not GROUP, HEADING, UNIT, TYPE or DATA`,
      )
      blankBefore = false
      return
    }
    if (tag === 'GROUP') {
      if (!blankBefore) report(n, '2', 'a GROUP row must follow a blank line', true)
      if (fields.length !== 2) report(n, '4', `a GROUP row has 2 fields, this one ${fields.length}`)
      group = {
        name: fields[1] ?? '',
        line: n,
        headingLine: n,
        unitLine: n,
        typeLine: n,
        headings: [],
        units: [],
        types: [],
        data: [],
      }
      const first = seen.get(group.name)
      // From memory of the rules' intent: a group is written once, its rows together.
      if (first)
        report(n, '2', `group ${group.name} appears a second time (first at line ${first})`)
      else seen.set(group.name, n)
      groups.push(group)
      last = 'GROUP'
    } else if (!group) {
      report(n, '2b', `a ${tag} row with no GROUP row above it`)
    } else {
      rowInGroup(group, tag, fields, n)
    }
    blankBefore = false
  })
  for (const g of groups) {
    if (!g.headings.length) report(g.line, '2b', `group ${g.name} has no HEADING row`)
    else if (g.unitLine === g.line) report(g.line, '2b', `group ${g.name} has no UNIT row`)
    else if (g.typeLine === g.line) report(g.line, '2b', `group ${g.name} has no TYPE row`)
    if (!g.data.length) report(g.line, '2', `group ${g.name} has no DATA rows`)
  }
  return { groups, issues }

  function rowInGroup(g: ParsedGroup, tag: Descriptor, fields: string[], n: number) {
    const at = order.indexOf(tag)
    const was = last ? order.indexOf(last) : 0
    if (tag !== 'DATA' && at <= was) report(n, '2b', `a second ${tag} row in group ${g.name}`)
    else if (at > Math.min(was + 1, 4))
      report(n, '2b', `${tag} row before the ${order[was + 1]} row of group ${g.name}`)
    last = at > was ? tag : last
    if (tag === 'HEADING') {
      if (!g.headings.length) {
        g.headings = fields.slice(1)
        g.headingLine = n
      }
      return
    }
    if (fields.length !== g.headings.length + 1)
      report(n, '4', `${fields.length} fields where the HEADING row has ${g.headings.length + 1}`)
    if (tag === 'UNIT' && g.unitLine === g.line) {
      g.units = fields.slice(1)
      g.unitLine = n
    } else if (tag === 'TYPE' && g.typeLine === g.line) {
      g.types = fields.slice(1)
      g.typeLine = n
    } else if (tag === 'DATA') g.data.push({ line: n, fields: fields.slice(1) })
  }
}
