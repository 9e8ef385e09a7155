// Shapes of the CSV import API: the preview of an upload and the history of a hole's imports,
// from the imports table (schema/) and orient's computed values.
import type { StructureComputed } from '../../../orient/index'
import type { Import as ImportRow, Interval as IntervalRow } from '../../../schema/index'
import type { CsvImportKind, IntervalStatus } from '../../../schema/vocabulary'
import type { Wire } from './types'

/** One row of a clean preview; structures carry the orientation computed with the hole's survey. */
export type ImportSampleRow = Record<string, unknown> & {
  line: number
  computed?: StructureComputed
}

export interface ImportPreview {
  importId: string
  kind: CsvImportKind
  fileName: string
  /** How the bytes were read, and what the person importing must see (e.g. the encoding guessed). */
  encoding: 'utf-8' | 'windows-1252'
  warnings: string[]
  headers: string[]
  mapping: Record<string, string>
  options: Record<string, unknown>
  rowCount: number
  /** More rows than the server commits within a request: the commit runs as a job. */
  background: boolean
  sample: ImportSampleRow[]
  flagCounts: Record<string, number>
  /** A committed import of the same bytes into this hole: committing again needs a confirmation. */
  duplicateOf: { importId: string; fileName: string; committedAt: string | null } | null
  /** Reviewed intervals the rows reach: approved ones refuse the commit, checked ones go to draft. */
  intervalsReached: (Pick<IntervalRow, 'id' | 'name' | 'fromDepth' | 'toDepth'> & {
    status: Exclude<IntervalStatus, 'draft'>
  })[]
}

/** An import as the history shows it: no file bytes, options or errors. */
export type ImportRecord = Pick<
  Wire<ImportRow>,
  | 'id'
  | 'kind'
  | 'status'
  | 'fileName'
  | 'rowCount'
  | 'progress'
  | 'message'
  | 'createdAt'
  | 'committedAt'
  | 'undoneAt'
> & {
  /** Rows a replacing import (runs, survey) took out, put back if it is undone. */
  replacedCount: number
}

export type ImportUndone = ImportRecord & { removed: number; restored: number; recomputed: number }
