import type { PackData } from './pack-types'
import { drawTable, PAGE, type Pdf } from './pdf-kit'
import { stampOf } from './sign-off'

const who = (name: string | null, at: Date | null, missing: string) =>
  name ? `${name}, ${stampOf(at)}` : missing

/** The cover's sign-off table: each interval's status, checker and approver with dates. */
export function drawSignOffTable(doc: Pdf, data: PackData, y: number): number {
  if (data.intervals.length === 0) {
    doc
      .font('body')
      .fontSize(9)
      .fillColor('#111')
      .text('No intervals in this pack.', PAGE.margin, y)
    return doc.y
  }
  return drawTable(
    doc,
    PAGE.margin,
    y,
    [
      { title: 'Interval', width: 160 },
      { title: 'Status', width: 55 },
      { title: 'Checked by', width: 150 },
      { title: 'Approved by', width: 150 },
    ],
    data.intervals.map(({ hole, interval, signOff }) => [
      `${hole.name} ${interval.name} (${interval.fromDepth}-${interval.toDepth} m)`,
      interval.status,
      who(signOff.checkedBy, signOff.checkedAt, 'not checked'),
      who(signOff.approvedBy, signOff.approvedAt, 'not approved'),
    ]),
  )
}
