import { computed, ref } from 'vue'
import { suggestSinusoids, type ImageMeta, type Suggestion, type TracePoint } from '../api/images'
import { describeError } from '../logic/format'
import { latestAnswer, takeLatest } from '../logic/image-picking/latest-answer'
import { sampleTrace } from '../logic/image-picking/sample-trace'
import type { DepthWindow } from '../logic/image-picking/view-window'
import { suggestionKey } from '../logic/image-picking/wall-sinusoids'

export type Candidate = Suggestion & { key: string }

/** The server looks at most this far at once (SuggestionsQuery). */
export const SUGGEST_MAX_M = 20

/**
 * Candidate traces the server finds in the depth window in view, best first. Nothing is ever kept
 * by itself: a candidate is taken to the picking step (its points sampled along it) or rejected —
 * hidden, and shown again on request. Answers for an earlier window are ignored.
 */
export function useImageSuggestions(
  projectId: () => string,
  holeId: () => string,
  image: () => Pick<ImageMeta, 'id' | 'topDepth' | 'bottomDepth'>,
) {
  const list = ref<Candidate[]>([])
  const busy = ref(false)
  const error = ref<string | null>(null)
  /** The window last searched, or null before the first search. */
  const searched = ref<DepthWindow | null>(null)
  const rejected = ref<string[]>([])
  const showRejected = ref(false)
  const guard = latestAnswer()

  const visible = computed(() =>
    showRejected.value ? list.value : list.value.filter((s) => !rejected.value.includes(s.key)),
  )

  /** Searches the part of `window` on the image; refuses a window over 20 m with a reason. */
  async function find(window: DepthWindow): Promise<void> {
    const img = image()
    const from = Math.max(window[0], img.topDepth)
    const to = Math.min(window[1], img.bottomDepth)
    if (to - from > SUGGEST_MAX_M) {
      error.value = `Zoom in to ${SUGGEST_MAX_M} m or less: the view shows ${(to - from).toFixed(1)} m.`
      return
    }
    if (!(to > from)) return
    busy.value = true
    error.value = null
    try {
      const answer = await takeLatest(guard, () =>
        suggestSinusoids(projectId(), holeId(), img.id, from, to),
      )
      // Overtaken by a newer search: that one owns the list and the progress.
      if (!answer) return
      list.value = answer.value.map((s) => ({ ...s, key: suggestionKey(s) }))
      searched.value = [from, to]
      busy.value = false
    } catch (err: unknown) {
      error.value = describeError(err, 'No candidates could be looked for.')
      busy.value = false
    }
  }

  const byKey = (key: string) => list.value.find((s) => s.key === key) ?? null
  const reject = (key: string) => (rejected.value = [...new Set([...rejected.value, key])])
  const restore = (key: string) => (rejected.value = rejected.value.filter((k) => k !== key))
  /** Kept as a pick: it leaves the list (the server leaves out candidates near picks anyway). */
  const taken = (key: string) => (list.value = list.value.filter((s) => s.key !== key))

  /** Points along a candidate for the API, which fits them back to the same sinusoid. */
  const pointsOf = (s: Suggestion): TracePoint[] =>
    sampleTrace({ depth: s.depth, height: s.height / 1000, troughAzimuth: s.troughAzimuth })

  function clear() {
    guard.invalidate()
    list.value = []
    searched.value = null
    error.value = null
    busy.value = false
  }

  return {
    list,
    visible,
    busy,
    error,
    searched,
    rejected,
    showRejected,
    find,
    byKey,
    reject,
    restore,
    taken,
    pointsOf,
    clear,
  }
}

export type ImageSuggestions = ReturnType<typeof useImageSuggestions>
