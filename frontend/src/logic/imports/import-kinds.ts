// What each CSV import kind maps and asks, for the import screen. The fields and conventions are
// the server's own (schema/vocabulary-imports.ts); this module adds only the screen's words.
import {
  csvImportKinds,
  importFieldSpecs,
  importOptions,
  PROJECT_SETTING,
  type CsvImportKind,
} from '../../../../schema/vocabulary'

export { PROJECT_SETTING }

export interface ImportField {
  name: string
  label: string
  required?: boolean
}

export interface ImportOption {
  key: string
  label: string
  choices: { value: string; label: string }[]
  initial: string
}

export interface ImportKindSpec {
  title: string
  fields: ImportField[]
  options: ImportOption[]
  /** Said before commit: structures are added, runs and survey replaced. */
  commitNote: string
}

/** A field with no column of the file (a select cannot show an empty value as chosen). */
export const NOT_MAPPED = '(none)'

const words: Record<CsvImportKind, { title: string; commitNote: string }> = {
  structures: {
    title: 'structures',
    commitNote: "Committing adds these structures to the hole's logged structures.",
  },
  runs: {
    title: 'core runs',
    commitNote:
      "Committing REPLACES all of this hole's core runs with the rows of this file, and recomputes every structure's flags.",
  },
  survey: {
    title: 'survey stations',
    commitNote:
      "Committing REPLACES this hole's whole survey with the stations of this file; every structure is then recomputed with it.",
  },
  picks: {
    title: 'televiewer picks',
    commitNote:
      'Committing adds these picks as image structures, converted with the survey at each depth; picks in steep parts or taller than the hole allows are flagged.',
  },
}

export const importKinds = Object.fromEntries(
  csvImportKinds.map((kind) => [
    kind,
    {
      ...words[kind],
      fields: importFieldSpecs[kind].map(({ name, label, required }) =>
        required ? { name, label, required } : { name, label },
      ),
      options: importOptions[kind],
    },
  ]),
) as Record<CsvImportKind, ImportKindSpec>

/** The options to send: those left to the project's setting are left out. */
export function optionsToSend(values: Record<string, string>): Record<string, string> {
  return Object.fromEntries(Object.entries(values).filter(([, v]) => v !== PROJECT_SETTING))
}

export function initialOptions(kind: CsvImportKind): Record<string, string> {
  return Object.fromEntries(importKinds[kind].options.map((o) => [o.key, o.initial]))
}

/** An import's status in words, the same in the import panel and the history. */
export const importStatusWords: Record<string, string> = {
  previewed: 'checked, not committed',
  queued: 'waiting for a worker',
  committing: 'committing',
  committed: 'committed',
  failed: 'failed',
  undone: 'undone',
}
