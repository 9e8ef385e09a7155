/** One header line `MNEM.UNIT  VALUE : DESCRIPTION` (CWLS LAS 2.0; LAS 3.0 adds {format}). */
export interface HeaderItem {
  mnemonic: string
  unit: string
  value: string
  description: string
  /** LAS 3.0 only: the `{F}`-style format code, '' when absent. */
  format: string
  /** 1-based line in the file. */
  line: number
}

/** A curve from ~C / ~Log_Definition with its samples; `value` holds the API code if any. */
export interface LasCurve extends HeaderItem {
  /** Samples in file order; NaN where the file holds the NULL value (and for text columns). */
  values: Float64Array
  /** A LAS 3.0 text column (`{S}`, dates): the values as written, one per sample. */
  text?: string[]
}

/** A LAS 3.0 data set beyond the log: a second log, a hole survey (inclinometry), cores, tops… */
export interface LasDataSet {
  /** The set's name from its definition (LOG (2), INCLINOMETRY, CORE [1]…). */
  name: string
  kind: 'log' | 'inclinometry' | 'other'
  /** Line of its definition section. */
  line: number
  /** Index column first, as defined. */
  curves: LasCurve[]
  sampleCount: number
  depthUnit: string
  /** Null when the index is not a depth (a test number, a date). */
  metresPerDepthUnit: number | null
}

/** A warning (the file is read) or, inside LasReadError, a reason the file is refused. */
export interface LasProblem {
  line: number | null
  message: string
}

export type LasDelimiter = 'SPACE' | 'TAB' | 'COMMA'
export type LasVersion = '1.2' | '2.0' | '3.0'

/** A section the reader does not import (LAS 3.0 ~Inclinometry_*, ~Core_*, user-defined…). */
export interface LasSectionNote {
  title: string
  line: number
  inclinometry: boolean
}

export interface LasFile {
  version: LasVersion
  wrap: boolean
  delimiter: LasDelimiter
  /** ~W items keyed by upper-case mnemonic (STRT, STOP, STEP, NULL, WELL, COMP, UWI, DATE…). */
  well: Record<string, HeaderItem>
  start: number | null
  stop: number | null
  /** null when absent; 0 means irregular sampling (LAS 2.0). */
  step: number | null
  nullValue: number | null
  parameters: HeaderItem[]
  /** ~O free text, lines joined with '\n'. */
  other: string
  /** Index (depth) curve first, as in the file. */
  curves: LasCurve[]
  /** The depth unit as written (upper case) and its size in metres. */
  depthUnit: string
  metresPerDepthUnit: number
  sampleCount: number
  /** LAS 3.0 data sets read besides the log (none in 1.2/2.0 files). */
  dataSets: LasDataSet[]
  otherSections: LasSectionNote[]
  problems: LasProblem[]
}

/** A file the reader refuses; `issues[0]` is the first reason, each with its line number. */
export class LasReadError extends Error {
  readonly issues: { line: number; message: string }[]

  constructor(issues: { line: number; message: string }[]) {
    super(
      issues.length > 0 ? `Line ${issues[0].line}: ${issues[0].message}` : 'Unreadable LAS file',
    )
    this.name = 'LasReadError'
    this.issues = issues
  }

  get line(): number {
    return this.issues[0]?.line ?? 1
  }
}

/** Throws a one-issue LasReadError. */
export function refuse(line: number, message: string): never {
  throw new LasReadError([{ line, message }])
}

/** Warnings kept in full: enough to judge a file, bounded for a junk one. */
const MAX_PROBLEMS = 100

/** Collects warnings, keeping the first hundred and counting the rest. */
export class ProblemLog {
  private readonly list: LasProblem[] = []
  private dropped = 0

  push(...problems: LasProblem[]): void {
    for (const p of problems) {
      if (this.list.length < MAX_PROBLEMS) this.list.push(p)
      else this.dropped++
    }
  }

  toArray(): LasProblem[] {
    const more =
      this.dropped > 0 ? [{ line: null, message: `${this.dropped} more warnings not listed.` }] : []
    return [...this.list, ...more]
  }
}
