// Geometry of the collar plan, kept apart from the SVG so it can be checked with fixed numbers.
import { scaleLinear, type ScaleLinear } from 'd3'

export interface CollarPoint {
  id?: number | string
  name: string
  east: number
  north: number
  /** Planned azimuth in degrees from true north; draws a short tick from the collar. */
  plannedAzimuth?: number | null
  /** Planned length (m); scales the tick between the shortest and longest hole. */
  plannedLength?: number | null
}

export interface Margins {
  top: number
  right: number
  bottom: number
  left: number
}

export const PLAN_MARGIN: Margins = { top: 16, right: 16, bottom: 44, left: 78 }
/** Free pixels kept between the outermost collars and the frame, for ticks and labels. */
export const PLAN_PADDING = 44
/** Smallest span shown (m), so one collar alone is not blown up to fill the frame. */
export const PLAN_MIN_SPAN = 50
export const LABEL_FONT_PX = 11
const LABEL_CHAR_PX = 0.62 * LABEL_FONT_PX
const COLLAR_RADIUS = 4
const TICK_MIN_PX = 10
const TICK_MAX_PX = 30

export interface Box {
  x: number
  y: number
  w: number
  h: number
}

export interface PlacedCollar {
  key: string
  id?: number | string
  name: string
  cx: number
  cy: number
  tick: { x2: number; y2: number } | null
  label: { x: number; y: number; anchor: 'start' | 'middle' | 'end'; box: Box }
}

export interface PlanLayout {
  x: ScaleLinear<number, number>
  y: ScaleLinear<number, number>
  /** Pixels per metre, the same along both axes. */
  scale: number
  inner: Box
  collars: PlacedCollar[]
}

/** Linear scales with one pixels-per-metre for easting and northing, centred on the collars. */
export function equalScales(points: CollarPoint[], width: number, height: number, m = PLAN_MARGIN) {
  const inner: Box = {
    x: m.left,
    y: m.top,
    w: width - m.left - m.right,
    h: height - m.top - m.bottom,
  }
  const easts = points.map((p) => p.east)
  const norths = points.map((p) => p.north)
  const [e0, e1] = points.length ? [Math.min(...easts), Math.max(...easts)] : [0, 0]
  const [n0, n1] = points.length ? [Math.min(...norths), Math.max(...norths)] : [0, 0]
  const spanE = Math.max(e1 - e0, PLAN_MIN_SPAN)
  const spanN = Math.max(n1 - n0, PLAN_MIN_SPAN)
  const usableW = Math.max(inner.w - 2 * PLAN_PADDING, 1)
  const usableH = Math.max(inner.h - 2 * PLAN_PADDING, 1)
  const scale = Math.min(usableW / spanE, usableH / spanN)
  const cE = (e0 + e1) / 2
  const cN = (n0 + n1) / 2
  const halfE = inner.w / (2 * scale)
  const halfN = inner.h / (2 * scale)
  const x = scaleLinear()
    .domain([cE - halfE, cE + halfE])
    .range([inner.x, inner.x + inner.w])
  const y = scaleLinear()
    .domain([cN - halfN, cN + halfN])
    .range([inner.y + inner.h, inner.y])
  return { x, y, scale, inner }
}

function overlap(a: Box, b: Box): number {
  const w = Math.min(a.x + a.w, b.x + b.w) - Math.max(a.x, b.x)
  const h = Math.min(a.y + a.h, b.y + b.h) - Math.max(a.y, b.y)
  return w > 0 && h > 0 ? w * h : 0
}

function outside(box: Box, frame: Box): number {
  const inside = overlap(box, frame)
  return box.w * box.h - inside
}

type Candidate = { dx: number; dy: number; anchor: 'start' | 'middle' | 'end' }
// Right, left, above, below, then the diagonals; y is the text baseline offset.
const CANDIDATES: Candidate[] = [
  { dx: 8, dy: 4, anchor: 'start' },
  { dx: -8, dy: 4, anchor: 'end' },
  { dx: 0, dy: -9, anchor: 'middle' },
  { dx: 0, dy: 17, anchor: 'middle' },
  { dx: 6, dy: -7, anchor: 'start' },
  { dx: 6, dy: 14, anchor: 'start' },
  { dx: -6, dy: -7, anchor: 'end' },
  { dx: -6, dy: 14, anchor: 'end' },
]

function labelBox(cx: number, cy: number, c: Candidate, text: string): Box {
  const w = text.length * LABEL_CHAR_PX
  const h = LABEL_FONT_PX + 2
  const left = c.anchor === 'start' ? cx + c.dx : c.anchor === 'end' ? cx + c.dx - w : cx - w / 2
  return { x: left, y: cy + c.dy - LABEL_FONT_PX, w, h }
}

function tickBoxes(cx: number, cy: number, x2: number, y2: number): Box[] {
  const boxes: Box[] = []
  for (let f = 0.25; f <= 1; f += 0.25) {
    boxes.push({ x: cx + (x2 - cx) * f - 1.5, y: cy + (y2 - cy) * f - 1.5, w: 3, h: 3 })
  }
  return boxes
}

/**
 * Places collars, their azimuth ticks and their labels. Labels go, in order of preference, to the
 * first position that overlaps no other label, collar or tick and stays in the frame; failing
 * that, to the position with the least overlap.
 */
export function layoutCollarPlan(
  points: CollarPoint[],
  width: number,
  height: number,
  convergenceDeg = 0,
): PlanLayout {
  const { x, y, scale, inner } = equalScales(points, width, height)
  const lengths = points.map((p) => p.plannedLength).filter((l): l is number => Number.isFinite(l))
  const maxLength = lengths.length ? Math.max(...lengths) : 0

  const placed = points.map((p, i) => {
    const cx = x(p.east)
    const cy = y(p.north)
    let tick: PlacedCollar['tick'] = null
    if (typeof p.plannedAzimuth === 'number' && Number.isFinite(p.plannedAzimuth)) {
      // The plan is drawn in grid coordinates: grid azimuth = true azimuth − convergence.
      const a = ((p.plannedAzimuth - convergenceDeg) * Math.PI) / 180
      const length =
        maxLength > 0 && typeof p.plannedLength === 'number'
          ? TICK_MIN_PX + (TICK_MAX_PX - TICK_MIN_PX) * (p.plannedLength / maxLength)
          : (TICK_MIN_PX + TICK_MAX_PX) / 2
      tick = { x2: cx + length * Math.sin(a), y2: cy - length * Math.cos(a) }
    }
    return { key: `${p.id ?? p.name}-${i}`, id: p.id, name: p.name, cx, cy, tick }
  })

  const obstacles: Box[] = placed.flatMap((c) => [
    {
      x: c.cx - COLLAR_RADIUS,
      y: c.cy - COLLAR_RADIUS,
      w: 2 * COLLAR_RADIUS,
      h: 2 * COLLAR_RADIUS,
    },
    ...(c.tick ? tickBoxes(c.cx, c.cy, c.tick.x2, c.tick.y2) : []),
  ])

  const collars: PlacedCollar[] = placed.map((c) => {
    let best: { cost: number; candidate: Candidate; box: Box } | null = null
    for (const candidate of CANDIDATES) {
      const box = labelBox(c.cx, c.cy, candidate, c.name)
      const cost = obstacles.reduce((sum, o) => sum + overlap(box, o), 0) + 4 * outside(box, inner)
      if (!best || cost < best.cost) best = { cost, candidate, box }
      if (cost === 0) break
    }
    const chosen = best as { candidate: Candidate; box: Box }
    obstacles.push(chosen.box)
    return {
      ...c,
      label: {
        x: c.cx + chosen.candidate.dx,
        y: c.cy + chosen.candidate.dy,
        anchor: chosen.candidate.anchor,
        box: chosen.box,
      },
    }
  })

  return { x, y, scale, inner, collars }
}

export function boxesOverlap(a: Box, b: Box): boolean {
  return overlap(a, b) > 0
}
