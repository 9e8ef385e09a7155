import type { NetPoint } from '../../../orient/index'
import { colourOf, type NetFigure } from './net-geometry'
import { DRAFT_MARK } from './sign-off'

const R = 200
const C = 230
const xy = (p: NetPoint) => `${(C + p.x * R).toFixed(2)},${(C - p.y * R).toFixed(2)}`
const path = (pts: NetPoint[]) => (pts.length ? `M${pts.map(xy).join('L')}` : '')
const esc = (s: string) =>
  s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;')

/**
 * A stand-alone SVG of one interval's net (lower hemisphere), drawn from the same geometry as the
 * PDF; a draft pack's nets carry the draft mark (and so do the PNGs drawn from them).
 */
export function netSvg(
  fig: NetFigure,
  title: string,
  projectionLabel: string,
  draft = false,
): string {
  const parts: string[] = []
  parts.push(
    `<circle cx="${C}" cy="${C}" r="${R}" fill="#fff" stroke="#222" stroke-width="1.5"/>`,
    `<path d="M${C},${C - R}L${C},${C - R - 12}" stroke="#222" stroke-width="1.5"/>`,
    `<text x="${C}" y="${C - R - 16}" text-anchor="middle" font-size="13">N</text>`,
    `<path d="M${C - 5},${C}L${C + 5},${C}M${C},${C - 5}L${C},${C + 5}" stroke="#222"/>`,
  )
  for (const c of fig.cones)
    parts.push(
      `<path d="${path(c.points)}" fill="none" stroke="${colourOf(c.setIndex)}" stroke-dasharray="${c.kind === 'combined' ? '8 3' : '3 2'}"/>`,
    )
  for (const c of fig.circles)
    parts.push(
      `<path d="${path(c.points)}" fill="none" stroke="${colourOf(c.setIndex)}" stroke-width="1.5"/>`,
    )
  for (const p of fig.poles) {
    const [x, y] = xy(p.point).split(',')
    parts.push(`<circle cx="${x}" cy="${y}" r="2.5" fill="${colourOf(p.setIndex)}"/>`)
  }
  for (const x of fig.intersections) {
    const [px, py] = xy(x.point).split(',').map(Number)
    parts.push(
      `<path d="M${px - 4},${py - 4}L${px + 4},${py + 4}M${px - 4},${py + 4}L${px + 4},${py - 4}" stroke="#111"/>`,
      `<text x="${px + 6}" y="${py - 4}" font-size="10">${esc(x.label)}</text>`,
    )
  }
  fig.setNames.forEach((name, i) =>
    parts.push(
      `<rect x="470" y="${40 + i * 18}" width="10" height="10" fill="${colourOf(i)}"/>`,
      `<text x="486" y="${49 + i * 18}" font-size="12">${esc(name)}</text>`,
    ),
  )
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="600" height="484" viewBox="0 0 600 484" font-family="Fira Sans, sans-serif">`,
    `<title>${esc(title)}</title>`,
    `<text x="10" y="20" font-size="14">${esc(title)}</text>`,
    ...(draft
      ? [
          `<text x="590" y="20" font-size="14" font-weight="bold" text-anchor="end" fill="#b91c1c">${DRAFT_MARK}</text>`,
        ]
      : []),
    `<text x="10" y="460" font-size="11">Lower hemisphere, ${esc(projectionLabel)}; poles, set mean great circles, intersections (x);</text>`,
    `<text x="10" y="475" font-size="11">alpha95 cones (short dashes), 95 % cones with the shared survey error (long dashes)</text>`,
    ...parts,
    '</svg>',
    '',
  ].join('\n')
}
