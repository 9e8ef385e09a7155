// The trace being picked: points clicked (or placed by keyboard) on one sinusoid, and the
// least-squares sinusoid they give, recomputed on every change. Pure: each edit returns a new draft.
import { fitSinusoid, wrap360, type SinusoidFit } from '../../../../orient/index'
import type { TracePoint } from '../../api/images'

/** The API takes at most this many points per pick (schema/api-images.ts TracePoints). */
export const MAX_TRACE_POINTS = 200

export interface TraceDraft {
  readonly points: readonly TracePoint[]
  /** The saved pick whose points are being moved; null while a new pick is drawn. */
  readonly editing: { readonly structureId: number; readonly version: number } | null
  /** The points came from an accepted suggestion (sent as `suggested: true`). */
  readonly suggested: boolean
}

export const emptyDraft = (): TraceDraft => ({ points: [], editing: null, suggested: false })

const point = (p: TracePoint): TracePoint => ({ depth: p.depth, azimuth: wrap360(p.azimuth) })

/** Adds a point at the end; a draft already holding the API's maximum stays as it is. */
export function addPoint(draft: TraceDraft, p: TracePoint): TraceDraft {
  if (draft.points.length >= MAX_TRACE_POINTS || !Number.isFinite(p.depth + p.azimuth)) return draft
  return { ...draft, points: [...draft.points, point(p)] }
}

/** Moves point `index` to `p` (a drag); an index outside the draft changes nothing. */
export function movePoint(draft: TraceDraft, index: number, p: TracePoint): TraceDraft {
  if (index < 0 || index >= draft.points.length || !Number.isFinite(p.depth + p.azimuth))
    return draft
  return { ...draft, points: draft.points.map((q, i) => (i === index ? point(p) : q)) }
}

/** Takes the last point off (Backspace); a new draft that runs empty is no suggestion any more. */
export function removeLastPoint(draft: TraceDraft): TraceDraft {
  const points = draft.points.slice(0, -1)
  return { ...draft, points, suggested: points.length > 0 && draft.suggested }
}

/** Every point shifted along the hole by `metres` (a saved pick's sinusoid dragged in depth). */
export function shiftPoints(points: readonly TracePoint[], metres: number): TracePoint[] {
  return points.map((p) => ({ depth: p.depth + metres, azimuth: p.azimuth }))
}

/** The live fit of the draft: undefined until three points in three directions fix a sinusoid. */
export function draftFit(draft: TraceDraft): SinusoidFit | undefined {
  return fitSinusoid(draft.points)
}

/** Enough points for the API (three or more) and a sinusoid through them. */
export const canAccept = (draft: TraceDraft) =>
  draft.points.length >= 3 && draftFit(draft) !== undefined
