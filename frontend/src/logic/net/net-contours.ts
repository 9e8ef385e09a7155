// Density contours: orient's densityGrid, traced with d3-contour and placed on the drawn net.
import { contours } from 'd3'
import { densityGrid } from '../../../../orient/index'
import type { DensityGrid, DensityMethod, Line, NetProjection } from '../../../../orient/index'

export type { DensityMethod }

export interface ContourBand {
  /** Lower bound of the band, in multiples of sigma. */
  level: number
  d: string
}

export interface DensityContours {
  grid: DensityGrid
  /** Highest density inside the primitive (sigma). */
  max: number
  /** The contour interval used (sigma). */
  step: number
  levels: number[]
  bands: ContourBand[]
}

/** Contour intervals offered by 'auto', in sigma: the first giving at most 10 levels is used. */
const AUTO_STEPS = [2, 4, 6, 10, 20, 30, 50, 100, 200, 500]

/** The interval 'auto' picks for a peak density (sigma). */
export function autoStep(max: number): number {
  return AUTO_STEPS.find((s) => max / s <= 10) ?? Math.ceil(max / 10)
}

/**
 * Contour levels step, 2·step, … up to the highest density inside the primitive; 'auto' takes
 * 2σ, widened for strong peaks so no more than ten levels are drawn.
 */
export function sigmaLevels(
  grid: DensityGrid,
  requested: number | 'auto',
): { max: number; levels: number[]; step: number } {
  let max = 0
  for (let k = 0; k < grid.values.length; k++)
    if (grid.inside[k] && grid.values[k] > max) max = grid.values[k]
  const step = requested === 'auto' ? autoStep(max) : requested
  const levels: number[] = []
  if (step > 0)
    for (let v = step; v <= max + 1e-9; v += step) levels.push(Math.round(v * 1e6) / 1e6)
  return { max, levels, step }
}

/**
 * Traces a size × size density grid (row-major from the north-west node, see orient's gridNodes)
 * into SVG paths on a net of radius R. d3-contour puts value (i, j) at (i + 0.5, j + 0.5); node i
 * sits at x = −1 + 2i/(size − 1) on the unit net, so both axes map by the same affine function.
 */
export function traceGrid(
  values: ArrayLike<number>,
  size: number,
  levels: readonly number[],
  radius: number,
): ContourBand[] {
  if (levels.length === 0) return []
  const scale = (c: number) => (-1 + (2 * (c - 0.5)) / (size - 1)) * radius
  const f = (v: number) => (Math.round(scale(v) * 100) / 100).toString()
  const generator = contours()
    .size([size, size])
    .thresholds([...levels])
  return generator(Array.from(values)).map((multi) => {
    let d = ''
    for (const polygon of multi.coordinates)
      for (const ring of polygon) {
        ring.forEach(([x, y], i) => (d += `${i ? 'L' : 'M'}${f(x)},${f(y)}`))
        d += 'Z'
      }
    return { level: multi.value, d }
  })
}

export interface ContourOptions {
  method: DensityMethod
  projection: NetProjection
  radius: number
  /** Contour interval in sigma, or 'auto' (default 2). */
  step?: number | 'auto'
  weights?: readonly number[]
  /** Grid nodes inside the primitive (default 2000, orient's). */
  nodes?: number
}

/** Density grid, levels and traced bands for poles; undefined when there is nothing to count. */
export function densityContours(
  poles: readonly Line[],
  options: ContourOptions,
): DensityContours | undefined {
  if (poles.length === 0) return undefined
  const grid = densityGrid(poles, {
    method: options.method,
    projection: options.projection,
    weights: options.weights,
    nodes: options.nodes,
  })
  if (!grid || grid.size === undefined) return undefined
  const { max, levels, step } = sigmaLevels(grid, options.step ?? 2)
  return {
    grid,
    max,
    step,
    levels,
    bands: traceGrid(grid.values, grid.size, levels, options.radius),
  }
}

/**
 * The blind zone on a pole net: poles of planes within `angle` of the hole axis (planes the hole
 * runs nearly along), |p·h| ≤ sin(angle), traced on a grid like the density.
 */
export function blindZonePath(
  hole: Line,
  angle: number,
  projection: NetProjection,
  radius: number,
  size = 121,
): string {
  const t = (hole.trend * Math.PI) / 180
  const p = (hole.plunge * Math.PI) / 180
  const h = [Math.sin(t) * Math.cos(p), Math.cos(t) * Math.cos(p), -Math.sin(p)]
  const limit = Math.sin((angle * Math.PI) / 180)
  const values = new Float64Array(size * size)
  const step = 2 / (size - 1)
  for (let j = 0; j < size; j++)
    for (let i = 0; i < size; i++) {
      const x = -1 + i * step
      const y = 1 - j * step
      const r = Math.hypot(x, y)
      const c =
        projection === 'equal-area' ? 2 * Math.asin(Math.min(r / Math.SQRT2, 1)) : 2 * Math.atan(r)
      const s = r === 0 ? 0 : Math.sin(c) / r
      const dot = Math.abs(x * s * h[0] + y * s * h[1] - Math.cos(c) * h[2])
      values[j * size + i] = limit - dot
    }
  return traceGrid(values, size, [0], radius)[0]?.d ?? ''
}
