import type { NetFigure } from './net-geometry'
import type { PackData, PackInterval } from './pack-types'
import { drawNet } from './pdf-net'
import { CONTENT_WIDTH, drawTable, PAGE, type Column, type Pdf } from './pdf-kit'
import { settingsText, signOffText } from './sign-off'

const f = (x: number | null | undefined, d: number) =>
  x === null || x === undefined || !Number.isFinite(x) ? '-' : x.toFixed(d)

const setColumns: Column[] = [
  { title: 'Set', width: 46 },
  { title: 'N', width: 28, align: 'right' },
  { title: 'N weighted', width: 40, align: 'right' },
  { title: '% data', width: 34, align: 'right' },
  { title: 'Dip', width: 36, align: 'right' },
  { title: 'Dip dir.', width: 38, align: 'right' },
  { title: 'Fisher K', width: 38, align: 'right' },
  { title: 'a95', width: 34, align: 'right' },
  { title: 'Survey 95', width: 38, align: 'right' },
  { title: 'Comb. 95', width: 38, align: 'right' },
  { title: 'Sph. var.', width: 40, align: 'right' },
  { title: 'True sp. m', width: 44, align: 'right' },
  { title: 'ISRM spacing', width: 60 },
]

function qualityLines(data: PackData, p: PackInterval): string[] {
  const { counts, structures } = p.analysis
  const flags = new Map<string, number>()
  for (const s of structures) for (const fl of s.flags) flags.set(fl, (flags.get(fl) ?? 0) + 1)
  const refs = new Set(
    data.stations.filter((s) => s.holeId === p.hole.id).map((s) => s.azimuthReference),
  )
  return [
    `Structures ${counts.total}; oriented ${counts.oriented} (${f(counts.total ? (100 * counts.oriented) / counts.total : 0, 0)} %)`,
    `Flags: ${flags.size ? [...flags].map(([k, n]) => `${k} ${n}`).join(', ') : 'none'}`,
    `Survey azimuths entered as: ${refs.size ? [...refs].join(', ') : 'no survey'}`,
    `Declination: ${declinationLabel(data)}`,
    `RQD ${f(p.runs.rqd, 1)} % (length-weighted over runs); fracture frequency ${f(p.runs.frequency, 2)} /m`,
  ]
}

export function declinationLabel(data: PackData): string {
  const p = data.project
  const grid = `grid convergence ${p.gridConvergenceDeg.toFixed(2)} deg`
  return p.declinationMode === 'manual'
    ? `manual, ${p.declinationDeg.toFixed(2)} deg (east positive); ${grid}`
    : `from the magnetic model at each collar; ${grid}`
}

/** One interval: net, set table, intersections, kinematic screening, RQD/frequency, data quality. */
export function drawIntervalPage(doc: Pdf, data: PackData, p: PackInterval, fig: NetFigure) {
  doc.addPage()
  const m = PAGE.margin
  const { interval, analysis } = p
  doc.font('bold').fontSize(13).fillColor('#111')
  doc.text(
    `${p.hole.name} - ${interval.name} (${f(interval.fromDepth, 2)}-${f(interval.toDepth, 2)} m)`,
    m,
    m,
  )
  doc.font('body').fontSize(9).fillColor('#444')
  doc.text(`Domain ${p.domain || '-'}; status ${interval.status}; ${signOffText(p.signOff)}`)
  doc.fontSize(8).text(`Settings: ${settingsText(p.settings)}`, { width: CONTENT_WIDTH })
  drawNet(doc, fig, m + 115, m + 178, 105)
  doc.font('body').fontSize(8).fillColor('#111')
  let y = m + 72
  for (const line of qualityLines(data, p)) {
    doc.text(line, m + 300, y, { width: CONTENT_WIDTH - 300 })
    y = doc.y + 3
  }
  y = Math.max(y, m + 300)
  doc.font('bold').fontSize(10).text('Sets', m, y)
  y = drawTable(
    doc,
    m,
    doc.y + 2,
    setColumns,
    analysis.sets.map((s) => [
      s.name,
      String(s.count),
      f(s.weightedCount, 1),
      f(s.percent, 1),
      f(s.mean?.dip, 1),
      f(s.mean?.dipDirection, 1),
      f(s.kappa, 1),
      f(s.alpha95, 1),
      f(s.systematic95, 1),
      f(s.uncertainty95, 1),
      f(s.sphericalVariance, 4),
      f(s.spacing?.true, 3),
      s.spacing?.isrmClass ?? '-',
    ]),
  )
  doc
    .font('body')
    .fontSize(7)
    .text(
      'a95: Fisher (1953) 95 % cone of the mean from the scatter of the members. Survey 95: 95 % cone of the mean from the survey error every structure of the hole shares (project error model, Monte Carlo). Comb. 95: both, added in quadrature.',
      m,
      y,
      { width: CONTENT_WIDTH },
    )
  y = doc.y + 6
  doc.font('bold').fontSize(10).text('Intersections of set means', m, y)
  y = drawTable(
    doc,
    m,
    doc.y + 2,
    [
      { title: 'Sets', width: 120 },
      { title: 'Trend', width: 60, align: 'right' },
      { title: 'Plunge', width: 60, align: 'right' },
      { title: 'Angle between planes', width: 110, align: 'right' },
    ],
    analysis.intersections.map((x) => [
      `${x.nameA} / ${x.nameB}`,
      f(x.trend, 1),
      f(x.plunge, 1),
      f(x.angle, 1),
    ]),
  )
  doc.font('bold').fontSize(10).text('Kinematic screening', m, y)
  doc.font('body').fontSize(8.5)
  const k = analysis.kinematics
  if (!k) doc.text('No design face or friction angle set for this interval.')
  else {
    doc.text(
      `Face ${f(k.face.dip, 0)} deg toward ${f(k.face.dipDirection, 0)}; friction ${f(k.friction, 0)} deg; lateral limit ${k.lateralLimit} deg; toppling limit ${k.topplingLimit} deg.`,
    )
    doc.text(
      `Planar sliding possible: ${k.planar.possible} structures (${f(k.planar.percent, 1)} %). Flexural toppling possible: ${k.toppling.possible} (${f(k.toppling.percent, 1)} %). Wedges possible: ${k.wedge.possible} set pairs (${f(k.wedge.percent, 1)} %).`,
    )
    const names = new Map(analysis.sets.map((s) => [s.id, s.name]))
    for (const w of k.pairs)
      doc.text(
        `Wedge ${names.get(w.setA)}/${names.get(w.setB)}: line ${f(w.trend, 1)}/${f(w.plunge, 1)} - ${w.possible ? 'possible' : 'not possible'}${w.slidesOn ? `, slides on ${w.slidesOn === 'a' ? names.get(w.setA) : w.slidesOn === 'b' ? names.get(w.setB) : 'along the intersection'}` : ''}`,
      )
  }
  doc.moveDown(0.5).fontSize(7.5).fillColor('#7c2d12')
  doc.text('Kinematic screening is not a stability analysis; set assignment is an interpretation.')
}
