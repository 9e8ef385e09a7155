import type { NetPoint } from '../../../orient/index'
import { colourOf, type NetFigure } from './net-geometry'
import type { Pdf } from './pdf-kit'

/** Draws a net with vector paths: primitive, north mark, cones, great circles, poles, intersections. */
export function drawNet(doc: Pdf, fig: NetFigure, cx: number, cy: number, r: number) {
  const at = (p: NetPoint): [number, number] => [cx + p.x * r, cy - p.y * r]
  const polyline = (pts: NetPoint[]) => {
    if (pts.length < 2) return false
    doc.moveTo(...at(pts[0]))
    for (const p of pts.slice(1)) doc.lineTo(...at(p))
    return true
  }
  doc.save()
  doc.circle(cx, cy, r).lineWidth(1).strokeColor('#222').stroke()
  doc
    .moveTo(cx, cy - r)
    .lineTo(cx, cy - r - 8)
    .stroke()
  doc
    .font('bold')
    .fontSize(9)
    .fillColor('#222')
    .text('N', cx - 3, cy - r - 19, { lineBreak: false })
  doc
    .moveTo(cx - 4, cy)
    .lineTo(cx + 4, cy)
    .moveTo(cx, cy - 4)
    .lineTo(cx, cy + 4)
    .lineWidth(0.5)
    .stroke()
  for (const c of fig.cones)
    if (polyline(c.points))
      doc
        .lineWidth(0.7)
        .dash(c.kind === 'combined' ? 5 : 2, { space: c.kind === 'combined' ? 2 : 1.5 })
        .strokeColor(colourOf(c.setIndex))
        .stroke()
        .undash()
  for (const c of fig.circles)
    if (polyline(c.points)) doc.lineWidth(1.1).strokeColor(colourOf(c.setIndex)).stroke()
  for (const p of fig.poles)
    doc
      .circle(...at(p.point), 1.6)
      .fillColor(colourOf(p.setIndex))
      .fill()
  doc.lineWidth(0.8).strokeColor('#111').fillColor('#111').font('body').fontSize(7)
  for (const x of fig.intersections) {
    const [px, py] = at(x.point)
    doc
      .moveTo(px - 3, py - 3)
      .lineTo(px + 3, py + 3)
      .moveTo(px - 3, py + 3)
      .lineTo(px + 3, py - 3)
      .stroke()
    doc.text(x.label, px + 4, py - 8, { lineBreak: false })
  }
  fig.setNames.forEach((name, i) => {
    doc
      .rect(cx + r + 14, cy - r + i * 12, 7, 7)
      .fillColor(colourOf(i))
      .fill()
    doc
      .fillColor('#111')
      .fontSize(8)
      .text(name, cx + r + 25, cy - r + i * 12 - 1, { lineBreak: false })
  })
  doc.restore()
}
