// Critical zones of the kinematic screening drawn on the net, from the same rules orient applies
// (Markland 1972; Hoek & Bray 1981; Goodman & Bray 1976; Wyllie & Mah 2004). Only the drawing is
// made here: the verdicts and percentages are the server's.
import { toScreen, type NetProjection } from './net-geometry'

export type ZoneMode = 'planar' | 'wedge' | 'toppling'

export interface ZoneSettings {
  face: { dip: number; dipDirection: number }
  friction: number
  /** Planar sliding: largest angle between plane and face dip directions. */
  lateralLimit: number
  /** Flexural toppling: largest angle off the direction opposite the face. */
  topplingLimit: number
}

const DEG = Math.PI / 180

function pointsPath(
  points: { trend: number; plunge: number }[],
  projection: NetProjection,
  R: number,
) {
  let d = ''
  for (const line of points) {
    const p = toScreen(
      { trend: ((line.trend % 360) + 360) % 360, plunge: line.plunge },
      projection,
      R,
    )
    if (p) d += `${d ? 'L' : 'M'}${p.x.toFixed(2)},${p.y.toFixed(2)}`
  }
  return d ? `${d}Z` : ''
}

/** Lines with trend in [from, to] and plunge between `low` and `high` (a sector of an annulus). */
function sector(
  from: number,
  to: number,
  low: number,
  high: number,
  projection: NetProjection,
  R: number,
) {
  if (!(high > low)) return ''
  const n = 48
  const outer = Array.from({ length: n + 1 }, (_, i) => ({
    trend: from + ((to - from) * i) / n,
    plunge: low,
  }))
  const inner = outer.map((l) => ({ trend: l.trend, plunge: high })).reverse()
  return pointsPath([...outer, ...inner], projection, R)
}

/**
 * Planar sliding, on poles: dip between friction and face dip, dip direction within the lateral
 * limit of the face's, i.e. pole plunge in (90 − face dip, 90 − friction), pole trend within the
 * limit of the face dip direction + 180.
 */
export function planarZone(s: ZoneSettings, projection: NetProjection, R: number): string {
  const centre = s.face.dipDirection + 180
  return sector(
    centre - s.lateralLimit,
    centre + s.lateralLimit,
    90 - s.face.dip,
    90 - s.friction,
    projection,
    R,
  )
}

/**
 * Flexural toppling, on poles: the plane dips into the face (pole trend within the limit of the
 * face dip direction) and (90 − dip) + friction < face dip, i.e. pole plunge < face dip − friction.
 */
export function topplingZone(s: ZoneSettings, projection: NetProjection, R: number): string {
  const dd = s.face.dipDirection
  return sector(
    dd - s.topplingLimit,
    dd + s.topplingLimit,
    0,
    s.face.dip - s.friction,
    projection,
    R,
  )
}

/**
 * Wedge sliding, on lines of intersection: trend within 90° of the face dip direction, plunge
 * above friction and below the face's apparent dip along the trend (tan = tan dip cos Δ), the
 * crescent between the friction circle and the face's great circle.
 */
export function wedgeZone(s: ZoneSettings, projection: NetProjection, R: number): string {
  const tanFace = Math.tan(s.face.dip * DEG)
  const ratio = Math.tan(s.friction * DEG) / tanFace
  if (!(ratio < 1) || !Number.isFinite(tanFace)) return ''
  const half = Math.acos(ratio) / DEG
  const n = 64
  const trends = Array.from(
    { length: n + 1 },
    (_, i) => s.face.dipDirection - half + (2 * half * i) / n,
  )
  const face = trends.map((t) => ({
    trend: t,
    plunge: Math.atan(tanFace * Math.cos((t - s.face.dipDirection) * DEG)) / DEG,
  }))
  const friction = trends.map((t) => ({ trend: t, plunge: s.friction })).reverse()
  return pointsPath([...face, ...friction], projection, R)
}

export function kinematicZone(
  mode: ZoneMode,
  s: ZoneSettings,
  projection: NetProjection,
  R: number,
) {
  if (mode === 'planar') return planarZone(s, projection, R)
  if (mode === 'toppling') return topplingZone(s, projection, R)
  return wedgeZone(s, projection, R)
}

export const zoneLabels: Record<ZoneMode, string> = {
  planar: 'Planar sliding: poles in the shaded sector',
  wedge: 'Wedge sliding: set intersections in the shaded crescent',
  toppling: 'Flexural toppling: poles in the shaded sector',
}
