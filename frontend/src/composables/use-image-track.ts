import { computed, ref, shallowRef, watch } from 'vue'
import { isApiError } from '../api/client'
import { listImagePicks, listImages, type ImageMeta, type ImagePickRecord } from '../api/images'
import type { DepthStructure } from '../api/interval-types'
import { describeError } from '../logic/format'
import { defaultDisplay, type ImageDisplay } from '../logic/image/image-types'
import type { PredictableStructure } from '../logic/image/predicted'
import { imageGroups, pickTraces, predictedTraces } from '../logic/image/track-sinusoids'

/** Images or picks the server does not offer (yet, or not for this hole) are simply none. */
async function optional<T>(call: Promise<T[]>): Promise<T[]> {
  try {
    return await call
  } catch (err: unknown) {
    if (isApiError(err, 404) || isApiError(err, 501)) return []
    throw err
  }
}

/**
 * The depth view's image track: the hole's ready images grouped by kind and reference, the group
 * shown, how it is drawn (colour map, contrast), and the traces on it — the hole's image picks
 * (their raw picks where made on these images) and, when asked, core structures' predicted traces.
 * `structures` are those the view's filters keep, so the track follows the filters too.
 */
export function useImageTrack(
  projectId: () => string,
  holeId: () => string,
  structures: () => readonly DepthStructure[],
  selectedId: () => number | null,
) {
  const images = shallowRef<ImageMeta[]>([])
  const records = shallowRef<Map<number, ImagePickRecord>>(new Map())
  const error = ref<string | null>(null)
  const chosen = ref<string | null>(null)
  const display = ref<ImageDisplay>(defaultDisplay('amplitude'))
  const showPicks = ref(true)
  const showPredicted = ref(false)

  const groups = computed(() => imageGroups(images.value))
  const group = computed(
    () => groups.value.find((g) => g.value === chosen.value) ?? groups.value[0] ?? null,
  )
  const shown = computed(() => group.value?.images ?? [])
  const title = computed(() => `${group.value?.label ?? 'Televiewer'} image`)
  const visible = computed(() => shown.value.length > 0)
  const trueColour = computed(() => shown.value[0]?.kind === 'optical')
  const extent = computed(() => Math.max(0, ...shown.value.map((i) => i.bottomDepth)))

  // A new kind starts from its own colour map; contrast settings carry over.
  watch(
    () => shown.value[0]?.kind,
    (kind) => {
      if (kind) display.value = { ...display.value, colourMap: defaultDisplay(kind).colourMap }
    },
  )

  async function load() {
    error.value = null
    try {
      const list = await optional(listImages(projectId(), holeId()))
      images.value = list
      const ready = list.filter((i) => i.status === 'ready' && i.pickCount > 0)
      const picks = await Promise.all(
        ready.map((i) => optional(listImagePicks(projectId(), holeId(), i.id))),
      )
      records.value = new Map(picks.flat().map((r) => [r.structureId, r]))
    } catch (err: unknown) {
      error.value = describeError(err, 'The images could not be loaded.')
    }
  }

  // The server sends every stored column of a structure, the declination it applied among them,
  // though DepthStructure does not name it: PredictableStructure reads it where it is there.
  const withDeclination = computed((): readonly PredictableStructure[] => structures())
  const sinusoids = computed(() => [
    ...(showPredicted.value
      ? predictedTraces(withDeclination.value, shown.value, selectedId())
      : []),
    ...(showPicks.value
      ? pickTraces(withDeclination.value, records.value, shown.value, selectedId())
      : []),
  ])

  return {
    images,
    groups,
    chosen,
    shown,
    title,
    visible,
    trueColour,
    extent,
    display,
    showPicks,
    showPredicted,
    sinusoids,
    error,
    load,
  }
}
