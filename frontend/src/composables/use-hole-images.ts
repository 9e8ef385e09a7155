import { computed, onScopeDispose, ref } from 'vue'
import { isApiError } from '../api/client'
import {
  deleteImage,
  getImage,
  imageFileUrl,
  listImages,
  uploadImage,
  type ImageMeta,
} from '../api/images'
import { describeError } from '../logic/format'
import {
  checkUpload,
  emptyUpload,
  toUpload,
  uploadErrors,
  type UploadDraft,
  type UploadErrors,
} from '../logic/image-picking/upload-fields'

/** How often an image still being tiled is asked for its progress. */
export const POLL_MS = 1500

const newestFirst = (a: ImageMeta, b: ImageMeta) =>
  b.createdAt.localeCompare(a.createdAt) || b.id - a.id

/**
 * A hole's televiewer images: the list, an upload form whose refusals land on their fields (a
 * file stored before needs a second, confirmed send), the progress of images being tiled (polled
 * until ready or failed) and deletion.
 */
export function useHoleImages(projectId: () => string, holeId: () => string) {
  const images = ref<ImageMeta[]>([])
  const loading = ref(false)
  const error = ref<string | null>(null)
  const draft = ref<UploadDraft>(emptyUpload())
  const errors = ref<UploadErrors>({})
  const busy = ref(false)
  /** The server's word that this file is in the hole already; sending again needs a yes. */
  const duplicate = ref<string | null>(null)
  const lastUpload = ref<ImageMeta | null>(null)
  let timer: ReturnType<typeof setTimeout> | null = null

  const processing = computed(() => images.value.filter((i) => i.status === 'processing'))

  function put(image: ImageMeta) {
    images.value = [...images.value.filter((i) => i.id !== image.id), image].sort(newestFirst)
  }

  async function load() {
    loading.value = true
    try {
      images.value = [...(await listImages(projectId(), holeId()))].sort(newestFirst)
      error.value = null
      schedule()
    } catch (err: unknown) {
      error.value = describeError(err, 'The images could not be loaded.')
    } finally {
      loading.value = false
    }
  }

  function schedule() {
    if (timer || processing.value.length === 0) return
    timer = setTimeout(() => void poll(), POLL_MS)
  }

  async function poll() {
    timer = null
    for (const image of processing.value) {
      try {
        put(await getImage(projectId(), holeId(), image.id))
      } catch (err: unknown) {
        // Deleted meanwhile (by another logger): it leaves the list; other errors: ask again.
        if (isApiError(err, 404)) images.value = images.value.filter((i) => i.id !== image.id)
      }
    }
    schedule()
  }
  onScopeDispose(() => {
    if (timer) clearTimeout(timer)
    timer = null
  })

  async function submit(confirmDuplicate = false) {
    errors.value = checkUpload(draft.value)
    if (Object.keys(errors.value).length > 0) return
    busy.value = true
    try {
      const stored = await uploadImage(
        projectId(),
        holeId(),
        toUpload(draft.value, confirmDuplicate),
      )
      lastUpload.value = stored
      duplicate.value = null
      draft.value = emptyUpload()
      // A LAS file may give several images (one per array): list them all.
      put(stored)
      await load()
    } catch (err: unknown) {
      if (isApiError(err, 409) && /duplicate/i.test(err.code)) duplicate.value = err.message
      else
        errors.value = isApiError(err)
          ? uploadErrors(err.details, err.message)
          : { form: describeError(err, 'The file was not stored.') }
    } finally {
      busy.value = false
    }
  }

  function setDraft(next: UploadDraft) {
    // Another file is another question: the duplicate warning was about the last one.
    if (next.file !== draft.value.file) duplicate.value = null
    draft.value = next
  }

  async function remove(image: ImageMeta) {
    try {
      await deleteImage(projectId(), holeId(), image.id)
      images.value = images.value.filter((i) => i.id !== image.id)
    } catch (err: unknown) {
      error.value = describeError(err, 'The image was not deleted.')
    }
  }

  const fileUrl = (image: ImageMeta) => imageFileUrl(projectId(), holeId(), image.id)

  return {
    images,
    loading,
    error,
    draft,
    errors,
    busy,
    duplicate,
    lastUpload,
    processing,
    load,
    submit,
    setDraft,
    remove,
    fileUrl,
    put,
  }
}

export type HoleImages = ReturnType<typeof useHoleImages>
