import { mulberry32 } from './random'
import { tensorSums } from './tensor'
import { coneScratch, finishCone } from './uncertainty-cone'
import { monteCarloOptions, seededNormals } from './uncertainty-draws'
import { VERTICAL_PLUNGE } from './uncertainty-hole'
import { memberPole } from './uncertainty-member'
import { SOURCE_TRUE, uncertaintyResult } from './uncertainty-columns'
import type { ConeScratch } from './uncertainty-cone'
import type { ErrorModel } from './error-model'
import type { UncertaintyColumns } from './uncertainty-columns'

/**
 * 95 % half-angle of a set's MEAN pole under the survey errors alone (azimuth, inclination), which
 * every member of one hole shares: per draw, one δA ~ N(0, 1)·azimuthSd and one δI ~ N(0,
 * surveyInclinationSd) per group (hole), applied to each member's hole direction as in
 * orientationUncertainty (no azimuth error in a vertical hole); the readings stay as logged. The
 * weighted axial mean is taken as in fisherStats (members flipped to the principal axis for the
 * computed mean; each draw's poles flipped to the computed mean's side), and the result is the 95th
 * percentile of the draw means' angle from the computed mean, as axes.
 *
 * Why a separate term: reading errors are independent between members and already inside the
 * set's Fisher alpha95, which shrinks as 1/√n; a hole's survey error moves all its members
 * together and does not average out within the hole — only across holes with independent surveys.
 * Combine the two with combinedCone95. True-source members carry no survey error (0 when nothing
 * can move). Undefined when no member has a pole or a positive weight; a RangeError when groups or
 * weights are shorter than the members (a programming error, not a data error).
 */
export function setMeanSystematic95(
  members: UncertaintyColumns,
  groups: Int32Array,
  weights: Float64Array | undefined,
  model: ErrorModel,
  options: { draws?: number; seed?: number } = {},
): number | undefined {
  const { draws, seed } = monteCarloOptions(options)
  const count = members.count
  if (groups.length < count || (weights && weights.length < count))
    throw new RangeError(`setMeanSystematic95: groups and weights need ${count} items`)
  const xyz = new Float64Array(3 * count).fill(NaN)
  const w = new Float64Array(count)
  const group = new Int32Array(count)
  const ids = new Map<number, number>()
  const pole = new Float64Array(3)
  for (let i = 0; i < count; i++) {
    const wi = weights ? weights[i] : 1
    if (!(wi > 0 && wi < Infinity)) continue
    if (!memberPole(members, i, members.holeTrend[i], members.holePlunge[i], pole)) continue
    xyz.set(pole, 3 * i)
    w[i] = wi
    let g = ids.get(groups[i])
    if (g === undefined) ids.set(groups[i], (g = ids.size))
    group[i] = g
  }
  const sums = tensorSums(xyz, w)
  if (!sums) return undefined
  const [ex, ey, ez] = sums.eigen.vectors[0]
  let mx = 0
  let my = 0
  let mz = 0
  for (let i = 0; i < count; i++) {
    if (!(w[i] > 0)) continue
    const s = xyz[3 * i] * ex + xyz[3 * i + 1] * ey + xyz[3 * i + 2] * ez < 0 ? -w[i] : w[i]
    mx += s * xyz[3 * i]
    my += s * xyz[3 * i + 1]
    mz += s * xyz[3 * i + 2]
  }
  const m = Math.hypot(mx, my, mz)
  if (!(m > 0)) return undefined
  // Nothing the survey can move (true sources, no survey error): exactly 0, not acos's rounding.
  if (!movable(members, w, model)) return 0
  const cone = coneScratch(draws)
  const [ux, uy, uz] = [mx / m, my / m, mz / m]
  const random = mulberry32(seed)
  const zA = new Float64Array(ids.size)
  const zI = new Float64Array(ids.size)
  for (let d = 0; d < draws; d++) {
    zA.set(seededNormals(ids.size, random))
    zI.set(seededNormals(ids.size, random))
    let sx = 0
    let sy = 0
    let sz = 0
    for (let i = 0; i < count; i++) {
      if (!(w[i] > 0)) continue
      const g = group[i]
      const plunge = members.holePlunge[i]
      const vertical = Math.abs(plunge) >= VERTICAL_PLUNGE
      const trend = members.holeTrend[i] + (vertical ? 0 : members.azimuthSd[i] * zA[g])
      if (!memberPole(members, i, trend, plunge + model.surveyInclinationSd * zI[g], pole)) continue
      const s = pole[0] * mx + pole[1] * my + pole[2] * mz < 0 ? -w[i] : w[i]
      sx += s * pole[0]
      sy += s * pole[1]
      sz += s * pole[2]
    }
    const r = Math.hypot(sx, sy, sz)
    if (r > 0) addDraw(cone, d, sx / r, sy / r, sz / r, ux, uy, uz)
    else cone.cos[d] = 0
  }
  const out = uncertaintyResult(1)
  finishCone(cone, ux, uy, uz, out, 0)
  return out.cone95[0]
}

/** True when some weighted member's pole moves with a survey error. */
function movable(cols: UncertaintyColumns, w: Float64Array, model: ErrorModel): boolean {
  for (let i = 0; i < cols.count; i++) {
    if (!(w[i] > 0) || cols.source[i] === SOURCE_TRUE) continue
    if (model.surveyInclinationSd > 0) return true
    if (cols.azimuthSd[i] > 0 && Math.abs(cols.holePlunge[i]) < VERTICAL_PLUNGE) return true
  }
  return false
}

/** One draw's unit mean (x, y, z) into the cone scratch, against the computed mean (x0, y0, z0). */
function addDraw(
  s: ConeScratch,
  d: number,
  x: number,
  y: number,
  z: number,
  x0: number,
  y0: number,
  z0: number,
) {
  const m = s.moments
  m[0] += x * x
  m[1] += x * y
  m[2] += x * z
  m[3] += y * y
  m[4] += y * z
  m[5] += z * z
  s.valid++
  s.cos[d] = Math.abs(x * x0 + y * y0 + z * z0)
}

/**
 * Quadrature sum √(alpha95² + systematic95²) of the set's Fisher alpha95 (independent reading
 * scatter) and its systematic survey term: independent errors add in variance (common practice).
 * A missing term counts as 0; null when neither is known.
 */
export function combinedCone95(
  alpha95: number | null | undefined,
  systematic95: number | null | undefined,
): number | null {
  const a = typeof alpha95 === 'number' && Number.isFinite(alpha95) ? alpha95 : undefined
  const s =
    typeof systematic95 === 'number' && Number.isFinite(systematic95) ? systematic95 : undefined
  if (a === undefined && s === undefined) return null
  return Math.hypot(a ?? 0, s ?? 0)
}
