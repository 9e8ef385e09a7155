import { computed, ref } from 'vue'
import { addRun, deleteRun, listRuns, updateRun } from '../api/logging'
import { isApiError } from '../api/client'
import type { Run } from '../api/types'
import { describeError } from '../logic/format'
import {
  isDirty,
  newRunRow,
  parseRun,
  rowFromRun,
  type RunErrors,
  type RunField,
  type RunRow,
} from '../logic/hole/run-rows'

export interface RunRowState {
  busy: boolean
  message: string | null
  errors: RunErrors
}

const byFrom = (a: Run, b: Run) => a.fromDepth - b.fromDepth

/** Server details (`body.recovered`) → the cell they name. */
function fieldErrors(err: unknown): RunErrors {
  if (!isApiError(err)) return {}
  const out: RunErrors = {}
  for (const d of err.details) out[d.path.replace(/^body\./, '') as RunField] = d.message
  return out
}

/**
 * The hole's core runs: as stored (what structures are computed against) and as rows being edited.
 * Each row is saved on its own (POST, or PATCH with its version), so two loggers can share a hole.
 */
export function useHoleRuns(projectId: () => string, holeId: () => string) {
  const runs = ref<Run[]>([])
  const rows = ref<RunRow[]>([])
  const states = ref<Record<string, RunRowState>>({})
  const loading = ref(false)
  const error = ref<string | null>(null)
  const dirtyCount = computed(() => rows.value.filter(isDirty).length)

  function setState(key: string, state: Partial<RunRowState>) {
    const before = states.value[key] ?? { busy: false, message: null, errors: {} }
    states.value = { ...states.value, [key]: { ...before, ...state } }
  }

  async function load() {
    loading.value = true
    try {
      runs.value = [...(await listRuns(projectId(), holeId()))].sort(byFrom)
      rows.value = runs.value.map(rowFromRun)
      states.value = {}
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, 'The core runs could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  function edit(key: string, field: RunField, value: string) {
    const row = rows.value.find((r) => r.key === key)
    if (!row) return
    row.cells[field] = value
    setState(key, { errors: {}, message: null })
  }

  function addRow(): RunRow {
    const row = newRunRow(rows.value.at(-1))
    rows.value.push(row)
    return row
  }

  function keep(run: Run) {
    runs.value = [...runs.value.filter((r) => r.id !== run.id), run].sort(byFrom)
  }

  /** Saves one row; resolves false and leaves the messages on the row when it could not. */
  async function saveRow(key: string): Promise<boolean> {
    const row = rows.value.find((r) => r.key === key)
    if (!row) return false
    const { input } = parseRun(row)
    if (!input) return false
    if (!isDirty(row)) return true
    setState(key, { busy: true, message: null, errors: {} })
    try {
      const saved = row.saved
        ? await updateRun(projectId(), holeId(), row.saved.id, {
            ...input,
            version: row.saved.version,
          })
        : await addRun(projectId(), holeId(), input)
      Object.assign(row, { saved, cells: rowFromRun(saved).cells })
      keep(saved)
      setState(key, { busy: false })
      return true
    } catch (err: unknown) {
      setState(key, {
        busy: false,
        errors: fieldErrors(err),
        message: isApiError(err, 409)
          ? 'Someone else changed this run since you loaded it: reload the runs to see it.'
          : describeError(err, 'The run could not be saved.'),
      })
      return false
    }
  }

  async function saveAll(): Promise<boolean> {
    let ok = true
    for (const row of rows.value.filter(isDirty)) ok = (await saveRow(row.key)) && ok
    return ok
  }

  async function removeRow(key: string) {
    const row = rows.value.find((r) => r.key === key)
    if (!row) return
    try {
      if (row.saved) await deleteRun(projectId(), holeId(), row.saved.id)
      const id = row.saved?.id
      rows.value = rows.value.filter((r) => r.key !== key)
      runs.value = runs.value.filter((r) => r.id !== id)
    } catch (err: unknown) {
      setState(key, { message: describeError(err, 'The run could not be deleted.') })
    }
  }

  return {
    runs,
    rows,
    states,
    loading,
    error,
    dirtyCount,
    load,
    edit,
    addRow,
    saveRow,
    saveAll,
    removeRow,
  }
}

export type HoleRuns = ReturnType<typeof useHoleRuns>
