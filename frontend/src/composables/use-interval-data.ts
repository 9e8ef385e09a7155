import { computed, reactive, ref, shallowRef } from 'vue'
import { getProject } from '../api/projects'
import { getHole } from '../api/holes'
import { isApiError } from '../api/client'
import {
  clusterSets,
  createSet,
  deleteSet,
  getAnalysis,
  replaceSetMembers,
  suggestSets,
  updateInterval,
  updateSet,
  type IntervalRef,
} from '../api/intervals'
import type { Hole, ProjectWithRole } from '../api/types'
import type {
  Analysis,
  AnalysisSet,
  KSuggestion,
  SetCreate,
  StructureSource,
} from '../api/interval-types'
import { describeError } from '../logic/format'
import { useAuthStore } from '../stores/auth'
import { useIntervalSettings } from './use-interval-settings'
import { useNotFound } from './use-not-found'

/** From approval on, an interval's sets and settings are frozen until a lead reopens it. */
export const frozenStatuses = ['approved', 'issued'] as const

/**
 * The interval view's server state: the analysis (the numbers shown, with the filters and the
 * explored settings), the saved settings, and the engineer's edits.
 */
export function useIntervalData(ids: () => IntervalRef) {
  const auth = useAuthStore()
  const handleMissing = useNotFound()
  const project = ref<ProjectWithRole | null>(null)
  const hole = ref<Hole | null>(null)
  const analysis = shallowRef<Analysis | null>(null)
  const suggestion = ref<KSuggestion | null>(null)
  const loading = ref(false)
  const busy = ref(false)
  const error = ref<string | null>(null)
  const query = reactive({ types: [] as string[], sources: [] as StructureSource[] })
  let pending: AbortController | null = null

  const interval = computed(() => analysis.value?.interval ?? null)
  const settings = useIntervalSettings(interval)
  const frozen = computed(() =>
    (frozenStatuses as readonly string[]).includes(interval.value?.status ?? ''),
  )
  const canEdit = computed(() => auth.can(ids().projectId, 'engineer') && !frozen.value)

  async function refresh() {
    pending?.abort()
    const controller = (pending = new AbortController())
    try {
      const search = { ...query, ...settings.overrides.value }
      analysis.value = await getAnalysis(ids(), search, controller.signal)
    } catch (err: unknown) {
      if (err instanceof Error && err.name === 'AbortError') return
      if (!handleMissing(err)) error.value = describeError(err, 'The analysis could not be loaded.')
    }
  }

  async function refreshSuggestion() {
    try {
      suggestion.value = await suggestSets(ids())
    } catch {
      suggestion.value = null // a suggestion is a help, not a requirement
    }
  }

  async function load() {
    loading.value = true
    error.value = null
    try {
      const { projectId, holeId } = ids()
      const [p, h] = await Promise.all([getProject(projectId), getHole(projectId, holeId)])
      project.value = p
      hole.value = h
      await Promise.all([refresh(), refreshSuggestion()])
    } catch (err: unknown) {
      if (!handleMissing(err)) error.value = describeError(err, 'The interval could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  /** Runs an edit, then reloads the analysis; a stale version reloads and says so. */
  async function edit(action: () => Promise<unknown>): Promise<boolean> {
    busy.value = true
    error.value = null
    try {
      await action()
      return true
    } catch (err: unknown) {
      error.value = isApiError(err, 409)
        ? `${err.message} The view has been reloaded: check and try again.`
        : describeError(err)
      return false
    } finally {
      await refresh()
      busy.value = false
    }
  }

  /** Current members of every set, unfiltered (the analysis shown may be filtered by type). */
  async function membersBySet(): Promise<Map<number, number[]>> {
    const full = await getAnalysis(ids())
    const map = new Map<number, number[]>()
    for (const s of full.structures)
      if (s.setId !== null) map.set(s.setId, [...(map.get(s.setId) ?? []), s.id])
    return map
  }

  const actions = {
    createSet: (body: SetCreate) => edit(() => createSet(ids(), body)),
    cluster: (k: number) => edit(() => clusterSets(ids(), k)),
    rename: (set: AnalysisSet, name: string) =>
      edit(() => updateSet(ids(), set.id, { version: set.version, name })),
    remove: (set: AnalysisSet) => edit(() => deleteSet(ids(), set.id)),
    /** Puts structures into a set (they leave any other set). */
    assign: (setId: number, structureIds: number[]) =>
      edit(async () => {
        const current = (await membersBySet()).get(setId) ?? []
        await replaceSetMembers(ids(), setId, [...new Set([...current, ...structureIds])])
      }),
    /** Takes structures out of whatever set holds them. */
    unassign: (structureIds: number[]) =>
      edit(async () => {
        const out = new Set(structureIds)
        for (const [setId, members] of await membersBySet())
          if (members.some((m) => out.has(m)))
            await replaceSetMembers(
              ids(),
              setId,
              members.filter((m) => !out.has(m)),
            )
      }),
    /** Saves the explored settings as the interval's own (a checked interval returns to draft). */
    saveSettings: () =>
      edit(async () => {
        const current = interval.value
        if (current) await updateInterval(ids(), { version: current.version, ...settings.explore })
      }),
  }

  return {
    project,
    hole,
    analysis,
    interval,
    suggestion,
    loading,
    busy,
    error,
    query,
    settings,
    frozen,
    canEdit,
    load,
    refresh,
    refreshSuggestion,
    ...actions,
  }
}
