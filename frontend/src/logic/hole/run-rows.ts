// The runs grid's rows as typed, their checks (the API's rules, stated before sending) and their
// TCR, SCR, RQD and fracture frequency from orient's runMetrics, the function the server uses.
import { runMetrics, type RunMetrics } from '../../../../orient/index'
import { markConfidences } from '../../../../schema/vocabulary'
import type { MarkConfidence, Run, RunInput } from '../../api/types'
import { pickWord } from './entry-choices'
import { parseNumber } from './entry-fields'

export const runFields = [
  'fromDepth',
  'toDepth',
  'recovered',
  'solid',
  'rqdLength',
  'fractureCount',
  'markConfidence',
  'comment',
] as const
export type RunField = (typeof runFields)[number]
export type RunErrors = Partial<Record<RunField, string>>

export interface RunRow {
  key: string
  saved: Run | null
  cells: Record<RunField, string>
}

let nextKey = 0
const newKey = () => `run-${++nextKey}`
const text = (v: number | string) => String(v)

export function rowFromRun(run: Run): RunRow {
  const cells = Object.fromEntries(runFields.map((f) => [f, text(run[f])])) as RunRow['cells']
  return { key: newKey(), saved: run, cells }
}

/** A new row continuing the previous one: from its end, the same length. */
export function newRunRow(previous?: RunRow): RunRow {
  const from = previous ? parseNumber(previous.cells.toDepth) : 0
  const prevFrom = previous ? parseNumber(previous.cells.fromDepth) : undefined
  const length = from !== undefined && prevFrom !== undefined ? from - prevFrom : 3
  const start = from !== undefined && !Number.isNaN(from) ? from : 0
  const end = Math.round((start + (length > 0 ? length : 3)) * 1000) / 1000
  const cells = Object.fromEntries(runFields.map((f) => [f, ''])) as RunRow['cells']
  return {
    key: newKey(),
    saved: null,
    cells: { ...cells, fromDepth: text(start), toDepth: text(end), markConfidence: 'good' },
  }
}

const numeric: RunField[] = ['fromDepth', 'toDepth', 'recovered', 'solid', 'rqdLength']

export interface ParsedRun {
  input: RunInput | null
  errors: RunErrors
  metrics: RunMetrics | undefined
}

/** Cells → API body, with the API's rules (schema RunInput) as messages on the cells they name. */
export function parseRun(row: RunRow): ParsedRun {
  const errors: RunErrors = {}
  const v: Partial<Record<RunField, number>> = {}
  for (const f of [...numeric, 'fractureCount'] as RunField[]) {
    const value = parseNumber(row.cells[f])
    if (value === undefined) {
      if (f !== 'fractureCount') errors[f] = 'required'
    } else if (Number.isNaN(value) || value < 0) errors[f] = 'a number, 0 or more'
    else v[f] = value
  }
  if (v.fractureCount !== undefined && !Number.isInteger(v.fractureCount))
    errors.fractureCount = 'a whole number'
  const length = (v.toDepth ?? 0) - (v.fromDepth ?? 0)
  if (v.toDepth !== undefined && v.fromDepth !== undefined && length <= 0)
    errors.toDepth = 'must be deeper than From'
  else if (v.recovered !== undefined && v.recovered > length + 1e-9)
    errors.recovered = `${v.recovered} m is longer than the run (${Math.round(length * 1000) / 1000} m)`
  if (v.solid !== undefined && v.recovered !== undefined && v.solid > v.recovered + 1e-9)
    errors.solid = 'longer than the recovered core'
  if (v.rqdLength !== undefined && v.recovered !== undefined && v.rqdLength > v.recovered + 1e-9)
    errors.rqdLength = 'longer than the recovered core'
  const mark = pickWord(row.cells.markConfidence, markConfidences) as MarkConfidence | undefined
  if (!mark) errors.markConfidence = 'good, fair, poor or none'
  const metrics =
    v.fromDepth !== undefined && v.toDepth !== undefined && v.recovered !== undefined
      ? runMetrics({
          from: v.fromDepth,
          to: v.toDepth,
          recovered: v.recovered,
          solid: v.solid ?? 0,
          rqdLength: v.rqdLength ?? 0,
          fractures: v.fractureCount ?? 0,
        })
      : undefined
  const ok = Object.keys(errors).length === 0
  const input: RunInput | null = ok
    ? {
        fromDepth: v.fromDepth!,
        toDepth: v.toDepth!,
        recovered: v.recovered!,
        solid: v.solid!,
        rqdLength: v.rqdLength!,
        fractureCount: v.fractureCount ?? 0,
        markConfidence: mark!,
        comment: row.cells.comment.trim(),
      }
    : null
  return { input, errors, metrics }
}

export function isDirty(row: RunRow): boolean {
  if (!row.saved) return true
  const saved = row.saved
  return runFields.some((f) => row.cells[f].trim() !== text(saved[f]))
}

export interface RunSequence {
  /** Row key → the run it overlaps. */
  overlaps: Record<string, string>
  gaps: { from: number; to: number; afterKey: string }[]
}

/** Overlaps (errors) and gaps (reported) between the rows, by depth, as the server checks them. */
export function runSequence(rows: readonly RunRow[]): RunSequence {
  const spans = rows
    .map((r) => ({
      key: r.key,
      from: parseNumber(r.cells.fromDepth),
      to: parseNumber(r.cells.toDepth),
    }))
    .filter(
      (s): s is { key: string; from: number; to: number } =>
        s.from !== undefined && s.to !== undefined && !Number.isNaN(s.from) && !Number.isNaN(s.to),
    )
    .sort((a, b) => a.from - b.from)
  const out: RunSequence = { overlaps: {}, gaps: [] }
  for (let i = 1; i < spans.length; i++) {
    const a = spans[i - 1]!
    const b = spans[i]!
    if (b.from < a.to - 1e-9) {
      out.overlaps[b.key] = `overlaps the run ${a.from}–${a.to} m`
      out.overlaps[a.key] ??= `overlaps the run ${b.from}–${b.to} m`
    } else if (b.from > a.to + 1e-9) out.gaps.push({ from: a.to, to: b.from, afterKey: a.key })
  }
  return out
}
