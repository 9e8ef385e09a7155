import type { PoleBins } from './density-bins'
import type { DensityKernel } from './density-kernels'

/** Kernel sums at every node, visiting only the cells within reach (radians) of each node. */
export function accumulate(
  bins: PoleBins,
  kernel: DensityKernel,
  nodes: Float64Array,
  reach: number,
): Float64Array {
  const { g, start, xyz, w } = bins
  const m = nodes.length / 3
  const out = new Float64Array(m)
  const cut = kernel.cosCutoff
  const k = kernel.k ?? 0
  const exponential = kernel.method === 'exponential'
  const cell = 2 / g
  const toCell = (u: number) => Math.min(g - 1, Math.max(0, Math.floor((u + 1) / cell)))
  // Kernel sum at unit vector s over the poles of cells [x0, x1] × [y0, y1], skipping the cells
  // of an already visited block skip = [x0, x1, y0, y1].
  const block = (
    sx: number,
    sy: number,
    sz: number,
    x0: number,
    x1: number,
    y0: number,
    y1: number,
    skip: number[] | undefined,
  ): number => {
    let sum = 0
    for (let cy = y0; cy <= y1; cy++) {
      for (let cx = x0; cx <= x1; cx++) {
        if (skip && cx >= skip[0] && cx <= skip[1] && cy >= skip[2] && cy <= skip[3]) continue
        const c = cy * g + cx
        for (let j = start[c]; j < start[c + 1]; j++) {
          const d = sx * xyz[3 * j] + sy * xyz[3 * j + 1] + sz * xyz[3 * j + 2]
          const a = d < 0 ? -d : d
          if (a >= cut) sum += exponential ? w[j] * Math.exp(k * (a - 1)) : w[j]
        }
      }
    }
    return sum
  }
  for (let i = 0; i < m; i++) {
    const f = nodes[3 * i + 2] > 0 ? -1 : 1
    const sx = f * nodes[3 * i]
    const sy = f * nodes[3 * i + 1]
    const sz = f * nodes[3 * i + 2]
    if (g === 1) {
      out[i] = block(sx, sy, sz, 0, 0, 0, 0, undefined)
      continue
    }
    const q = 1 / Math.sqrt(1 - sz)
    const r = reach + 1e-9
    const own = [toCell(sx * q - r), toCell(sx * q + r), toCell(sy * q - r), toCell(sy * q + r)]
    let sum = block(sx, sy, sz, own[0], own[1], own[2], own[3], undefined)
    const h = Math.hypot(sx, sy)
    if (-sz <= Math.sin(r) && h > 0) {
      // Poles near the antipode −s lie across the primitive, within 2·reach of the horizontal
      // point opposite s.
      const hx = -sx / h
      const hy = -sy / h
      sum += block(
        sx,
        sy,
        sz,
        toCell(hx - 2 * r),
        toCell(hx + 2 * r),
        toCell(hy - 2 * r),
        toCell(hy + 2 * r),
        own,
      )
    }
    out[i] = sum
  }
  return out
}
