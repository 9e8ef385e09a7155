import { DEG2RAD } from './math'
import { SERIES_REACH, TINY_REACH, markTurn, planHole } from './uncertainty-hole'
import { corePoleTrig } from './uncertainty-kernel'
import { storeMoments } from './uncertainty-cone'
import type { DrawTables } from './uncertainty-draws'
import type { ErrorModel } from './error-model'
import type { SourceScratch } from './uncertainty-sources'
import type { UncertaintyColumns } from './uncertainty-columns'

/**
 * A core structure's draws: alpha ~ N(α, alphaSd), folded into 0–90 by reflection at both ends
 * (|sin|, |cos| of the perturbed angle); beta ~ N(β, betaSd) with the steep-hole mark error
 * (markTurn; uniform where the mark means nothing); the hole as planHole. The pole of each draw is
 * n = sin α z′ − cos α (cos β x′ + sin β y′) as coreToPlane (corePoleTrig, written out). Writes
 * the computed pole to s.n0 and the draws to s.cone; false without a pole.
 *
 * One fused loop, no call: each perturbed sine and cosine is an angle addition from a draw table,
 * and each per-structure turn k·z (depth, mark) a Taylor series (SERIES_REACH; Math.sin/cos past
 * it). Split into passes over per-draw columns it took about a fifth longer in V8 (measured).
 */
export function coreDraws(
  cols: UncertaintyColumns,
  i: number,
  t: DrawTables,
  s: SourceScratch,
  model: ErrorModel,
): boolean {
  const alpha = cols.alpha[i] * DEG2RAD
  const beta = cols.beta[i] * DEG2RAD
  const plunge = cols.holePlunge[i]
  const h = s.plan
  if (!(alpha >= 0 && alpha <= Math.PI / 2) || !Number.isFinite(beta)) return false
  const holeOk = planHole(
    t,
    h,
    cols.holeTrend[i],
    plunge,
    cols.holeTrendRate[i],
    cols.holePlungeRate[i],
    cols.azimuthSd[i],
    model.depthSd,
  )
  if (!holeOk) return false
  const sa0 = Math.sin(alpha)
  const ca0 = Math.cos(alpha)
  const kMark = markTurn(t, plunge, model.surveyInclinationSd)
  const uniform = Number.isNaN(kMark)
  const kB = uniform ? 0 : kMark
  const sb0 = uniform ? 0 : Math.sin(beta)
  const cb0 = uniform ? 1 : Math.cos(beta)
  const rb = uniform ? t.uniform : t.beta
  const { sT: sT0, cT: cT0, sP: sP0, cP: cP0, kT, kP } = h
  const n0 = s.n0
  corePoleTrig(n0, sa0, ca0, Math.sin(beta), Math.cos(beta), sT0, cT0, sP0, cP0)
  const x0 = n0[0]
  const y0 = n0[1]
  const z0 = n0[2]
  const exactD = h.reach > SERIES_REACH
  const tinyD = h.reach <= TINY_REACH
  const exactB = kB * t.maxBeta > SERIES_REACH
  const tinyB = kB * t.maxBeta <= TINY_REACH
  const { s: as, c: ac } = t.alpha
  const { s: bs, c: bc } = rb
  const { s: zs, c: zc } = h.azimuth
  const { s: is, c: ic } = t.inclination
  const { zBeta, zDepth } = t
  const cos = s.cone.cos
  let m0 = 0
  let m1 = 0
  let m2 = 0
  let m3 = 0
  let m4 = 0
  let m5 = 0
  for (let d = 0; d < cos.length; d++) {
    const sa = Math.abs(sa0 * ac[d] + ca0 * as[d])
    const ca = Math.abs(ca0 * ac[d] - sa0 * as[d])
    // beta: table, then the mark turn.
    let s1 = bs[d]
    let c1 = bc[d]
    if (kB !== 0) {
      const x = kB * zBeta[d]
      const q = x * x
      const sx = tinyB
        ? x - x * q * (1 / 6)
        : exactB
          ? Math.sin(x)
          : x * (1 - q * (1 / 6 - q * (1 / 120 - q * (1 / 5040))))
      const cx = exactB
        ? Math.cos(x)
        : 1 - q * (1 / 2 - q * (1 / 24 - q * (1 / 720 - q * (1 / 40320))))
      const u = s1 * cx + c1 * sx
      c1 = c1 * cx - s1 * sx
      s1 = u
    }
    const sb = sb0 * c1 + cb0 * s1
    const cb = cb0 * c1 - sb0 * s1
    // trend: survey azimuth table, then the depth turn.
    s1 = zs[d]
    c1 = zc[d]
    if (kT !== 0) {
      const x = kT * zDepth[d]
      const q = x * x
      const sx = tinyD
        ? x - x * q * (1 / 6)
        : exactD
          ? Math.sin(x)
          : x * (1 - q * (1 / 6 - q * (1 / 120 - q * (1 / 5040))))
      const cx = exactD
        ? Math.cos(x)
        : 1 - q * (1 / 2 - q * (1 / 24 - q * (1 / 720 - q * (1 / 40320))))
      const u = s1 * cx + c1 * sx
      c1 = c1 * cx - s1 * sx
      s1 = u
    }
    const st = sT0 * c1 + cT0 * s1
    const ct = cT0 * c1 - sT0 * s1
    // plunge: inclination table, then the depth turn.
    s1 = is[d]
    c1 = ic[d]
    if (kP !== 0) {
      const x = kP * zDepth[d]
      const q = x * x
      const sx = tinyD
        ? x - x * q * (1 / 6)
        : exactD
          ? Math.sin(x)
          : x * (1 - q * (1 / 6 - q * (1 / 120 - q * (1 / 5040))))
      const cx = exactD
        ? Math.cos(x)
        : 1 - q * (1 / 2 - q * (1 / 24 - q * (1 / 720 - q * (1 / 40320))))
      const u = s1 * cx + c1 * sx
      c1 = c1 * cx - s1 * sx
      s1 = u
    }
    const sp = sP0 * c1 + cP0 * s1
    const cp = cP0 * c1 - sP0 * s1
    const x = sa * st * cp + ca * (cb * st * sp + sb * ct)
    const y = sa * ct * cp + ca * (cb * ct * sp - sb * st)
    const z = ca * cb * cp - sa * sp
    m0 += x * x
    m1 += x * y
    m2 += x * z
    m3 += y * y
    m4 += y * z
    m5 += z * z
    const c = x * x0 + y * y0 + z * z0
    cos[d] = c < 0 ? -c : c
  }
  storeMoments(s.cone.moments, m0, m1, m2, m3, m4, m5)
  s.cone.valid = cos.length
  return true
}
