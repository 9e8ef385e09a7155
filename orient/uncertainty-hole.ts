import { DEG2RAD, RAD2DEG } from './math'
import { azimuthTable } from './uncertainty-draws'
import type { DrawTables } from './uncertainty-draws'

/** At or above this |plunge| (degrees) a hole is vertical: its stated trend is a convention. */
export const VERTICAL_PLUNGE = 89.9

/**
 * Largest per-structure turn (radians) the source loops take by the Taylor series sin x ≈ x − x³/3!
 * + x⁵/5! − x⁷/7!, cos x ≈ 1 − x²/2! + x⁴/4! − x⁶/6! + x⁸/8! (remainders x⁹/9!, x¹⁰/10! below
 * 2e-11 here, far below Monte Carlo noise); beyond it they call Math.sin and Math.cos. The loops
 * write the coefficients as literals and use nothing imported per draw: a bundler may turn an
 * imported binding into a getter call, which cost the first version several times its loop.
 */
export const SERIES_REACH = 0.3

/** Up to this turn (radians) sin x ≈ x − x³/6 and cos x ≈ 1 − x²/2 + x⁴/24 (remainders < 1e-15). */
export const TINY_REACH = 2e-3

/**
 * One structure's hole perturbation, as the loops use it (see planHole): the undisturbed sines and
 * cosines, the survey tables, and the per-structure depth turns k·zDepth[d] of trend and plunge.
 */
export interface HolePlan {
  sT: number
  cT: number
  sP: number
  cP: number
  azimuth: { readonly s: Float64Array; readonly c: Float64Array }
  kT: number
  kP: number
  /** Largest |k|·max|z| of the two depth turns (radians). */
  reach: number
}

export function holePlan(t: DrawTables): HolePlan {
  return { sT: 0, cT: 1, sP: 0, cP: 1, azimuth: azimuthTable(t, 0), kT: 0, kP: 0, reach: 0 }
}

/**
 * The hole direction at a structure's depth, perturbed draw by draw by the survey and depth errors
 * (first order, common practice):
 * - survey azimuth δA ~ N(0, azimuthSd) turns the hole, and with it the bottom-of-hole line, about
 *   the vertical. In a vertical hole (|plunge| ≥ 89.9°) the azimuth is no measurement — the stated
 *   trend only fixes the reference convention of holeFrame — so no azimuth error is drawn there,
 *   and the trend is not moved by the depth error either;
 * - inclination δI ~ N(0, surveyInclinationSd) changes the plunge (t.inclination);
 * - depth δz ~ N(0, depthSd) moves the structure along the hole, whose direction changes by
 *   rate · δz (the caller's rates, linearised); one δz moves trend and plunge together.
 * False for a non-finite direction.
 */
export function planHole(
  t: DrawTables,
  plan: HolePlan,
  trend: number,
  plunge: number,
  trendRate: number,
  plungeRate: number,
  azimuthSd: number,
  depthSd: number,
): boolean {
  if (!Number.isFinite(trend) || !Number.isFinite(plunge)) return false
  const vertical = Math.abs(plunge) >= VERTICAL_PLUNGE
  plan.azimuth = azimuthTable(t, vertical || !(azimuthSd > 0) ? 0 : azimuthSd)
  plan.kT = vertical || !Number.isFinite(trendRate) ? 0 : trendRate * depthSd * DEG2RAD
  plan.kP = Number.isFinite(plungeRate) ? plungeRate * depthSd * DEG2RAD : 0
  plan.reach = Math.max(Math.abs(plan.kT), Math.abs(plan.kP)) * t.maxDepth
  plan.sT = Math.sin(trend * DEG2RAD)
  plan.cT = Math.cos(trend * DEG2RAD)
  plan.sP = Math.sin(plunge * DEG2RAD)
  plan.cP = Math.cos(plunge * DEG2RAD)
  return true
}

/**
 * The per-structure turn of beta (radians per standard normal of t.zBeta) for the bottom-of-hole
 * mark error of a steep hole, or NaN where beta is to be drawn uniform. An isotropic tilt error
 * σ_I on a tilt vector of length t = 90° − |plunge| turns its direction by σ_I / t to first
 * order, so the mark's 1σ is σ_m = atan(σ_I / t); where t ≤ σ_I the mark means nothing and beta is
 * uniform on 0–360. The reading and mark errors, independent normals, are drawn as one,
 * N(0, betaSd² + σ_m²): the betaSd table turned further by (√(betaSd² + σ_m²) − betaSd)·z.
 */
export function markTurn(t: DrawTables, plunge: number, sdI: number): number {
  const tilt = 90 - Math.abs(plunge)
  if (!(sdI > 0)) return 0
  if (tilt <= sdI) return NaN
  const mark = Math.atan(sdI / tilt) * RAD2DEG
  return (Math.hypot(t.betaSd, mark) - t.betaSd) * DEG2RAD
}
