import type { Interval } from '../../../schema/index'
import type { AnalysisSettings } from '../services/intervals'
import { CAUTIONS } from './cautions'
import type { PackData, SignOff } from './pack-types'

/** The words every page and file of a pack holding unapproved intervals carries. */
export const DRAFT_MARK = 'DRAFT — not for design'

/** Only approved intervals can be issued; issued ones were approved first. */
export const isApproved = (i: Pick<Interval, 'status'>) =>
  i.status === 'approved' || i.status === 'issued'

/** A stamp in UTC to the minute: `2026-12-01 10:05 UTC`. */
export const stampOf = (at: Date | null) =>
  at ? `${at.toISOString().slice(0, 16).replace('T', ' ')} UTC` : ''

/** "checked by A on …; approved by B on …", saying plainly where a step is missing. */
export function signOffText(s: SignOff): string {
  const step = (what: string, who: string | null, at: Date | null) =>
    who ? `${what} by ${who} on ${stampOf(at)}` : `not ${what}`
  return `${step('checked', s.checkedBy, s.checkedAt)}; ${step('approved', s.approvedBy, s.approvedAt)}`
}

/** The saved settings in words, as every file states them. */
export function settingsText(s: AnalysisSettings): string {
  const face =
    s.faceDip === null || s.faceDipDirection === null
      ? 'no design face'
      : `face ${s.faceDip}/${s.faceDipDirection}`
  const friction = s.frictionDeg === null ? 'no friction angle' : `friction ${s.frictionDeg} deg`
  const weighting = s.weighting === 'terzaghi' ? 'Terzaghi-weighted' : 'unweighted'
  const contours = s.contourMethod === 'kamb' ? 'Kamb' : 'exponential-kernel'
  return `${weighting} Fisher statistics; ${contours} contours; ${face}; ${friction}; lateral limit ${s.lateralLimitDeg} deg; toppling limit ${s.topplingLimitDeg} deg`
}

/**
 * The header every text file of a pack starts with: the draft mark first (when any interval is
 * not approved), what the file is, then each interval's status, sign-off and settings.
 */
export function packHeaderLines(
  data: PackData,
  meta: { packId: string; builtBy: string; builtAt: Date },
  file: string,
): string[] {
  const lines = [
    ...(data.draft
      ? [`${DRAFT_MARK}: it holds intervals that are not approved; a preview, never issued.`]
      : []),
    `Downdip design pack ${data.project.code} ${meta.packId.slice(0, 8)}: ${file}, built by ${meta.builtBy} on ${stampOf(meta.builtAt)}`,
    ...data.intervals.map(
      ({ hole, interval, signOff, settings }) =>
        `${hole.name} ${interval.name} (${interval.fromDepth.toFixed(2)}-${interval.toDepth.toFixed(2)} m) ${interval.status}: ${signOffText(signOff)}. Settings: ${settingsText(settings)}.`,
    ),
    ...CAUTIONS,
  ]
  return lines.map((l) => l.replace(/[\r\n]+/g, ' '))
}
