import { computed, onScopeDispose, ref, shallowRef, watch } from 'vue'
import { useRoute, useRouter } from 'vue-router'
import {
  applyReconciliation,
  getReconciliation,
  undoAdjustment,
  type ReconciliationAnswer,
  type ReconciliationApplyAnswer,
  type UndoAnswer,
} from '../api/reconciliation'
import { describeError } from '../logic/format'
import type { ApplyBody } from '../logic/reconcile/reconcile-apply'
import { matchLinks } from '../logic/reconcile/match-links'
import {
  changedOptions,
  defaultOptions,
  optionTexts,
  parseOptions,
  type OptionTexts,
} from '../logic/reconcile/reconcile-options'
import { useAuthStore } from '../stores/auth'

/** Typing pauses this long (ms) before the comparison is asked for again. */
export const OPTIONS_DEBOUNCE_MS = 400

const newKey = () =>
  globalThis.crypto?.randomUUID?.() ?? `${Date.now().toString(36)}-${Math.random().toString(36)}`

const aborted = (err: unknown) => err instanceof Error && err.name === 'AbortError'

/**
 * The hole's core-to-image comparison, the options it was asked with (as typed, checked before
 * sending), and the writes on it: recording adjustments and undoing one. Each write's error stays
 * with it, so the screen shows it where the user acted.
 */
export function useReconciliation(projectId: () => string, holeId: () => string) {
  const auth = useAuthStore()
  const answer = shallowRef<ReconciliationAnswer | null>(null)
  const loading = ref(false)
  const error = ref<string | null>(null)
  const texts = ref<OptionTexts>(optionTexts(defaultOptions))
  const parsed = computed(() => parseOptions(texts.value))
  const canAdjust = computed(() => auth.can(projectId(), 'engineer'))
  const applying = ref(false)
  const applyError = ref<string | null>(null)
  const applied = ref<ReconciliationApplyAnswer | null>(null)
  const undoing = ref<number | null>(null)
  const undoError = ref<string | null>(null)
  const undone = ref<UndoAnswer | null>(null)
  // Only the newest request may land: a slow answer to old options never replaces a newer one.
  let request = 0
  let controller: AbortController | null = null
  let timer: ReturnType<typeof setTimeout> | undefined
  /** The last apply that failed keeps its key, so sending it again can never record it twice. */
  let attempt: { body: string; key: string } | null = null

  async function load(): Promise<void> {
    const options = parsed.value.options
    if (!options) return
    const ticket = ++request
    controller?.abort()
    controller = new AbortController()
    loading.value = true
    try {
      const query = changedOptions(options)
      const data = await getReconciliation(projectId(), holeId(), query, controller.signal)
      if (ticket !== request) return
      answer.value = data
      error.value = null
    } catch (err: unknown) {
      if (ticket !== request || aborted(err)) return
      error.value = describeError(err, 'The comparison could not be loaded.')
    } finally {
      if (ticket === request) loading.value = false
    }
  }

  watch(
    () => JSON.stringify(parsed.value.options ?? null),
    (key, before) => {
      clearTimeout(timer)
      if (key !== 'null' && key !== before) timer = setTimeout(load, OPTIONS_DEBOUNCE_MS)
    },
  )
  onScopeDispose(() => {
    clearTimeout(timer)
    controller?.abort()
  })

  async function apply(body: ApplyBody): Promise<boolean> {
    const text = JSON.stringify(body)
    if (attempt?.body !== text) attempt = { body: text, key: newKey() }
    applying.value = true
    applyError.value = null
    try {
      applied.value = await applyReconciliation(projectId(), holeId(), body, attempt.key)
      attempt = null
      await load()
      return true
    } catch (err: unknown) {
      applyError.value = describeError(err, 'The adjustments could not be recorded.')
      return false
    } finally {
      applying.value = false
    }
  }

  async function undo(adjustmentId: number): Promise<boolean> {
    undoing.value = adjustmentId
    undoError.value = null
    try {
      undone.value = await undoAdjustment(projectId(), holeId(), adjustmentId)
      await load()
      return true
    } catch (err: unknown) {
      undoError.value = describeError(err, 'The adjustment could not be undone.')
      return false
    } finally {
      undoing.value = null
    }
  }

  return {
    answer,
    loading,
    error,
    texts,
    optionErrors: computed(() => parsed.value.errors),
    canAdjust,
    applying,
    applyError,
    applied,
    undoing,
    undoError,
    undone,
    load,
    apply,
    undo,
  }
}

export type Reconciliation = ReturnType<typeof useReconciliation>

/**
 * The depth view's pair links: off unless `?links=pairs` is in the address (so a reload keeps
 * them); when on and the hole has both kinds of structure, the comparison with the default options
 * is fetched once per hole and its pairs among the kept structures are returned.
 */
export function useMatchLinks(
  projectId: () => string,
  holeId: () => string,
  available: () => boolean,
  kept: () => readonly { id: number }[],
) {
  const route = useRoute()
  const router = useRouter()
  const answer = shallowRef<ReconciliationAnswer | null>(null)
  const error = ref<string | null>(null)
  const offered = computed(available)
  const shown = computed({
    get: () => route.query.links === 'pairs',
    set: (on: boolean) => {
      const { links: _, ...rest } = route.query
      void router.replace({ query: on ? { ...rest, links: 'pairs' } : rest })
    },
  })

  watch(
    () => [projectId(), holeId()],
    () => (answer.value = null),
  )
  watch(
    () => shown.value && offered.value && answer.value === null,
    async (wanted) => {
      if (!wanted) return
      try {
        answer.value = await getReconciliation(projectId(), holeId())
        error.value = null
      } catch (err: unknown) {
        error.value = describeError(err, 'The core–image pairs could not be loaded.')
      }
    },
    { immediate: true },
  )

  const links = computed(() => {
    if (!shown.value || !offered.value || !answer.value) return null
    return matchLinks(answer.value, new Set(kept().map((s) => s.id)))
  })
  return { available: offered, shown, links, error }
}
