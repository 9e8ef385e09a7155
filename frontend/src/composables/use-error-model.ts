import { computed, ref } from 'vue'
import { isApiError } from '../api/client'
import {
  getErrorModel,
  saveErrorModel,
  type ErrorModelAnswer,
  type ErrorModelKey,
} from '../api/error-model'
import { describeError } from '../logic/format'
import { isStaleVersion } from '../logic/refusals'
import {
  draftOf,
  errorModelFields,
  readDraft,
  readField,
  type ErrorModelDraft,
} from '../logic/project/error-model-fields'

/** Why a save was refused as a whole: the version moved, or an approved interval would change. */
export type ErrorModelConflict = { kind: 'stale' | 'approved' | 'other'; message: string }

const keys = errorModelFields.map((f) => f.key)
const isKey = (k: string): k is ErrorModelKey => (keys as string[]).includes(k)

/**
 * The project's error model as stored, the draft being typed over it, and the lead's save. A
 * refused save keeps the draft: a 400 marks each field it names, a 409 says why in place.
 */
export function useErrorModel(projectId: () => string) {
  const answer = ref<ErrorModelAnswer | null>(null)
  const draft = ref<ErrorModelDraft | null>(null)
  const loading = ref(false)
  const saving = ref(false)
  const loadError = ref<string | null>(null)
  const fieldErrors = ref<Partial<Record<ErrorModelKey, string>>>({})
  const conflict = ref<ErrorModelConflict | null>(null)
  const saved = ref(false)

  /** Keys whose typed value differs from the default (what the project has made its own). */
  const differsFromDefault = computed(() => {
    const a = answer.value
    const d = draft.value
    if (!a || !d) return new Set<ErrorModelKey>()
    return new Set(
      errorModelFields
        .filter((f) => {
          const read = readField(f, d[f.key])
          return !('value' in read) || read.value !== a.defaults[f.key]
        })
        .map((f) => f.key),
    )
  })

  /** The draft differs from the stored model. */
  const dirty = computed(() => {
    const a = answer.value
    const d = draft.value
    if (!a || !d) return false
    return errorModelFields.some((f) => {
      const read = readField(f, d[f.key])
      return !('value' in read) || read.value !== a.model[f.key]
    })
  })

  function take(next: ErrorModelAnswer) {
    answer.value = next
    draft.value = draftOf(next.model)
    fieldErrors.value = {}
  }

  async function load(): Promise<void> {
    loading.value = true
    loadError.value = null
    try {
      take(await getErrorModel(projectId()))
      conflict.value = null
    } catch (err: unknown) {
      loadError.value = describeError(err, 'The error model could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  /** Sends all ten keys with the version read; true when the server stored them. */
  async function save(): Promise<boolean> {
    const a = answer.value
    if (!a || !draft.value) return false
    saved.value = false
    conflict.value = null
    const read = readDraft(draft.value)
    if ('errors' in read) {
      fieldErrors.value = read.errors
      return false
    }
    fieldErrors.value = {}
    saving.value = true
    try {
      take(await saveErrorModel(projectId(), read.model, a.version))
      saved.value = true
      return true
    } catch (err: unknown) {
      refused(err)
      return false
    } finally {
      saving.value = false
    }
  }

  function refused(err: unknown) {
    if (isApiError(err, 400) && err.details.length) {
      const marked: Partial<Record<ErrorModelKey, string>> = {}
      for (const d of err.details) {
        const key = d.path.replace(/^model\./, '')
        if (isKey(key)) marked[key] = d.message
      }
      fieldErrors.value = marked
      if (Object.keys(marked).length === err.details.length) return
    }
    if (isStaleVersion(err) || (isApiError(err, 409) && err.code === 'stale'))
      conflict.value = { kind: 'stale', message: describeError(err) }
    else if (isApiError(err, 409) && err.code === 'interval_approved')
      conflict.value = { kind: 'approved', message: err.message }
    else conflict.value = { kind: 'other', message: describeError(err) }
  }

  /** Keeps what was typed in one input, as typed. */
  function edit(key: ErrorModelKey, text: string) {
    if (!draft.value) return
    draft.value = { ...draft.value, [key]: text }
    saved.value = false
  }

  /** Puts the defaults in the draft; nothing is stored until Save. */
  function resetToDefaults() {
    if (!answer.value) return
    draft.value = draftOf(answer.value.defaults)
    fieldErrors.value = {}
    saved.value = false
  }

  function discard() {
    if (answer.value) take(answer.value)
    conflict.value = null
  }

  return {
    answer,
    draft,
    loading,
    saving,
    loadError,
    fieldErrors,
    conflict,
    saved,
    differsFromDefault,
    dirty,
    load,
    edit,
    save,
    resetToDefaults,
    discard,
  }
}

export type ErrorModelState = ReturnType<typeof useErrorModel>
