import { project } from './projection'
import { linesToXyz } from './tensor'
import { vecToLine } from './vector'
import type { NetProjection } from './projection'
import type { Line } from './types'

/** Where a density is evaluated: unit vectors, their lines and their net positions. */
export interface DensityNodes {
  /** Nodes per side of the square grid; undefined for nodes given as lines. */
  readonly size: number | undefined
  /** Interleaved unit vectors (east, north, up) at which the density is evaluated. */
  readonly xyz: Float64Array
  readonly lines: Line[]
  readonly x: Float64Array
  readonly y: Float64Array
  /** 1 where the node lies on or inside the primitive. */
  readonly inside: Uint8Array
  /**
   * Integration weight per node (equal-area grid only): the solid angle of the part of the node's
   * grid cell inside the primitive, so Σ nodeArea = 2π and Σ f·nodeArea integrates f over the
   * hemisphere. Nodes just outside the primitive carry the sliver of their cell inside it.
   */
  readonly nodeArea: Float64Array | undefined
}

/** Grid side whose nodes inside the unit circle number at least `count`. */
export function gridSize(count: number): number {
  let size = Math.max(3, Math.ceil(Math.sqrt((4 * count) / Math.PI)))
  for (;;) {
    const h = 2 / (size - 1)
    let inside = 0
    for (let j = 0; j < size; j++)
      for (let i = 0; i < size; i++)
        if ((-1 + i * h) ** 2 + (-1 + j * h) ** 2 <= 1 + 1e-12) inside++
    if (inside >= count) return size
    size++
  }
}

/**
 * A size × size grid over the square [−1, 1]² of the unit net, row-major from the north-west
 * corner: node (i, j) at x = −1 + 2i/(size − 1), y = 1 − 2j/(size − 1), index j·size + i (the
 * layout of an image, ready for marching squares). Nodes outside the primitive carry the direction
 * the projection gives beyond 90° from the centre — the upper-hemisphere continuation — so
 * densities there repeat those across the primitive and contours close on it. On the equal-area net
 * every node inside the primitive stands for the same solid angle, 2(2/(size − 1))².
 */
export function gridNodes(count: number, projection: NetProjection): DensityNodes {
  const size = gridSize(count)
  const total = size * size
  const h = 2 / (size - 1)
  const xyz = new Float64Array(3 * total)
  const x = new Float64Array(total)
  const y = new Float64Array(total)
  const inside = new Uint8Array(total)
  const lines: Line[] = new Array(total)
  for (let j = 0; j < size; j++) {
    for (let i = 0; i < size; i++) {
      const k = j * size + i
      const px = -1 + i * h
      const py = 1 - j * h
      const r = Math.hypot(px, py)
      // c = angle from the net centre (the downward vertical).
      const c = projection === 'equal-area' ? 2 * Math.asin(r / Math.SQRT2) : 2 * Math.atan(r)
      const s = r === 0 ? 0 : Math.sin(c) / r
      xyz[3 * k] = px * s
      xyz[3 * k + 1] = py * s
      xyz[3 * k + 2] = -Math.cos(c)
      x[k] = px
      y[k] = py
      inside[k] = r <= 1 + 1e-12 ? 1 : 0
      lines[k] = vecToLine([xyz[3 * k], xyz[3 * k + 1], xyz[3 * k + 2]])
    }
  }
  const nodeArea = projection === 'equal-area' ? cellAreas(size) : undefined
  return { size, xyz, lines, x, y, inside, nodeArea }
}

/** Nodes at given lines, positioned on the chosen net. */
export function lineNodes(lines: readonly Line[], projection: NetProjection): DensityNodes {
  const valid = lines.filter((l) => Number.isFinite(l.trend) && Number.isFinite(l.plunge))
  const x = new Float64Array(valid.length)
  const y = new Float64Array(valid.length)
  valid.forEach((l, i) => {
    const p = project(l, projection) ?? { x: 0, y: 0 }
    x[i] = p.x
    y[i] = p.y
  })
  const xyz = linesToXyz(valid)
  const normalised = valid.map((_, i) => vecToLine([xyz[3 * i], xyz[3 * i + 1], xyz[3 * i + 2]]))
  const inside = new Uint8Array(valid.length).fill(1)
  return { size: undefined, xyz, lines: normalised, x, y, inside, nodeArea: undefined }
}

/**
 * Solid angle of each grid cell's part inside the unit circle. The equal-area net maps the
 * hemisphere (2π sr) onto the unit disk (area π), so solid angle = 2 × net area. Cells crossed by
 * the circle are integrated over 32 strips with the exact chord in each: area good to ~1e-5 of a
 * cell.
 */
function cellAreas(size: number): Float64Array {
  const h = 2 / (size - 1)
  const out = new Float64Array(size * size)
  const strips = 32
  for (let j = 0; j < size; j++) {
    const y0 = 1 - j * h - h / 2
    const y1 = y0 + h
    for (let i = 0; i < size; i++) {
      const x0 = -1 + i * h - h / 2
      const near = Math.hypot(
        Math.max(0, Math.abs(x0 + h / 2) - h / 2),
        Math.max(0, Math.abs(y0 + h / 2) - h / 2),
      )
      const far = Math.hypot(Math.abs(x0 + h / 2) + h / 2, Math.abs(y0 + h / 2) + h / 2)
      let area = 0
      if (far <= 1) area = h * h
      else if (near < 1) {
        for (let s = 0; s < strips; s++) {
          const x = x0 + ((s + 0.5) * h) / strips
          const half = Math.sqrt(Math.max(0, 1 - x * x))
          area += (Math.max(0, Math.min(y1, half) - Math.max(y0, -half)) * h) / strips
        }
      }
      out[j * size + i] = 2 * area
    }
  }
  return out
}
