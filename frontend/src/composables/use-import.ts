import { computed, ref, shallowRef } from 'vue'
import { commitImport, uploadImport } from '../api/imports'
import { isApiError } from '../api/client'
import type { CsvImportKind, ErrorDetail, ImportPreview, ImportRecord } from '../api/types'
import { describeError } from '../logic/format'
import { importKinds, initialOptions, optionsToSend } from '../logic/imports/import-kinds'
import { guessMapping, sniffHeaders } from '../logic/imports/import-problems'
import { useImportProgress } from './use-import-progress'

export type ImportStage = 'pick' | 'problems' | 'preview' | 'following' | 'done'

export interface ImportProblems {
  code: string
  message: string
  details: ErrorDetail[]
  rowCount?: number
  errorCount?: number
}

/**
 * One CSV import: choose a file → upload for checking → fix mapping/options and check again (the
 * same File, re-sent) → clean preview → commit (or follow the background job). Only the server's
 * 20-row sample and error descriptions are held, never the file's rows.
 */
export function useImport(
  projectId: () => string,
  holeId: () => string,
  kind: () => CsvImportKind,
) {
  const stage = ref<ImportStage>('pick')
  const file = shallowRef<File | null>(null)
  const headers = ref<string[]>([])
  const mapping = ref<Record<string, string>>({})
  const options = ref<Record<string, string>>(initialOptions(kind()))
  const problems = ref<ImportProblems | null>(null)
  const preview = ref<ImportPreview | null>(null)
  const busy = ref(false)
  const error = ref<string | null>(null)
  /** Mapping or options changed since the preview: check again before committing. */
  const stale = ref(false)
  /** The logger saw that this file was committed here before and commits it again anyway. */
  const confirmDuplicate = ref(false)
  const progress = useImportProgress(projectId, holeId)
  const duplicate = computed(() => preview.value?.duplicateOf ?? null)
  const reached = computed(() => preview.value?.intervalsReached ?? [])
  /** Approved (or issued) intervals the rows reach: the server refuses such a commit. */
  const frozen = computed(() => reached.value.filter((i) => i.status !== 'checked'))
  /** Checked intervals the rows reach: they go back to draft when the commit goes through. */
  const demoted = computed(() => reached.value.filter((i) => i.status === 'checked'))
  const canCommit = computed(
    () =>
      stage.value === 'preview' &&
      !stale.value &&
      !busy.value &&
      frozen.value.length === 0 &&
      (duplicate.value === null || confirmDuplicate.value),
  )

  function reset() {
    progress.stop()
    stage.value = 'pick'
    file.value = null
    headers.value = []
    mapping.value = {}
    options.value = initialOptions(kind())
    problems.value = null
    preview.value = null
    error.value = null
    stale.value = false
    confirmDuplicate.value = false
  }

  async function check(withMapping: boolean) {
    const f = file.value
    if (!f) return
    busy.value = true
    error.value = null
    try {
      const sent = { file: f, kind: kind(), options: optionsToSend(options.value) }
      preview.value = await uploadImport(projectId(), holeId(), {
        ...sent,
        ...(withMapping ? { mapping: mapping.value } : {}),
      })
      headers.value = preview.value.headers
      mapping.value = { ...preview.value.mapping }
      problems.value = null
      stale.value = false
      confirmDuplicate.value = false
      stage.value = 'preview'
    } catch (err: unknown) {
      preview.value = null
      if (!isApiError(err) || err.status === 0 || err.status >= 500) {
        error.value = describeError(err, 'The file could not be checked.')
        return
      }
      const meta = (err.meta ?? {}) as Partial<{
        headers: string[]
        mapping: Record<string, string>
        rowCount: number
        errorCount: number
      }>
      headers.value = meta.headers ?? (await sniffHeaders(f))
      if (meta.mapping) mapping.value = { ...meta.mapping }
      else if (Object.keys(mapping.value).length === 0)
        mapping.value = guessMapping(headers.value, importKinds[kind()].fields)
      problems.value = {
        code: err.code,
        message: err.message,
        details: err.details,
        rowCount: meta.rowCount,
        errorCount: meta.errorCount,
      }
      stale.value = false
      stage.value = 'problems'
    } finally {
      busy.value = false
    }
  }

  /** A new file starts over with the server's suggested mapping; the options chosen are kept. */
  async function choose(f: File) {
    file.value = f
    mapping.value = {}
    await check(false)
  }

  function setMapping(field: string, column: string) {
    const next = { ...mapping.value }
    if (column) next[field] = column
    else delete next[field]
    mapping.value = next
    stale.value = true
  }

  function setOption(key: string, value: string) {
    options.value = { ...options.value, [key]: value }
    stale.value = true
  }

  async function commit(done: (r: ImportRecord) => void) {
    const p = preview.value
    if (!p || !canCommit.value) return
    busy.value = true
    error.value = null
    try {
      const record = await commitImport(
        projectId(),
        holeId(),
        p.importId,
        duplicate.value !== null && confirmDuplicate.value,
      )
      stage.value = 'following'
      progress.follow(record, (r) => {
        stage.value = 'done'
        if (r.status === 'committed') done(r)
      })
    } catch (err: unknown) {
      error.value = describeError(err, 'The import could not be committed.')
    } finally {
      busy.value = false
    }
  }

  return {
    stage,
    file,
    headers,
    mapping,
    options,
    problems,
    preview,
    busy,
    error,
    stale,
    confirmDuplicate,
    duplicate,
    frozen,
    demoted,
    canCommit,
    record: progress.record,
    progressError: progress.error,
    choose,
    check,
    setMapping,
    setOption,
    commit,
    reset,
  }
}
