import type { Hole } from '../../../schema/index'
import type { PackData } from './pack-types'
import { PAGE, type Pdf } from './pdf-kit'

/**
 * One hole as depth tracks sharing a depth axis: tadpoles (dip as position, tail toward the dip
 * direction, north up), natural fracture frequency per run, and the packed intervals.
 */
export function drawDepthView(doc: Pdf, data: PackData, hole: Hole) {
  doc.addPage()
  doc
    .font('bold')
    .fontSize(13)
    .fillColor('#111')
    .text(`${hole.name}: depth view`, PAGE.margin, PAGE.margin)
  const top = PAGE.margin + 40
  const bottom = PAGE.height - PAGE.margin - 20
  const depthMax = hole.finalDepth
  const yOf = (d: number) => top + ((bottom - top) * d) / depthMax
  const axisX = PAGE.margin + 30
  const tad = { x: axisX + 10, w: 220 }
  const freq = { x: tad.x + tad.w + 20, w: 140 }
  const intv = { x: freq.x + freq.w + 20, w: 70 }
  doc.font('body').fontSize(7).fillColor('#333').lineWidth(0.5).strokeColor('#555')
  const step = depthMax > 150 ? 25 : depthMax > 60 ? 10 : 5
  for (let d = 0; d <= depthMax + 1e-9; d += step) {
    doc
      .moveTo(axisX - 4, yOf(d))
      .lineTo(axisX, yOf(d))
      .stroke()
    doc.text(`${d}`, PAGE.margin - 6, yOf(d) - 3, { width: 30, align: 'right', lineBreak: false })
  }
  doc.moveTo(axisX, top).lineTo(axisX, bottom).stroke()
  doc.text('depth (m)', PAGE.margin - 6, top - 24, { lineBreak: false })
  for (const [t, label] of [
    [tad, 'dip 0-90 deg, tail to dip direction'],
    [freq, 'fractures per metre (runs)'],
    [intv, 'intervals'],
  ] as const) {
    doc
      .rect(t.x, top, t.w, bottom - top)
      .strokeColor('#bbb')
      .stroke()
    doc.fillColor('#333').text(label, t.x, top - 12, { width: t.w, lineBreak: false })
  }
  for (let dip = 0; dip <= 90; dip += 30) {
    const x = tad.x + (tad.w * dip) / 90
    doc.moveTo(x, top).lineTo(x, bottom).strokeColor('#e5e5e5').stroke()
  }
  doc.strokeColor('#1f2937').fillColor('#1f2937').lineWidth(0.6)
  for (const s of data.structures.filter((x) => x.holeId === hole.id && x.dip !== null)) {
    const x = tad.x + (tad.w * s.dip!) / 90
    const y = yOf(s.depth)
    const a = ((s.dipDirection ?? 0) * Math.PI) / 180
    doc.circle(x, y, 1.8).fill()
    doc
      .moveTo(x, y)
      .lineTo(x + 6 * Math.sin(a), y - 6 * Math.cos(a))
      .stroke()
  }
  const runs = data.runs.get(hole.id) ?? []
  const fMax = Math.max(5, ...runs.map((r) => r.metrics?.frequency ?? 0))
  doc.fillColor('#0f766e')
  for (const r of runs) {
    const f = r.metrics?.frequency ?? 0
    doc
      .rect(
        freq.x,
        yOf(r.fromDepth),
        (freq.w * f) / fMax,
        Math.max(0.5, yOf(r.toDepth) - yOf(r.fromDepth)),
      )
      .fill()
  }
  doc
    .fillColor('#333')
    .fontSize(7)
    .text(`0 - ${fMax.toFixed(0)} /m`, freq.x, bottom + 4, { lineBreak: false })
  for (const p of data.intervals.filter((i) => i.hole.id === hole.id)) {
    const y0 = yOf(p.interval.fromDepth)
    const y1 = yOf(p.interval.toDepth)
    doc
      .rect(intv.x, y0, intv.w, y1 - y0)
      .fillColor('#e0f2f1')
      .fill()
    doc
      .rect(intv.x, y0, intv.w, y1 - y0)
      .strokeColor('#0f766e')
      .stroke()
    doc
      .fillColor('#111')
      .text(p.interval.name, intv.x + 3, y0 + 3, { width: intv.w - 6, lineBreak: false })
  }
}
