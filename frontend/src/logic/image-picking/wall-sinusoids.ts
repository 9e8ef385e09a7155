// Everything the picking view draws on the wall as sinusoids, in the ImageCanvas shape: heights
// in metres there, millimetres in the API.
import type { ImagePickRecord, Suggestion } from '../../api/images'
import type { SinusoidFit } from '../../../../orient/index'
import type { DrawnSinusoid } from '../image/image-types'
import { symbolOf } from '../track/structure-symbols'
import { pendingKey, pickKey, type PendingPick } from './pick-rows'

/** One trace for ImageCanvas (its own type): depth and height in metres, trough in image ref. */
export type WallSinusoid = DrawnSinusoid

export const DRAFT_KEY = 'draft'
export const suggestionKey = (s: Suggestion) =>
  `suggestion:${s.depth.toFixed(4)}:${s.height.toFixed(1)}:${s.troughAzimuth.toFixed(1)}`

/** A saved pick while its sinusoid is dragged: drawn `shift` metres off its stored depth. */
export interface PickShift {
  key: string
  metres: number
}

export function pickSinusoids(
  saved: readonly ImagePickRecord[],
  pending: readonly PendingPick[],
  selectedKey: string | null,
  shift: PickShift | null,
  hiddenKey: string | null = null,
): WallSinusoid[] {
  const out: WallSinusoid[] = []
  for (const p of saved) {
    const key = pickKey(p.structureId)
    if (key === hiddenKey) continue
    out.push({
      key,
      depth: p.centreDepth + (shift?.key === key ? shift.metres : 0),
      height: p.heightMm / 1000,
      troughAzimuth: p.troughAzimuth,
      role: 'pick',
      selected: key === selectedKey,
      colour: symbolOf(p.structure.type).colour,
      label: symbolOf(p.structure.type).label,
    })
  }
  for (const p of pending) {
    out.push({
      key: pendingKey(p.key),
      depth: p.fit.depth,
      height: p.fit.height,
      troughAzimuth: p.fit.troughAzimuth,
      role: 'pick',
      selected: pendingKey(p.key) === selectedKey,
      colour: symbolOf(p.type).colour,
      label: p.status === 'failed' ? 'not saved' : 'saving…',
    })
  }
  return out
}

export function suggestionSinusoids(
  list: readonly Suggestion[],
  selectedKey: string | null,
): WallSinusoid[] {
  return list.map((s) => ({
    key: suggestionKey(s),
    depth: s.depth,
    height: s.height / 1000,
    troughAzimuth: s.troughAzimuth,
    role: 'suggestion',
    selected: suggestionKey(s) === selectedKey,
    label: `score ${s.score.toFixed(2)}`,
  }))
}

export function draftSinusoid(fit: SinusoidFit | undefined): WallSinusoid[] {
  return fit
    ? [
        {
          key: DRAFT_KEY,
          depth: fit.depth,
          height: fit.height,
          troughAzimuth: fit.troughAzimuth,
          role: 'draft',
        },
      ]
    : []
}
