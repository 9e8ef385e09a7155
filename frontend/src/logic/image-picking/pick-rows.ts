// What the picking view shows of the image's picks: saved ones as the API sends them, and ones on
// their way (saving, or failed and kept with their points until retried).
import { poleOf, type SinusoidFit } from '../../../../orient/index'
import type { ImagePickRecord, TracePoint } from '../../api/images'
import type { NetPole } from '../net/net-types'
import { symbolOf } from '../track/structure-symbols'

/** A pick accepted on screen and not stored yet. */
export interface PendingPick {
  key: number
  points: TracePoint[]
  type: string
  confidence: string | null
  comment: string
  suggested: boolean
  /** One per pick as sent: a retry can never store it twice. */
  idempotencyKey: string
  status: 'saving' | 'failed'
  message: string | null
  /** The client's fit, drawn until the server's answer replaces it. */
  fit: SinusoidFit
}

/** A fresh Idempotency-Key for one pick as sent. */
export const requestKey = () =>
  globalThis.crypto?.randomUUID?.() ??
  `${Date.now().toString(36)}-${Math.random().toString(36).slice(2)}-${Math.random().toString(36).slice(2)}`

/** A pick on its way, sent under a key of its own. */
export function newPending(
  key: number,
  fields: Pick<PendingPick, 'type' | 'confidence' | 'comment' | 'suggested' | 'fit'> & {
    points: readonly TracePoint[]
  },
): PendingPick {
  return {
    key,
    ...fields,
    points: [...fields.points],
    idempotencyKey: requestKey(),
    status: 'saving',
    message: null,
  }
}

/** The API body of a pending pick. */
export const pendingBody = (p: PendingPick) => ({
  points: p.points,
  type: p.type,
  confidence: p.confidence ?? undefined,
  comment: p.comment || undefined,
  suggested: p.suggested || undefined,
})

/** One line of the pick table. */
export interface PickRow {
  key: string
  structureId: number | null
  depth: number
  type: string
  dip: number | null
  dipDirection: number | null
  heightMm: number
  troughAzimuth: number
  rmsMm: number | null
  confidence: string | null
  suggested: boolean
  status: 'saved' | 'saving' | 'failed'
  message: string | null
}

export const pickKey = (structureId: number) => `pick:${structureId}`
export const pendingKey = (key: number) => `pending:${key}`

export const savedRow = (p: ImagePickRecord): PickRow => ({
  key: pickKey(p.structureId),
  structureId: p.structureId,
  depth: p.centreDepth,
  type: p.structure.type,
  dip: p.structure.dip,
  dipDirection: p.structure.dipDirection,
  heightMm: p.heightMm,
  troughAzimuth: p.troughAzimuth,
  rmsMm: p.rmsMm,
  confidence: p.structure.confidence,
  suggested: p.suggested,
  status: 'saved',
  message: null,
})

export const pendingRow = (p: PendingPick): PickRow => ({
  key: pendingKey(p.key),
  structureId: null,
  depth: p.fit.depth,
  type: p.type,
  dip: null,
  dipDirection: null,
  heightMm: p.fit.height * 1000,
  troughAzimuth: p.fit.troughAzimuth,
  rmsMm: p.fit.rms * 1000,
  confidence: p.confidence,
  suggested: p.suggested,
  status: p.status,
  message: p.message,
})

/** Saved and pending picks in one list, down the hole. */
export function pickRows(saved: readonly ImagePickRecord[], pending: readonly PendingPick[]) {
  return [...saved.map(savedRow), ...pending.map(pendingRow)].sort(
    (a, b) => a.depth - b.depth || a.key.localeCompare(b.key),
  )
}

/** The key `by` lines up or down from `current` (the first or last line when none is chosen). */
export function stepKey(rows: readonly PickRow[], current: string | null, by: -1 | 1) {
  if (rows.length === 0) return null
  const at = rows.findIndex((r) => r.key === current)
  const next =
    at < 0 ? (by > 0 ? 0 : rows.length - 1) : Math.min(rows.length - 1, Math.max(0, at + by))
  return rows[next]!
}

/** The poles of the saved picks, coloured by type as on the depth view's net. */
export function pickPoles(saved: readonly ImagePickRecord[]): NetPole[] {
  return saved.flatMap((p) => {
    const { dip, dipDirection } = p.structure
    if (dip === null || dipDirection === null) return []
    const pole = poleOf({ dip, dipDirection })
    if (!pole) return []
    return [
      {
        id: p.structureId,
        trend: pole.trend,
        plunge: pole.plunge,
        dip,
        dipDirection,
        group: -1,
        colour: symbolOf(p.structure.type).colour,
        flagged: p.structure.flags.length > 0,
        weight: 1,
      },
    ]
  })
}
