import type { NetProjection } from '../../../orient/index'
import { CAUTIONS } from './cautions'
import { netFigure } from './net-geometry'
import type { PackData } from './pack-types'
import { drawDepthView } from './pdf-depth'
import { createPdf, pdfBytes, PAGE, type Pdf, type PdfFont } from './pdf-kit'
import { declinationLabel, drawIntervalPage } from './pdf-interval'
import { drawSignOffTable } from './pdf-sign-off'
import { DRAFT_MARK } from './sign-off'

export interface ReportMeta {
  packId: string
  builtBy: string
  builtAt: Date
  font?: PdfFont
  compress?: boolean
}

/** The selection in words: holes and their intervals. */
export function selectionLabel(data: PackData): string {
  return data.holes
    .map((h) => {
      const names = data.intervals.filter((i) => i.hole.id === h.id).map((i) => i.interval.name)
      return `${h.name} (${names.length ? names.join(', ') : 'no intervals'})`
    })
    .join('; ')
}

function cover(doc: Pdf, data: PackData, meta: ReportMeta) {
  const m = PAGE.margin
  if (data.draft) {
    doc
      .rect(m, 52, PAGE.width - 2 * m, 24)
      .fillColor('#b91c1c')
      .fill()
    doc.font('bold').fontSize(12).fillColor('#fff')
    doc.text(`${DRAFT_MARK}: intervals not approved; a preview, never issued`, m + 10, 58, {
      width: PAGE.width - 2 * m - 20,
      lineBreak: false,
    })
  }
  doc.font('bold').fontSize(22).fillColor('#0f766e').text('Design pack', m, 86)
  doc.fontSize(15).fillColor('#111').text(`${data.project.code} - ${data.project.name}`)
  doc.moveDown(1).font('body').fontSize(10)
  const lines: [string, string][] = [
    ['Selection', selectionLabel(data) || 'no holes'],
    ['Built by', meta.builtBy],
    ['Built at', `${meta.builtAt.toISOString().replace('T', ' ').slice(0, 19)} UTC`],
    ['Pack', meta.packId],
    ['Inputs SHA-256', data.inputsHash],
    [
      'Set statistics',
      'Fisher statistics with the settings saved with each interval (see its page)',
    ],
    ['Net', `lower hemisphere, ${data.project.netProjection}`],
    ['Declination', declinationLabel(data)],
  ]
  for (const [k, v] of lines) {
    const y = doc.y
    doc.font('bold').text(k, m, y, { width: 110 })
    doc.font('body').text(v, m + 115, y, { width: 400 })
    doc.moveDown(0.3)
  }
  doc.moveDown(0.6).font('bold').fontSize(10).fillColor('#111').text('Sign-off', m)
  const y = drawSignOffTable(doc, data, doc.y + 2) + 10
  doc
    .rect(m, y, PAGE.width - 2 * m, 86)
    .fillColor('#fff7ed')
    .fill()
  doc
    .rect(m, y, PAGE.width - 2 * m, 86)
    .lineWidth(1)
    .strokeColor('#b45309')
    .stroke()
  doc
    .font('bold')
    .fontSize(10)
    .fillColor('#7c2d12')
    .text('Cautions', m + 10, y + 10)
  doc.font('body').fontSize(9.5).fillColor('#111')
  for (const c of CAUTIONS) doc.text(c, m + 10, doc.y + 3, { width: PAGE.width - 2 * m - 20 })
}

/**
 * The pack's PDF: cover with sign-off and cautions, a page per interval, a depth view per hole.
 * Every page carries the pack in its header and footer, and the draft mark when it is a draft.
 */
export async function buildReport(data: PackData, meta: ReportMeta): Promise<Buffer> {
  const title = `Design pack ${data.project.code} ${meta.packId.slice(0, 8)}`
  const doc = createPdf(
    data.draft ? `${title} (${DRAFT_MARK})` : title,
    meta.font ?? 'fira',
    meta.compress ?? true,
  )
  cover(doc, data, meta)
  const projection = data.project.netProjection as NetProjection
  for (const p of data.intervals) drawIntervalPage(doc, data, p, netFigure(p.analysis, projection))
  for (const h of data.holes) drawDepthView(doc, data, h)
  const range = doc.bufferedPageRange()
  for (let i = range.start; i < range.start + range.count; i++) {
    doc.switchToPage(i)
    // Footer below the bottom margin: lift the margin so pdfkit does not start a new page.
    doc.page.margins.bottom = 0
    const draft = data.draft ? `${DRAFT_MARK} - ` : ''
    doc
      .font('bold')
      .fontSize(7)
      .fillColor(data.draft ? '#b91c1c' : '#666')
    doc.text(`${draft}${title}`, PAGE.margin, 18, {
      width: PAGE.width - 2 * PAGE.margin,
      align: 'right',
      lineBreak: false,
      height: 10,
    })
    doc
      .font('body')
      .fontSize(7)
      .fillColor(data.draft ? '#b91c1c' : '#666')
    doc.text(
      `${draft}${title} - page ${i + 1} of ${range.count} - aids to professional judgement`,
      PAGE.margin,
      PAGE.height - 28,
      {
        width: PAGE.width - 2 * PAGE.margin,
        lineBreak: false,
        height: 10,
      },
    )
  }
  return pdfBytes(doc)
}
