// How the reconciliation's numbers read on screen: signed shifts and rotations, spreads, the trend,
// verdict words. One place, so the summary, the table and the confirm dialog say the same thing.
import type { AdjustmentAnswer, ReconciliationAnswer } from '../../../../schema/index'

export type ReconcileRun = ReconciliationAnswer['runs'][number]
export type RunVerdict = NonNullable<ReconcileRun['verdict']>

const dash = '—'
const finite = (v: number | null | undefined): v is number =>
  typeof v === 'number' && Number.isFinite(v)

/** A signed value with a true minus sign: 0.35 → "+0.350", −0.35 → "−0.350". */
export function signed(value: number | null | undefined, digits: number): string {
  if (!finite(value)) return dash
  const text = Math.abs(value).toFixed(digits)
  if (Number(text) === 0) return text
  return `${value < 0 ? '\u2212' : '+'}${text}`
}

/** Depth shift or depth difference in metres, to the millimetre. */
export const formatShift = (value: number | null | undefined) =>
  finite(value) ? `${signed(value, 3)} m` : dash

export const formatSpreadMetres = (value: number | null | undefined) =>
  finite(value) ? `± ${value.toFixed(3)} m` : ''

/** Rotation of an orientation line in degrees, to a tenth. */
export const formatRotation = (value: number | null | undefined) =>
  finite(value) ? `${signed(value, 1)}°` : dash

export const formatSpreadDegrees = (value: number | null | undefined) =>
  finite(value) ? `± ${value.toFixed(1)}°` : ''

/** The shift's trend with depth, per 10 m of hole: slope 0.0012 → "+0.012 m per 10 m". */
export function formatTrend(trend: ReconciliationAnswer['depthTrend']): string {
  if (!trend) return ''
  const error = finite(trend.slopeError) ? ` (± ${(trend.slopeError * 10).toFixed(3)})` : ''
  return `${signed(trend.slope * 10, 3)} m per 10 m${error}`
}

export const formatRange = (from: number, to: number) => `${from.toFixed(1)}–${to.toFixed(1)} m`

export const verdictWords: Record<RunVerdict, string> = {
  ok: 'ok',
  suspect: 'suspect',
  wrong: 'wrong',
}

/** What a verdict tells the user, for the chip's title. */
export const verdictHints: Record<RunVerdict, string> = {
  ok: 'The rotated core poles agree with the image poles within the ok limit.',
  suspect: 'The residual lies between the ok and wrong limits: look at this run again.',
  wrong: 'The residual is above the wrong limit: the orientation line is likely misplaced.',
}

export const adjustmentKindWords: Record<AdjustmentAnswer['kind'], string> = {
  'depth-shift': 'Image depth shift',
  'run-rotation': 'Run rotation',
}

/** Kind, value and previous value of an adjustment, with its run's range when it has one. */
export function describeAdjustment(a: AdjustmentAnswer, runs: readonly ReconcileRun[]) {
  const run = a.runId === null ? undefined : runs.find((r) => r.runId === a.runId)
  const format = a.kind === 'depth-shift' ? formatShift : formatRotation
  const where =
    a.runId === null ? '' : run ? formatRange(run.fromDepth, run.toDepth) : `run ${a.runId}`
  return {
    kind: adjustmentKindWords[a.kind],
    where,
    value: format(a.value),
    previous: format(a.previous),
  }
}

export const formatWhen = (iso: string | null) => (iso ? new Date(iso).toLocaleString() : dash)
