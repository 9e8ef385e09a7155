import type { ImageRows } from './sinusoid-detect'
import { columnGain, rowScale } from './sinusoid-detect-scale'

/** Depth-gradient edge strength of an image, in units of its own texture's gradient scale. */
export interface EdgeMap {
  readonly width: number
  readonly rows: number
  /** ∂grey/∂depth ÷ robust texture scale, row-major; 0 where not observable. Evidence uses |z|. */
  readonly z: Float32Array
  /** evidence(z) of every pixel, 0..1. */
  readonly w: Float32Array
  /** 1 where the gradient could be formed (the sample and both depth neighbours hold values). */
  readonly observable: Uint8Array
}

/** Edge strength (texture scales) below which a pixel is no evidence, and from which it is full. */
export const EVIDENCE_FROM = 1.5
export const EVIDENCE_FULL = 4.5

/** Evidence 0..1 of an edge strength |z|: a ramp between EVIDENCE_FROM and EVIDENCE_FULL. */
export function evidence(z: number): number {
  const w = (Math.abs(z) - EVIDENCE_FROM) / (EVIDENCE_FULL - EVIDENCE_FROM)
  return w <= 0 ? 0 : w >= 1 ? 1 : w
}

/** Binomial smoothing along depth (σ = 1 row) before the derivative: speckle is not an edge. */
const KERNEL = [1, 4, 6, 4, 1]

/**
 * Edge map for the detector: the image smoothed along depth ([1 4 6 4 1]/16) and round the turn
 * ([1 2 1]/4), then the central difference along depth — the direction a plane's trace crosses;
 * vertical stripes of tool artefacts give no response. Kept signed (the refinement pairs the two
 * edges of a band) but weighed by magnitude only, so dark and bright bands both count. Divided by
 * the texture's own gradient scale (sinusoid-detect-scale), so evidence does not depend on the
 * grey scale or the roughness of the wall. Undefined when the image holds no two distinct values.
 */
export function edgeMap(img: ImageRows): EdgeMap | undefined {
  const { width, rows, values } = img
  if (!(width > 0) || !(rows >= 5) || values.length < width * rows) return undefined
  let lo = Infinity
  let hi = -Infinity
  for (let i = 0; i < width * rows; i++) {
    const v = values[i]
    if (!Number.isFinite(v)) continue
    if (v < lo) lo = v
    if (v > hi) hi = v
  }
  if (!(hi > lo)) return undefined
  const g = gradient(img)
  const observable = new Uint8Array(width * rows)
  for (let i = 0; i < g.length; i++) observable[i] = Number.isNaN(g[i]) ? 0 : 1
  const scale = rowScale(g, width, rows, img.rowStep, (hi - lo) * 1e-6)
  const gain = columnGain(g, width, rows)
  const z = new Float32Array(width * rows)
  const w = new Float32Array(width * rows)
  for (let r = 0; r < rows; r++) {
    const s = scale[r]
    for (let c = 0; c < width; c++) {
      const i = r * width + c
      const v = g[i]
      if (Number.isNaN(v)) continue
      z[i] = v / (s * gain[c])
      w[i] = evidence(z[i])
    }
  }
  return { width, rows, z, w, observable }
}

/** ∂/∂depth of the smoothed columns; NaN where a value or a depth neighbour is missing. */
function gradient(img: ImageRows): Float32Array {
  const { width, rows, values } = img
  const n = width * rows
  // Row-major passes: the rows above and below are the neighbours, read in memory order.
  const smooth = new Float32Array(n)
  for (let r = 0; r < rows; r++)
    for (let c = 0; c < width; c++) {
      const i = r * width + c
      const v0 = values[i]
      if (!Number.isFinite(v0)) {
        smooth[i] = NaN
        continue
      }
      let sum = KERNEL[2] * v0
      let weight = KERNEL[2]
      for (let k = -2; k <= 2; k++) {
        const rr = r + k
        if (k === 0 || rr < 0 || rr >= rows) continue
        const v = values[i + k * width]
        if (!Number.isFinite(v)) continue
        sum += KERNEL[k + 2] * v
        weight += KERNEL[k + 2]
      }
      smooth[i] = sum / weight
    }
  const across = smoothAcross(smooth, width, rows)
  const g = new Float32Array(n).fill(NaN)
  for (let i = width; i < n - width; i++) {
    const d = (across[i + width] - across[i - width]) / 2
    if (!Number.isNaN(d) && !Number.isNaN(smooth[i])) g[i] = d
  }
  return g
}

/**
 * [1 2 1]/4 round the turn (the image wraps at 360°): speckle down by 0.61 while a trace, which
 * runs across the columns, keeps its contrast; no-value neighbours are left out.
 */
function smoothAcross(v: Float32Array, width: number, rows: number): Float32Array {
  const out = new Float32Array(v.length)
  for (let r = 0; r < rows; r++) {
    const base = r * width
    for (let c = 0; c < width; c++) {
      const mid = v[base + c]
      if (Number.isNaN(mid)) {
        out[base + c] = NaN
        continue
      }
      const a = v[base + (c === 0 ? width - 1 : c - 1)]
      const b = v[base + (c === width - 1 ? 0 : c + 1)]
      let sum = 2 * mid
      let weight = 2
      if (!Number.isNaN(a)) [sum, weight] = [sum + a, weight + 1]
      if (!Number.isNaN(b)) [sum, weight] = [sum + b, weight + 1]
      out[base + c] = sum / weight
    }
  }
  return out
}
