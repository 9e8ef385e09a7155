import Papa from 'papaparse'
import { ApiError, badRequest } from '../http/errors'

/** A delimited text file read into a header and string cells, each row with its file line. */
export interface CsvTable {
  headers: string[]
  rows: string[][]
  /** 1-based line in the file of each row (the header is line 1 or later). */
  lines: number[]
  delimiter: string
  linebreak: string
  /** How the bytes were read: UTF-8, or Windows-1252 when they are not valid UTF-8. */
  encoding: 'utf-8' | 'windows-1252'
  /** Things the person importing must see in the preview (e.g. the encoding guessed). */
  warnings: string[]
}

export const MAX_IMPORT_ROWS = 250_000
/** More columns than any logging sheet has: a junk or transposed file (400, not a huge preview). */
export const MAX_IMPORT_COLUMNS = 500
const SNIFF_BYTES = 64 * 1024

/** 1-based line of a byte or character offset: newlines before it, plus one. */
function lineAt(text: string | Buffer, offset: number): number {
  let line = 1
  for (let i = text.indexOf('\n'); i >= 0 && i < offset; i = text.indexOf('\n', i + 1)) line++
  return line
}

/**
 * Rejects what is not text: a NUL byte anywhere (named by its line: PostgreSQL text cannot hold
 * one), or more than 2% control characters in the first 64 KB.
 */
function assertText(buffer: Buffer): void {
  const nul = buffer.indexOf(0)
  if (nul >= 0) {
    const line = lineAt(buffer, nul)
    throw badRequest(
      `Line ${line}: the file is not text (it contains a NUL byte).`,
      [{ path: `file.line.${line}`, message: 'NUL byte (binary content)' }],
      'not_text',
    )
  }
  const head = buffer.subarray(0, SNIFF_BYTES)
  let control = 0
  for (const byte of head) {
    if (byte < 32 && byte !== 9 && byte !== 10 && byte !== 13) control++
  }
  if (control > head.length * 0.02) {
    throw badRequest(
      'The file is not text.',
      [{ path: 'file', message: 'binary content' }],
      'not_text',
    )
  }
}

/**
 * The bytes as text: UTF-8 when they are valid UTF-8 (a byte-order mark dropped), else Windows-1252
 * (a superset of Latin-1 for printable text, what spreadsheets on Windows save as "CSV"), with a
 * warning naming the first line that is not UTF-8 so the preview shows it.
 */
export function decodeText(buffer: Buffer): Pick<CsvTable, 'encoding' | 'warnings'> & {
  text: string
} {
  try {
    const text = new TextDecoder('utf-8', { fatal: true }).decode(buffer).replace(/^\uFEFF/, '')
    return { text, encoding: 'utf-8', warnings: [] }
  } catch {
    const text = new TextDecoder('windows-1252').decode(buffer)
    let bad = 0
    while (bad < buffer.length) {
      const b = buffer[bad]
      const len = b < 0x80 ? 1 : b >= 0xc2 && b <= 0xdf ? 2 : b >= 0xe0 && b <= 0xef ? 3 : 4
      const tail = buffer.subarray(bad + 1, bad + len)
      if (len > 1 && (b > 0xf4 || tail.length < len - 1 || tail.some((t) => (t & 0xc0) !== 0x80)))
        break
      bad += len
    }
    const line = lineAt(buffer, bad)
    return {
      text,
      encoding: 'windows-1252',
      warnings: [
        `The file is not UTF-8 (first at line ${line}): it was read as Windows-1252 (Latin-1). Check accented text in the preview, or save the file as UTF-8.`,
      ],
    }
  }
}

/** Line breaks inside a cell's text: `\n` (also ending CRLF), or a bare `\r` in old Mac files. */
function breaksIn(cell: string, linebreak: string): number {
  const mark = linebreak === '\r' ? '\r' : '\n'
  let n = 0
  for (let i = cell.indexOf(mark); i >= 0; i = cell.indexOf(mark, i + 1)) n++
  return n
}

/**
 * The file line each parsed row starts on. Papa keeps a quoted cell's line breaks in its text, so
 * row r starts one line after row r − 1 ends: its first line plus the breaks its cells hold.
 */
function rowLines(rows: string[][], linebreak: string): number[] {
  const out: number[] = []
  let line = 1
  for (const row of rows) {
    out.push(line)
    line += 1 + row.reduce((n, cell) => n + breaksIn(cell, linebreak), 0)
  }
  return out
}

/** The file line of one cell: its row's first line plus the line breaks in the cells before it. */
export function cellLine(table: CsvTable, rowIndex: number, column: number): number {
  const cells = table.rows[rowIndex]
  let line = table.lines[rowIndex]
  for (let c = 0; c < column && c < cells.length; c++) line += breaksIn(cells[c], table.linebreak)
  return line
}

/**
 * Reads CSV (comma, semicolon, tab or bar separated; UTF-8 with or without a byte-order mark, or
 * Windows-1252 with a warning) into a table. Empty, binary or header-only files, duplicate headers,
 * too many columns and broken quoting → 400 naming the line. Lines are physical file lines.
 */
export function readCsvTable(buffer: Buffer): CsvTable {
  if (buffer.length === 0 || buffer.toString('utf8').trim() === '') {
    throw badRequest('The file is empty.', [{ path: 'file', message: 'no content' }], 'empty_file')
  }
  assertText(buffer)
  const { text, encoding, warnings } = decodeText(buffer)
  const parsed = Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t', '|'],
  })
  const physical = rowLines(parsed.data, parsed.meta.linebreak)
  const broken = parsed.errors.find((e) => e.type === 'Quotes')
  if (broken) {
    const line = physical[broken.row ?? 0] ?? (broken.row ?? 0) + 1
    throw badRequest(
      `Line ${line}: ${broken.message}.`,
      [{ path: `file.line.${line}`, message: broken.message }],
      'bad_csv',
    )
  }
  const all = parsed.data
  let first = all.findIndex((r) => r.some((c) => c.trim() !== ''))
  if (first < 0) first = 0
  const headers = (all[first] ?? []).map((h) => h.trim())
  const headerLine = physical[first] ?? first + 1
  if (headers.length > MAX_IMPORT_COLUMNS) {
    throw badRequest(
      `Line ${headerLine}: the header has ${headers.length} columns; the limit is ${MAX_IMPORT_COLUMNS}.`,
      [
        {
          path: `file.line.${headerLine}`,
          message: `${headers.length} columns (at most ${MAX_IMPORT_COLUMNS})`,
        },
      ],
      'too_many_columns',
    )
  }
  const seen = new Set<string>()
  for (const h of headers) {
    const key = h.toLowerCase()
    if (h && seen.has(key)) {
      throw badRequest(
        `Line ${headerLine}: column "${h}" appears twice.`,
        [{ path: `file.line.${headerLine}`, message: `duplicate column ${h}` }],
        'bad_csv',
      )
    }
    seen.add(key)
  }
  const rows: string[][] = []
  const lines: number[] = []
  for (let i = first + 1; i < all.length; i++) {
    const row = all[i]
    if (row.every((c) => c.trim() === '')) continue
    rows.push(row)
    lines.push(physical[i])
  }
  if (rows.length === 0) {
    throw badRequest(
      'The file has a header but no data rows.',
      [{ path: 'file', message: 'no data rows' }],
      'empty_file',
    )
  }
  if (rows.length > MAX_IMPORT_ROWS) {
    throw new ApiError(
      413,
      'too_many_rows',
      `The file has ${rows.length} rows; the limit is ${MAX_IMPORT_ROWS}.`,
    )
  }
  return {
    headers,
    rows,
    lines,
    delimiter: parsed.meta.delimiter,
    linebreak: parsed.meta.linebreak,
    encoding,
    warnings,
  }
}
