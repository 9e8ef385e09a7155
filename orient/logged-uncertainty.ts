import { betaFromBottom } from './core'
import { surveyInstrumentOf, type ErrorModel } from './error-model'
import {
  orientationUncertainty,
  uncertaintyColumns,
  uncertaintyReasonBits,
  type UncertaintyColumns,
} from './uncertainty'
import type { ComputeContext, StructureComputed, StructureInputs } from './logged-structures'
import type { PreparedSurvey } from './survey-interpolate'
import type { ImagePick } from './image-pick'
import type { Line } from './types'

/** Half the step (m) over which the hole's change of direction per metre is read. */
const RATE_STEP = 0.5

const angleStep = (a: number, b: number) => ((((b - a) % 360) + 540) % 360) - 180

/** A structure's inputs as the cone needs them: what computeStructures used, and the survey's error. */
export interface UncertaintyRow {
  source: 'core' | 'true' | 'image'
  alpha?: number | null
  /** As logged, with its reference line; the run's rotation separately. */
  beta?: number | null
  reference: 'bottom' | 'top'
  betaRotation?: number | null
  hole: Line
  /** Change of the hole direction per metre along hole (degrees/m), for the depth error. */
  holeRate?: Line
  /** Survey azimuth 1σ of the instrument at this depth (degrees). */
  azimuthSd: number
  pick?: ImagePick | null
  dip?: number | null
  dipDirection?: number | null
}

/** The columns orientationUncertainty reads, filled from rows (a row without a pole stays zero). */
export function uncertaintyColumnsOf(rows: readonly UncertaintyRow[]): UncertaintyColumns {
  const cols = uncertaintyColumns(rows.length)
  rows.forEach((r, i) => {
    cols.holeTrend[i] = r.hole.trend
    cols.holePlunge[i] = r.hole.plunge
    cols.holeTrendRate[i] = r.holeRate?.trend ?? 0
    cols.holePlungeRate[i] = r.holeRate?.plunge ?? 0
    cols.azimuthSd[i] = r.azimuthSd
    if (r.source === 'core') {
      cols.source[i] = 0
      cols.alpha[i] = r.alpha ?? 0
      const beta = (r.beta ?? 0) + (r.betaRotation ?? 0)
      cols.beta[i] = betaFromBottom(beta, { reference: r.reference })
    } else if (r.source === 'true') {
      cols.source[i] = 1
      cols.inputDip[i] = r.dip ?? 0
      cols.inputDipDirection[i] = r.dipDirection ?? 0
    } else if (r.pick) {
      cols.source[i] = 2
      cols.amplitude[i] = r.pick.amplitude
      cols.diameter[i] = r.pick.diameter
      cols.trough[i] = r.pick.troughAzimuth
      cols.north[i] = r.pick.reference === 'north' ? 1 : 0
    }
  })
  return cols
}

/** The survey azimuth 1σ for a depth: the instrument of the station at or above it. */
export function azimuthSdAt(
  stations: readonly { depth: number; method?: string | null }[],
  depth: number,
  model: ErrorModel,
): number {
  let method = stations[0]?.method
  for (const s of stations) {
    if (s.depth > depth) break
    method = s.method
  }
  return surveyInstrumentOf(method) === 'gyro'
    ? model.surveyAzimuthSdGyro
    : model.surveyAzimuthSdMagnetic
}

/**
 * Fills each computed structure's 95 % cone from the error model (orientationUncertainty): the
 * inputs as computeStructures used them — core beta from the bottom-of-hole line with the run's
 * rotation, the hole direction at the depth and its change per metre (for the depth error), the
 * azimuth error of the instrument of the station at or above the depth (gyro or magnetic) — so
 * the cone is about the very pole that was stored. Structures without a pole keep null.
 */
export function structureUncertainty(
  ctx: ComputeContext,
  model: ErrorModel,
  items: readonly StructureInputs[],
  out: StructureComputed[],
  survey: PreparedSurvey,
): void {
  const index: number[] = []
  const rows: UncertaintyRow[] = []
  items.forEach((s, i) => {
    const c = out[i]
    if (c.poleTrend === null || c.holeTrend === null || c.holePlunge === null) return
    if (s.source === 'image' && !s.pick) return
    let holeRate: Line | undefined
    const above = survey.holeAt(Math.max(0, s.depth - RATE_STEP))
    const below = survey.holeAt(s.depth + RATE_STEP)
    if (above && below) {
      const span = s.depth + RATE_STEP - Math.max(0, s.depth - RATE_STEP)
      holeRate = {
        trend: angleStep(above.trend, below.trend) / span,
        plunge: (below.plunge - above.plunge) / span,
      }
    }
    index.push(i)
    rows.push({
      source: s.source,
      alpha: s.alpha,
      beta: s.beta,
      reference: s.referenceLine ?? ctx.referenceLine,
      betaRotation: c.betaRotationApplied,
      hole: { trend: c.holeTrend, plunge: c.holePlunge },
      holeRate,
      azimuthSd: azimuthSdAt(ctx.stations, s.depth, model),
      pick: s.pick,
      dip: c.dip,
      dipDirection: c.dipDirection,
    })
  })
  if (rows.length === 0) return
  const result = orientationUncertainty(uncertaintyColumnsOf(rows), model)
  const noSurvey = ctx.stations.length === 0
  index.forEach((i, k) => {
    if (!Number.isFinite(result.cone95[k])) return
    const c = out[i]
    c.uncertainty95 = round(result.cone95[k])
    if (Number.isFinite(result.major95[k]) && Number.isFinite(result.minor95[k])) {
      c.uncertaintyMajor = round(result.major95[k])
      c.uncertaintyMinor = round(result.minor95[k])
      c.uncertaintyAxisTrend = round(result.axisTrend[k])
      c.uncertaintyAxisPlunge = round(result.axisPlunge[k])
    }
    const bits = result.reasons[k]
    const reasons: string[] = uncertaintyReasonBits.filter((_, b) => (bits >> b) & 1)
    if (noSurvey && items[i].source !== 'true' && !reasons.includes('no-survey'))
      reasons.push('no-survey')
    c.uncertaintyReasons = reasons
  })
}

const round = (x: number) => Math.round(x * 100) / 100
