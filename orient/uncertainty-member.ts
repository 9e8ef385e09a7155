import { DEG2RAD } from './math'
import { corePoleTrig, northPickPoleTrig, truePoleTrig } from './uncertainty-kernel'
import { SOURCE_CORE, SOURCE_IMAGE, SOURCE_TRUE } from './uncertainty-columns'
import type { UncertaintyColumns } from './uncertainty-columns'

/**
 * Item i's pole (unit, into out) with its readings as logged and the hole direction given
 * (degrees): the conversions of coreToPlane, imagePickToPlane or the plane as entered, through
 * the same kernel as the Monte Carlo. False without a pole.
 */
export function memberPole(
  cols: UncertaintyColumns,
  i: number,
  trend: number,
  plunge: number,
  out: Float64Array,
): boolean {
  const source = cols.source[i]
  if (source === SOURCE_TRUE) {
    const dd = cols.inputDipDirection[i] * DEG2RAD
    const dip = cols.inputDip[i] * DEG2RAD
    if (!Number.isFinite(dd) || !Number.isFinite(dip)) return false
    truePoleTrig(out, Math.sin(dd), Math.cos(dd), Math.sin(dip), Math.cos(dip))
    return true
  }
  if (!Number.isFinite(trend) || !Number.isFinite(plunge)) return false
  const t = trend * DEG2RAD
  const p = plunge * DEG2RAD
  const [sT, cT, sP, cP] = [Math.sin(t), Math.cos(t), Math.sin(p), Math.cos(p)]
  if (source === SOURCE_CORE) {
    const a = cols.alpha[i]
    const b = cols.beta[i] * DEG2RAD
    if (!(a >= 0 && a <= 90) || !Number.isFinite(b)) return false
    const sa = Math.sin(a * DEG2RAD)
    const ca = Math.cos(a * DEG2RAD)
    corePoleTrig(out, sa, ca, Math.sin(b), Math.cos(b), sT, cT, sP, cP)
    return true
  }
  if (source !== SOURCE_IMAGE) return false
  const height = cols.amplitude[i]
  const diameter = cols.diameter[i]
  const th = cols.trough[i] * DEG2RAD
  if (!(diameter > 0 && diameter < Infinity && height >= 0 && height < Infinity)) return false
  if (!Number.isFinite(th)) return false
  const r = 1 / Math.hypot(height, diameter)
  const [sa, ca, st, ct] = [diameter * r, height * r, Math.sin(th), Math.cos(th)]
  if (cols.north[i] === 1) return northPickPoleTrig(out, sa, ca, st, ct, sT, cT, sP, cP)
  corePoleTrig(out, sa, ca, -st, -ct, sT, cT, sP, cP)
  return true
}
