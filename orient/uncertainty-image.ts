import { DEG2RAD } from './math'
import { SERIES_REACH, TINY_REACH, planHole } from './uncertainty-hole'
import { corePoleTrig, northPickPoleTrig } from './uncertainty-kernel'
import { storeMoments } from './uncertainty-cone'
import type { DrawTables } from './uncertainty-draws'
import type { ErrorModel } from './error-model'
import type { SourceScratch } from './uncertainty-sources'
import type { UncertaintyColumns } from './uncertainty-columns'

/**
 * An image pick's draws: height H ~ N(H, pickHeightSdMm) clamped at 0, alpha = 90° − atan(H/D)
 * (so sin α = D/√(H² + D²), cos α = H/√(H² + D²)); trough ~ N(θ, pickTroughSd); the hole as
 * planHole. A north-referenced pick depends on the perturbed hole axis only (northPickPoleTrig), a
 * high-side pick on the perturbed frame (corePoleTrig with beta = trough + 180°), as
 * imagePickToPlane. A draw whose projected north vanishes counts as 90° off. One fused loop, as
 * coreDraws. False without a pole.
 */
export function imageDraws(
  cols: UncertaintyColumns,
  i: number,
  t: DrawTables,
  s: SourceScratch,
  model: ErrorModel,
): boolean {
  const height = cols.amplitude[i]
  const diameter = cols.diameter[i]
  const trough = cols.trough[i] * DEG2RAD
  const north = cols.north[i] === 1
  const h = s.plan
  if (!(diameter > 0 && diameter < Infinity && height >= 0 && height < Infinity)) return false
  if (!Number.isFinite(trough)) return false
  const holeOk = planHole(
    t,
    h,
    cols.holeTrend[i],
    cols.holePlunge[i],
    cols.holeTrendRate[i],
    cols.holePlungeRate[i],
    cols.azimuthSd[i],
    model.depthSd,
  )
  if (!holeOk) return false
  const sh0 = Math.sin(trough)
  const ch0 = Math.cos(trough)
  const r0 = 1 / Math.hypot(height, diameter)
  const { sT: sT0, cT: cT0, sP: sP0, cP: cP0, kT, kP } = h
  const n0 = s.n0
  if (!north) corePoleTrig(n0, diameter * r0, height * r0, -sh0, -ch0, sT0, cT0, sP0, cP0)
  else if (!northPickPoleTrig(n0, diameter * r0, height * r0, sh0, ch0, sT0, cT0, sP0, cP0))
    return false
  const x0 = n0[0]
  const y0 = n0[1]
  const z0 = n0[2]
  const exactD = h.reach > SERIES_REACH
  const tinyD = h.reach <= TINY_REACH
  const sdH = model.pickHeightSdMm
  const d2 = diameter * diameter
  const { s: hs, c: hc } = t.trough
  const { s: zs, c: zc } = h.azimuth
  const { s: is, c: ic } = t.inclination
  const { zHeight, zDepth } = t
  const cos = s.cone.cos
  let m0 = 0
  let m1 = 0
  let m2 = 0
  let m3 = 0
  let m4 = 0
  let m5 = 0
  let valid = 0
  for (let d = 0; d < cos.length; d++) {
    const hd = Math.max(0, height + sdH * zHeight[d])
    const r = 1 / Math.sqrt(hd * hd + d2)
    const sa = diameter * r
    const ca = hd * r
    const sh = sh0 * hc[d] + ch0 * hs[d]
    const ch = ch0 * hc[d] - sh0 * hs[d]
    let s1 = zs[d]
    let c1 = zc[d]
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
    let x: number
    let y: number
    let z: number
    if (!north) {
      // corePoleTrig with (sin β, cos β) = (−sin θ, −cos θ).
      x = sa * st * cp - ca * (ch * st * sp + sh * ct)
      y = sa * ct * cp - ca * (ch * ct * sp - sh * st)
      z = -ca * ch * cp - sa * sp
    } else {
      // northPickPoleTrig, written out.
      const ax = st * cp
      const ay = ct * cp
      const az = -sp
      const hn = Math.sqrt(Math.max(0, 1 - ay * ay))
      // EPSILON of math.ts, as a literal (see SERIES_REACH).
      if (hn < 1e-12) {
        cos[d] = 0
        continue
      }
      const k = 1 / hn
      const rx = -ay * ax * k
      const rz = -ay * az * k
      const yx = ay * rz - az * hn
      const yy = az * rx - ax * rz
      const yz = ax * hn - ay * rx
      x = sa * ax - ca * (ch * rx + sh * yx)
      y = sa * ay - ca * (ch * hn + sh * yy)
      z = sa * az - ca * (ch * rz + sh * yz)
    }
    m0 += x * x
    m1 += x * y
    m2 += x * z
    m3 += y * y
    m4 += y * z
    m5 += z * z
    valid++
    const c = x * x0 + y * y0 + z * z0
    cos[d] = c < 0 ? -c : c
  }
  storeMoments(s.cone.moments, m0, m1, m2, m3, m4, m5)
  s.cone.valid = valid
  return true
}
