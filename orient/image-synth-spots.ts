import { hash01 } from './image-synth-noise'

/** Spot lattice: one possible spot per cell of this depth (m) and turn fraction. */
const CELL_M = 0.04
const CELLS_PER_TURN = 12
const MAX_RADIUS_M = 0.006

/**
 * Small dark spots (pits, vugs, grains pulled out): sharp edges that are not any plane's trace,
 * so a detector is tried against clutter as well as smooth texture. Spot k of cell (i, j) exists
 * with probability density / (cells per metre) and takes its place, size and darkness from
 * hashes of (i, j, seed) alone: any row range draws the same spots.
 */
export function darkenSpots(
  out: Float32Array,
  o: { width: number; topDepth: number; rowStep: number; leftAzimuth?: number; seed: number },
  density: number,
  fromRow: number,
  toRow: number,
): void {
  if (!(density > 0)) return
  const { width, topDepth, rowStep } = o
  const chance = Math.min(1, density / (CELLS_PER_TURN / CELL_M))
  const top = topDepth + fromRow * rowStep
  const bottom = topDepth + toRow * rowStep
  for (let i = Math.floor((top - MAX_RADIUS_M) / CELL_M); i * CELL_M <= bottom + MAX_RADIUS_M; i++)
    for (let j = 0; j < CELLS_PER_TURN; j++) {
      const h = (k: number) => hash01(i, j * 8 + k, o.seed ^ 0x5bd1e995)
      if (h(0) >= chance) continue
      const depth = (i + h(1)) * CELL_M
      const turn = (j + h(2)) / CELLS_PER_TURN
      const ry = 0.001 + h(3) * (MAX_RADIUS_M - 0.001)
      const rx = ((0.6 + h(4)) * ry * width) / 0.3 // about 0.3 m round the wall
      const dark = 0.2 + 0.4 * h(5)
      const r0 = Math.max(fromRow, Math.floor((depth - 2 * ry - topDepth) / rowStep))
      const r1 = Math.min(toRow - 1, Math.ceil((depth + 2 * ry - topDepth) / rowStep))
      const cx = turn * width - ((o.leftAzimuth ?? 0) / 360) * width - 0.5
      for (let r = r0; r <= r1; r++) {
        const dy = (topDepth + (r + 0.5) * rowStep - depth) / ry
        for (let dc = -Math.ceil(2 * rx); dc <= Math.ceil(2 * rx); dc++) {
          const c = Math.round(cx) + dc
          const dx = (c - cx) / rx
          const f = Math.exp(-(dx * dx + dy * dy))
          if (f < 0.02) continue
          const cc = ((c % width) + width) % width
          out[(r - fromRow) * width + cc] *= 1 - dark * f
        }
      }
    }
}
