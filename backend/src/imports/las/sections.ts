import { LineCursor } from './text'
import { refuse } from './types'

/** LAS 2.0 sections by their letter; 'other' for anything else (noted, not read). */
export type SectionKind = 'V' | 'W' | 'C' | 'P' | 'O' | 'A' | 'other'

/** A section: its `~` title line, and its body as offsets into the text. */
export interface Section {
  title: string
  line: number
  bodyStart: number
  bodyEnd: number
  bodyFirstLine: number
}

/** LAS 3.0 files hold a few data sets of three sections each; thousands is not a LAS file. */
const MAX_SECTIONS = 1000

/** LAS 3.0 section names (CWLS LAS 3.0) that map onto the LAS 2.0 log sections. */
const V3_NAMES: Record<string, SectionKind> = {
  V: 'V',
  VERSION: 'V',
  W: 'W',
  WELL: 'W',
  C: 'C',
  CURVE: 'C',
  LOG_DEFINITION: 'C',
  P: 'P',
  PARAMETER: 'P',
  LOG_PARAMETER: 'P',
  O: 'O',
  OTHER: 'O',
  A: 'A',
  ASCII: 'A',
  LOG_DATA: 'A',
}

/** The first word of a title: up to a blank or LAS 3.0's `|` association bar, upper case. */
export function titleWord(title: string): string {
  let end = 0
  while (end < title.length) {
    const c = title.charCodeAt(end)
    if (c === 32 || c === 9 || c === 124) break
    end++
  }
  return title.slice(0, end).toUpperCase()
}

/**
 * LAS 2.0 reads only the letter after `~` (so `~Curve Information (v2) - …` is ~C); LAS 3.0 reads
 * the whole name, so `~Core_Data` is not ~C.
 */
export function sectionKind(title: string, version3: boolean): SectionKind {
  const word = titleWord(title)
  if (version3) return V3_NAMES[word] ?? 'other'
  const letter = word.charAt(0)
  return 'VWCPOA'.includes(letter) && letter !== '' ? (letter as SectionKind) : 'other'
}

/**
 * Splits the text at lines whose first non-blank character is `~`. Only blank lines and `#`
 * comments may come before the first section. One pass, no regular expressions.
 */
export function scanSections(text: string): Section[] {
  const sections: Section[] = []
  const cursor = new LineCursor(text)
  while (cursor.next()) {
    const first = cursor.firstNonBlank()
    if (first === cursor.end) continue
    const c = text.charCodeAt(first)
    if (c === 126 /* ~ */) {
      if (sections.length >= MAX_SECTIONS)
        refuse(cursor.number, `More than ${MAX_SECTIONS} sections.`)
      const open = sections.at(-1)
      if (open) open.bodyEnd = cursor.start
      sections.push({
        title: text.slice(first + 1, cursor.end).trim(),
        line: cursor.number,
        bodyStart: cursor.nextOffset,
        bodyEnd: text.length,
        bodyFirstLine: cursor.number + 1,
      })
    } else if (sections.length === 0 && c !== 35 /* # */) {
      refuse(cursor.number, 'The file must start with the ~V (version) section.')
    }
  }
  if (sections.length === 0)
    refuse(Math.max(cursor.number, 1), 'No LAS sections (lines starting with ~) found.')
  return sections
}
