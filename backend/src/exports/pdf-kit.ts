import PDFDocument from 'pdfkit'
import { existsSync } from 'node:fs'
import { fileURLToPath } from 'node:url'

export type Pdf = PDFKit.PDFDocument
export type PdfFont = 'fira' | 'helvetica'

const firaFile = (weight: number) =>
  fileURLToPath(
    new URL(
      `../../../node_modules/@fontsource/fira-sans/files/fira-sans-latin-${weight}-normal.woff`,
      import.meta.url,
    ),
  )

/** A4 portrait page metrics, points. */
export const PAGE = { width: 595.28, height: 841.89, margin: 40 }
export const CONTENT_WIDTH = PAGE.width - 2 * PAGE.margin

/**
 * A new report document with our two faces registered as 'body' and 'bold': Fira Sans (shipped
 * WOFF, read by pdfkit's font engine) or the built-in Helvetica when asked or when it is missing.
 */
export function createPdf(title: string, font: PdfFont, compress: boolean): Pdf {
  const doc = new PDFDocument({
    size: 'A4',
    margin: PAGE.margin,
    compress,
    bufferPages: true,
    info: { Title: title, Creator: 'Downdip', Producer: 'Downdip' },
  })
  if (font === 'fira' && existsSync(firaFile(400)) && existsSync(firaFile(600))) {
    doc.registerFont('body', firaFile(400))
    doc.registerFont('bold', firaFile(600))
  } else {
    doc.registerFont('body', 'Helvetica')
    doc.registerFont('bold', 'Helvetica-Bold')
  }
  doc.font('body')
  return doc
}

/** Collects the document's bytes once it is ended. */
export function pdfBytes(doc: Pdf): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    doc.on('data', (c: Buffer) => chunks.push(c))
    doc.on('end', () => resolve(Buffer.concat(chunks)))
    doc.on('error', reject)
    doc.end()
  })
}

export interface Column {
  title: string
  width: number
  align?: 'left' | 'right'
}

/** A compact table with a header rule; starts a new page when the next row will not fit. */
export function drawTable(doc: Pdf, x: number, y: number, columns: Column[], rows: string[][]) {
  const rowHeight = 13
  const header = () => {
    doc.font('bold').fontSize(8).fillColor('#222')
    let cx = x
    for (const c of columns) {
      doc.text(c.title, cx + 2, y + 2, {
        width: c.width - 4,
        align: c.align ?? 'left',
        lineBreak: false,
      })
      cx += c.width
    }
    const total = columns.reduce((s, c) => s + c.width, 0)
    doc
      .moveTo(x, y + rowHeight)
      .lineTo(x + total, y + rowHeight)
      .lineWidth(0.6)
      .strokeColor('#444')
      .stroke()
    y += rowHeight + 2
    doc.font('body')
  }
  header()
  for (const row of rows) {
    if (y + rowHeight > PAGE.height - PAGE.margin) {
      doc.addPage()
      y = PAGE.margin
      header()
    }
    let cx = x
    doc.fontSize(8).fillColor('#111')
    row.forEach((cell, i) => {
      const c = columns[i]
      doc.text(cell, cx + 2, y + 2, {
        width: c.width - 4,
        align: c.align ?? 'left',
        lineBreak: false,
      })
      cx += c.width
    })
    y += rowHeight
  }
  return y + 6
}
