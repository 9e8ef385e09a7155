import { DEG2RAD, RAD2DEG, finite, wrap360 } from './math'
import { highSideFromNorth } from './image-pick'
import { holeFrame } from './hole-frame'
import { cross, dot, normalise, planeToPoleVec, scale } from './vector'
import type { Line, Plane, Vec3 } from './types'

/** A point clicked on an unrolled image: depth (m) and azimuth (degrees, the image's reference). */
export interface TracePoint {
  readonly depth: number
  readonly azimuth: number
}

/** A plane's trace on the unrolled wall: depth(θ) = depth + (height/2)·cos(θ − troughAzimuth). */
export interface Sinusoid {
  /** Centre depth d₀ (m): the mean of the trace over a turn. */
  readonly depth: number
  /** Peak-to-trough height (m). */
  readonly height: number
  /** Azimuth of the deepest point (degrees, the image's reference). */
  readonly troughAzimuth: number
}

export interface SinusoidFit extends Sinusoid {
  /** Root-mean-square depth residual of the points about the fitted trace (m). */
  readonly rms: number
  /** Each point's residual (point depth − trace depth, m), in the order given. */
  readonly residuals: readonly number[]
}

/**
 * Least-squares sinusoid through three or more points: depth = d₀ + a·sin θ + b·cos θ is linear in
 * (d₀, a, b), so the normal equations (3 × 3) give the fit directly; height = 2√(a² + b²) and the
 * trough (deepest) azimuth θt = atan2(a, b) [common practice for image-log picking; see
 * REFERENCES.md "Sinusoid fitting"]. Undefined when the points do not fix a sinusoid: fewer than
 * three, non-finite values, or azimuths that do not span at least three distinct directions.
 */
export function fitSinusoid(points: readonly TracePoint[]): SinusoidFit | undefined {
  if (points.length < 3) return undefined
  const distinct = new Set<number>()
  let s1 = 0
  let ss = 0
  let sc = 0
  let sss = 0
  let scc = 0
  let ssc = 0
  let sy = 0
  let sys = 0
  let syc = 0
  for (const p of points) {
    if (!finite(p.depth, p.azimuth)) return undefined
    const th = wrap360(p.azimuth) * DEG2RAD
    distinct.add(Math.round(wrap360(p.azimuth) * 1e6))
    const s = Math.sin(th)
    const c = Math.cos(th)
    s1 += 1
    ss += s
    sc += c
    sss += s * s
    scc += c * c
    ssc += s * c
    sy += p.depth
    sys += p.depth * s
    syc += p.depth * c
  }
  if (distinct.size < 3) return undefined
  const solved = solve3(
    [
      [s1, ss, sc],
      [ss, sss, ssc],
      [sc, ssc, scc],
    ],
    [sy, sys, syc],
  )
  if (!solved) return undefined
  const [d0, a, b] = solved
  const residuals = points.map(
    (p) => p.depth - (d0 + a * Math.sin(p.azimuth * DEG2RAD) + b * Math.cos(p.azimuth * DEG2RAD)),
  )
  const rms = Math.sqrt(residuals.reduce((t, r) => t + r * r, 0) / points.length)
  const half = Math.hypot(a, b)
  return {
    depth: d0,
    height: 2 * half,
    troughAzimuth: half === 0 ? 0 : wrap360(Math.atan2(a, b) * RAD2DEG),
    rms,
    residuals,
  }
}

/** Depth of the trace at image azimuth θ (degrees). */
export function sinusoidDepthAt(s: Sinusoid, azimuth: number): number {
  return s.depth + (s.height / 2) * Math.cos((azimuth - s.troughAzimuth) * DEG2RAD)
}

/** Gaussian elimination with partial pivoting; undefined for a (near-)singular system. */
function solve3(m: number[][], v: number[]): [number, number, number] | undefined {
  const a = m.map((row, i) => [...row, v[i]])
  const scaleOf = Math.max(...a.flat().map(Math.abs), 1e-300)
  for (let col = 0; col < 3; col++) {
    let pivot = col
    for (let r = col + 1; r < 3; r++) if (Math.abs(a[r][col]) > Math.abs(a[pivot][col])) pivot = r
    if (Math.abs(a[pivot][col]) < 1e-12 * scaleOf) return undefined
    ;[a[col], a[pivot]] = [a[pivot], a[col]]
    for (let r = 0; r < 3; r++) {
      if (r === col) continue
      const f = a[r][col] / a[col][col]
      for (let k = col; k < 4; k++) a[r][k] -= f * a[col][k]
    }
  }
  return [a[0][3] / a[0][0], a[1][3] / a[1][1], a[2][3] / a[2][2]]
}

/** What an image's azimuth 0 is, for the inverse below. */
export interface ImageFrame {
  readonly reference: 'highside' | 'north'
  /** Borehole diameter (any unit: the height comes back in it). */
  readonly diameter: number
}

/**
 * The sinusoid a true plane would leave on the wall of a hole with axis `hole` (the inverse of
 * imagePickToPlane): relative dip δ = angle between the plane and the section normal to the hole,
 * height = D·tan δ; the trough is where the plane reaches deepest down the hole, its azimuth
 * measured clockwise looking down-hole from the reference (high side, or true north projected
 * onto the section). Centre depth is not part of it (0). Undefined where the plane contains the
 * hole axis (an infinitely tall trace), for a north reference in a horizontal north–south hole, or
 * for non-finite input.
 */
export function planeToImageSinusoid(
  plane: Plane,
  hole: Line,
  frame: ImageFrame,
): { height: number; troughAzimuth: number } | undefined {
  if (!finite(plane.dip, plane.dipDirection, hole.trend, hole.plunge, frame.diameter))
    return undefined
  const n = planeToPoleVec(plane)
  const { z: t, x: down } = holeFrame(hole)
  const nt = dot(n, t)
  if (Math.abs(nt) < 1e-9) return undefined
  // Point on the wall at unit direction u (⊥ t): the plane through the centre meets it at
  // s = −(n·u)/(n·t) along t (per unit radius). Deepest where u ∥ −sign(n·t)·(n − (n·t)t).
  const inSection = normalise([n[0] - nt * t[0], n[1] - nt * t[1], n[2] - nt * t[2]])
  const x = frame.reference === 'north' ? projectedNorth(t) : scale(down, -1)
  if (!x) return undefined
  const y = cross(t, x)
  const relativeDip = Math.acos(Math.min(1, Math.abs(nt)))
  if (!inSection) return { height: 0, troughAzimuth: 0 }
  const u = scale(inSection, nt > 0 ? -1 : 1)
  return {
    height: frame.diameter * Math.tan(relativeDip),
    troughAzimuth: wrap360(Math.atan2(dot(u, y), dot(u, x)) * RAD2DEG),
  }
}

/**
 * A trough azimuth on a magnetic-north image referred to true north (or back, with `toMagnetic`):
 * trough_true = trough_mag − a_mag + a_true, a the angle from projected (magnetic or true) north
 * to the high side in the hole's own frame — not simply + declination, which holds only in
 * vertical holes. Declination in degrees, east positive.
 */
export function referNorth(
  trough: number,
  hole: Line,
  declination: number,
  toMagnetic = false,
): number | undefined {
  if (declination === 0) return wrap360(trough)
  const toHighTrue = highSideFromNorth(hole)
  const toHighMag = highSideFromNorth({
    trend: wrap360(hole.trend - declination),
    plunge: hole.plunge,
  })
  if (toHighTrue === undefined || toHighMag === undefined) return undefined
  return toMagnetic
    ? wrap360(trough - toHighTrue + toHighMag)
    : wrap360(trough - toHighMag + toHighTrue)
}

function projectedNorth(t: Vec3): Vec3 | undefined {
  return normalise([-t[1] * t[0], 1 - t[1] * t[1], -t[1] * t[2]])
}
