import { LineCursor } from './text'
import { parseDecimal, tokenize } from './tokenize'
import type { LasDelimiter, LasProblem } from './types'

export interface DataRequest {
  text: string
  bodyStart: number
  bodyEnd: number
  bodyFirstLine: number
  curveCount: number
  wrap: boolean
  delimiter: LasDelimiter
  nullValue: number | null
}

export interface DataResult {
  columns: Float64Array[]
  rows: number
  /** Refusals; when not empty the file must be refused. */
  errors: { line: number; message: string }[]
  warnings: LasProblem[]
}

/** Stop collecting after this many refusals: enough to fix a file, bounded for a junk one. */
const MAX_ERRORS = 20
/**
 * Largest depth index accepted, in the file's own unit: 100,000 (30 km in feet, 100 km in metres)
 * is past any borehole; a value such as 1e308 is a corrupt file, not a depth.
 */
export const MAX_INDEX_DEPTH = 100_000

/**
 * Reads ~A / ~Log_Data: numbers only (CWLS LAS 2.0), NULL → NaN. Unwrapped: one
 * sample per line with one value per curve. Wrapped: the depth alone on a line, the other values
 * on the lines after it. Depths must be non-NULL and strictly increasing or decreasing. One pass.
 */
export function readData(req: DataRequest): DataResult {
  const { text, curveCount: n, nullValue } = req
  let capacity = 1
  for (let i = text.indexOf('\n', req.bodyStart); i >= 0 && i < req.bodyEnd;) {
    capacity++
    i = text.indexOf('\n', i + 1)
  }
  const columns = Array.from({ length: n }, () => new Float64Array(capacity))
  const row = new Float64Array(n)
  const values = new Float64Array(n)
  const errors: DataResult['errors'] = []
  let emptyFields = 0
  let rows = 0
  let filled = 0
  let recordLine = 0
  let lastDataLine = 0
  let direction = 0
  let shortLast = false

  const fail = (line: number, message: string) => {
    if (errors.length < MAX_ERRORS) errors.push({ line, message })
  }
  const commit = (line: number) => {
    const depth = row[0]
    if (Number.isNaN(depth)) return fail(line, 'The depth of this sample is the NULL value.')
    if (!Number.isFinite(depth) || Math.abs(depth) > MAX_INDEX_DEPTH)
      return fail(line, `Depth ${depth} is out of range (at most ${MAX_INDEX_DEPTH} in any unit).`)
    for (let c = 1; c < n; c++)
      if (row[c] === Infinity || row[c] === -Infinity)
        return fail(line, `The value of curve ${c + 1} is too large to store.`)
    if (rows > 0) {
      const step = depth - columns[0][rows - 1]
      if (direction === 0 && step !== 0) direction = Math.sign(step)
      if (step === 0 || Math.sign(step) !== direction)
        return fail(line, `Depth ${depth} does not continue the run of depths before it.`)
    }
    for (let c = 0; c < n; c++) columns[c][rows] = row[c]
    rows++
  }

  const cursor = new LineCursor(text, req.bodyStart, req.bodyEnd, req.bodyFirstLine)
  const tokens: number[] = []
  while (cursor.next() && errors.length < MAX_ERRORS) {
    const first = cursor.firstNonBlank()
    if (first === cursor.end || text.charCodeAt(first) === 35 /* # */) continue
    lastDataLine = cursor.number
    tokens.length = 0
    emptyFields += tokenize(text, first, cursor.end, req.delimiter, tokens)
    const count = tokens.length / 2
    const parsed = Math.min(count, n)
    let bad = -1
    for (let t = 0; t < parsed; t++) {
      const a = tokens[2 * t]
      const b = tokens[2 * t + 1]
      // an empty field (TAB/COMMA) is absent; anything else must be a number
      const v = a < b ? parseDecimal(text, a, b) : NaN
      if (a < b && Number.isNaN(v)) {
        bad = t
        break
      }
      values[t] = v === nullValue ? NaN : v
    }
    if (bad >= 0) {
      const a = tokens[2 * bad]
      const shown = text.slice(a, Math.min(tokens[2 * bad + 1], a + 24))
      fail(cursor.number, `Text in the data: "${shown}" is not a number.`)
      continue
    }
    if (!req.wrap) {
      if (count !== n) {
        shortLast = count < n
        fail(cursor.number, `This line has ${count} values; the ~C section defines ${n} curves.`)
        continue
      }
      row.set(values)
      commit(cursor.number)
      continue
    }
    if (filled === 0) {
      if (count !== 1) {
        fail(cursor.number, 'Wrapped data (WRAP YES) must have the depth alone on its line.')
        continue
      }
      row[0] = values[0]
      filled = 1
      recordLine = cursor.number
    } else if (filled + count > n) {
      fail(cursor.number, `The sample starting at line ${recordLine} has more than ${n} values.`)
      filled = 0
    } else {
      for (let t = 0; t < count; t++) row[filled + t] = values[t]
      filled += count
    }
    if (filled === n) {
      commit(recordLine)
      filled = 0
    }
  }
  // a cut-off file ends in a short last sample: an unwrapped short line is caught above
  if (req.wrap && filled > 0 && errors.length < MAX_ERRORS) {
    fail(
      lastDataLine,
      `The sample starting at line ${recordLine} ends after ${filled} of ${n} values: the file seems cut short.`,
    )
  }
  // only the last line short: the file was most likely cut off while being written or copied
  if (!req.wrap && errors.length === 1 && errors[0].line === lastDataLine && shortLast) {
    errors[0].message += ' The file seems cut short.'
  }
  const warnings: LasProblem[] =
    emptyFields > 0
      ? [{ line: null, message: `${emptyFields} empty data fields read as NULL.` }]
      : []
  // wrapped files over-reserve (several lines per sample): copy rather than pin the spare room
  const trim = (c: Float64Array) => (rows * 2 < capacity ? c.slice(0, rows) : c.subarray(0, rows))
  return { columns: columns.map(trim), rows, errors, warnings }
}
