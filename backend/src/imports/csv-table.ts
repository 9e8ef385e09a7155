import Papa from 'papaparse'
import { ApiError, badRequest } from '../http/errors'

/** A delimited text file read into a header and string cells, each row with its file line. */
export interface CsvTable {
  headers: string[]
  rows: string[][]
  /** 1-based line in the file of each row (the header is line 1 or later). */
  lines: number[]
  delimiter: string
}

export const MAX_IMPORT_ROWS = 250_000
const SNIFF_BYTES = 64 * 1024

/** Rejects what is not text: NUL bytes, or more than 2% control characters in the first 64 KB. */
function assertText(buffer: Buffer): void {
  const head = buffer.subarray(0, SNIFF_BYTES)
  let control = 0
  for (const byte of head) {
    if (byte === 0)
      throw badRequest(
        'The file is not text (it contains NUL bytes).',
        [{ path: 'file', message: 'binary content' }],
        'not_text',
      )
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
 * Reads CSV (comma, semicolon, tab or bar separated; a UTF-8 byte-order mark is dropped) into a
 * table. Empty, binary or header-only files, duplicate headers and broken quoting → 400 naming the
 * line.
 */
export function readCsvTable(buffer: Buffer): CsvTable {
  if (buffer.length === 0 || buffer.toString('utf8').trim() === '') {
    throw badRequest('The file is empty.', [{ path: 'file', message: 'no content' }], 'empty_file')
  }
  assertText(buffer)
  const text = buffer.toString('utf8').replace(/^\uFEFF/, '')
  const parsed = Papa.parse<string[]>(text, {
    header: false,
    skipEmptyLines: false,
    delimitersToGuess: [',', ';', '\t', '|'],
  })
  const broken = parsed.errors.find((e) => e.type === 'Quotes')
  if (broken) {
    const line = (broken.row ?? 0) + 1
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
  const seen = new Set<string>()
  for (const h of headers) {
    const key = h.toLowerCase()
    if (h && seen.has(key)) {
      throw badRequest(
        `Line ${first + 1}: column "${h}" appears twice.`,
        [{ path: `file.line.${first + 1}`, message: `duplicate column ${h}` }],
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
    lines.push(i + 1)
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
  return { headers, rows, lines, delimiter: parsed.meta.delimiter }
}
