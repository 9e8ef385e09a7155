import { ref } from 'vue'
import { addComment, listComments, type CommentRow } from '../api/review'
import { describeError } from '../logic/format'

type Entity = 'structure' | 'interval'

/** The comment thread of one structure or interval: its rows and the draft being written. */
export function useComments(projectId: () => string, entity: () => Entity, entityId: () => number) {
  const rows = ref<CommentRow[]>([])
  const draft = ref('')
  const error = ref<string | null>(null)
  const busy = ref(false)

  async function load() {
    try {
      rows.value = await listComments(projectId(), entity(), entityId())
    } catch (err: unknown) {
      error.value = describeError(err, 'Comments could not be loaded.')
    }
  }

  /** Saves the draft; on failure the draft stays as typed. */
  async function send() {
    busy.value = true
    error.value = null
    try {
      await addComment(projectId(), { entity: entity(), entityId: entityId(), body: draft.value })
      draft.value = ''
      await load()
    } catch (err: unknown) {
      error.value = describeError(err, 'The comment was not saved.')
    } finally {
      busy.value = false
    }
  }

  return { rows, draft, error, busy, load, send }
}
