// Sinusoids and point handles drawn over the wall, each role in its own line style: picks solid
// in their type's colour, predicted core traces dashed, suggestions dotted with their score, the
// draft thin with its points as handles; the selected one haloed. Every line has a dark casing so
// it reads on bright and dark images alike.
import type { TracePoint } from '../../api/images'
import type { DrawnSinusoid, SinusoidRole } from './image-types'
import {
  azimuthToX,
  depthToY,
  inView,
  peakOf,
  sinusoidPoints,
  type WallScale,
} from './sinusoid-path'

interface RoleStyle {
  colour: string
  width: number
  dash: number[]
}

const ROLE: Record<SinusoidRole, RoleStyle> = {
  pick: { colour: '#f2f4f7', width: 2, dash: [] },
  predicted: { colour: '#8fd3ff', width: 1.6, dash: [7, 4] },
  suggestion: { colour: '#ffe066', width: 1.8, dash: [1.5, 3.5] },
  draft: { colour: '#3ee0c4', width: 1.4, dash: [] },
}

/** Order of drawing: what matters most ends on top. */
const ORDER: SinusoidRole[] = ['predicted', 'suggestion', 'pick', 'draft']

export const roleStyle = (role: SinusoidRole) => ROLE[role]

/**
 * Draws the traces in view and the draft's points, in CSS pixels (the context scaled by dpr).
 * Traces of one style share one path, cased and stroked once: hundreds of picks on a zoomed-out
 * wall cost a handful of strokes, and a trace shorter than a pixel is drawn as a straight line.
 */
export function drawOverlay(
  ctx: CanvasRenderingContext2D,
  sc: WallScale,
  sinusoids: readonly DrawnSinusoid[],
  points: readonly TracePoint[],
): void {
  ctx.lineJoin = 'round'
  ctx.lineCap = 'round'
  const shown = sinusoids.filter((s) => inView(sc, s))
  const groups = new Map<
    string,
    { rank: number; style: RoleStyle; colour: string; selected: boolean; list: DrawnSinusoid[] }
  >()
  for (const s of shown) {
    const style = ROLE[s.role]
    const colour = s.colour ?? style.colour
    const selected = !!s.selected
    const key = `${s.role}|${colour}|${selected}`
    let g = groups.get(key)
    if (!g) {
      g = {
        rank: ORDER.indexOf(s.role) * 2 + (selected ? 1 : 0),
        style,
        colour,
        selected,
        list: [],
      }
      groups.set(key, g)
    }
    g.list.push(s)
  }
  for (const g of [...groups.values()].sort((a, b) => a.rank - b.rank)) {
    const path = new Path2D()
    for (const s of g.list) addTrace(path, sc, s)
    const width = g.style.width + (g.selected ? 1 : 0)
    ctx.setLineDash(g.style.dash)
    if (g.selected) stroke(ctx, path, 'rgba(255, 255, 255, 0.9)', width + 5)
    stroke(ctx, path, 'rgba(10, 12, 16, 0.7)', width + 2.2)
    stroke(ctx, path, g.colour, width)
  }
  ctx.setLineDash([])
  for (const s of shown) if (s.label) label(ctx, sc, s)
  for (const p of points) handle(ctx, azimuthToX(sc, p.azimuth), depthToY(sc, p.depth))
}

function stroke(ctx: CanvasRenderingContext2D, path: Path2D, colour: string, width: number) {
  ctx.strokeStyle = colour
  ctx.lineWidth = width
  ctx.stroke(path)
}

function addTrace(path: Path2D, sc: WallScale, s: DrawnSinusoid) {
  const tall = Math.abs(depthToY(sc, s.depth + s.height) - depthToY(sc, s.depth))
  if (tall < 1) {
    const y = depthToY(sc, s.depth)
    path.moveTo(0, y)
    path.lineTo(sc.width, y)
    return
  }
  const p = sinusoidPoints(sc, s)
  path.moveTo(p[0], p[1])
  for (let i = 2; i < p.length; i += 2) path.lineTo(p[i], p[i + 1])
}

function label(ctx: CanvasRenderingContext2D, sc: WallScale, s: DrawnSinusoid) {
  const text = s.label ?? ''
  const { x, y } = peakOf(sc, s)
  ctx.font = '600 10.5px "Fira Sans", sans-serif'
  const w = ctx.measureText(text).width + 8
  const lx = Math.max(2, Math.min(sc.width - w - 2, x - w / 2))
  const ly = Math.max(2, y - 18)
  ctx.fillStyle = 'rgba(10, 12, 16, 0.72)'
  ctx.fillRect(lx, ly, w, 14)
  ctx.fillStyle = s.colour ?? ROLE[s.role].colour
  ctx.textBaseline = 'middle'
  ctx.fillText(text, lx + 4, ly + 7.5)
}

function handle(ctx: CanvasRenderingContext2D, x: number, y: number) {
  ctx.beginPath()
  ctx.arc(x, y, 4.5, 0, Math.PI * 2)
  ctx.fillStyle = '#ffffff'
  ctx.fill()
  ctx.lineWidth = 2
  ctx.strokeStyle = '#0b6e5f'
  ctx.stroke()
}
