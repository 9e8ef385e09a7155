import { DEG2RAD } from './math'
import { storeMoments } from './uncertainty-cone'
import type { DrawTables } from './uncertainty-draws'
import type { SourceScratch } from './uncertainty-sources'
import type { UncertaintyColumns } from './uncertainty-columns'

/**
 * An orientation entered as measured (compass-clinometer): dip ~ N(dip, trueDipSd), dip direction
 * ~ N(dd, trueDipDirectionSd); no survey or depth error applies. Pole (−sin dd sin dip,
 * −cos dd sin dip, −cos dip) as planeToPoleVec; a draw's dip past 0 or 90 stays on the same
 * continuous axis. False without a pole.
 */
export function trueDraws(
  cols: UncertaintyColumns,
  i: number,
  t: DrawTables,
  s: SourceScratch,
): boolean {
  const dip = cols.inputDip[i] * DEG2RAD
  const dd = cols.inputDipDirection[i] * DEG2RAD
  if (!Number.isFinite(dip) || !Number.isFinite(dd)) return false
  const sd0 = Math.sin(dip)
  const cd0 = Math.cos(dip)
  const sdd0 = Math.sin(dd)
  const cdd0 = Math.cos(dd)
  const x0 = -sdd0 * sd0
  const y0 = -cdd0 * sd0
  const z0 = -cd0
  s.n0[0] = x0
  s.n0[1] = y0
  s.n0[2] = z0
  const { s: ds, c: dc } = t.dip
  const { s: es, c: ec } = t.dipDirection
  const cos = s.cone.cos
  let m0 = 0
  let m1 = 0
  let m2 = 0
  let m3 = 0
  let m4 = 0
  let m5 = 0
  for (let d = 0; d < cos.length; d++) {
    const sd = sd0 * dc[d] + cd0 * ds[d]
    const cd = cd0 * dc[d] - sd0 * ds[d]
    const sdd = sdd0 * ec[d] + cdd0 * es[d]
    const cdd = cdd0 * ec[d] - sdd0 * es[d]
    const x = -sdd * sd
    const y = -cdd * sd
    const z = -cd
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
