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
  /** LAS 3.0 `{S}` (and date/time) columns: read as text, not numbers. Never the index. */
  textColumns?: readonly boolean[]
}

export interface DataResult {
  columns: Float64Array[]
  /** The text of each text column (others null), one entry per sample. */
  texts: (string[] | null)[]
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
 * Reads ~A / ~Log_Data: numbers (CWLS LAS 2.0), NULL → NaN, and LAS 3.0 text columns as text.
 * Decimal commas (`12,5`) are read where a comma cannot be the delimiter (DLM SPACE or TAB, or a
 * quoted field), with a notice; a file that mixes decimal points and decimal commas is ambiguous
 * and refused at the first line that disagrees. Unwrapped: one
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
  const isText = Array.from({ length: n }, (_, c) => c > 0 && req.textColumns?.[c] === true)
  const texts: (string[] | null)[] = isText.map((t) => (t ? [] : null))
  const rowText: string[] = new Array<string>(n).fill('')
  const commaDecimals = req.delimiter !== 'COMMA'
  let firstComma = 0
  let firstPoint = 0
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
    for (let c = 1; c < n; c++) if (isText[c]) texts[c]!.push(rowText[c])
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
    // the column each token fills: wrapped lines continue the sample being filled
    const column0 = req.wrap && filled > 0 ? filled : 0
    let mixed = ''
    for (let t = 0; t < parsed; t++) {
      const a = tokens[2 * t]
      const b = tokens[2 * t + 1]
      const column = column0 + t
      if (column < n && isText[column]) {
        rowText[column] = text.slice(a, b).replaceAll('""', '"')
        values[t] = NaN
        continue
      }
      // an empty field (TAB/COMMA) is absent; anything else must be a number
      let v = a < b ? parseDecimal(text, a, b) : NaN
      if (a < b && Number.isNaN(v) && commaDecimals) {
        v = parseCommaDecimal(text, a, b)
        if (!Number.isNaN(v)) firstComma ||= cursor.number
      } else if (!Number.isNaN(v) && firstPoint === 0 && hasPoint(text, a, b)) {
        firstPoint = cursor.number
      }
      if (a < b && Number.isNaN(v)) {
        bad = t
        break
      }
      if (firstComma > 0 && firstPoint > 0 && mixed === '') {
        mixed = `Decimal commas (line ${firstComma}) and decimal points (line ${firstPoint}) in one file: which is meant is ambiguous.`
      }
      values[t] = v === nullValue ? NaN : v
    }
    if (mixed !== '') {
      fail(cursor.number, mixed)
      break
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
  if (firstComma > 0)
    warnings.push({
      line: firstComma,
      message: 'Decimal commas read as decimal marks (12,5 = 12.5).',
    })
  // wrapped files over-reserve (several lines per sample): copy rather than pin the spare room
  const trim = (c: Float64Array) => (rows * 2 < capacity ? c.slice(0, rows) : c.subarray(0, rows))
  return { columns: columns.map(trim), texts, rows, errors, warnings }
}

/** `12,5` or `-0,25` (one comma, digits on both sides, no point or exponent) → 12.5; else NaN. */
function parseCommaDecimal(text: string, a: number, b: number): number {
  const comma = text.indexOf(',', a)
  if (comma < 0 || comma >= b - 1) return NaN
  let i = a
  const sign = text.charCodeAt(i)
  if (sign === 45 || sign === 43) i++
  if (i === comma) return NaN
  for (let k = i; k < b; k++) {
    const c = text.charCodeAt(k)
    if (k !== comma && !(c >= 48 && c <= 57)) return NaN
  }
  return Number(`${text.slice(a, comma)}.${text.slice(comma + 1, b)}`)
}

function hasPoint(text: string, a: number, b: number): boolean {
  const p = text.indexOf('.', a)
  return p >= 0 && p < b
}
