// Where each tadpole goes in a track, as a few paths per structure type (thousands of tadpoles stay
// a handful of SVG elements) plus the positions the pointer searches.
import { scaleLinear } from 'd3'
import { flaggedColour, symbolOf, symbolPath, tailEnd } from './structure-symbols'
import type { DepthRange, TrackStructure } from './track-types'

/** Width of the lane of unoriented structures at the left of the track (px). */
export const UNORIENTED_LANE = 22
const RIGHT_PAD = 8

export interface TadpoleGroup {
  type: string
  colour: string
  /** Filled symbols of oriented structures. */
  symbols: string
  tails: string
  /** Hollow symbols of unoriented structures, in their lane. */
  hollow: string
  count: number
}

export interface TadpoleLayout {
  groups: TadpoleGroup[]
  flagged: string
  /** Visible structures with their plot positions. */
  ids: number[]
  xs: number[]
  ys: number[]
  dipX: (dip: number) => number
}

export function dipScale(width: number) {
  return scaleLinear()
    .domain([0, 90])
    .range([UNORIENTED_LANE + 8, width - RIGHT_PAD])
}

export function layoutTadpoles(
  structures: readonly TrackStructure[],
  width: number,
  height: number,
  domain: DepthRange,
): TadpoleLayout {
  const y = scaleLinear().domain(domain).range([0, height])
  const x = dipScale(width)
  const visible = structures.filter((s) => s.depth >= domain[0] && s.depth <= domain[1])
  const r = visible.length > 1500 ? 2.6 : 3.4
  const groups = new Map<string, TadpoleGroup>()
  const out: TadpoleLayout = { groups: [], flagged: '', ids: [], xs: [], ys: [], dipX: x }
  for (const s of visible) {
    const symbol = symbolOf(s.type)
    let g = groups.get(s.type)
    if (!g) {
      g = { type: s.type, colour: symbol.colour, symbols: '', tails: '', hollow: '', count: 0 }
      groups.set(s.type, g)
    }
    g.count++
    const py = y(s.depth)
    const oriented = s.dip !== null && s.dipDirection !== null
    const px = oriented ? x(s.dip!) : UNORIENTED_LANE / 2
    if (oriented) {
      g.symbols += symbolPath(symbol.shape, px, py, r)
      const end = tailEnd(px, py, s.dipDirection!)
      g.tails += `M${px.toFixed(2)},${py.toFixed(2)}L${end.x.toFixed(2)},${end.y.toFixed(2)}`
    } else g.hollow += symbolPath(symbol.shape, px, py, r)
    if (s.flagged) out.flagged += symbolPath('disc', px, py, r + 2.4)
    out.ids.push(s.id)
    out.xs.push(px)
    out.ys.push(py)
  }
  out.groups = [...groups.values()].sort((a, b) => a.type.localeCompare(b.type))
  return out
}

export { flaggedColour }
