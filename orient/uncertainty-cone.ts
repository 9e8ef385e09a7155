import { RAD2DEG, acos } from './math'
import { tangentBasis } from './uncertainty-kernel'
import { rankedCos, selectScratch } from './uncertainty-select'
import type { SelectScratch } from './uncertainty-select'
import type { UncertaintyResult } from './uncertainty-columns'

/** χ²₂ 95 % quantile, −2 ln 0.05: the 95 % ellipse of a 2-D Gaussian is at this squared radius. */
export const CHI2_2_95 = 5.991

/**
 * Above this cone (degrees) orthographic tangent-plane coordinates understate angles by more than
 * 5 % (sin 30° = 0.500 against 0.524 rad): the ellipse is left NaN and the cone alone stands.
 */
export const MAX_ELLIPSE_CONE = 30

/**
 * One structure's draws as the source loops leave them: cos[d] = |n_d·n₀| (0 for a failed draw,
 * which so counts as 90° off and is never dropped) and the sums Σ n nᵀ over the valid draws
 * (xx, xy, xz, yy, yz, zz) with their count.
 */
export interface ConeScratch {
  readonly cos: Float64Array
  readonly moments: Float64Array
  readonly select: SelectScratch
  readonly basis: Float64Array
  valid: number
}

export function coneScratch(draws: number): ConeScratch {
  return {
    cos: new Float64Array(draws),
    moments: new Float64Array(6),
    select: selectScratch(draws),
    basis: new Float64Array(6),
    valid: 0,
  }
}

/**
 * The 95 % figures of one structure (degrees) into out[i], from its scratch and its computed unit
 * pole (x0, y0, z0). The angle of a draw from the computed pole is taken as an axis, θ =
 * acos|n·n₀| = min(θ, 180° − θ); its 95th percentile (nearest rank, ⌈0.95 N⌉) comes by selection
 * (rankedCos, no sort) and one acos. The ellipse comes from the second moments of the draws'
 * tangent-plane coordinates about the computed pole — u = n·e₁, v = n·e₂, so Σu² = e₁ᵀ(Σ n nᵀ)e₁ —
 * not about the draws' mean, so a bias such as the reflection of alpha at 0 or 90 widens it rather
 * than hiding; semi-axes √(5.991 λ) for the eigenvalues λ of the 2 × 2 moment matrix.
 */
export function finishCone(
  s: ConeScratch,
  x0: number,
  y0: number,
  z0: number,
  out: UncertaintyResult,
  i: number,
): void {
  const m = s.moments
  const k = s.valid > 0 ? 1 / s.valid : 0
  const e = s.basis
  tangentBasis(e, x0, y0, z0)
  const a = k * quad(m, e[0], e[1], e[2], e[0], e[1], e[2])
  const b = k * quad(m, e[0], e[1], e[2], e[3], e[4], e[5])
  const c = k * quad(m, e[3], e[4], e[5], e[3], e[4], e[5])
  const lambda1 = 0.5 * (a + c) + Math.sqrt(0.25 * (a - c) * (a - c) + b * b)
  const cone = acos(rankedCos(s.cos, s.valid > 0 ? lambda1 : 1, s.select)) * RAD2DEG
  out.cone95[i] = cone
  if (!(cone <= MAX_ELLIPSE_CONE) || s.valid === 0) return
  ellipse(out, i, e, a, b, c)
}

/** aᵀ M b for the symmetric M held as (xx, xy, xz, yy, yz, zz). */
function quad(
  m: Float64Array,
  ax: number,
  ay: number,
  az: number,
  bx: number,
  by: number,
  bz: number,
): number {
  return (
    ax * (m[0] * bx + m[1] * by + m[2] * bz) +
    ay * (m[1] * bx + m[3] * by + m[4] * bz) +
    az * (m[2] * bx + m[4] * by + m[5] * bz)
  )
}

/** A 95 % semi-axis (degrees) from a tangent-plane variance (sin² units). */
function semiAxis(lambda: number): number {
  return Math.asin(Math.min(1, Math.sqrt(CHI2_2_95 * Math.max(0, lambda)))) * RAD2DEG
}

/** Semi-axes and major-axis line of the 2 × 2 moment matrix [[a, b], [b, c]] in basis e. */
function ellipse(
  out: UncertaintyResult,
  i: number,
  e: Float64Array,
  a: number,
  b: number,
  c: number,
) {
  const mid = 0.5 * (a + c)
  const half = Math.sqrt(0.25 * (a - c) * (a - c) + b * b)
  out.major95[i] = semiAxis(mid + half)
  out.minor95[i] = semiAxis(mid - half)
  const phi = 0.5 * Math.atan2(2 * b, a - c)
  const f = Math.cos(phi)
  const g = Math.sin(phi)
  const sign = f * e[2] + g * e[5] > 0 ? -1 : 1
  const x = sign * (f * e[0] + g * e[3])
  const y = sign * (f * e[1] + g * e[4])
  const z = sign * (f * e[2] + g * e[5])
  const h = Math.hypot(x, y)
  const trend = h < 1e-12 ? 0 : Math.atan2(x, y) * RAD2DEG
  out.axisTrend[i] = trend < 0 ? trend + 360 : trend
  out.axisPlunge[i] = Math.atan2(-z, h) * RAD2DEG
}

/** Σ n nᵀ of a source loop (xx, xy, xz, yy, yz, zz) into m, with no array allocated. */
export function storeMoments(
  m: Float64Array,
  xx: number,
  xy: number,
  xz: number,
  yy: number,
  yz: number,
  zz: number,
): void {
  m[0] = xx
  m[1] = xy
  m[2] = xz
  m[3] = yy
  m[4] = yz
  m[5] = zz
}
