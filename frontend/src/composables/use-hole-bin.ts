import { ref } from 'vue'
import { listDeletedHoles, purgeHole, restoreHole, type DeletedHole } from '../api/holes'
import { describeError } from '../logic/format'

/** The project's bin of deleted holes: list, restore (leads), purge (administrators). */
export function useHoleBin(projectId: () => string, onRestored: () => Promise<void> | void) {
  const rows = ref<DeletedHole[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)

  async function load() {
    loading.value = true
    try {
      rows.value = await listDeletedHoles(projectId())
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, 'The deleted holes could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  async function act(what: () => Promise<unknown>, fallback: string) {
    try {
      await what()
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err, fallback)
    }
    await load()
  }

  const restore = (row: DeletedHole) =>
    act(async () => {
      await restoreHole(projectId(), row.id)
      await onRestored()
    }, `${row.name} could not be restored.`)
  const purge = (row: DeletedHole) =>
    act(() => purgeHole(projectId(), row.id), `${row.name} could not be purged.`)

  return { rows, loading, error, load, restore, purge }
}
