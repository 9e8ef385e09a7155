import { computed, onScopeDispose, ref, watch } from 'vue'
import { fitPoints, type FitResult, type TracePoint } from '../api/images'
import { describeError } from '../logic/format'
import { debouncedLatest } from '../logic/image-picking/debounced-latest'
import { pickKey, stepKey } from '../logic/image-picking/pick-rows'
import * as td from '../logic/image-picking/trace-draft'
import type { PickShift } from '../logic/image-picking/wall-sinusoids'
import { useImagePickWrites } from './use-image-pick-writes'

/** The step that keeps a trace: type and confidence (the core entry's words), a comment. */
export interface PickChoice {
  type: string
  confidence: string | null
  comment: string
}

/**
 * Picking on one image: the trace being drawn with its live least-squares fit (orient, in the
 * browser) and the server's (debounced, stale answers ignored), the chosen pick, and the edits of a
 * saved pick — its sinusoid dragged in depth, its points moved. Stored picks and their writes are
 * in `writes` (use-image-pick-writes).
 */
export function useImagePicking(
  projectId: () => string,
  holeId: () => string,
  imageId: () => number,
  onChanged: () => void = () => {},
) {
  const writes = useImagePickWrites(projectId, holeId, imageId, onChanged)
  const draft = ref<td.TraceDraft>(td.emptyDraft())
  const liveFit = computed(() => td.draftFit(draft.value))
  const serverFit = ref<FitResult | null>(null)
  const fitBusy = ref(false)
  const fitError = ref<string | null>(null)
  const selectedKey = ref<string | null>(null)
  const shift = ref<PickShift | null>(null)

  const fitter = debouncedLatest(
    (points: TracePoint[]) => fitPoints(projectId(), holeId(), imageId(), points),
    {
      onAnswer: (answer) => {
        serverFit.value = answer
        fitError.value = null
      },
      onError: (err) => {
        serverFit.value = null
        fitError.value = describeError(err, 'The server could not fit the points.')
      },
      onBusy: (busy) => (fitBusy.value = busy),
    },
  )
  watch(
    () => draft.value.points,
    (points) => {
      if (liveFit.value && points.length >= 3) return fitter.request([...points])
      fitter.cancel()
      serverFit.value = null
      fitError.value = null
    },
  )
  onScopeDispose(() => fitter.cancel())
  // The chosen pick stays chosen when it goes from pending to saved.
  watch(
    writes.renamed,
    (r) => {
      if (r && selectedKey.value === r.from) selectedKey.value = r.to
    },
    { flush: 'sync' },
  )

  const selected = computed(
    () => writes.picks.value.find((p) => pickKey(p.structureId) === selectedKey.value) ?? null,
  )

  function edit(next: td.TraceDraft) {
    if (next !== draft.value) writes.settle()
    draft.value = next
  }
  const addPoint = (p: TracePoint) => edit(td.addPoint(draft.value, p))
  const movePoint = (i: number, p: TracePoint) => edit(td.movePoint(draft.value, i, p))
  const dropPoint = () => edit(td.removeLastPoint(draft.value))
  const clearDraft = () => (draft.value = td.emptyDraft())
  const startDraft = (points: TracePoint[], suggested: boolean) =>
    edit({ points: [...points], editing: null, suggested })

  /** Keeps the trace: a new pick goes on its way at once; moved points are sent as a change. */
  async function accept(choice: PickChoice): Promise<boolean> {
    const fit = liveFit.value
    const d = draft.value
    if (!fit || !td.canAccept(d)) return false
    if (d.editing) {
      const ok = await writes.update(d.editing.structureId, {
        points: [...d.points],
        type: choice.type,
        confidence: choice.confidence,
      })
      if (ok) clearDraft()
      return ok
    }
    selectedKey.value = writes.create({ points: d.points, ...choice, suggested: d.suggested, fit })
    clearDraft()
    return true
  }

  /** A failed pick's points back on the wall as the trace being drawn, to fix and keep again. */
  function backToDraft(key: number) {
    const item = writes.takeBack(key)
    if (item) startDraft(item.points, item.suggested)
  }

  /** A saved pick's sinusoid dragged in depth: drawn where it is, stored on letting go. */
  async function dragPick(key: string, metres: number, final: boolean) {
    const row = writes.picks.value.find((p) => pickKey(p.structureId) === key)
    if (!row) return
    shift.value = { key, metres }
    if (!final) return
    if (Math.abs(metres) > 1e-6)
      await writes.update(row.structureId, { points: td.shiftPoints(row.points, metres) })
    shift.value = null
  }

  /** The trace being drawn dragged in depth: every point moves with it from where it began. */
  let dragBase: readonly TracePoint[] | null = null
  function dragDraft(metres: number, final: boolean) {
    dragBase ??= draft.value.points
    edit({ ...draft.value, points: td.shiftPoints(dragBase, metres) })
    if (final) dragBase = null
  }

  /** The chosen pick's points onto the wall to be moved; its own sinusoid is hidden meanwhile. */
  function editPoints() {
    const row = selected.value
    if (!row) return
    const editing = { structureId: row.structureId, version: row.structure.version }
    edit({ points: [...row.points], editing, suggested: row.suggested })
  }

  async function remove(structureId: number) {
    const ok = await writes.remove(structureId)
    if (ok && selectedKey.value === pickKey(structureId)) selectedKey.value = null
    return ok
  }

  function undoDelete() {
    const key = writes.undoDelete()
    if (key) selectedKey.value = key
  }

  /** Chooses the previous / next pick down the hole; returns its depth. */
  function stepPick(by: -1 | 1): number | null {
    const row = stepKey(writes.rows.value, selectedKey.value, by)
    selectedKey.value = row?.key ?? selectedKey.value
    return row?.depth ?? null
  }

  return {
    writes,
    draft,
    liveFit,
    serverFit,
    fitBusy,
    fitError,
    selectedKey,
    selected,
    shift,
    addPoint,
    movePoint,
    dropPoint,
    clearDraft,
    startDraft,
    accept,
    backToDraft,
    dragPick,
    dragDraft,
    editPoints,
    remove,
    undoDelete,
    stepPick,
  }
}

export type ImagePicking = ReturnType<typeof useImagePicking>
