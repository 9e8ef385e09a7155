// The links the depth view draws between paired tadpoles: each pair's core depth on the left and
// its image structure's shown depth on the right, on the tracks' shared depth scale.
import { scaleLinear } from 'd3'
import type { ReconciliationAnswer } from '../../../../schema/index'
import type { DepthRange } from '../track/track-types'

export interface MatchLink {
  coreId: number
  imageId: number
  coreDepth: number
  /** Where the image tadpole is drawn: the logged image depth less the shift in force. */
  imageDepth: number
}

/** The pairs as links; with `kept`, only pairs whose two structures both pass the filters. */
export function matchLinks(answer: ReconciliationAnswer, kept?: ReadonlySet<number>): MatchLink[] {
  const shift = answer.appliedDepthShift
  return answer.matches
    .filter((m) => !kept || (kept.has(m.coreStructureId) && kept.has(m.imageStructureId)))
    .map((m) => ({
      coreId: m.coreStructureId,
      imageId: m.imageStructureId,
      coreDepth: m.coreDepth,
      imageDepth: m.imageDepth - shift,
    }))
}

export interface LinkSegment extends MatchLink {
  x1: number
  y1: number
  x2: number
  y2: number
}

/** Segments of the links that cross the shown depth range, from x = 0 (core) to x = width. */
export function layoutLinks(
  links: readonly MatchLink[],
  width: number,
  height: number,
  domain: DepthRange,
): LinkSegment[] {
  const y = scaleLinear().domain(domain).range([0, height])
  const [top, bottom] = domain
  return links
    .filter(
      (l) =>
        Math.min(l.coreDepth, l.imageDepth) <= bottom && Math.max(l.coreDepth, l.imageDepth) >= top,
    )
    .map((l) => ({ ...l, x1: 0, y1: y(l.coreDepth), x2: width, y2: y(l.imageDepth) }))
}
