// The hole's direction near a depth, read from the structures stored with it: the axis of the
// blind zone drawn on the net of an image's picks.
import type { Line } from '../../../../orient/index'
import type { Structure } from '../../api/types'

/** The hole axis of the structure nearest `depth` that has one, or null. */
export function holeAxisNear(
  structures: readonly Pick<Structure, 'depth' | 'holeTrend' | 'holePlunge'>[],
  depth: number,
): Line | null {
  let best: Line | null = null
  let gap = Infinity
  for (const s of structures) {
    if (s.holeTrend === null || s.holePlunge === null) continue
    const d = Math.abs(s.depth - depth)
    if (d < gap) {
      gap = d
      best = { trend: s.holeTrend, plunge: s.holePlunge }
    }
  }
  return best
}
