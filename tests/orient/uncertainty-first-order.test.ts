import { describe, expect, it } from 'vitest'
import { imagePickToPlane, orientationUncertainty } from '../../orient'
import type { ErrorModel } from '../../orient'
import { axisAngle, columnsOf, cross, onlyErrors, poleVec } from './uncertainty-fixture'
import type { Item, V3 } from './uncertainty-fixture'

// First-order (linearised) propagation, written here independently of orient/ [derived]:
//
// Core pole n(α, β, A, I) = sin α z′ − cos α (cos β x′ + sin β y′), hole frame z′ = (sA cP, cA cP,
// −sP), x′ = (−sA sP, −cA sP, −cP), y′ = (−cA, sA, 0) (A trend, P plunge). Tangent-plane Jacobian
// columns, radians per radian:
//   ∂n/∂α = cos α z′ + sin α d with d = cos β x′ + sin β y′ — unit length (z′ ⟂ d);
//   ∂n/∂β = −cos α (−sin β x′ + cos β y′) — length cos α;
//   survey azimuth: the frame, and n with it, turns about the vertical k: ∂n/∂A = k × n;
//   inclination: ∂z′/∂P = x′, ∂x′/∂P = −z′, ∂y′/∂P = 0, so the frame turns rigidly about y′ (the
//   horizontal normal to the hole's vertical plane): ∂n/∂I = y′ × n;
//   the steep-hole mark error adds σ_m² = atan(σ_I / (90° − |P|))² to beta's variance.
// Each column enters as σ² g gᵀ, so its sign does not matter: Σ = Σ_j σ_j² g_j g_jᵀ, taken in a
// basis e₁, e₂ of the plane normal to n, with eigenvalues λ₁ ≥ λ₂. In polar coordinates (r, φ)
// about n the 2-D Gaussian density is exp(−r² q(φ)/2) / (2π√(λ₁λ₂)), q = cos²φ/λ₁ + sin²φ/λ₂, so
//   P(r < θ) = 1/(2π√(λ₁λ₂)) ∫₀^2π (1 − exp(−θ² q(φ)/2)) / q(φ) dφ,
// solved for P = 0.95 by bisection. Isotropic (λ₁ = λ₂ = σ²): P = 1 − exp(−θ²/2σ²), so
// θ95 = σ √(−2 ln 0.05) = 2.4477 σ (Rayleigh distribution, common practice).
// Image pick (high side): α = 90° − atan(H/D), ∂α/∂H = −D/(H² + D²) per mm; the trough acts as
// beta (lever cos α); survey columns as for core (the image frame turns with the hole). North-
// referenced picks: columns by central finite differences of imagePickToPlane.

const D = Math.PI / 180
type Column = { g: V3; sd: number }

const add = (a: V3, b: V3, k = 1): V3 => [a[0] + k * b[0], a[1] + k * b[1], a[2] + k * b[2]]
const scale = (a: V3, k: number): V3 => [a[0] * k, a[1] * k, a[2] * k]
const dotv = (a: V3, b: V3) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2]

function frame(trend: number, plunge: number) {
  const [sA, cA, sP, cP] = [
    Math.sin(trend * D),
    Math.cos(trend * D),
    Math.sin(plunge * D),
    Math.cos(plunge * D),
  ]
  return {
    z: [sA * cP, cA * cP, -sP] as V3,
    x: [-sA * sP, -cA * sP, -cP] as V3,
    y: [-cA, sA, 0] as V3,
  }
}

/** P(r < θ) of the 2-D Gaussian with eigenvalues l1, l2 (trapezoid rule on 2000 steps in φ). */
function insideProbability(theta: number, l1: number, l2: number): number {
  const steps = 2000
  let sum = 0
  for (let k = 0; k < steps; k++) {
    const phi = (2 * Math.PI * (k + 0.5)) / steps
    const q = Math.cos(phi) ** 2 / l1 + Math.sin(phi) ** 2 / l2
    sum += (1 - Math.exp((-theta * theta * q) / 2)) / q
  }
  return (sum * (2 * Math.PI)) / steps / (2 * Math.PI * Math.sqrt(l1 * l2))
}

/**
 * 95 % radius (degrees) of the tangent-plane Gaussian of the columns about pole n, and its 95 %
 * ellipse semi-axes √(5.991 λ) (χ²₂ 95 %, common practice).
 */
function linearised(n: V3, columns: Column[]) {
  const h = Math.hypot(n[0], n[1])
  const e1: V3 = h < 1e-9 ? [1, 0, 0] : [n[1] / h, -n[0] / h, 0]
  const e2 = cross(n, e1)
  let [a, b, c] = [0, 0, 0]
  for (const { g, sd } of columns) {
    const [u, v] = [dotv(g, e1) * sd * D, dotv(g, e2) * sd * D]
    a += u * u
    b += u * v
    c += v * v
  }
  const mid = (a + c) / 2
  const half = Math.sqrt(((a - c) / 2) ** 2 + b * b)
  const [l1, l2] = [mid + half, Math.max(mid - half, 1e-30)]
  let [lo, hi] = [0, 10 * Math.sqrt(l1)]
  for (let k = 0; k < 60; k++) {
    const m = (lo + hi) / 2
    if (insideProbability(m, l1, l2) < 0.95) lo = m
    else hi = m
  }
  const semi = (l: number) => Math.sqrt(5.991 * l) / D
  const phi = Math.atan2(2 * b, a - c) / 2
  const axis = add(scale(e1, Math.cos(phi)), e2, Math.sin(phi))
  return { theta: (lo + hi) / 2 / D, major: semi(l1), minor: semi(l2), axis }
}

const linearised95 = (n: V3, columns: Column[]) => linearised(n, columns).theta

const up: V3 = [0, 0, 1]

function coreColumns(
  alpha: number,
  beta: number,
  trend: number,
  plunge: number,
  m: ErrorModel,
  azimuthSd: number,
) {
  const f = frame(trend, plunge)
  const [sa, ca, sb, cb] = [
    Math.sin(alpha * D),
    Math.cos(alpha * D),
    Math.sin(beta * D),
    Math.cos(beta * D),
  ]
  const d = add(scale(f.x, cb), f.y, sb)
  const n = add(scale(f.z, sa), d, -ca)
  const mark = Math.atan(m.surveyInclinationSd / (90 - Math.abs(plunge))) / D
  const columns: Column[] = [
    { g: add(scale(f.z, ca), d, sa), sd: m.alphaSd },
    { g: scale(add(scale(f.x, -sb), f.y, cb), -ca), sd: Math.hypot(m.betaSd, mark) },
    { g: cross(up, n), sd: azimuthSd },
    { g: cross(f.y, n), sd: m.surveyInclinationSd },
  ]
  return { n, columns }
}

function highSideColumns(
  H: number,
  Dm: number,
  trough: number,
  trend: number,
  plunge: number,
  m: ErrorModel,
  azimuthSd: number,
) {
  const alpha = 90 - Math.atan2(H, Dm) / D
  // High side: beta = trough + 180, so the core columns apply with that beta.
  const { n, columns } = coreColumns(
    alpha,
    trough + 180,
    trend,
    plunge,
    { ...m, surveyInclinationSd: 0 },
    azimuthSd,
  )
  const dAlphaDH = Dm / (H * H + Dm * Dm) / D // degrees of alpha per mm (sign irrelevant)
  columns[0].sd = m.pickHeightSdMm * dAlphaDH
  columns[1].sd = m.pickTroughSd
  columns[3].sd = m.surveyInclinationSd
  return { n, columns }
}

/** Columns of a north-referenced pick by central differences of imagePickToPlane (1e-4 step). */
function northColumns(
  H: number,
  Dm: number,
  trough: number,
  trend: number,
  plunge: number,
  m: ErrorModel,
  azimuthSd: number,
) {
  const pole = (h: number, t: number, a: number, p: number) =>
    poleVec(
      imagePickToPlane(
        { amplitude: h, diameter: Dm, troughAzimuth: t, reference: 'north' },
        { trend: a, plunge: p },
      )!,
    )
  const n = pole(H, trough, trend, plunge)
  const e = 1e-4
  const diff = (f: (s: number) => V3, perDegree: boolean): V3 => {
    const [a, b] = [f(e), f(-e)]
    const sa = dotv(a, n) < 0 ? -1 : 1
    const sb = dotv(b, n) < 0 ? -1 : 1
    return scale(add(scale(a, sa), b, -sb), 1 / (2 * e * (perDegree ? D : 1)))
  }
  const columns: Column[] = [
    {
      g: scale(
        diff((s) => pole(H + s, trough, trend, plunge), false),
        1 / D,
      ),
      sd: m.pickHeightSdMm,
    },
    { g: diff((s) => pole(H, trough + s, trend, plunge), true), sd: m.pickTroughSd },
    { g: diff((s) => pole(H, trough, trend + s, plunge), true), sd: azimuthSd },
    { g: diff((s) => pole(H, trough, trend, plunge + s), true), sd: m.surveyInclinationSd },
  ]
  return { n, columns }
}

const small = onlyErrors({
  alphaSd: 0.5,
  betaSd: 0.5,
  surveyInclinationSd: 0.2,
  pickHeightSdMm: 1,
  pickTroughSd: 0.5,
})
const AZ = 0.2

describe('orientationUncertainty() against first-order propagation', () => {
  it('linearised95() isotropic: θ95 = 2.4477 σ (Rayleigh, common practice)', () => {
    const sd = 1.3
    const theta = linearised95(
      [0, 0, 1],
      [
        { g: [1, 0, 0], sd },
        { g: [0, 1, 0], sd },
      ],
    )
    expect(theta / sd).toBeCloseTo(Math.sqrt(-2 * Math.log(0.05)), 3)
    expect(theta / sd).toBeCloseTo(2.4477, 3)
  })

  it('orientationUncertainty() true source, vertical plane, σ_dip = σ_dd = 2°: isotropic, cone ≈ 2.4477 × 2°', () => {
    // Pole horizontal: the dip error moves it by σ_dip, the dip-direction error by sin(dip) σ_dd.
    const model = onlyErrors({ trueDipSd: 2, trueDipDirectionSd: 2 })
    const r = orientationUncertainty(
      columnsOf([{ source: 'true', dip: 90, dipDirection: 70 }]),
      model,
      { draws: 4000 },
    )
    expect(r.cone95[0] / (2.4477 * 2)).toBeGreaterThan(0.95)
    expect(r.cone95[0] / (2.4477 * 2)).toBeLessThan(1.05)
  })

  const cases: { name: string; item: Item; lin: { n: V3; columns: Column[] } }[] = [
    {
      name: 'core alpha 30 in hole 120/60',
      item: { source: 'core', alpha: 30, beta: 40, hole: [120, 60], azimuthSd: AZ },
      lin: coreColumns(30, 40, 120, 60, small, AZ),
    },
    {
      name: 'core alpha 60 in hole 120/60',
      item: { source: 'core', alpha: 60, beta: 220, hole: [120, 60], azimuthSd: AZ },
      lin: coreColumns(60, 220, 120, 60, small, AZ),
    },
    {
      name: 'core alpha 45 in hole 300/35',
      item: { source: 'core', alpha: 45, beta: 300, hole: [300, 35], azimuthSd: AZ },
      lin: coreColumns(45, 300, 300, 35, small, AZ),
    },
    {
      name: 'image pick, high side, in hole 045/70',
      item: {
        source: 'image',
        amplitude: 80,
        diameter: 96,
        trough: 150,
        north: false,
        hole: [45, 70],
        azimuthSd: AZ,
      },
      lin: highSideColumns(80, 96, 150, 45, 70, small, AZ),
    },
    {
      name: 'image pick, north-referenced, in hole 200/55',
      item: {
        source: 'image',
        amplitude: 120,
        diameter: 96,
        trough: 260,
        north: true,
        hole: [200, 55],
        azimuthSd: AZ,
      },
      lin: northColumns(120, 96, 260, 200, 55, small, AZ),
    },
  ]
  for (const c of cases) {
    it(`orientationUncertainty() ${c.name}: Monte Carlo cone within 10 % of first order [derived]`, () => {
      const r = orientationUncertainty(columnsOf([c.item]), small, { draws: 4000 })
      const { theta: expected, major, minor, axis: linearAxis } = linearised(c.lin.n, c.lin.columns)
      expect(r.cone95[0] / expected).toBeGreaterThan(0.9)
      expect(r.cone95[0] / expected).toBeLessThan(1.1)
      // And at the default 500 draws.
      const r500 = orientationUncertainty(columnsOf([c.item]), small)
      expect(Math.abs(r500.cone95[0] / expected - 1)).toBeLessThan(0.1)
      expect(Math.abs(r.major95[0] / major - 1)).toBeLessThan(0.1)
      expect(Math.abs(r.minor95[0] / minor - 1)).toBeLessThan(0.1)
      // The ellipse's major axis lies in the plane normal to the pole.
      const t = r.axisTrend[0] * D
      const p = r.axisPlunge[0] * D
      const axis: V3 = [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), -Math.sin(p)]
      expect(axisAngle(axis, c.lin.n)).toBeGreaterThan(89.9)
      // Where clearly elliptical, along the first-order major axis.
      if (major > 1.3 * minor) expect(axisAngle(axis, linearAxis)).toBeLessThan(10)
    })
  }
})
