// The traces on the wall, bottom layer first: predicted core traces, candidates, the image's
// picks, and the trace being drawn on top.
import type { ImageMeta, ImagePickRecord, Suggestion } from '../../api/images'
import type { SinusoidFit } from '../../../../orient/index'
import type { PendingPick } from './pick-rows'
import { pickKey } from './pick-rows'
import { predictedSinusoids, type PredictableStructure } from '../image/predicted'
import type { DepthWindow } from './view-window'
import * as ws from './wall-sinusoids'

export interface WallLayers {
  saved: readonly ImagePickRecord[]
  pending: readonly PendingPick[]
  selectedKey: string | null
  shift: ws.PickShift | null
  /** The saved pick whose points are being moved (drawn as the draft instead). */
  editingId: number | null
  liveFit: SinusoidFit | undefined
  candidates: readonly (Suggestion & { key: string })[]
  /** A candidate taken into the draft (drawn as the draft instead). */
  takenKey: string | null
  chosenCandidate: string | null
  structures: readonly PredictableStructure[]
  image: ImageMeta
  domain: DepthWindow
  showPredicted: boolean
}

export function wallSinusoids(l: WallLayers): ws.WallSinusoid[] {
  const predicted = l.showPredicted
    ? predictedSinusoids(l.structures, l.image, l.domain[0], l.domain[1])
    : []
  const candidates = ws.suggestionSinusoids(
    l.candidates.filter((c) => c.key !== l.takenKey),
    l.chosenCandidate,
  )
  const hidden = l.editingId === null ? null : pickKey(l.editingId)
  const picks = ws.pickSinusoids(l.saved, l.pending, l.selectedKey, l.shift, hidden)
  return [...predicted, ...candidates, ...picks, ...ws.draftSinusoid(l.liveFit)]
}
