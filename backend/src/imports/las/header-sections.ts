import { headerNumber, splitHeaderLine } from './header-line'
import { titleWord, type Section } from './sections'
import { LineCursor } from './text'
import {
  refuse,
  type HeaderItem,
  type LasDelimiter,
  type LasVersion,
  type ProblemLog,
} from './types'

/** Real headers have tens of lines (a few thousand for array logs); more is not a LAS header. */
const MAX_HEADER_LINES = 20_000

/** Non-blank, non-comment lines of a section body with their line numbers. */
export function* bodyLines(text: string, s: Section): Generator<{ line: string; n: number }> {
  const cursor = new LineCursor(text, s.bodyStart, s.bodyEnd, s.bodyFirstLine)
  let count = 0
  while (cursor.next()) {
    const first = cursor.firstNonBlank()
    if (first === cursor.end || text.charCodeAt(first) === 35 /* # */) continue
    if (++count > MAX_HEADER_LINES) {
      refuse(
        cursor.number,
        `The ~${titleWord(s.title)} section has over ${MAX_HEADER_LINES} lines.`,
      )
    }
    yield { line: text.slice(first, cursor.end), n: cursor.number }
  }
}

/**
 * Header lines of ~W, ~P or ~C. A line without a dot is refused in ~C (every line there is a
 * curve, and the data columns depend on them) and skipped with a warning elsewhere.
 */
export function readItems(
  text: string,
  s: Section,
  version3: boolean,
  problems: ProblemLog,
  curves = false,
): HeaderItem[] {
  const items: HeaderItem[] = []
  for (const { line, n } of bodyLines(text, s)) {
    const item = splitHeaderLine(line, n, version3)
    if (!item || item.mnemonic === '') {
      if (curves) refuse(n, 'A curve line needs the form MNEM.UNIT  API CODE : DESCRIPTION.')
      problems.push({ line: n, message: 'Skipped a header line without the MNEM.UNIT form.' })
      continue
    }
    items.push(item)
  }
  return items
}

export interface VersionInfo {
  version: LasVersion
  wrap: boolean
  delimiter: LasDelimiter
}

/** ~V: VERS (1.2, 2.0 or 3.0), WRAP (YES/NO), DLM (LAS 3.0: SPACE, TAB or COMMA). */
export function readVersion(text: string, s: Section, problems: ProblemLog): VersionInfo {
  const items = readItems(text, s, false, problems)
  const find = (m: string) => items.find((i) => i.mnemonic.toUpperCase() === m)
  const vers = find('VERS')
  if (!vers) refuse(s.line, 'The ~V section has no VERS line (LAS 2.0 or 3.0).')
  const number = headerNumber(vers.value)
  if (number !== 1.2 && number !== 2 && number !== 3) {
    refuse(
      vers.line,
      `VERS is "${vers.value.slice(0, 20)}": only LAS 1.2, 2.0 and 3.0 files are read.`,
    )
  }
  const version: LasVersion = number === 3 ? '3.0' : number === 2 ? '2.0' : '1.2'
  if (version === '1.2') {
    problems.push({
      line: vers.line,
      message:
        'LAS 1.2: read as LAS 2.0 (same sections and line syntax; ~W text items swapped back).',
    })
  }
  const wrapItem = find('WRAP')
  const wrapValue = wrapItem?.value.toUpperCase()
  if (wrapValue !== 'YES' && wrapValue !== 'NO') {
    if (wrapItem)
      refuse(wrapItem.line, `WRAP is "${wrapItem.value.slice(0, 20)}": it must be YES or NO.`)
    problems.push({ line: s.line, message: 'The ~V section has no WRAP line: read as WRAP NO.' })
  }
  const dlmItem = find('DLM')
  const dlm = (dlmItem?.value || 'SPACE').toUpperCase()
  if (dlm !== 'SPACE' && dlm !== 'TAB' && dlm !== 'COMMA') {
    refuse(dlmItem?.line ?? s.line, `DLM is "${dlm.slice(0, 20)}": it must be SPACE, TAB or COMMA.`)
  }
  const wrap = wrapValue === 'YES'
  if (wrap && version === '3.0')
    refuse(wrapItem?.line ?? s.line, 'LAS 3.0 files cannot be wrapped.')
  return { version, wrap, delimiter: dlm }
}

/** ~O: free text kept as written, comment lines dropped. */
export function readOther(text: string, s: Section): string {
  const lines: string[] = []
  for (const { line } of bodyLines(text, s)) lines.push(line.trimEnd())
  return lines.join('\n')
}
