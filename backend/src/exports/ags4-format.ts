import { agsGroups, type AgsHeading } from './ags4-dictionary'
import { neutraliseCell } from './cell-safety'

/** A group ready to write: its headings (dictionary order, user-defined last) and DATA rows. */
export interface AgsTable {
  name: string
  headings: AgsHeading[]
  rows: Record<string, string>[]
}

const replacements: Record<string, string> = {
  '\u00b0': ' deg',
  '\u2013': '-',
  '\u2014': '-',
  '\u2018': "'",
  '\u2019': "'",
  '\u201c': '"',
  '\u201d': '"',
  '\u00d7': 'x',
  '\u2265': '>=',
  '\u2264': '<=',
}

/** AGS4 files are ASCII with no line breaks inside a field: map what we can, drop the rest. */
export function asciiField(text: string): string {
  return text
    .replace(/[\r\n\t]+/g, ' ')
    .replace(/[^\x20-\x7e]/g, (c) => replacements[c] ?? '')
    .normalize('NFKD')
    .replace(/[^\x20-\x7e]/g, '')
}

/** A number with exactly `n` decimals (the nDP types); blank when missing. */
export function dp(x: number | null | undefined, n: number): string {
  if (x === null || x === undefined || !Number.isFinite(x)) return ''
  const s = x.toFixed(n)
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s
}

const quote = (field: string) => `"${asciiField(field).replace(/"/g, '""')}"`
const line = (fields: string[]) => `${fields.map(quote).join(',')}\r\n`
/** DATA fields are neutralised against spreadsheet formula injection; numbers stay numbers. */
const dataLine = (fields: string[]) => line(fields.map((f, i) => (i === 0 ? f : neutraliseCell(f))))

/** The headings of a dictionary group, keeping only those named (dictionary order kept). */
export function headingsOf(group: string, names?: readonly string[]): AgsHeading[] {
  const all = agsGroups[group]
  return names ? all.filter((hd) => names.includes(hd.name)) : all
}

/** Writes the tables as AGS4 text: GROUP, HEADING, UNIT, TYPE, DATA rows; a blank line between. */
export function writeAgsTables(tables: readonly AgsTable[]): string {
  return tables
    .map((t) => {
      const names = t.headings.map((hd) => hd.name)
      return [
        line(['GROUP', t.name]),
        line(['HEADING', ...names]),
        line(['UNIT', ...t.headings.map((hd) => hd.unit)]),
        line(['TYPE', ...t.headings.map((hd) => hd.type)]),
        ...t.rows.map((r) => dataLine(['DATA', ...names.map((n) => r[n] ?? '')])),
      ].join('')
    })
    .join('\r\n')
}
