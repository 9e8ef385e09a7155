import { computed, ref } from 'vue'
import {
  createStructure,
  deleteStructure,
  getStructure,
  listStructures,
  updateStructure,
} from '../api/logging'
import { isApiError } from '../api/client'
import type { Structure, StructureInput } from '../api/types'
import { describeError } from '../logic/format'

const byDepth = (a: Structure, b: Structure) => a.depth - b.depth || a.id - b.id

/**
 * The hole's structures as stored, and the writes on them. Writes resolve to the saved row and
 * reject with the ApiError, so the row that made the call can show the message in place.
 */
export function useHoleStructures(projectId: () => string, holeId: () => string) {
  const rows = ref<Structure[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)
  const loadedAt = ref<Date | null>(null)
  const count = computed(() => rows.value.length)
  /** Counts local writes: a list fetched while one landed is stale and fetched again. */
  let writes = 0

  function put(row: Structure) {
    writes++
    rows.value = [...rows.value.filter((r) => r.id !== row.id), row].sort(byDepth)
  }

  function drop(id: number) {
    writes++
    rows.value = rows.value.filter((r) => r.id !== id)
  }

  /** Reloads every row: picks up other loggers' rows and flags the server recomputed. */
  async function load(): Promise<void> {
    loading.value = true
    const before = writes
    try {
      const fetched = [...(await listStructures(projectId(), holeId()))].sort(byDepth)
      if (writes !== before) return load()
      rows.value = fetched
      loadedAt.value = new Date()
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, 'The structures could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  async function create(input: StructureInput, idempotencyKey?: string): Promise<Structure> {
    const row = await createStructure(projectId(), holeId(), input, idempotencyKey)
    put(row)
    return row
  }

  async function update(row: Structure, fields: Partial<StructureInput>): Promise<Structure> {
    const saved = await updateStructure(projectId(), holeId(), row.id, {
      ...fields,
      version: row.version,
    })
    put(saved)
    return saved
  }

  async function remove(row: Structure): Promise<void> {
    await deleteStructure(projectId(), holeId(), row.id, row.version)
    drop(row.id)
  }

  /** Fetches one row again after a conflict; a row deleted elsewhere leaves the list. */
  async function reloadOne(id: number): Promise<Structure | null> {
    try {
      const row = await getStructure(projectId(), holeId(), id)
      put(row)
      return row
    } catch (err: unknown) {
      if (!isApiError(err, 404)) throw err
      drop(id)
      return null
    }
  }

  return { rows, loading, error, loadedAt, count, load, create, update, remove, reloadOne }
}

export type HoleStructures = ReturnType<typeof useHoleStructures>
