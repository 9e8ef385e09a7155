import type { z } from 'zod'
import { badRequest } from '../http/errors'
import { cellLine, type CsvTable } from './csv-table'

/** A target field of an import and the column names that suggest it. */
export interface FieldSpec {
  name: string
  kind: 'number' | 'text'
  required: boolean
  aliases: readonly string[]
}

/** One problem in one cell (or row): data row number, file line, source column, reason. */
export interface RowError {
  row: number
  line: number
  column: string
  message: string
}

export interface ParsedRow<T> {
  row: number
  line: number
  value: T
}

const normalise = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, '')

/** Field → header, by exact or alias match (case, spaces and punctuation ignored). */
export function suggestMapping(
  headers: string[],
  fields: readonly FieldSpec[],
): Record<string, string> {
  const byKey = new Map(headers.map((h) => [normalise(h), h]))
  const mapping: Record<string, string> = {}
  for (const f of fields) {
    for (const name of [f.name, ...f.aliases]) {
      const hit = byKey.get(normalise(name))
      if (hit !== undefined) {
        mapping[f.name] = hit
        break
      }
    }
  }
  return mapping
}

/** Field → column index; a mapped column missing from the file, or a required field left unmapped → 400. */
export function resolveMapping(
  headers: string[],
  fields: readonly FieldSpec[],
  mapping: Record<string, string>,
): Map<string, number> {
  const index = new Map<string, number>()
  const problems: { path: string; message: string }[] = []
  for (const f of fields) {
    const column = mapping[f.name]
    if (column === undefined || column === '') {
      if (f.required)
        problems.push({
          path: `mapping.${f.name}`,
          message: `required column "${f.name}" is missing: map it to a column of the file`,
        })
      continue
    }
    const at = headers.indexOf(column)
    if (at < 0)
      problems.push({ path: `mapping.${f.name}`, message: `column "${column}" is not in the file` })
    else index.set(f.name, at)
  }
  if (problems.length) {
    const names = problems.map((p) => p.path.slice('mapping.'.length)).join(', ')
    throw badRequest(`Missing columns: ${names}.`, problems, 'missing_columns')
  }
  return index
}

const NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/
const DECIMAL_COMMA = /^[+-]?\d+,\d+$/

/** Cell text → number, undefined when blank, or an error message. */
function toNumber(text: string, decimalComma: boolean): number | undefined | string {
  const t = text.trim()
  if (t === '') return undefined
  const candidate = decimalComma && DECIMAL_COMMA.test(t) ? t.replace(',', '.') : t
  if (!NUMBER.test(candidate)) return `"${t}" is not a number`
  return Number(candidate)
}

/**
 * Every row through the mapping and the row schema: numbers parsed (decimal commas accepted in
 * semicolon files), then zod. All errors are collected, none stops the pass.
 */
export function readRows<T>(
  table: CsvTable,
  fields: readonly FieldSpec[],
  index: Map<string, number>,
  schema: z.ZodType<T>,
): { rows: ParsedRow<T>[]; errors: RowError[] } {
  const decimalComma = table.delimiter === ';'
  const rows: ParsedRow<T>[] = []
  const errors: RowError[] = []
  table.rows.forEach((cells, i) => {
    const where = { row: i + 1, line: table.lines[i] }
    if (cells.length !== table.headers.length) {
      errors.push({
        ...where,
        column: '',
        message: `has ${cells.length} fields, the header has ${table.headers.length}`,
      })
      return
    }
    const raw: Record<string, unknown> = {}
    let bad = false
    for (const f of fields) {
      const at = index.get(f.name)
      if (at === undefined) continue
      const text = cells[at] ?? ''
      if (f.kind === 'number') {
        const n = toNumber(text, decimalComma)
        if (typeof n === 'string') {
          const line = cellLine(table, i, at)
          errors.push({ ...where, line, column: table.headers[at], message: n })
          bad = true
        } else raw[f.name] = n
      } else raw[f.name] = text.trim() === '' ? undefined : text.trim()
    }
    if (bad) return
    const parsed = schema.safeParse(raw)
    if (parsed.success) {
      rows.push({ ...where, value: parsed.data })
      return
    }
    for (const issue of parsed.error.issues) {
      const field = String(issue.path[0] ?? '')
      const at = index.get(field)
      errors.push({
        ...where,
        line: at === undefined ? where.line : cellLine(table, i, at),
        column: at === undefined ? field : table.headers[at],
        message: issue.message,
      })
    }
  })
  return { rows, errors }
}

/** Row errors as API error details: `file.line.12.alpha`. */
export function rowErrorDetails(errors: RowError[], limit = 1000) {
  return errors.slice(0, limit).map((e) => ({
    path: `file.line.${e.line}${e.column ? `.${e.column}` : ''}`,
    message: `row ${e.row} (line ${e.line})${e.column ? `, column ${e.column}` : ''}: ${e.message}`,
  }))
}
