// How a structure's stored uncertainty and reconciliation adjustments read on screen: the 95 %
// cone about its pole, its ellipse when the spread is far from round, and why it is large.
import type { UncertaintyReason } from '../../../../schema/vocabulary'
import type { DepthStructure } from '../../api/interval-types'
import { formatAngle, formatAzimuth, formatMetres, formatNumber } from '../format'

/** Above this major/minor ratio the cone is described by its ellipse as well. */
export const ELLIPSE_RATIO = 1.5

export const uncertaintyReasonWords: Record<UncertaintyReason, string> = {
  'steep-hole': 'near-vertical hole: the bottom-of-hole mark is poorly defined',
  'alpha-near-90': 'alpha near 90°: beta is barely defined',
  'alpha-near-0': 'alpha near 0°: the plane lies near the core axis',
  'no-survey': 'no survey: the planned hole direction stood in',
}

const reasonWord = (r: string) =>
  r in uncertaintyReasonWords ? uncertaintyReasonWords[r as UncertaintyReason] : r

export interface ConeText {
  /** "±4.2° (95 %)", or "not computed" with its reason when known. */
  figure: string
  /** "ellipse 6.1 × 2.3°, long axis toward 045°" when major/minor > ELLIPSE_RATIO. */
  ellipse: string | null
  /** Why the cone is large, in words. */
  reasons: string[]
  computed: boolean
}

type ConeFields = Pick<
  DepthStructure,
  | 'dip'
  | 'poleTrend'
  | 'holeTrend'
  | 'uncertainty95'
  | 'uncertaintyMajor'
  | 'uncertaintyMinor'
  | 'uncertaintyAxisTrend'
  | 'uncertaintyReasons'
>

/** The cone of one structure as the card shows it; a null cone says why when the row tells. */
export function coneText(s: ConeFields): ConeText {
  const reasons = (s.uncertaintyReasons ?? []).map(reasonWord)
  if (s.uncertainty95 === null || s.uncertainty95 === undefined) {
    const why =
      s.dip === null || s.poleTrend === null
        ? ': unoriented, so there is no pole'
        : s.holeTrend === null
          ? ': no hole direction at this depth'
          : ''
    return { figure: `not computed${why}`, ellipse: null, reasons, computed: false }
  }
  const major = s.uncertaintyMajor
  const minor = s.uncertaintyMinor
  const elongated =
    major !== null && minor !== null && major > 0 && (minor <= 0 || major / minor > ELLIPSE_RATIO)
  const ellipse = elongated
    ? `ellipse ${formatNumber(major, 1)} × ${formatAngle(minor)}, long axis toward ${formatAzimuth(
        s.uncertaintyAxisTrend,
        0,
      )}`
    : null
  return { figure: `±${formatAngle(s.uncertainty95)} (95 %)`, ellipse, reasons, computed: true }
}

/** Beta as logged, with the run's reconciliation rotation beside it when one is in force. */
export function betaText(beta: number | null, rotation: number | null | undefined): string {
  const logged = formatAngle(beta)
  if (beta === null || !rotation) return logged
  const sign = rotation > 0 ? '+' : '−'
  return `${logged} (${sign}${Math.abs(rotation).toFixed(1)}° run adjustment)`
}

/** The stored depth; an image structure moved onto core depths names its logged depth too. */
export function depthText(depth: number, shift: number | null | undefined): string {
  const shown = formatMetres(depth, 2)
  if (!shift) return shown
  const sign = shift > 0 ? '+' : '−'
  return `${shown} (logged ${formatMetres(depth + shift, 2)}, image shift ${sign}${Math.abs(shift).toFixed(2)} m)`
}
