import { computed, onBeforeUnmount, ref } from 'vue'
import {
  createPack,
  deletePack,
  getPack,
  issuePack,
  listPacks,
  rebuildPack,
  type PackDetail,
  type PackSelection,
  type PackSummary,
} from '../api/packs'
import { describeError } from '../logic/format'

const active = (p: { status: string }) => p.status === 'queued' || p.status === 'building'

/**
 * Page state of a project's design packs: the list, the pack open in the preview, and polling
 * every second while any pack is queued or building (so a reload resumes watching a build).
 */
export function usePacks(projectId: () => string) {
  const packs = ref<PackSummary[]>([])
  const selected = ref<PackDetail | null>(null)
  const error = ref<string | null>(null)
  const busy = ref(false)
  let timer: ReturnType<typeof setTimeout> | null = null

  const building = computed(() => packs.value.some(active))

  async function refresh() {
    try {
      packs.value = await listPacks(projectId())
      if (selected.value) selected.value = await getPack(projectId(), selected.value.id)
      error.value = null
    } catch (err: unknown) {
      error.value = describeError(err)
    }
    schedule()
  }

  function schedule() {
    if (timer) clearTimeout(timer)
    timer = building.value ? setTimeout(() => void refresh(), 1000) : null
  }

  async function act<T>(work: () => Promise<T>): Promise<T | undefined> {
    busy.value = true
    try {
      const out = await work()
      error.value = null
      return out
    } catch (err: unknown) {
      error.value = describeError(err)
      return undefined
    } finally {
      busy.value = false
      await refresh()
    }
  }

  const open = (id: string) =>
    act(async () => {
      selected.value = await getPack(projectId(), id)
    })
  const build = (selection: PackSelection) =>
    act(async () => {
      const created = await createPack(projectId(), selection)
      selected.value = await getPack(projectId(), created.id)
    })
  const issue = (id: string) => act(() => issuePack(projectId(), id))
  const rebuild = (id: string) => act(() => rebuildPack(projectId(), id))
  const remove = (id: string) =>
    act(async () => {
      await deletePack(projectId(), id)
      if (selected.value?.id === id) selected.value = null
    })

  onBeforeUnmount(() => {
    if (timer) clearTimeout(timer)
  })

  return { packs, selected, error, busy, building, refresh, open, build, issue, rebuild, remove }
}
