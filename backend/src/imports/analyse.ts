import { z } from 'zod'
import type {
  CsvImportKind,
  RunInputT,
  StationInputT,
  StructureInputT,
} from '../../../schema/index'
import { badRequest } from '../http/errors'
import { zodDetails } from '../http/validate'
import { readCsvTable, type CsvTable } from './csv-table'
import {
  readRows,
  resolveMapping,
  suggestMapping,
  type FieldSpec,
  type ParsedRow,
  type RowError,
} from './csv-rows'
import { RunImportOptions, runFieldSpecs, runRowSchema } from './kinds/runs'
import { StructureImportOptions, structureFieldSpecs, structureRowSchema } from './kinds/structures'
import { PickImportOptions, pickFieldSpecs, pickRowSchema, type PickRow } from './kinds/picks'
import { SurveyImportOptions, surveyFieldSpecs, surveyRowSchema } from './kinds/survey'

export { csvImportKinds, type CsvImportKind } from '../../../schema/index'

interface KindRows {
  picks: PickRow
  structures: StructureInputT
  runs: RunInputT
  survey: StationInputT
}

/** What one upload holds once read: the table, the mapping and options used, good rows, errors. */
export interface Analysis<K extends CsvImportKind = CsvImportKind> {
  kind: K
  table: CsvTable
  mapping: Record<string, string>
  options: Record<string, unknown>
  fields: readonly FieldSpec[]
  rows: ParsedRow<KindRows[K]>[]
  errors: RowError[]
}

const kinds = {
  structures: {
    fields: structureFieldSpecs,
    options: StructureImportOptions,
    rowSchema: structureRowSchema,
  },
  runs: { fields: runFieldSpecs, options: RunImportOptions, rowSchema: runRowSchema },
  survey: { fields: surveyFieldSpecs, options: SurveyImportOptions, rowSchema: surveyRowSchema },
  picks: { fields: pickFieldSpecs, options: PickImportOptions, rowSchema: pickRowSchema },
} as const

/** Rows that clash with each other: repeated survey depths, overlapping runs. */
function crossRowErrors(kind: CsvImportKind, a: Pick<Analysis, 'rows' | 'mapping'>): RowError[] {
  const errors: RowError[] = []
  if (kind === 'survey') {
    const seen = new Map<number, number>()
    for (const r of a.rows as ParsedRow<StationInputT>[]) {
      const first = seen.get(r.value.depth)
      if (first !== undefined) {
        errors.push({
          row: r.row,
          line: r.line,
          column: a.mapping.depth,
          message: `depth ${r.value.depth} repeats line ${first}`,
        })
      } else seen.set(r.value.depth, r.line)
    }
  }
  if (kind === 'runs') {
    const sorted = [...(a.rows as ParsedRow<RunInputT>[])].sort(
      (x, y) => x.value.fromDepth - y.value.fromDepth,
    )
    for (let i = 1; i < sorted.length; i++) {
      const prev = sorted[i - 1]
      const r = sorted[i]
      if (r.value.fromDepth < prev.value.toDepth - 1e-9) {
        errors.push({
          row: r.row,
          line: r.line,
          column: a.mapping.fromDepth,
          message: `run overlaps the run on line ${prev.line}`,
        })
      }
    }
  }
  return errors
}

/** The depth field of each kind that must lie within the hole: a run ends by its toDepth. */
const deepestField = {
  structures: 'depth',
  picks: 'depth',
  survey: 'depth',
  runs: 'toDepth',
} as const

/** Rows deeper than the hole's final depth, named by line and by the column the depth came from. */
function beyondFinalDepth(
  kind: CsvImportKind,
  a: Pick<Analysis, 'rows' | 'mapping'>,
  finalDepth: number | undefined,
): RowError[] {
  if (finalDepth === undefined) return []
  const field = deepestField[kind]
  return a.rows.flatMap((r) => {
    const depth = (r.value as unknown as Record<typeof field, number>)[field]
    if (!(depth > finalDepth + 1e-9)) return []
    return [
      {
        row: r.row,
        line: r.line,
        column: a.mapping[field] ?? field,
        message: `${field} ${Math.round(depth * 1000) / 1000} m is beyond the hole's final depth (${finalDepth} m)`,
      },
    ]
  })
}

/** What the rows are checked against besides the file itself. */
export interface AnalyseLimits {
  /** The hole's final depth, metres: no row may lie deeper. */
  finalDepth?: number
}

/** Reads an upload of one kind with a mapping (suggested from the headers when absent) and options. */
export function analyseCsv<K extends CsvImportKind>(
  kind: K,
  file: Buffer,
  mappingIn: Record<string, string> | undefined,
  optionsIn: unknown,
  limits: AnalyseLimits = {},
): Analysis<K> {
  const spec = kinds[kind]
  const opts = (spec.options as z.ZodType).safeParse(optionsIn ?? {})
  if (!opts.success) throw badRequest('Invalid import options.', zodDetails('options', opts.error))
  const table = readCsvTable(file)
  const mapping = mappingIn ?? suggestMapping(table.headers, spec.fields)
  const index = resolveMapping(table.headers, spec.fields, mapping)
  const schema = (
    spec.rowSchema as unknown as (o: unknown, m: Set<string>) => z.ZodType<KindRows[K]>
  )(opts.data, new Set(index.keys()))
  const { rows, errors } = readRows(table, spec.fields, index, schema)
  const cross = [
    ...crossRowErrors(kind, { rows, mapping }),
    ...beyondFinalDepth(kind, { rows, mapping }, limits.finalDepth),
  ]
  const all = [...errors, ...cross].sort((x, y) => x.line - y.line)
  return {
    kind,
    table,
    mapping,
    options: opts.data as Record<string, unknown>,
    fields: spec.fields,
    rows,
    errors: all,
  }
}
