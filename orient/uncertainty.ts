import { finishCone } from './uncertainty-cone'
import { drawTables, monteCarloOptions } from './uncertainty-draws'
import { coreDraws } from './uncertainty-core'
import { imageDraws } from './uncertainty-image'
import { sourceScratch } from './uncertainty-sources'
import { trueDraws } from './uncertainty-true'
import {
  SOURCE_CORE,
  SOURCE_IMAGE,
  SOURCE_TRUE,
  uncertaintyReasonBits,
  uncertaintyResult,
} from './uncertainty-columns'
import type { ErrorModel } from './error-model'
import type { UncertaintyColumns, UncertaintyResult } from './uncertainty-columns'

export { uncertaintyColumns, uncertaintyReasonBits } from './uncertainty-columns'
export type {
  UncertaintyColumns,
  UncertaintyReason,
  UncertaintyResult,
} from './uncertainty-columns'
export { combinedCone95, setMeanSystematic95 } from './uncertainty-set'

/** At or above this |plunge| a core structure's cone carries 'steep-hole' (gravity mark weak). */
export const STEEP_CORE_PLUNGE = 80
/** alpha at or above this: 'alpha-near-90' — the ellipse is near circular, beta barely defined. */
export const ALPHA_NEAR_90 = 80
/** alpha at or below this: 'alpha-near-0' — the plane is near the core axis. */
export const ALPHA_NEAR_0 = 10

const bit = (name: (typeof uncertaintyReasonBits)[number]) =>
  1 << uncertaintyReasonBits.indexOf(name)

/**
 * 95 % cone half-angle of every structure's pole by seeded Monte Carlo through the conversions the
 * product stores (coreToPlane with holeFrame, imagePickToPlane, true orientations as entered),
 * with the error model's 1σ per input (error-model.ts). The physics, first order (common
 * practice), each with its loop:
 * - survey azimuth δA ~ N(0, azimuthSd) turns the hole and its bottom-of-hole line about the
 *   vertical; none in a vertical hole (|plunge| ≥ 89.9°), whose trend is only the reference
 *   convention of holeFrame, so there the survey azimuth error is irrelevant (planHole);
 * - inclination δI ~ N(0, surveyInclinationSd) on the plunge; depth δz ~ N(0, depthSd) turns the
 *   hole by rate · δz from the caller's rates (planHole);
 * - core: alpha ~ N(α, alphaSd) reflected into 0–90, beta ~ N(β, betaSd) plus the steep-hole mark
 *   error atan(σ_I / (90° − |plunge|)), uniform beta where 90° − |plunge| ≤ σ_I (coreDraws,
 *   markTurn);
 * - image: height ~ N(H, pickHeightSdMm) clamped at 0, trough ~ N(θ, pickTroughSd); north-
 *   referenced picks follow the hole axis only, high-side ones the frame (imageDraws);
 * - true: dip ~ N(dip, trueDipSd), dip direction ~ N(dd, trueDipDirectionSd), no survey
 *   (trueDraws).
 * cone95 is the 95th percentile (nearest rank) of the angle between each draw's pole and the
 * computed (undisturbed) pole, as axes (min(θ, 180° − θ)); NaN where there is no pole. The ellipse
 * is the tangent-plane second-moment matrix about that pole scaled to the χ²₂ 95 % quantile, the
 * 95 % region of a bivariate normal (common practice; finishCone), NaN past 30°.
 *
 * Reasons, core only, simple thresholds set whatever the cone: 'steep-hole' at |plunge| ≥ 80°
 * (the gravity mark weakens; the cone widens as the hole steepens, up to uniform beta);
 * 'alpha-near-90' at alpha ≥ 80° — beta is then barely defined as a reading, but the pole hardly
 * depends on it (beta's lever is cos α), so the cone is not large because of it; 'alpha-near-0'
 * at alpha ≤ 10°, where beta's full error moves the pole and the cone is wider. 'no-survey' is
 * the caller's.
 *
 * Draws below 500 are raised to 500. Common random numbers: every structure sees the same seeded
 * standard normals, so the same seed gives identical arrays and equal inputs equal cones.
 */
export function orientationUncertainty(
  cols: UncertaintyColumns,
  model: ErrorModel,
  options: { draws?: number; seed?: number } = {},
): UncertaintyResult {
  const { draws, seed } = monteCarloOptions(options)
  const tables = drawTables(model, draws, seed)
  const s = sourceScratch(tables)
  const out = uncertaintyResult(cols.count)
  for (let i = 0; i < cols.count; i++) {
    const source = cols.source[i]
    let ok = false
    if (source === SOURCE_CORE) ok = coreDraws(cols, i, tables, s, model)
    else if (source === SOURCE_IMAGE) ok = imageDraws(cols, i, tables, s, model)
    else if (source === SOURCE_TRUE) ok = trueDraws(cols, i, tables, s)
    if (!ok) continue
    finishCone(s.cone, s.n0[0], s.n0[1], s.n0[2], out, i)
    if (source !== SOURCE_CORE) continue
    const alpha = cols.alpha[i]
    let reasons = 0
    if (Math.abs(cols.holePlunge[i]) >= STEEP_CORE_PLUNGE) reasons |= bit('steep-hole')
    if (alpha >= ALPHA_NEAR_90) reasons |= bit('alpha-near-90')
    if (alpha <= ALPHA_NEAR_0) reasons |= bit('alpha-near-0')
    out.reasons[i] = reasons
  }
  return out
}
