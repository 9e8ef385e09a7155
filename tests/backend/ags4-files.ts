import { readFileSync } from 'node:fs'
import { expect } from 'vitest'
import { checkAgs } from '../../backend/src/exports/ags4-validate'
import { readDictionaryFile } from '../../backend/src/exports/ags4-dictionary-file'
import { dictionaryOf } from '../../backend/src/exports/ags4-standard'

/** Our own valid AGS4 files (Greyscar Quarry), with groups Downdip itself does not write. */
export const validFiles = ['gsq-site-investigation.ags', 'gsq-laboratory.ags', 'gsq-monitoring.ags']

export const readAgs = (name: string) =>
  readFileSync(new URL(`../../testdata/ags4/${name}`, import.meta.url), 'latin1')

export const site = readAgs('gsq-site-investigation.ags')
export const lab = readAgs('gsq-laboratory.ags')
export const monitoring = readAgs('gsq-monitoring.ags')

/**
 * Our own test subset of the AGS 4.1.1 standard dictionary, in the AGS4 dictionary format: the
 * groups Downdip writes and those the files above use, with their KEY, REQUIRED and used headings
 * as 4.1.1 defines them (names, order, status, type, unit; no descriptions).
 */
export const dictionaryFileName = 'dictionary/gsq-test-dictionary-4-1-1.ags'
export const dictionaryText = readAgs(dictionaryFileName)
/** The test subset as the validator sees a loaded edition. */
export const testDictionary = dictionaryOf(
  '4.1.1',
  'loaded',
  readDictionaryFile(dictionaryText).groups,
)

/** `text` with `from` replaced by `to`; `from` must be there, so a test never breaks nothing. */
export function edit(text: string, from: string, to: string): string {
  expect(text.includes(from), `"${from}" is in the file`).toBe(true)
  return text.replace(from, to)
}

/** The 1-based line of the first line holding `needle`. */
export function lineOf(text: string, needle: string): number {
  const at = text.split('\n').findIndex((l) => l.includes(needle))
  expect(at, `"${needle}" is in the file`).toBeGreaterThanOrEqual(0)
  return at + 1
}

/** The findings of a file as `rule@line` (test dictionary loaded), errors only unless warnings. */
export function findings(text: string, withWarnings = false): string[] {
  return checkAgs(text, testDictionary)
    .issues.filter((i) => withWarnings || i.severity === 'error')
    .map((i) => `${i.rule}@${i.line}`)
}

/** The messages of a file's findings (test dictionary loaded). */
export const messages = (text: string) =>
  checkAgs(text, testDictionary).issues.map((i) => i.message)

const quote = (fields: string[]) => fields.map((f) => `"${f.replace(/"/g, '""')}"`).join(',')
const unquote = (line: string) =>
  line
    .slice(1, -1)
    .split('","')
    .map((f) => f.replace(/""/g, '"'))

/** Applies `change` to every row (HEADING, UNIT, TYPE, DATA) of one group, as field arrays. */
function eachRow(text: string, group: string, change: (fields: string[], head: string[]) => void) {
  const lines = text.split('\r\n')
  const start = lines.indexOf(`"GROUP","${group}"`)
  expect(start, `group ${group} is in the file`).toBeGreaterThanOrEqual(0)
  const head = unquote(lines[start + 1])
  for (let i = start + 1; i < lines.length && lines[i] !== ''; i++) {
    const fields = unquote(lines[i])
    change(fields, head)
    lines[i] = quote(fields)
  }
  return lines.join('\r\n')
}

/** Swaps two columns of a group in every row. */
export const swapColumns = (text: string, group: string, a: string, b: string) =>
  eachRow(text, group, (f, head) => {
    // head[0] is the HEADING descriptor, so its indexes are the rows' field indexes.
    const i = head.indexOf(a)
    const j = head.indexOf(b)
    expect(i * j, `${a} and ${b} are headings of ${group}`).toBeGreaterThan(0)
    ;[f[i], f[j]] = [f[j], f[i]]
  })

/** Moves one column of a group, in every row, to just before another. */
export const moveColumn = (text: string, group: string, heading: string, before: string) =>
  eachRow(text, group, (f, head) => {
    const i = head.indexOf(heading)
    expect(
      i * head.indexOf(before),
      `${heading} and ${before} are headings of ${group}`,
    ).toBeGreaterThan(0)
    const [field] = f.splice(i, 1)
    const rest = head.filter((h) => h !== heading)
    f.splice(rest.indexOf(before), 0, field)
  })

/** Removes one column of a group from every row. */
export const dropColumn = (text: string, group: string, heading: string) =>
  eachRow(text, group, (f, head) => {
    const i = head.indexOf(heading)
    expect(i, `${heading} is a heading of ${group}`).toBeGreaterThan(0)
    f.splice(i, 1)
  })

/** Removes a whole group and the blank line after it. */
export function dropGroup(text: string, group: string): string {
  const lines = text.split('\r\n')
  const start = lines.indexOf(`"GROUP","${group}"`)
  expect(start, `group ${group} is in the file`).toBeGreaterThanOrEqual(0)
  let end = start
  while (end < lines.length && lines[end] !== '') end++
  lines.splice(start, end - start + 1)
  return lines.join('\r\n')
}
