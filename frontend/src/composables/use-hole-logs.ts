import { computed, ref } from 'vue'
import { isApiError } from '../api/client'
import {
  commitLas,
  listCurves,
  originalFileUrl,
  uploadLas,
  type LasPreview,
  type StoredCurve,
} from '../api/logs'
import type { ErrorDetail } from '../api/types'
import { describeError } from '../logic/format'

/**
 * A hole's LAS curves: the stored list, and one file read into a preview whose curves are kept
 * or left out and depth-shifted before anything is stored.
 */
export function useHoleLogs(projectId: () => string, holeId: () => string) {
  const curves = ref<StoredCurve[]>([])
  const preview = ref<LasPreview | null>(null)
  const chosen = ref<string[]>([])
  const depthShift = ref(0)
  const error = ref<string | null>(null)
  const problems = ref<ErrorDetail[]>([])
  const busy = ref(false)

  async function load() {
    try {
      curves.value = await listCurves(projectId(), holeId())
    } catch (err: unknown) {
      error.value = describeError(err, 'The curves could not be loaded.')
    }
  }

  /** Reads the file on the server; every numeric curve starts chosen (text columns stay in the file). */
  async function read(file: File) {
    busy.value = true
    error.value = null
    problems.value = []
    preview.value = null
    try {
      preview.value = await uploadLas(projectId(), holeId(), file)
      chosen.value = preview.value.curves.filter((c) => !c.text).map((c) => c.mnemonic)
    } catch (err: unknown) {
      error.value = describeError(err, 'The file was not read.')
      problems.value = isApiError(err) ? err.details : []
    } finally {
      busy.value = false
    }
  }

  async function commit() {
    if (!preview.value) return
    busy.value = true
    try {
      await commitLas(projectId(), holeId(), preview.value.importId, {
        depthShift: depthShift.value,
        curves: chosen.value,
      })
      preview.value = null
      await load()
    } catch (err: unknown) {
      error.value = describeError(err, 'The curves were not stored.')
    } finally {
      busy.value = false
    }
  }

  const shown = computed(() => preview.value?.curves ?? [])
  const fileUrl = (importId: string) => originalFileUrl(projectId(), holeId(), importId)

  return {
    curves,
    preview,
    chosen,
    depthShift,
    error,
    problems,
    busy,
    shown,
    load,
    read,
    commit,
    fileUrl,
  }
}
