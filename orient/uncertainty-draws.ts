import { DEG2RAD } from './math'
import { mulberry32 } from './random'
import type { ErrorModel } from './error-model'

/**
 * Fewest Monte Carlo draws. The nearest-rank 95th percentile of N draws scatters by
 * √(0.95 · 0.05 / N) / f(q₉₅) [derived, order statistics]; for a circular normal (Rayleigh, q₉₅ =
 * 2.448 σ, f(q₉₅) = 0.122/σ) that is 3.3 % of the cone at N = 500.
 */
export const MIN_DRAWS = 500

/** Draw count and seed as used: at least MIN_DRAWS whole draws (500 when not finite), seed 1. */
export function monteCarloOptions(options: { draws?: number; seed?: number } = {}) {
  const asked = options.draws ?? MIN_DRAWS
  const draws = Number.isFinite(asked) ? Math.max(MIN_DRAWS, Math.floor(asked)) : MIN_DRAWS
  return { draws, seed: options.seed ?? 1 }
}

/** cos and sin of one angular perturbation per draw. */
export interface Rotation {
  readonly c: Float64Array
  readonly s: Float64Array
}

/**
 * Common random numbers for the Monte Carlo: one seeded set of standard-normal draws per error
 * channel, shared by every structure (a standard variance-reduction device, common practice; it
 * also makes two structures' cones comparable draw by draw). Perturbations whose 1σ is the same
 * for every structure are turned into cos/sin tables once, so the per-structure loops need no
 * trigonometric call: the perturbed sine and cosine follow from sin(a + δ) = sin a cos δ +
 * cos a sin δ and cos(a + δ) = cos a cos δ − sin a sin δ.
 */
export interface DrawTables {
  readonly draws: number
  readonly alpha: Rotation
  readonly beta: Rotation
  readonly inclination: Rotation
  readonly trough: Rotation
  readonly dip: Rotation
  readonly dipDirection: Rotation
  /** A uniform angle on [0, 2π): beta when the bottom-of-hole mark means nothing. */
  readonly uniform: Rotation
  /** The model's beta 1σ (degrees) and the standard normals behind the beta table. */
  readonly betaSd: number
  readonly zBeta: Float64Array
  /** Standard normals whose 1σ differs per structure (depth rates, pick height). */
  readonly zDepth: Float64Array
  readonly zHeight: Float64Array
  /** Largest |z| of zBeta and zDepth: how far a per-structure turn can reach. */
  readonly maxBeta: number
  readonly maxDepth: number
  /** Standard normals of the survey azimuth, and its tables by 1σ (see azimuthTable). */
  readonly zAzimuth: Float64Array
  readonly azimuths: Map<number, Rotation>
}

/** Seeded standard normals by the Box–Muller transform (Box & Muller 1958). */
export function seededNormals(count: number, random: () => number): Float64Array {
  const z = new Float64Array(count)
  for (let i = 0; i < count; i += 2) {
    // 1 − u lies in (0, 1]: the logarithm stays finite.
    const r = Math.sqrt(-2 * Math.log(1 - random()))
    const phi = 2 * Math.PI * random()
    z[i] = r * Math.cos(phi)
    if (i + 1 < count) z[i + 1] = r * Math.sin(phi)
  }
  return z
}

function rotation(z: Float64Array, sdDeg: number): Rotation {
  const c = new Float64Array(z.length)
  const s = new Float64Array(z.length)
  const k = sdDeg * DEG2RAD
  for (let i = 0; i < z.length; i++) {
    c[i] = Math.cos(k * z[i])
    s[i] = Math.sin(k * z[i])
  }
  return { c, s }
}

const maxAbs = (z: Float64Array) => z.reduce((m, v) => Math.max(m, Math.abs(v)), 0)

/** The tables for a model, a number of draws and a seed (see DrawTables). */
export function drawTables(model: ErrorModel, draws: number, seed: number): DrawTables {
  const random = mulberry32(seed)
  const normals = () => seededNormals(draws, random)
  const zAzimuth = normals()
  const alpha = rotation(normals(), model.alphaSd)
  const zBeta = normals()
  const beta = rotation(zBeta, model.betaSd)
  const inclination = rotation(normals(), model.surveyInclinationSd)
  const trough = rotation(normals(), model.pickTroughSd)
  const dip = rotation(normals(), model.trueDipSd)
  const dipDirection = rotation(normals(), model.trueDipDirectionSd)
  const zDepth = normals()
  const zHeight = normals()
  const u = Float64Array.from({ length: draws }, () => random() * 360)
  const uniform = rotation(u, 1)
  return {
    draws,
    alpha,
    beta,
    inclination,
    trough,
    dip,
    dipDirection,
    uniform,
    betaSd: model.betaSd,
    zBeta,
    zDepth,
    zHeight,
    maxBeta: maxAbs(zBeta),
    maxDepth: maxAbs(zDepth),
    zAzimuth,
    azimuths: new Map(),
  }
}

/**
 * The survey azimuth perturbation table for a 1σ in degrees, built once per distinct value (the
 * caller picks the 1σ per hole from its instrument, so a project has few).
 */
export function azimuthTable(t: DrawTables, sdDeg: number): Rotation {
  let r = t.azimuths.get(sdDeg)
  if (!r) t.azimuths.set(sdDeg, (r = rotation(t.zAzimuth, sdDeg)))
  return r
}
