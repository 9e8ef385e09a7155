// The depth view's image track: images grouped so one canvas shows one kind in one reference, and
// the hole's structures as traces on them — image picks as picked, or, for a pick made on an
// image of another reference, its true plane turned back into this image's frame.
import type { ImageMeta, ImagePickRecord } from '../../api/images'
import { symbolOf } from '../track/structure-symbols'
import type { DrawnSinusoid } from './image-types'
import { predictedSinusoids, type PredictableStructure } from './predicted'
import { referenceShort } from './azimuth-scale'

export interface ImageGroup {
  value: string
  label: string
  images: ImageMeta[]
}

const KIND_LABEL: Record<ImageMeta['kind'], string> = {
  amplitude: 'Amplitude',
  traveltime: 'Travel time',
  optical: 'Optical',
}
const KIND_ORDER = ['amplitude', 'traveltime', 'optical']

const groupKey = (i: ImageMeta) => `${i.kind}|${i.azimuthReference}|${i.northReference ?? ''}`

/** Ready images by kind and reference, amplitude first; each group oldest → newest. */
export function imageGroups(images: readonly ImageMeta[]): ImageGroup[] {
  const map = new Map<string, ImageMeta[]>()
  for (const i of images) {
    if (i.status !== 'ready' || i.levels < 1) continue
    map.set(groupKey(i), [...(map.get(groupKey(i)) ?? []), i])
  }
  const kinds = new Map<string, number>()
  for (const list of map.values()) kinds.set(list[0].kind, (kinds.get(list[0].kind) ?? 0) + 1)
  return [...map.entries()]
    .map(([value, list]) => {
      const i = list[0]
      const label =
        (kinds.get(i.kind) ?? 0) > 1
          ? `${KIND_LABEL[i.kind]} · ${referenceShort(i.azimuthReference, i.northReference)}`
          : KIND_LABEL[i.kind]
      const sorted = [...list].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id)
      return { value, label, images: sorted }
    })
    .sort((a, b) => KIND_ORDER.indexOf(a.images[0].kind) - KIND_ORDER.indexOf(b.images[0].kind))
}

/** The newest image of the group covering `depth`, else the newest. */
export function imageAt(group: readonly ImageMeta[], depth: number): ImageMeta | undefined {
  for (let k = group.length - 1; k >= 0; k--)
    if (group[k].topDepth <= depth && depth <= group[k].bottomDepth) return group[k]
  return group.at(-1)
}

/**
 * Image-source structures as 'pick' traces on the group's images: the raw pick where it was made
 * on one of them (centre depth, height, trough as picked), otherwise from its true plane in the
 * frame of the image at its depth (planeToImageSinusoid, as for predicted traces).
 */
export function pickTraces(
  structures: readonly PredictableStructure[],
  records: ReadonlyMap<number, ImagePickRecord>,
  group: readonly ImageMeta[],
  selectedId: number | null,
): DrawnSinusoid[] {
  const ids = new Set(group.map((i) => i.id))
  return structures.flatMap((s): DrawnSinusoid[] => {
    if (s.source !== 'image') return []
    const colour = symbolOf(s.type).colour
    const key = `pick:${s.id}`
    const selected = s.id === selectedId
    const r = records.get(s.id)
    if (r && r.imageId !== null && ids.has(r.imageId))
      return [
        {
          key,
          depth: r.centreDepth,
          height: r.heightMm / 1000,
          troughAzimuth: r.troughAzimuth,
          role: 'pick',
          colour,
          selected,
        },
      ]
    const image = imageAt(group, s.depth)
    if (!image) return []
    const [trace] = predictedSinusoids([{ ...s, source: 'core' }], image, -Infinity, Infinity)
    return trace ? [{ ...trace, key, role: 'pick', label: undefined, selected }] : []
  })
}

/** Core structures' predicted traces, each in the frame of the image at its depth. */
export function predictedTraces(
  structures: readonly PredictableStructure[],
  group: readonly ImageMeta[],
  selectedId: number | null,
): DrawnSinusoid[] {
  if (!group.length) return []
  return structures.flatMap((s) => {
    if (s.source === 'image') return []
    const image = imageAt(group, s.depth)
    if (!image) return []
    return predictedSinusoids([s], image, image.topDepth, image.bottomDepth).map((p) => ({
      ...p,
      label: undefined,
      selected: s.id === selectedId,
    }))
  })
}
